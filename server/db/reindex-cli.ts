// `npm run db:reindex`: rebuilds the logbook search index from the logbook tables, e.g. after a
// change to what a search document holds. It upserts, then compacts the table; writes to the
// logbook wait while the table is compacted (seconds), so run it in a quiet hour.
import { QueryTypes } from 'sequelize';
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
  // Rebuilding the table drops the FULLTEXT entries of replaced document versions (writes wait meanwhile).
  await sequelize.query('OPTIMIZE TABLE logbook_documents', { type: QueryTypes.SELECT }); // answers with a status table
  console.log(`[db] logbook search index rebuilt and compacted in ${((performance.now() - started) / 1000).toFixed(1)} s`);
} finally {
  await sequelize.close();
}
