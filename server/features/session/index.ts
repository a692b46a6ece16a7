// The session feature as other features see it: import from here, never from its files.
export { endSessionsOf } from './sessions';
