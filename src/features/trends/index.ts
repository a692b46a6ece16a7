// Trends: keys for the live-update map and the page, loaded on demand (it carries the chart library).
export { trendKeys } from './api/trend-keys';
export const loadTrendsPage = async () => (await import('./routes/trends-page')).TrendsPage;
