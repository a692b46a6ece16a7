// The overview (front page): its keys and page.
export { overviewKeys } from './api/overview-keys';
export { OverviewPage } from './routes/overview-page';
