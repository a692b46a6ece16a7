// The shift log: its shifts (the shift pages list them), keys and page, loaded on demand.
export { logKeys, conditionKeys } from './api/log-keys';
export { useShifts } from './api/get-shifts';
export const loadLogPage = async () => (await import('./routes/log-page')).LogPage;
