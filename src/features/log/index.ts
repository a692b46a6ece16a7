// What other features and the router may use of the shift log.
export { useShifts, useEquipment, logKeys, conditionKeys } from './api/log';
export { LogPage } from './routes/log-page';
