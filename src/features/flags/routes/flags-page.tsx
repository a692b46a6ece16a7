import { useState } from 'react';
import { can } from '../../../../shared/policies/permissions';
import { checkCatalog, checkKeys } from '../../../../shared/calc/check-catalog';
import { UnitPicker, useSelectedUnit } from '../../../components/readings/unit-picker';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { FilterSelect } from '../../../components/ui/filter-select';
import { ZoneNote } from '../../../components/station-time/zone-note';
import { stationDayStart } from '../../../../shared/station-time';
import { useMe } from '../../session';
import { useFlags, type FlagFilters } from '../api/flags';
import { FlagCard } from '../components/flag-card';
import { RaiseFlagForm } from '../components/raise-flag-form';
import { useWatchUnit } from '../../../app/use-live-updates';

const selectClass = 'rounded-md border border-line bg-field px-2 py-1';
const severityOptions = [
  { value: 'watch', label: 'Watch' },
  { value: 'alarm', label: 'Alarm' },
];
const parameterOptions = checkKeys.map((k) => ({ value: k, label: checkCatalog[k].label }));

export function FlagsPage() {
  const { data: me } = useMe();
  const { unitId, unit } = useSelectedUnit();
  useWatchUnit(unitId);
  const [filters, setFilters] = useState<FlagFilters>({ status: 'open' });
  const flags = useFlags(unitId, filters);
  const mayLead = Boolean(me && can(me.role, 'flag.manage'));
  const set = (patch: Partial<FlagFilters>) => setFilters((f) => ({ ...f, ...patch }));
  // A station day runs from its midnight to the next (23 or 25 hours on clock-change days).
  const dayStart = (date: string, addDays = 0) => (date && unit ? stationDayStart(date, unit.timeZone, addDays)?.toISOString() : undefined);
  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <h1 className="text-2xl font-bold">Flags</h1>
          <p className="text-muted">{unit ? `${unit.name} · ` : ''}readings and checks outside their limits, and those a shift lead has flagged.</p>
          <ZoneNote zone={unit} />
        </div>
        <UnitPicker />
      </div>
      <CautionNote />
      {mayLead && unitId ? <RaiseFlagForm unitId={unitId} /> : null}
      <fieldset className="flex flex-wrap gap-3 rounded-lg border border-line bg-panel p-3 text-sm">
        <legend className="font-bold">Show</legend>
        <FilterSelect
          label="Status"
          value={filters.status}
          options={[
            { value: 'open', label: 'Open' },
            { value: 'cleared', label: 'Cleared' },
            { value: 'all', label: 'All' },
          ]}
          onChange={(v) => set({ status: (v ?? 'open') as FlagFilters['status'] })}
        />
        <FilterSelect label="Severity" anyLabel="Any" value={filters.severity} options={severityOptions} onChange={(v) => set({ severity: v })} />
        <FilterSelect label="Parameter" anyLabel="Any" value={filters.parameter} options={parameterOptions} onChange={(v) => set({ parameter: v })} />
        <label className="flex flex-col">
          Raised from (station day)
          <input type="date" className={selectClass} onChange={(e) => set({ from: dayStart(e.target.value) })} />
        </label>
        <label className="flex flex-col">
          Raised to (station day)
          <input type="date" className={selectClass} onChange={(e) => set({ to: dayStart(e.target.value, 1) })} />
        </label>
      </fieldset>
      {flags.error ? <Notice kind="error">{flags.error.message}</Notice> : null}
      {flags.data && flags.data.length === 0 ? <Notice kind="info">No flags match.</Notice> : null}
      <div className="flex flex-col gap-3">
        {unit
          ? flags.data?.map((flag) => (
              <FlagCard key={flag.id} flag={flag} mayLead={mayLead} timeZone={unit.timeZone} />
            ))
          : null}
      </div>
    </section>
  );
}
