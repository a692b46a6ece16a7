// Query keys only, apart from the fetchers, so the live-update map in the entry chunk does not carry this feature's code.
import type { TrendRequest } from './get-trend';

export const trendKeys = {
  all: ['trends'] as const,
  /** Every trend of a unit (TanStack matches the object key partly). */
  unit: (unitId: number) => [...trendKeys.all, { unitId }] as const,
  one: (r: TrendRequest) => [...trendKeys.all, r] as const,
};
