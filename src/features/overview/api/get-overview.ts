import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Overview } from '../../../../shared/schemas/overview';
import { api } from '../../../lib/api-client';
import { overviewKeys } from './overview-keys';

export const getOverview = () => api.get<Overview>('/api/overview');

export const overviewQueryOptions = () => queryOptions({ queryKey: overviewKeys.page(), queryFn: getOverview });

export const useOverview = () => useQuery(overviewQueryOptions());
