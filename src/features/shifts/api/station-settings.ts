import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StationSettings } from '../../../../shared/schemas/log';
import { api } from '../../../lib/api-client';
import { invalidateForChange } from '../../../app/live-keys';

import { stationSettingsKeys, useStationSettings } from './station-settings-query';

export { stationSettingsKeys, useStationSettings };

export function useSaveStationSettings(stationId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (settings: StationSettings) => (await api.put<{ settings: StationSettings }>(`/api/stations/${stationId}/settings`, settings)).settings,
    // Shift times, the round interval and the zone reach the log's shifts, the board, units' zones and the overview:
    // the same keys the live event makes stale in other browsers.
    onSuccess: () => invalidateForChange(queryClient, { entity: 'station_settings', id: stationId }),
  });
}
