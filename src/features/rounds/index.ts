// Rounds: keys for the live-update map and the pages, loaded on demand.
export { readingKeys } from './api/reading-keys';
export const loadRoundsPage = async () => (await import('./routes/rounds-page')).RoundsPage;
export const loadReadingPage = async () => (await import('./routes/reading-page')).ReadingPage;
