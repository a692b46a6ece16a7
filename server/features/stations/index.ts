// The stations feature as other features see it: import from here, never from its files.
export { defaultStationSettings, requireKnown, saveCrewRotation, settingsForStation, settingsForUnit, shiftSetupsByStation, stationShiftSetup, timeZonesByStation } from './settings';
