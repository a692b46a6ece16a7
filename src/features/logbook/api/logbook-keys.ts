// Query keys only, apart from the fetchers, so the live-update map in the entry chunk does not carry this feature's code.
import type { SearchFilters } from './logbook';

export const logbookKeys = {
  all: ['logbook'] as const,
  search: (filters: SearchFilters) => [...logbookKeys.all, 'search', filters] as const,
  shift: (unitId: number, shiftStart: string) => [...logbookKeys.all, 'shift', unitId, shiftStart] as const,
  myComments: () => [...logbookKeys.all, 'my-comments'] as const,
};
