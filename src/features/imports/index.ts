// Historian imports: keys for the live-update map and the page, loaded on demand.
export { importKeys } from './api/import-keys';
export const loadImportPage = async () => (await import('./routes/import-page')).ImportPage;
