// The session feature's public surface: who is signed in, signing out, its keys and pages.
// Pages behind a route are loaded on demand, so each stays in its own chunk.
export { useMe, meQueryOptions } from './api/get-me';
export { useSignOut } from './api/sign-out';
export { sessionKeys } from './api/session-keys';
export const loadSignInPage = async () => (await import('./routes/sign-in-page')).SignInPage;
export const loadChangePasswordPage = async () => (await import('./routes/change-password-page')).ChangePasswordPage;
