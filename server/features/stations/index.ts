// The stations feature as other features see it: import from here, never from its files.
export { StationSettingsRow } from './model';
export { defaultStationSettings, requireKnown, settingsForStation, settingsForUnit, settingsFromRow, stationShiftSetup } from './settings';
