import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { LimitSet } from '../../../../shared/calc/limits';
import type { PlausibleRanges } from '../../../../shared/calc/plausibility';
import type { UnitDesign } from '../../../../shared/schemas/plant';
import { api } from '../../../lib/api-client';
import { invalidateForChange } from '../../../app/live-keys';
import { setupKeys } from './setup-keys';
export { setupKeys };

type VersionRow = { id: number; effectiveFrom: string; note: string | null; by: string };
export type UnitSetup = {
  unit: { id: number; code: string; name: string };
  design: { versionId: number; data: UnitDesign };
  limits: { versionId: number; data: LimitSet };
  /** versionId null: the unit has no ranges of its own and the starting ranges apply. */
  plausible: { versionId: number | null; data: PlausibleRanges };
  designHistory: VersionRow[];
  limitHistory: VersionRow[];
  plausibleHistory: VersionRow[];
  equipment: { id: number; kind: string; tag: string; name: string }[];
};

export const setupQueryOptions = (unitId: number) => queryOptions({ queryKey: setupKeys.unit(unitId), queryFn: () => api.get<UnitSetup>(`/api/plant/units/${unitId}/setup`) });
export const useUnitSetup = (unitId: number | null) => useQuery({ ...setupQueryOptions(unitId ?? 0), enabled: unitId !== null });

type Change =
  | { kind: 'design'; design: UnitDesign; note: string }
  | { kind: 'limits'; limits: LimitSet; note: string }
  | { kind: 'plausible'; ranges: PlausibleRanges; note: string }
  | { kind: 'equipment'; equipment: { kind: string; tag: string; name: string } };

export function useChangeSetup(unitId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (change: Change) => {
      if (change.kind === 'design') return api.post(`/api/plant/units/${unitId}/design-versions`, { design: change.design, note: change.note });
      if (change.kind === 'limits') return api.post(`/api/plant/units/${unitId}/limit-versions`, { limits: change.limits, note: change.note });
      if (change.kind === 'plausible') return api.post(`/api/plant/units/${unitId}/plausible-range-versions`, { ranges: change.ranges, note: change.note });
      return api.post(`/api/plant/units/${unitId}/equipment`, change.equipment);
    },
    onSuccess: () => invalidateForChange(queryClient, { entity: 'plant', id: unitId, unitId }),
  });
}
