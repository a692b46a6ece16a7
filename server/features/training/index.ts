// The training feature as other features see it: import from here, never from its files.
export { countersignQueue } from './service';
