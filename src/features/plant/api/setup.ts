import { useCallback, useState } from 'react';
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

export type VersionKind = 'design' | 'limits' | 'plausible';
/** Told the version a save created, before the page refetches: the page redraws its forms for the new version, so the form itself cannot hold the confirmation. */
export type OnVersionSaved = (kind: VersionKind, versionId: number) => void;

export function useChangeSetup(unitId: number, onVersionSaved?: OnVersionSaved) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (change: Change) => {
      if (change.kind === 'design') return api.post<{ versionId: number }>(`/api/plant/units/${unitId}/design-versions`, { design: change.design, note: change.note });
      if (change.kind === 'limits') return api.post<{ versionId: number }>(`/api/plant/units/${unitId}/limit-versions`, { limits: change.limits, note: change.note });
      if (change.kind === 'plausible') return api.post<{ versionId: number }>(`/api/plant/units/${unitId}/plausible-range-versions`, { ranges: change.ranges, note: change.note });
      return api.post<{ versionId?: number }>(`/api/plant/units/${unitId}/equipment`, change.equipment);
    },
    onSuccess: (result, change) => {
      if (change.kind !== 'equipment' && typeof result.versionId === 'number') onVersionSaved?.(change.kind, result.versionId);
      return invalidateForChange(queryClient, { entity: 'plant', id: unitId, unitId });
    },
  });
}

/**
 * The versions this person saved on this page: a form says “Saved” while the version in force is the one
 * they saved. Version ids are unique across units, so another unit's in-force version never matches.
 */
export function useVersionsSavedHere() {
  const [versions, setVersions] = useState<Partial<Record<VersionKind, number>>>({});
  const onVersionSaved = useCallback<OnVersionSaved>((kind, versionId) => setVersions((v) => ({ ...v, [kind]: versionId })), []);
  return { versions, onVersionSaved };
}
