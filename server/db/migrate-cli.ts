import { createSequelize } from './sequelize';
import { createMigrator } from './migrator';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATABASE_URL is not set');
const sequelize = createSequelize(url);
try {
  const applied = await createMigrator(sequelize).up();
  console.log(applied.length ? `[db] applied ${applied.map((m) => m.name).join(', ')}` : '[db] schema up to date');
} finally {
  await sequelize.close();
}
