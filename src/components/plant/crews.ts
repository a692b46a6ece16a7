import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../lib/api-client';

export type CrewSummary = { id: number; name: string; stationId: number };

export const getCrews = async () => (await api.get<{ crews: CrewSummary[] }>('/api/plant/crews')).crews;
export const crewKeys = { all: ['plant', 'crews'] as const };
export const crewsQueryOptions = () => queryOptions({ queryKey: crewKeys.all, queryFn: getCrews, staleTime: 5 * 60_000 });
export const useCrews = () => useQuery(crewsQueryOptions());
