import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { LimitBand, Status } from '../../../../shared/calc/limits';
import { api } from '../../../lib/api-client';
import { trendKeys } from './trend-keys';
export { trendKeys };

export type TrendResponse = {
  /** t: epoch milliseconds (UTC) */
  /** o: the value lies outside the unit's plausible range (kept off the chart's scale). */
  series: { parameter: string; points: { t: number; v: number; s: Status; o?: true }[] }[];
  limitBands: { from: string; to: string; bands: Record<string, LimitBand | null> }[];
  flags: { id: number; parameter: string; severity: 'watch' | 'alarm'; status: string; origin: string; raisedAt: string; clearedAt: string | null }[];
};

export type TrendRequest = { unitId: number; parameters: string[]; from: string; to: string };


export const trendQueryOptions = (r: TrendRequest) =>
  queryOptions({
    queryKey: trendKeys.one(r),
    queryFn: () =>
      api.get<TrendResponse>(
        `/api/units/${r.unitId}/trends?parameters=${r.parameters.join(',')}&from=${encodeURIComponent(r.from)}&to=${encodeURIComponent(r.to)}`,
      ),
    placeholderData: keepPreviousData,
  });
export const useTrend = (r: TrendRequest | null) => useQuery({ ...trendQueryOptions(r ?? { unitId: 0, parameters: [], from: '', to: '' }), enabled: r !== null });
