// Judging a value against watch and alarm limits.
import type { CheckKey } from './check-catalog';

export type Status = 'normal' | 'watch' | 'alarm' | 'unknown';
export type LimitBand = { lowAlarm?: number | null; lowWatch?: number | null; highWatch?: number | null; highAlarm?: number | null };
export type LimitSet = Partial<Record<CheckKey, LimitBand>>;

export function judge(value: number | null, band: LimitBand | undefined): Status {
  if (value === null) return 'unknown';
  if (!band) return 'normal';
  if ((band.highAlarm != null && value >= band.highAlarm) || (band.lowAlarm != null && value <= band.lowAlarm)) return 'alarm';
  if ((band.highWatch != null && value >= band.highWatch) || (band.lowWatch != null && value <= band.lowWatch)) return 'watch';
  return 'normal';
}

/**
 * Starting limits for a unit that has none of its own. Common practice, no source: every plant
 * sets its own from its design and procedures, and these are only a place to begin. SI units.
 */
export const startingLimits: LimitSet = {
  backpressure: { highWatch: 11_000, highAlarm: 16_000 },
  subcooling: { highWatch: 1.5, highAlarm: 3 },
  ttd: { highWatch: 7, highAlarm: 10 },
  cwRise: { highWatch: 12, highAlarm: 15 },
  cleanlinessFactor: { lowWatch: 0.75, lowAlarm: 0.65 },
  backpressureDeviation: { highWatch: 700, highAlarm: 1500 },
  dissolvedOxygen: { highWatch: 20, highAlarm: 40 },
  towerApproach: { highWatch: 8, highAlarm: 11 },
  cycles: { lowWatch: 2, highWatch: 6, highAlarm: 8 },
  langelier: { lowAlarm: -2, lowWatch: -1, highWatch: 1.5, highAlarm: 2.5 },
  ryznar: { lowAlarm: 5, lowWatch: 6, highWatch: 8, highAlarm: 9 },
};
