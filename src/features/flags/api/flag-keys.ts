// Query keys only, apart from the fetchers, so the live-update map in the entry chunk does not carry this feature's code.
import type { FlagFilters } from './flags';

export const flagKeys = {
  all: ['flags'] as const,
  unit: (unitId: number) => [...flagKeys.all, 'list', unitId] as const,
  list: (unitId: number, filters: FlagFilters) => [...flagKeys.unit(unitId), filters] as const,
};
