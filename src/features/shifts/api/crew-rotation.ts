import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { crewRotationSchema, crewSwapSchema } from '../../../../shared/schemas/handovers';
import { api } from '../../../lib/api-client';
import { invalidateForChange } from '../../../app/live-keys';

type Rotation = z.output<typeof crewRotationSchema>;
type Swap = z.output<typeof crewSwapSchema>;

/** Rotation and swaps decide who works each shift: the same keys a station-settings event makes stale. */
export function useSaveRotation(stationId: number | null) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: Rotation) => api.put(`/api/stations/${stationId}/crew-rotation`, body),
    onSuccess: () => invalidateForChange(queryClient, { entity: 'station_settings', id: stationId ?? 0 }),
  });
}

export function useAddSwap(stationId: number | null) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: Swap) => api.post(`/api/stations/${stationId}/crew-swaps`, body),
    onSuccess: () => invalidateForChange(queryClient, { entity: 'station_settings', id: stationId ?? 0 }),
  });
}
