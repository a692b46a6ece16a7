// A station's settings as other pages read them, apart from the setting page's save, so the feature's index
// (reached from the entry chunk for its keys) stays light.
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StationSettings } from '../../../../shared/schemas/log';
import { api } from '../../../lib/api-client';

export const stationSettingsKeys = {
  all: ['station-settings'] as const,
  station: (stationId: number) => [...stationSettingsKeys.all, stationId] as const,
};

export const getStationSettings = async (stationId: number) => (await api.get<{ settings: StationSettings }>(`/api/stations/${stationId}/settings`)).settings;

export const stationSettingsQueryOptions = (stationId: number) => queryOptions({ queryKey: stationSettingsKeys.station(stationId), queryFn: () => getStationSettings(stationId) });

export const useStationSettings = (stationId: number | null) => useQuery({ ...stationSettingsQueryOptions(stationId ?? 0), enabled: stationId !== null });
