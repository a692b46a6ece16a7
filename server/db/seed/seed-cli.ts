import { createSequelize } from '../sequelize';
import { initModels } from '../models';
import { seedDemo } from './seed-demo';

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
