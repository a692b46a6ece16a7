// Energy (or money) lost over a shift from rates sampled at each round. Rounds are minutes to
// hours apart, so the rule is stated plainly and kept conservative:
//   - between two rounds that both have the rate: trapezoid, (r₁ + r₂)/2 · Δt;
//   - a round without the rate breaks the line: the intervals on either side of it count nothing;
//   - after the last round of the window: its rate held flat until `until` (if it has one);
//   - before the first round of the window: nothing (no extrapolation backwards into the shift).
// Signed: a negative rate (running better than expected) reduces the total.
import { CalcInputError, requireFinite } from './input-error';

/** One sample: t in epoch milliseconds; `rate` per second of whatever is integrated (W, money/s). */
export type RateSample = { t: number; rate: number | null };

export type Integral = {
  /** ∫ rate dt in rate·seconds */
  total: number;
  /** seconds of the window that the total covers */
  coveredSeconds: number;
  /** samples that carried a rate */
  samplesUsed: number;
};

export function integrateRate(samples: readonly RateSample[], from: number, until: number): Integral {
  requireFinite('shift start', from);
  requireFinite('until', until);
  if (until < from) throw new CalcInputError('until', 'must not be before the shift start');
  const inside = samples
    .filter((s) => Number.isFinite(s.t) && s.t >= from && s.t <= until)
    .map((s) => ({ t: s.t, rate: s.rate !== null && Number.isFinite(s.rate) ? s.rate : null }))
    .sort((a, b) => a.t - b.t);
  let total = 0;
  let coveredMs = 0;
  for (let i = 0; i + 1 < inside.length; i++) {
    const a = inside[i]!;
    const b = inside[i + 1]!;
    if (a.rate === null || b.rate === null) continue;
    const dtMs = b.t - a.t;
    total += ((a.rate + b.rate) / 2) * (dtMs / 1000);
    coveredMs += dtMs;
  }
  const last = inside.at(-1);
  if (last && last.rate !== null) {
    total += last.rate * ((until - last.t) / 1000);
    coveredMs += until - last.t;
  }
  return { total, coveredSeconds: coveredMs / 1000, samplesUsed: inside.filter((s) => s.rate !== null).length };
}

/** Joules → megawatt-hours (1 MWh = 3.6 × 10⁹ J, exact). */
export const joulesToMwh = (joules: number) => joules / 3.6e9;
