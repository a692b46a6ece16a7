// The shifts feature as other features see it: import from here, never from its files.
export { type CrewRotation, crewFromRotation, crewOnShift, crewsOnShifts, shiftChangeAt, swapsOfStation } from './crews';
