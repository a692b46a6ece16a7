import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type UnitSummary = { id: number; code: string; name: string; stationId: number; station: string };

export const plantKeys = {
  all: ['plant'] as const,
  units: () => [...plantKeys.all, 'units'] as const,
  crews: () => [...plantKeys.all, 'crews'] as const,
};

export const getUnits = async () => (await api.get<{ units: UnitSummary[] }>('/api/plant/units')).units;
export const unitsQueryOptions = () => queryOptions({ queryKey: plantKeys.units(), queryFn: getUnits, staleTime: 5 * 60_000 });
export const useUnits = () => useQuery(unitsQueryOptions());
