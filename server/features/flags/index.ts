// The flags feature as other features see it: import from here, never from its files.
export { refreshAutomaticFlags, takeFlagTurn } from './automatic';
export { Flag } from './model';
export { findFlag, flagsOpenDuring, flagsRaisedBetween, presentFlags } from './service';
