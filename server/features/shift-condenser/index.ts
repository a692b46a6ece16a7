// The shift-condenser feature as other features see it: import from here, never from its files.
export { freezeCondenserState } from './snapshot';
