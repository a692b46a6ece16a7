// People administration: its keys (for the live-update map) and its page, loaded on demand.
export { userKeys } from './api/user-keys';
export const loadUsersPage = async () => (await import('./routes/users-page')).UsersPage;
