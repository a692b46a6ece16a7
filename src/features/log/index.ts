// The shift log: its shifts (the shift pages list them), equipment picker, keys and page, loaded on demand.
export { useShifts, useEquipment, logKeys, conditionKeys } from './api/log';
export const loadLogPage = async () => (await import('./routes/log-page')).LogPage;
