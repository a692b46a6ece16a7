import type { Status } from '../../../shared/calc/limits';

type Point = { t: string; value: number; status: Status };

/** A small trend line by time, drawn inline: the board and the print view stay free of chart libraries. */
export function Sparkline({ points, label, width = 120, height = 32 }: { points: Point[]; label: string; width?: number; height?: number }) {
  if (!points.length) return <span className="text-xs text-muted">no trend</span>;
  const times = points.map((p) => Date.parse(p.t));
  const values = points.map((p) => p.value);
  const [t0, t1] = [Math.min(...times), Math.max(...times)];
  const [v0, v1] = [Math.min(...values), Math.max(...values)];
  const pad = 3;
  // A flat line or a single round sits in the middle rather than dividing by zero.
  const x = (t: number) => (t1 === t0 ? width / 2 : pad + ((t - t0) / (t1 - t0)) * (width - 2 * pad));
  const y = (v: number) => (v1 === v0 ? height / 2 : height - pad - ((v - v0) / (v1 - v0)) * (height - 2 * pad));
  const line = points.map((p, i) => `${x(times[i]!).toFixed(1)},${y(p.value).toFixed(1)}`).join(' ');
  const last = points.length - 1;
  return (
    <svg role="img" aria-label={`${label}: trend of ${points.length} ${points.length === 1 ? 'round' : 'rounds'}`} width={width} height={height} viewBox={`0 0 ${width} ${height}`} className="shrink-0 text-accent">
      {points.length > 1 ? <polyline points={line} fill="none" stroke="currentColor" strokeWidth="1.5" strokeLinejoin="round" /> : null}
      {points.map((p, i) =>
        p.status === 'watch' || p.status === 'alarm' ? (
          <rect key={i} x={x(times[i]!) - 2.5} y={y(p.value) - 2.5} width="5" height="5" className={p.status === 'alarm' ? 'fill-alarm' : 'fill-watch'} />
        ) : null,
      )}
      <circle cx={x(times[last]!)} cy={y(values[last]!)} r="2.5" fill="currentColor" />
    </svg>
  );
}
