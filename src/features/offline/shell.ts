// What the app's shell needs of the offline feature from the first page on, without the queue, its
// lists and IndexedDB's wrapper (those come with the pages that use them, through index.ts): who is
// signed in for the queue, dropping the worker's copies at sign-out, and the indicator, loaded after
// the first page draws.
export { noteSignedInPerson } from './api/session-person';
export { forgetOfflineCopies } from './api/service-worker';
export const loadOfflineStatus = async () => (await import('./components/offline-status')).OfflineStatus;
