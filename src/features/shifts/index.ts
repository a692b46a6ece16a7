// Shifts and crews: a station's settings (zone, shifts, positions) as others read them, keys and the page, loaded on demand.
export { useStationSettings, stationSettingsKeys } from './api/station-settings-query';
export const loadShiftsPage = async () => (await import('./routes/shifts-page')).ShiftsPage;
