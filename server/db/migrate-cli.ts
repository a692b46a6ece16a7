import { createSequelize } from './sequelize';
import { createMigrator } from './migrator';
import { initModels } from './models';
import { rebuildLogbookIndex } from '../features/logbook/documents';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATABASE_URL is not set');
const sequelize = createSequelize(url);
try {
  const applied = await createMigrator(sequelize).up();
  console.log(applied.length ? `[db] applied ${applied.map((m) => m.name).join(', ')}` : '[db] schema up to date');
  // The search index arrived with this migration: index the logbook written before it, once.
  if (applied.some((m) => m.name === '0009-training-and-logbook')) {
    initModels(sequelize);
    await rebuildLogbookIndex(sequelize);
    console.log('[db] logbook search index built');
  }
} finally {
  await sequelize.close();
}
