import { useSearchParams } from 'react-router';
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UnitSummary } from '../../../shared/schemas/plant';
import { api } from '../../lib/api-client';

export type { UnitSummary };
/** Units with their stations and station time zones: stale when plant or station settings change. */
export const unitKeys = { all: ['plant', 'units'] as const };
export const unitsQueryOptions = () =>
  queryOptions({ queryKey: unitKeys.all, queryFn: async () => (await api.get<{ units: UnitSummary[] }>('/api/plant/units')).units, staleTime: 5 * 60_000 });
export const useUnitList = () => useQuery(unitsQueryOptions());

const REMEMBERED = 'hotwell.unit';
/** The unit this browser last chose, so a page opened without ?unit= starts there, not on the first unit. */
export function rememberedUnitId(): number | null {
  try {
    const id = Number(localStorage.getItem(REMEMBERED));
    return Number.isInteger(id) && id > 0 ? id : null;
  } catch {
    return null;
  }
}
function rememberUnit(id: number) {
  try {
    localStorage.setItem(REMEMBERED, String(id));
  } catch {
    // private mode: the address still carries the unit
  }
}

/** The unit a page shows, kept in the address (?unit=) so a link, a reload or the menu keeps it. */
export function useSelectedUnit() {
  const [params] = useSearchParams();
  const units = useUnitList();
  const requested = Number(params.get('unit'));
  const remembered = rememberedUnitId();
  const known = (id: number | null) => (id !== null && units.data?.some((u) => u.id === id) ? id : null);
  const unitId = Number.isInteger(requested) && requested > 0 ? requested : (known(remembered) ?? units.data?.[0]?.id ?? null);
  return { unitId, unit: units.data?.find((u) => u.id === unitId) ?? null, units: units.data ?? [] };
}

export function UnitPicker() {
  const [params, setParams] = useSearchParams();
  const { unitId, units } = useSelectedUnit();
  return (
    <label className="ml-auto flex flex-col text-sm">
      Unit
      <select
        className="rounded-md border border-line bg-field px-2 py-1"
        value={unitId ?? ''}
        onChange={(e) => {
          const next = new URLSearchParams(params);
          next.set('unit', e.target.value);
          rememberUnit(Number(e.target.value));
          setParams(next);
        }}
      >
        {units.map((u) => (
          <option key={u.id} value={u.id}>
            {u.name} · {u.station}
          </option>
        ))}
      </select>
    </label>
  );
}
