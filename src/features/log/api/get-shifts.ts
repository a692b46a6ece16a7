// The unit's recent shifts on its own, so the shifts page (through the feature's index) does not pull the log's code into the entry chunk.
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ShiftsView } from './log';
import { logKeys } from './log-keys';

export const useShifts = (unitId: number | null) =>
  useQuery({ queryKey: logKeys.shifts(unitId ?? 0), queryFn: () => api.get<ShiftsView>(`/api/units/${unitId}/log/shifts`), enabled: unitId !== null });
