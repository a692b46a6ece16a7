import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Quantity } from '../../../../shared/calc/check-catalog';
import type { AssignFlagInput, ClearFlagInput, RaiseFlagInput } from '../../../../shared/schemas/flags';
import { api } from '../../../lib/api-client';
import { flagKeys } from './flag-keys';
export { flagKeys };

export type FlagView = {
  id: number;
  unitId: number;
  parameter: string;
  parameterLabel: string;
  quantity: Quantity | null;
  origin: 'automatic' | 'manual';
  severity: 'watch' | 'alarm';
  status: 'open' | 'cleared';
  lastValue: number | null;
  lastReadingSetId: number | null;
  raisedAt: string;
  lastSeenAt: string;
  raisedBy: string | null;
  comment: string | null;
  assignedTo: string | null;
  followUp: string | null;
  clearedBy: string | null;
  clearedAt: string | null;
  clearComment: string | null;
  version: number;
};

export type FlagFilters = { status: 'open' | 'cleared' | 'all'; severity?: string; parameter?: string; from?: string; to?: string };


function query(filters: FlagFilters) {
  const params = new URLSearchParams({ status: filters.status });
  for (const key of ['severity', 'parameter', 'from', 'to'] as const) if (filters[key]) params.set(key, filters[key]!);
  return params.toString();
}

export const flagsQueryOptions = (unitId: number, filters: FlagFilters) =>
  queryOptions({
    queryKey: flagKeys.list(unitId, filters),
    queryFn: async () => (await api.get<{ flags: FlagView[] }>(`/api/units/${unitId}/flags?${query(filters)}`)).flags,
  });
export const useFlags = (unitId: number | null, filters: FlagFilters) => useQuery({ ...flagsQueryOptions(unitId ?? 0, filters), enabled: unitId !== null });

type FlagAction =
  | { kind: 'raise'; unitId: number; input: RaiseFlagInput }
  | { kind: 'assign'; id: number; input: AssignFlagInput }
  | { kind: 'clear'; id: number; input: ClearFlagInput };

export function useFlagAction() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (action: FlagAction) => {
      if (action.kind === 'raise') return (await api.post<{ flag: FlagView }>(`/api/units/${action.unitId}/flags`, action.input)).flag;
      return (await api.post<{ flag: FlagView }>(`/api/flags/${action.id}/${action.kind}`, action.input)).flag;
    },
    onSettled: () => void queryClient.invalidateQueries({ queryKey: flagKeys.all }),
  });
}
