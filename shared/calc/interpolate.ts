import { CalcInputError } from './input-error';

/** Linear interpolation in a table of [x, y] points sorted by x. Never extrapolates. */
export function interpolate(points: readonly (readonly [number, number])[], x: number): number {
  if (points.length < 2) throw new CalcInputError('table', 'needs at least two points');
  const first = points[0]!;
  const last = points[points.length - 1]!;
  if (x < first[0] || x > last[0]) {
    throw new CalcInputError('table', `${x} is outside the table (${first[0]}–${last[0]})`);
  }
  for (let i = 1; i < points.length; i++) {
    const [x1, y1] = points[i]!;
    const [x0, y0] = points[i - 1]!;
    if (x <= x1) return x1 === x0 ? y1 : y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
  }
  return last[1];
}

/** True when x lies within the table's first and last x. */
export const withinTable = (points: readonly (readonly [number, number])[], x: number) =>
  points.length >= 2 && x >= points[0]![0] && x <= points[points.length - 1]![0];
