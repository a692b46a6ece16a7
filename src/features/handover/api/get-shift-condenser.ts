import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShiftCondenserState } from '../../../../shared/shift-condenser';
import { api } from '../../../lib/api-client';
import { shiftCondenserKeys } from './shift-condenser-keys';
export { shiftCondenserKeys };

/** A `reading` event for a unit invalidates `unit(unitId)`; a `plant` change (design, limits) invalidates `all`. */

export const getShiftCondenser = async (unitId: number, shiftStart: string | null) => {
  const query = shiftStart ? `?shiftStart=${encodeURIComponent(shiftStart)}` : '';
  return (await api.get<{ state: ShiftCondenserState }>(`/api/units/${unitId}/shift-condenser${query}`)).state;
};

export const shiftCondenserQueryOptions = (unitId: number, shiftStart: string | null = null) =>
  queryOptions({
    queryKey: shiftCondenserKeys.shift(unitId, shiftStart),
    queryFn: () => getShiftCondenser(unitId, shiftStart),
    // "So far" figures grow with the clock between rounds; a refetch now and then keeps them honest.
    refetchInterval: shiftStart ? false : 5 * 60_000,
  });

export const useShiftCondenser = (unitId: number | null, shiftStart: string | null = null) =>
  useQuery({ ...shiftCondenserQueryOptions(unitId ?? 0, shiftStart), enabled: unitId !== null });
