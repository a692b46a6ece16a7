import { CartesianGrid, Legend, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { checkCatalog, type CheckKey } from '../../../../shared/calc/check-catalog';
import { convertForDisplay, type DisplayPreferences } from '../../../../shared/display';
import { formatStationTime } from '../../../../shared/station-time';
import type { TrendResponse } from '../api/get-trend';

const lineColours = ['var(--c-accent)', 'var(--c-ink)', 'var(--c-muted)', 'var(--c-focus)'];
const dashes = ['0', '6 3', '2 2', '8 2 2 2']; // told apart by dash as well as colour

export type ChartRow = { t: number } & Record<string, number>;

/** The column of a parameter's points outside the plausible range (their true value). */
export const outsideKey = (parameter: string) => `${parameter}~outside`;
/** The same points pinned to the edge of the scale, where they are drawn. */
const edgeKey = (parameter: string) => `${parameter}~edge`;

/**
 * Rows keyed by time with one column per parameter, in display units. A point outside the plausible
 * range goes in a column of its own, so one bad reading cannot stretch the axis.
 */
export function toRows(data: TrendResponse, prefs: DisplayPreferences): { rows: ChartRow[]; unit: string; outside: number } {
  const byTime = new Map<number, ChartRow>();
  let unit = '';
  let outside = 0;
  for (const series of data.series) {
    const quantity = checkCatalog[series.parameter as CheckKey].quantity;
    for (const p of series.points) {
      const t = p.t;
      const shown = convertForDisplay(p.v, quantity, prefs);
      unit = shown.unit;
      const row = byTime.get(t) ?? ({ t } as ChartRow);
      if (p.o) {
        row[outsideKey(series.parameter)] = shown.value;
        outside += 1;
      } else row[series.parameter] = shown.value;
      byTime.set(t, row);
    }
  }
  return { rows: [...byTime.values()].sort((a, b) => a.t - b.t), unit, outside };
}

/** The scale from plausible points only (from the others when there is nothing else to show). */
export function valueScale(rows: ChartRow[], parameters: string[]): { yMin: number; yMax: number } {
  const pick = (key: (p: string) => string) => rows.flatMap((r) => parameters.map((p) => r[key(p)]).filter((v): v is number => typeof v === 'number'));
  const plausible = pick((p) => p);
  const values = plausible.length ? plausible : pick(outsideKey);
  const span = Math.max(...values) - Math.min(...values) || Math.abs(values[0] ?? 1) * 0.1 || 1;
  return { yMin: Math.min(...values) - span * 0.08, yMax: Math.max(...values) + span * 0.08 };
}

/** A hollow diamond: the same mark the round list uses for "outside plausible range". */
function OutsideMark(props: { cx?: number; cy?: number; stroke?: string }) {
  const { cx, cy } = props;
  if (cx == null || cy == null) return null;
  return <path d={`M${cx},${cy - 6} L${cx + 6},${cy} L${cx},${cy + 6} L${cx - 6},${cy} Z`} fill="var(--c-panel)" stroke="var(--c-watch)" strokeWidth={2} />;
}

export function TrendChart({ data, prefs, parameters, timeZone }: { data: TrendResponse; prefs: DisplayPreferences; parameters: CheckKey[]; timeZone: string }) {
  const { rows, unit, outside } = toRows(data, prefs);
  const first = parameters[0]!;
  const quantity = checkCatalog[first].quantity;
  const shown = (v: number | null | undefined) => (v == null ? undefined : convertForDisplay(v, quantity, prefs).value);
  const { yMin, yMax } = valueScale(rows, parameters);
  for (const row of rows) {
    for (const p of parameters) {
      const value = row[outsideKey(p)];
      if (value !== undefined) row[edgeKey(p)] = Math.min(Math.max(value, yMin), yMax);
    }
  }
  const xMin = rows[0]?.t ?? 0;
  const xMax = rows.at(-1)?.t ?? 0;
  return (
    <div className="flex flex-col gap-1">
      <div className="h-96 w-full rounded-lg border border-line bg-panel p-2" role="img" aria-label={`Trend of ${parameters.map((p) => checkCatalog[p].label).join(', ')} in ${unit}`}>
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={rows} margin={{ top: 10, right: 20, bottom: 10, left: 10 }}>
            <CartesianGrid stroke="var(--c-line)" strokeOpacity={0.4} />
            <XAxis dataKey="t" type="number" domain={['dataMin', 'dataMax']} scale="time" tickFormatter={(t: number) => formatStationTime(t, timeZone).slice(5, 16)} stroke="var(--c-muted)" />
            <YAxis stroke="var(--c-muted)" label={{ value: unit, angle: -90, position: 'insideLeft', fill: 'var(--c-muted)' }} domain={[yMin, yMax]} tickFormatter={(v: number) => Number(v.toPrecision(3)).toString()} />
            <Tooltip
              labelFormatter={(t) => `${formatStationTime(Number(t), timeZone)} station time`}
              formatter={(v, _name, item) => {
                // A point drawn at the edge shows its true value.
                const key = String(item.dataKey ?? '');
                const real = key.endsWith('~edge') ? (item.payload as ChartRow)[outsideKey(key.slice(0, -'~edge'.length))] : Number(v);
                return `${Number(real).toFixed(3)} ${unit}${key.endsWith('~edge') ? ' (outside plausible range)' : ''}`;
              }}
              contentStyle={{ background: 'var(--c-panel)' }}
            />
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
            {outside
              ? parameters.map((p) => (
                  <Line key={edgeKey(p)} dataKey={edgeKey(p)} name={`${checkCatalog[p].label} — outside plausible range`} stroke="var(--c-watch)" strokeWidth={0} dot={<OutsideMark />} activeDot={false} legendType="diamond" isAnimationActive={false} />
                ))
              : null}
          </LineChart>
        </ResponsiveContainer>
      </div>
      {outside ? (
        <p className="text-sm" data-testid="trend-outside-plausible">
          <span aria-hidden="true">◇ </span>
          {outside} {outside === 1 ? 'point lies' : 'points lie'} outside the unit’s plausible range: kept off the scale and drawn at its edge (hover for the value).
        </p>
      ) : null}
    </div>
  );
}
