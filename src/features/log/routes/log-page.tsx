import { useState } from 'react';
import { can } from '../../../../shared/policies/permissions';
import { UnitPicker, useSelectedUnit } from '../../../components/readings/unit-picker';
import { Notice } from '../../../components/ui/notice';
import { ZoneNote } from '../../../components/station-time/zone-note';
import { FilterSelect, keyedOptions } from '../../../components/ui/filter-select';
import { useWatchUnit } from '../../../app/use-live-updates';
import { useMe } from '../../session';
import { useLog, useShifts, useSignReview, type LogFilters } from '../api/log';
import { ConditionsPanel } from '../components/conditions-panel';
import { EntryBar } from '../components/entry-bar';
import { EntryList } from '../components/entry-list';
import { Button } from '../../../components/ui/button';
import { WaitingRecords, type QueuedRecord } from '../../offline';

const field = 'rounded-md border border-line bg-field px-2 py-1';

export function LogPage() {
  const { data: me } = useMe();
  const { unitId, unit } = useSelectedUnit();
  useWatchUnit(unitId);
  const shifts = useShifts(unitId);
  const settings = shifts.data?.settings;
  const [position, setPosition] = useState<string | null>(null);
  const activePosition = position ?? me?.position ?? settings?.positions[0]?.key ?? '';
  const [filters, setFilters] = useState<LogFilters>({});
  const [fixing, setFixing] = useState<QueuedRecord | null>(null);
  const log = useLog(unitId, filters);
  const review = useSignReview(unitId ?? 0);
  const mayWrite = me && can(me.role, 'log.write');
  const reviewShift = filters.shiftStart ?? shifts.data?.shifts[1]?.start ?? shifts.data?.shifts[0]?.start;
  const reviewPosition = filters.position ?? activePosition;
  const signed = shifts.data?.reviews.find((r) => r.shiftStart === reviewShift && r.position === reviewPosition);
  const set = (patch: Partial<LogFilters>) => setFilters((f) => ({ ...f, ...patch }));

  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <h1 className="text-2xl font-bold">Shift log</h1>
          <p className="text-muted">{unit ? `${unit.name} · ` : ''}a running record of what changed and why. Entries are never changed or removed; corrections are amendments.</p>
          {settings && unit ? <ZoneNote zone={{ timeZone: settings.timeZone, station: unit.station }} /> : null}
        </div>
        <UnitPicker />
      </div>
      <aside className="rounded-md border border-watch bg-panel px-4 py-2 text-sm" aria-label="Caution">
        <strong>Caution — </strong>the log is a record and an aid, not an alarm or protection system. Report urgent conditions by the plant’s
        own means first.
      </aside>
      {settings && unitId ? (
        <div className="grid grid-cols-1 gap-4 lg:grid-cols-3">
          <div className="flex min-w-0 flex-col gap-4 lg:col-span-2">
            {mayWrite ? (
              <>
                <label className="flex flex-wrap items-center gap-2 text-sm font-bold">
                  Writing as
                  <select className={field} value={activePosition} onChange={(e) => setPosition(e.target.value)}>
                    {settings.positions.map((p) => (
                      <option key={p.key} value={p.key}>
                        {p.label}
                      </option>
                    ))}
                  </select>
                </label>
                <EntryBar unitId={unitId} settings={settings} position={activePosition} fixing={fixing} onFixed={() => setFixing(null)} />
              </>
            ) : null}
            {me ? <WaitingRecords kind="log_entry" unitId={unitId} userId={me.id} timeZone={settings.timeZone} onFix={setFixing} /> : null}
            <fieldset className="flex flex-wrap gap-2 rounded-lg border border-line bg-panel p-2 text-sm">
              <legend className="font-bold">Show</legend>
              <FilterSelect
                label="Shift"
                anyLabel="All recent"
                value={filters.shiftStart}
                options={(shifts.data?.shifts ?? []).map((s) => ({ value: s.start, label: `from ${s.label}` }))}
                onChange={(v) => set({ shiftStart: v })}
              />
              <FilterSelect label="Position" anyLabel="All" value={filters.position} options={keyedOptions(settings.positions)} onChange={(v) => set({ position: v })} />
              <FilterSelect label="Category" anyLabel="All" value={filters.category} options={keyedOptions(settings.categories)} onChange={(v) => set({ category: v })} />
              <FilterSelect
                label="Author"
                anyLabel="Anyone"
                value={filters.authorId}
                options={[...new Map((log.data ?? []).map((e) => [e.authorId, e.author])).entries()].map(([id, name]) => ({ value: id, label: name }))}
                onChange={(v) => set({ authorId: v ? Number(v) : undefined })}
              />
            </fieldset>
            {log.error ? <Notice kind="error">{log.error.message}</Notice> : null}
            {log.data ? <EntryList entries={log.data} settings={settings} /> : null}
          </div>
          <div className="flex flex-col gap-4">
            <section aria-label="End-of-shift review" className="rounded-lg border border-line bg-panel p-3 text-sm">
              <h2 className="font-bold">End-of-shift review</h2>
              <p>
                Shift from {shifts.data?.shifts.find((s) => s.start === reviewShift)?.label} (station time, {settings.timeZone}),{' '}
                {settings.positions.find((p) => p.key === reviewPosition)?.label}.
              </p>
              {signed ? (
                <p className="font-bold text-normal" data-testid="review-signed">
                  ✔ Reviewed by {signed.by}
                </p>
              ) : me && can(me.role, 'log.review') && reviewShift ? (
                <Button size="sm" className="mt-1" onClick={() => review.mutate({ position: reviewPosition, shiftStart: reviewShift })}>
                  Sign as reviewed
                </Button>
              ) : (
                <p className="text-muted">Not yet reviewed. The shift lead signs it.</p>
              )}
              {review.error ? <p role="alert" className="text-alarm">⚠ {review.error.message}</p> : null}
            </section>
            <ConditionsPanel unitId={unitId} position={activePosition} mayHandle={Boolean(me && can(me.role, 'condition.manage'))} />
          </div>
        </div>
      ) : null}
    </section>
  );
}
