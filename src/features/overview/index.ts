// The overview (front page): its keys and page, loaded on demand like every page so the entry chunk stays small.
export { overviewKeys } from './api/overview-keys';
export const loadOverviewPage = async () => (await import('./routes/overview-page')).OverviewPage;
