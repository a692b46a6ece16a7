import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { StationSettings } from '../../../../shared/schemas/log';
import { api } from '../../../lib/api-client';
import { invalidateForChange } from '../../../app/live-keys';

export const stationSettingsKeys = {
  all: ['station-settings'] as const,
  station: (stationId: number) => [...stationSettingsKeys.all, stationId] as const,
};

export const getStationSettings = async (stationId: number) => (await api.get<{ settings: StationSettings }>(`/api/stations/${stationId}/settings`)).settings;

export const stationSettingsQueryOptions = (stationId: number) => queryOptions({ queryKey: stationSettingsKeys.station(stationId), queryFn: () => getStationSettings(stationId) });

export const useStationSettings = (stationId: number | null) => useQuery({ ...stationSettingsQueryOptions(stationId ?? 0), enabled: stationId !== null });

export function useSaveStationSettings(stationId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (settings: StationSettings) => (await api.put<{ settings: StationSettings }>(`/api/stations/${stationId}/settings`, settings)).settings,
    // Shift times, the round interval and the zone reach the log's shifts, the board, units' zones and the overview:
    // the same keys the live event makes stale in other browsers.
    onSuccess: () => invalidateForChange(queryClient, { entity: 'station_settings', id: stationId }),
  });
}
