// Possible-cause hints: the signatures an experienced operator reads from the same numbers.
// Every rule is common practice (no formal source) and is shown as a possibility, never a verdict.
import type { CheckKey } from './check-catalog';
import type { Status } from './limits';

export type Hint = { id: string; title: string; detail: string; basis: string; severity: 'watch' | 'alarm' };

type Judged = Record<CheckKey, { status: Status; value: number | null }>;

const raised = (s: Status) => s === 'watch' || s === 'alarm';
const worst = (...statuses: Status[]): 'watch' | 'alarm' => (statuses.includes('alarm') ? 'alarm' : 'watch');
const COMMON_PRACTICE = 'Common practice in condenser performance monitoring; no formal source.';

type Rule = { id: string; title: string; detail: string; applies: (c: Judged) => boolean; severity: (c: Judged) => 'watch' | 'alarm' };

const rules: Rule[] = [
  {
    id: 'fouling-or-air-binding',
    title: 'Tube fouling or air binding',
    detail: 'TTD is high while the CW rise is normal: heat is not getting through the tubes. Check cleanliness trend, waterbox debris and air removal.',
    // When cleanliness and the deviation from expected are both known and normal, a high TTD is
    // explained by load and water temperature instead.
    applies: (c) =>
      raised(c.ttd.status) &&
      c.cwRise.status === 'normal' &&
      !(c.cleanlinessFactor.status === 'normal' && c.backpressureDeviation.status === 'normal'),
    severity: (c) => worst(c.ttd.status),
  },
  {
    id: 'air-in-leakage',
    title: 'Air in-leakage',
    detail: 'Condensate subcooling is high together with raised dissolved oxygen or air-removal flow: air is blanketing tubes. Consider a vacuum-decay test and a leak search.',
    applies: (c) => raised(c.subcooling.status) && (raised(c.dissolvedOxygen.status) || raised(c.airRemovalFlow.status)),
    severity: (c) => worst(c.subcooling.status, c.dissolvedOxygen.status, c.airRemovalFlow.status),
  },
  {
    id: 'air-or-high-level',
    title: 'Air in the shell or high hotwell level',
    detail: 'Condensate subcooling is high. Check hotwell level (flooded tubes) and air removal; a dissolved-oxygen reading would tell the two apart.',
    applies: (c) => raised(c.subcooling.status) && !raised(c.dissolvedOxygen.status) && !raised(c.airRemovalFlow.status),
    severity: (c) => worst(c.subcooling.status),
  },
  {
    id: 'low-cw-flow',
    title: 'Low circulating-water flow',
    detail: 'The CW temperature rise is high: less water is carrying the same heat. Check CW pump status, discharge pressure, waterbox and screen differential.',
    applies: (c) => raised(c.cwRise.status),
    severity: (c) => worst(c.cwRise.status),
  },
  {
    id: 'warm-cw-inlet',
    title: 'Warm CW inlet or high load',
    detail: 'Backpressure is high but TTD and the deviation from expected are normal: the condenser is doing what it can with the water it gets. Check cooling-tower performance and load.',
    applies: (c) => raised(c.backpressure.status) && c.ttd.status === 'normal' && c.backpressureDeviation.status === 'normal',
    severity: (c) => worst(c.backpressure.status),
  },
  {
    id: 'low-cleanliness',
    title: 'Tubes losing cleanliness',
    detail: 'The cleanliness factor is low and the backpressure is above expected: consider tube cleaning and check the ball-cleaning or screen systems.',
    applies: (c) => raised(c.cleanlinessFactor.status) && (c.backpressureDeviation.value ?? 0) > 0,
    severity: (c) => worst(c.cleanlinessFactor.status),
  },
  {
    id: 'tower-performance',
    title: 'Cooling-tower performance',
    detail: 'The tower approach is high: check fans, fill, water distribution and basin level.',
    applies: (c) => raised(c.towerApproach.status),
    severity: (c) => worst(c.towerApproach.status),
  },
];

export function possibleCauses(checks: Judged): Hint[] {
  return rules
    .filter((rule) => rule.applies(checks))
    .map((rule) => ({ id: rule.id, title: rule.title, detail: rule.detail, basis: COMMON_PRACTICE, severity: rule.severity(checks) }));
}
