import { format } from 'date-fns';
import { CartesianGrid, Legend, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { checkCatalog, type CheckKey } from '../../../../shared/calc/check-catalog';
import { convertForDisplay, type DisplayPreferences } from '../../../../shared/display';
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
      const t = Date.parse(p.t);
      const shown = convertForDisplay(p.v, quantity, prefs);
      unit = shown.unit;
      const row = byTime.get(t) ?? ({ t } as ChartRow);
      row[series.parameter] = shown.value;
      byTime.set(t, row);
    }
  }
  return { rows: [...byTime.values()].sort((a, b) => a.t - b.t), unit };
}

export function TrendChart({ data, prefs, parameters }: { data: TrendResponse; prefs: DisplayPreferences; parameters: CheckKey[] }) {
  const { rows, unit } = toRows(data, prefs);
  const first = parameters[0]!;
  const quantity = checkCatalog[first].quantity;
  const shown = (v: number | null | undefined) => (v == null ? undefined : convertForDisplay(v, quantity, prefs).value);
  return (
    <div className="h-96 w-full rounded-lg border border-line bg-panel p-2" role="img" aria-label={`Trend of ${parameters.map((p) => checkCatalog[p].label).join(', ')} in ${unit}`}>
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={rows} margin={{ top: 10, right: 20, bottom: 10, left: 10 }}>
          <CartesianGrid stroke="var(--c-line)" strokeOpacity={0.4} />
          <XAxis dataKey="t" type="number" domain={['dataMin', 'dataMax']} scale="time" tickFormatter={(t: number) => format(new Date(t), 'MM-dd HH:mm')} stroke="var(--c-muted)" />
          <YAxis stroke="var(--c-muted)" label={{ value: unit, angle: -90, position: 'insideLeft', fill: 'var(--c-muted)' }} domain={['auto', 'auto']} />
          <Tooltip labelFormatter={(t) => format(new Date(Number(t)), 'yyyy-MM-dd HH:mm')} formatter={(v) => `${Number(v).toFixed(3)} ${unit}`} contentStyle={{ background: 'var(--c-panel)' }} />
          <Legend />
          {/* Limit bands of the first parameter, each over the period its version was in force. */}
          {data.limitBands.flatMap((band, i) => {
            const limits = band.bands[first];
            if (!limits) return [];
            const x1 = Date.parse(band.from);
            const x2 = Date.parse(band.to);
            const areas = [];
            if (limits.highWatch != null) areas.push(<ReferenceArea key={`hw${i}`} x1={x1} x2={x2} y1={shown(limits.highWatch)} y2={shown(limits.highAlarm) ?? undefined} fill="var(--c-watch)" fillOpacity={0.12} ifOverflow="hidden" label={{ value: '▲ watch', position: 'insideTopLeft', fill: 'var(--c-watch)', fontSize: 11 }} />);
            if (limits.highAlarm != null) areas.push(<ReferenceArea key={`ha${i}`} x1={x1} x2={x2} y1={shown(limits.highAlarm)} fill="var(--c-alarm)" fillOpacity={0.12} ifOverflow="hidden" label={{ value: '◆ alarm', position: 'insideTopLeft', fill: 'var(--c-alarm)', fontSize: 11 }} />);
            if (limits.lowWatch != null) areas.push(<ReferenceArea key={`lw${i}`} x1={x1} x2={x2} y1={shown(limits.lowAlarm) ?? undefined} y2={shown(limits.lowWatch)} fill="var(--c-watch)" fillOpacity={0.12} ifOverflow="hidden" />);
            if (limits.lowAlarm != null) areas.push(<ReferenceArea key={`la${i}`} x1={x1} x2={x2} y2={shown(limits.lowAlarm)} fill="var(--c-alarm)" fillOpacity={0.12} ifOverflow="hidden" />);
            return areas;
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
