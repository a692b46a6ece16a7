import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CondenserDesignSi } from '../../../shared/calc/evaluate';
import type { LimitSet } from '../../../shared/calc/limits';
import type { PlausibleRanges } from '../../../shared/calc/plausibility';
import { api } from '../../lib/api-client';

export const calcKeys = {
  all: ['calc'] as const,
  design: (unitId: number) => [...calcKeys.all, 'design', unitId] as const,
};

export type DesignAndLimits = { design: CondenserDesignSi; limits: LimitSet; plausible: PlausibleRanges };

export const getCondenserDesign = (unitId: number) => api.get<DesignAndLimits>(`/api/calc/units/${unitId}/condenser-design`);

export const condenserDesignQueryOptions = (unitId: number) =>
  queryOptions({ queryKey: calcKeys.design(unitId), queryFn: () => getCondenserDesign(unitId), staleTime: 5 * 60_000 });

export const useCondenserDesign = (unitId: number | null) =>
  useQuery({ ...condenserDesignQueryOptions(unitId ?? 0), enabled: unitId !== null });
