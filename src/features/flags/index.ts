// Flags: keys for the live-update map and the page, loaded on demand.
export { flagKeys } from './api/flag-keys';
export const loadFlagsPage = async () => (await import('./routes/flags-page')).FlagsPage;
