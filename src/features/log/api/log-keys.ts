// Query keys only, apart from the fetchers, so the live-update map in the entry chunk does not carry this feature's code.
import type { LogFilters } from './log';

export const logKeys = {
  all: ['log'] as const,
  unitEntries: (unitId: number) => [...logKeys.all, 'entries', unitId] as const,
  entries: (unitId: number, f: LogFilters) => [...logKeys.unitEntries(unitId), f] as const,
  shifts: (unitId: number) => [...logKeys.all, 'shifts', unitId] as const,
};
export const conditionKeys = { all: ['conditions'] as const, list: (unitId: number) => [...conditionKeys.all, unitId] as const };
