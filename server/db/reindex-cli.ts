// `npm run db:reindex`: rebuilds the logbook search index from the logbook tables, e.g. after a
// change to what a search document holds. Safe to run on a live database (it upserts).
import { createSequelize } from './sequelize';
import { initModels } from './models';
import { rebuildLogbookIndex } from '../features/logbook/documents';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATABASE_URL is not set');
const sequelize = createSequelize(url);
try {
  initModels(sequelize);
  const started = performance.now();
  await rebuildLogbookIndex(sequelize);
  console.log(`[db] logbook search index rebuilt in ${((performance.now() - started) / 1000).toFixed(1)} s`);
} finally {
  await sequelize.close();
}
