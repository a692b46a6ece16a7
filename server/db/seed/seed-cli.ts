// `npm run db:seed -- --demo`: loads the fictional demo scenario (Fernhollow Station, its people and
// their published password). Refused unless the demo is asked for by name (`--demo` or
// HOTWELL_DEMO=1), so it cannot be run into a plant's database by habit or by a copied command.
import { createSequelize } from '../sequelize';
import { initModels } from '../models';
import { seedDemo } from './seed-demo';

const DEMO_REFUSAL =
  'The demo scenario was not loaded: it adds people whose password is published in the README. ' +
  'Load it only into a database for trying Hotwell out, with --demo (or HOTWELL_DEMO=1). ' +
  'A real installation starts with `npm run admin:create`.';

const asked = process.argv.includes('--demo') || process.env.HOTWELL_DEMO === '1';
if (!asked) {
  console.error(DEMO_REFUSAL);
  process.exit(1);
}
const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATABASE_URL is not set');
const sequelize = createSequelize(url);
initModels(sequelize);
try {
  const { created } = await seedDemo(sequelize);
  console.log(created ? `[db] demo scenario loaded (${created} rows)` : '[db] demo scenario already present; left as it is');
} finally {
  await sequelize.close();
}
