import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../lib/api-client';

export type CrewSummary = { id: number; name: string; stationId: number };

export const getCrews = async () => (await api.get<{ crews: CrewSummary[] }>('/api/plant/crews')).crews;
export const crewsQueryOptions = () => queryOptions({ queryKey: ['plant', 'crews'], queryFn: getCrews, staleTime: 5 * 60_000 });
export const useCrews = () => useQuery(crewsQueryOptions());
