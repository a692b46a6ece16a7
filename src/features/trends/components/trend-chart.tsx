import { CartesianGrid, Legend, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { checkCatalog, type CheckKey } from '../../../../shared/calc/check-catalog';
import { convertForDisplay, type DisplayPreferences } from '../../../../shared/display';
import { formatStationTime } from '../../../../shared/station-time';
import type { TrendResponse } from '../api/get-trend';

const lineColours = ['var(--c-accent)', 'var(--c-ink)', 'var(--c-muted)', 'var(--c-focus)'];
const dashes = ['0', '6 3', '2 2', '8 2 2 2']; // told apart by dash as well as colour

export type ChartRow = { t: number } & Record<string, number>;

/** Rows keyed by time with one column per parameter, in display units. */
export function toRows(data: TrendResponse, prefs: DisplayPreferences): { rows: ChartRow[]; unit: string } {
  const byTime = new Map<number, ChartRow>();
  let unit = '';
  for (const series of data.series) {
    const quantity = checkCatalog[series.parameter as CheckKey].quantity;
    for (const p of series.points) {
      const t = p.t;
      const shown = convertForDisplay(p.v, quantity, prefs);
      unit = shown.unit;
      const row = byTime.get(t) ?? ({ t } as ChartRow);
      row[series.parameter] = shown.value;
      byTime.set(t, row);
    }
  }
  return { rows: [...byTime.values()].sort((a, b) => a.t - b.t), unit };
}

export function TrendChart({ data, prefs, parameters, timeZone }: { data: TrendResponse; prefs: DisplayPreferences; parameters: CheckKey[]; timeZone: string }) {
  const { rows, unit } = toRows(data, prefs);
  const first = parameters[0]!;
  const quantity = checkCatalog[first].quantity;
  const shown = (v: number | null | undefined) => (v == null ? undefined : convertForDisplay(v, quantity, prefs).value);
  const values = rows.flatMap((r) => parameters.map((p) => r[p]).filter((v): v is number => typeof v === 'number'));
  const span = Math.max(...values) - Math.min(...values) || Math.abs(values[0] ?? 1) * 0.1 || 1;
  const yMin = Math.min(...values) - span * 0.08;
  const yMax = Math.max(...values) + span * 0.08;
  const xMin = rows[0]?.t ?? 0;
  const xMax = rows.at(-1)?.t ?? 0;
  return (
    <div className="h-96 w-full rounded-lg border border-line bg-panel p-2" role="img" aria-label={`Trend of ${parameters.map((p) => checkCatalog[p].label).join(', ')} in ${unit}`}>
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={rows} margin={{ top: 10, right: 20, bottom: 10, left: 10 }}>
          <CartesianGrid stroke="var(--c-line)" strokeOpacity={0.4} />
          <XAxis dataKey="t" type="number" domain={['dataMin', 'dataMax']} scale="time" tickFormatter={(t: number) => formatStationTime(t, timeZone).slice(5, 16)} stroke="var(--c-muted)" />
          <YAxis stroke="var(--c-muted)" label={{ value: unit, angle: -90, position: 'insideLeft', fill: 'var(--c-muted)' }} domain={[yMin, yMax]} tickFormatter={(v: number) => Number(v.toPrecision(3)).toString()} />
          <Tooltip labelFormatter={(t) => `${formatStationTime(Number(t), timeZone)} station time`} formatter={(v) => `${Number(v).toFixed(3)} ${unit}`} contentStyle={{ background: 'var(--c-panel)' }} />
          <Legend />
          {/* Limit bands of the first parameter, each over the period its version was in force,
              clamped to the plotted range so an off-scale limit never floods the chart. */}
          {data.limitBands.flatMap((band, i) => {
            const limits = band.bands[first];
            if (!limits) return [];
            const x1 = Math.max(Date.parse(band.from), xMin);
            const x2 = Math.min(Date.parse(band.to), xMax);
            if (!(x2 > x1)) return [];
            const zones: { key: string; lo: number | undefined; hi: number | undefined; colour: string; label?: string }[] = [
              { key: 'hw', lo: shown(limits.highWatch), hi: shown(limits.highAlarm), colour: 'var(--c-watch)', label: '▲ watch' },
              { key: 'ha', lo: shown(limits.highAlarm), hi: Infinity, colour: 'var(--c-alarm)', label: '◆ alarm' },
              { key: 'lw', lo: shown(limits.lowAlarm), hi: shown(limits.lowWatch), colour: 'var(--c-watch)', label: '▲ watch' },
              { key: 'la', lo: -Infinity, hi: shown(limits.lowAlarm), colour: 'var(--c-alarm)', label: '◆ alarm' },
            ];
            return zones.flatMap((z) => {
              const lo = Math.max(z.lo ?? (z.key === 'lw' ? -Infinity : NaN), yMin);
              const hi = Math.min(z.hi ?? (z.key === 'hw' ? Infinity : NaN), yMax);
              if (!(hi > lo)) return [];
              return [
                <ReferenceArea key={`${z.key}${i}`} x1={x1} x2={x2} y1={lo} y2={hi} ifOverflow="hidden" fill={z.colour} fillOpacity={0.14} label={z.label ? { value: z.label, position: 'insideTopLeft', fill: z.colour, fontSize: 11 } : undefined} />,
              ];
            });
          })}
          {data.flags.map((flag) => (
            <ReferenceLine key={flag.id} x={Date.parse(flag.raisedAt)} stroke={flag.severity === 'alarm' ? 'var(--c-alarm)' : 'var(--c-watch)'} strokeDasharray="4 2" ifOverflow="hidden" label={{ value: flag.severity === 'alarm' ? '◆' : '▲', position: 'top' }} />
          ))}
          {parameters.map((p, i) => (
            <Line key={p} dataKey={p} name={checkCatalog[p].label} stroke={lineColours[i]} strokeDasharray={dashes[i]} dot={rows.length < 60} isAnimationActive={false} connectNulls />
          ))}
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}
