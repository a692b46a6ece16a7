// Rounds: keys for the live-update map and the pages, loaded on demand.
import type { QueryClient } from '@tanstack/react-query';
import { condenserDesignQueryOptions } from '../../components/readings/get-condenser-design';
import { readingsQueryOptions } from './api/readings-query';
export { readingKeys } from './api/reading-keys';
export const loadRoundsPage = async () => (await import('./routes/rounds-page')).RoundsPage;
export const loadReadingPage = async () => (await import('./routes/reading-page')).ReadingPage;

/**
 * The rounds page's data, asked for by the route as the page's code loads, not after the shell and the
 * page have drawn: on a slow link that is one round trip instead of three. The page's own queries then
 * find the answers there or on their way. (The two query definitions are small and ride in the entry.)
 */
export function prefetchRoundsPage(queryClient: QueryClient, unitId: number | null) {
  if (!unitId) return;
  void queryClient.prefetchQuery(readingsQueryOptions(unitId));
  void queryClient.prefetchQuery(condenserDesignQueryOptions(unitId));
}
