import { useMemo, useState } from 'react';
import Papa from 'papaparse';
import { checkCatalog, checkKeys, type CheckKey } from '../../../../shared/calc/check-catalog';
import { convertForDisplay, type DisplayPreferences } from '../../../../shared/display';
import { UnitPicker, useSelectedUnit } from '../../../components/readings/unit-picker';
import { Button } from '../../../components/ui/button';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { useTrend } from '../api/get-trend';
import { TrendChart } from '../components/trend-chart';
import { useWatchUnit } from '../../../app/use-live-updates';
import { ZoneNote } from '../../../components/station-time/zone-note';
import { formatStationTime } from '../../../../shared/station-time';

const views: { label: string; parameters: CheckKey[] }[] = [
  { label: 'Actual vs expected backpressure', parameters: ['backpressure', 'expectedBackpressure'] },
  { label: 'Cleanliness factor', parameters: ['cleanlinessFactor'] },
  { label: 'Output lost to backpressure deviation', parameters: ['deviationCostPower'] },
  ...checkKeys.map((key) => ({ label: checkCatalog[key].label, parameters: [key] })),
];
const ranges = [
  { label: 'Last 24 hours', days: 1 },
  { label: 'Last 7 days', days: 7 },
  { label: 'Last 30 days', days: 30 },
  { label: 'Last 90 days', days: 90 },
  { label: 'Last 365 days', days: 365 },
];
const prefs: DisplayPreferences = { temperature: 'degC', pressure: 'kPa_a', currency: 'EUR' };

export function TrendsPage() {
  const { unitId, unit } = useSelectedUnit();
  useWatchUnit(unitId);
  const [viewIndex, setViewIndex] = useState(0);
  const [days, setDays] = useState(7);
  // The window is fixed when chosen, so the query key (and cache) stays stable between renders.
  const [anchor, setAnchor] = useState(() => Date.now());
  const view = views[viewIndex]!;
  const request = useMemo(
    () => (unitId ? { unitId, parameters: view.parameters, from: new Date(anchor - days * 86_400_000).toISOString(), to: new Date(anchor).toISOString() } : null),
    [unitId, view, days, anchor],
  );
  const trend = useTrend(request);
  const points = trend.data?.series.reduce((n, s) => n + s.points.length, 0) ?? 0;

  const exportCsv = () => {
    if (!trend.data) return;
    const rows = trend.data.series.flatMap((s) =>
      s.points.map((p) => {
        const shown = convertForDisplay(p.v, checkCatalog[s.parameter as CheckKey].quantity, prefs);
        return {
          time_utc: new Date(p.t).toISOString(),
          time_station: unit ? formatStationTime(p.t, unit.timeZone, 'datetime-seconds') : '',
          station_time_zone: unit?.timeZone ?? '',
          parameter: s.parameter,
          value: shown.value,
          unit: shown.unit,
          status: p.s,
          outside_plausible_range: p.o ? 'yes' : '',
        };
      }),
    );
    const blob = new Blob([Papa.unparse(rows)], { type: 'text/csv;charset=utf-8' });
    const link = document.createElement('a');
    link.href = URL.createObjectURL(blob);
    link.download = `${unit?.code ?? 'unit'}-${view.parameters.join('+')}-${days}d.csv`;
    link.click();
    URL.revokeObjectURL(link.href);
  };

  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <h1 className="text-2xl font-bold">Trends</h1>
          <p className="text-muted">{unit ? `${unit.name} · ` : ''}computed checks over time, with the limit bands in force and flags marked.</p>
          <ZoneNote zone={unit} what="Time axis" />
        </div>
        <UnitPicker />
      </div>
      <CautionNote />
      <div className="flex flex-wrap items-end gap-3 rounded-lg border border-line bg-panel p-3 text-sm">
        <label className="flex flex-col">
          Show
          <select className="rounded-md border border-line bg-field px-2 py-1" value={viewIndex} onChange={(e) => setViewIndex(Number(e.target.value))}>
            {views.map((v, i) => (
              <option key={v.label + i} value={i}>
                {v.label}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col">
          Period
          <select
            className="rounded-md border border-line bg-field px-2 py-1"
            value={days}
            onChange={(e) => {
              setDays(Number(e.target.value));
              setAnchor(Date.now());
            }}
          >
            {ranges.map((r) => (
              <option key={r.days} value={r.days}>
                {r.label}
              </option>
            ))}
          </select>
        </label>
        <Button tone="plain" onClick={() => setAnchor(Date.now())}>
          Refresh
        </Button>
        <Button tone="plain" onClick={exportCsv} disabled={!points}>
          Export shown series (CSV)
        </Button>
        <span className="ml-auto text-muted" data-testid="trend-points">
          {points} points
        </span>
      </div>
      {trend.error ? <Notice kind="error">{trend.error.message}</Notice> : null}
      {trend.data && points === 0 ? <Notice kind="info">No readings in this period.</Notice> : null}
      {trend.data && points > 0 && unit ? <TrendChart data={trend.data} prefs={prefs} parameters={view.parameters} timeZone={unit.timeZone} /> : null}
      {trend.data?.limitBands.length ? (
        <p className="text-sm text-muted">
          Shaded: ▲ watch and ◆ alarm bands of {checkCatalog[view.parameters[0]!].label}, as each limit version was in force. Dashed
          verticals: flags raised.
        </p>
      ) : null}
    </section>
  );
}
