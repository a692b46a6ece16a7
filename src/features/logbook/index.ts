// Logbook history: keys, the person's review comments (shown on their training page too) and its pages, loaded on demand.
export { logbookKeys } from './api/logbook-keys';
export { MyReviewComments } from './components/my-review-comments-loader';
export const loadLogbookPage = async () => (await import('./routes/logbook-page')).LogbookPage;
export const loadPastShiftPage = async () => (await import('./routes/past-shift-page')).PastShiftPage;
