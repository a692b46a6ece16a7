// The unit's recent rounds as a query, on its own so the route can ask for them before the page's code
// has arrived (see ../index.ts).
import { queryOptions } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { readingKeys } from './reading-keys';
import type { ReadingSummary } from './readings';

export const readingsQueryOptions = (unitId: number) =>
  queryOptions({
    queryKey: readingKeys.list(unitId),
    queryFn: async () => (await api.get<{ readings: ReadingSummary[] }>(`/api/units/${unitId}/readings?limit=20`)).readings,
  });
