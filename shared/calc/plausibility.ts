// Plausible ranges: a reading or a check outside one is possible but suspicious (a failing
// transmitter, a slipped decimal). The round asks the operator to confirm it, marks it, and the
// checks computed from it are withheld rather than judged. Each unit keeps its own ranges as a
// versioned setting; the starting ranges are common practice for surface condensers, no source.
import type { Quantity } from './check-catalog';
import { HEI_EXHAUST_HEAT_J_PER_KG } from './water';

export const plausibleKeys = [
  'backpressure',
  'hotwellTemperature',
  'cwInletTemperature',
  'cwFlow',
  'steamFlow',
  'subcooling',
  'ttd',
  'cwRise',
  'tubeVelocity',
  'cleanlinessFactor',
  'towerApproach',
  'pH',
  'cycles',
] as const;
export type PlausibleKey = (typeof plausibleKeys)[number];

/** SI, except the flows: a fraction of the unit's design flow (1 = 100 %). */
export type PlausibleRange = { low: number; high: number };
export type PlausibleRanges = Record<PlausibleKey, PlausibleRange>;

/** How a range is kept and shown: an SI quantity, or a fraction of a design flow. */
export type PlausibleKind = Extract<Quantity, 'pressure' | 'temperature' | 'temperature_difference' | 'velocity' | 'ratio'> | 'design_fraction' | 'ph';

export const plausibleCatalog: Record<PlausibleKey, { label: string; kind: PlausibleKind; settable: PlausibleRange }> = {
  // `settable`: what an administrator may enter, so a range cannot reach into the impossible.
  backpressure: { label: 'Condenser absolute pressure', kind: 'pressure', settable: { low: 611.657, high: 200_000 } },
  hotwellTemperature: { label: 'Hotwell temperature', kind: 'temperature', settable: { low: 273.15, high: 373.15 } },
  cwInletTemperature: { label: 'CW inlet temperature', kind: 'temperature', settable: { low: 273.15, high: 373.15 } },
  cwFlow: { label: 'CW flow', kind: 'design_fraction', settable: { low: 0, high: 3 } },
  steamFlow: { label: 'Exhaust steam flow', kind: 'design_fraction', settable: { low: 0, high: 3 } },
  subcooling: { label: 'Condensate subcooling', kind: 'temperature_difference', settable: { low: -20, high: 50 } },
  ttd: { label: 'TTD', kind: 'temperature_difference', settable: { low: -20, high: 100 } },
  cwRise: { label: 'CW temperature rise', kind: 'temperature_difference', settable: { low: 0, high: 100 } },
  tubeVelocity: { label: 'Tube water velocity', kind: 'velocity', settable: { low: 0, high: 10 } },
  cleanlinessFactor: { label: 'Cleanliness factor', kind: 'ratio', settable: { low: 0, high: 2 } },
  towerApproach: { label: 'Cooling-tower approach', kind: 'temperature_difference', settable: { low: 0, high: 100 } },
  pH: { label: 'pH', kind: 'ph', settable: { low: 0, high: 14 } },
  cycles: { label: 'Cycles of concentration', kind: 'ratio', settable: { low: 1, high: 100 } },
};

/**
 * Typical surface-condenser service, common practice with no source, as a place to start: each
 * plant narrows or widens them from its own design. (HEI's usual tube velocity band is about
 * 1.2–2.4 m/s; a cleanliness factor above about 1.05 usually means a bad reading, not clean tubes.)
 */
export const startingPlausibleRanges: PlausibleRanges = {
  backpressure: { low: 2_000, high: 25_000 },
  hotwellTemperature: { low: 288.15, high: 338.15 },
  cwInletTemperature: { low: 273.15, high: 313.15 },
  cwFlow: { low: 0.2, high: 1.3 },
  steamFlow: { low: 0, high: 1.2 },
  subcooling: { low: -2, high: 5 },
  ttd: { low: 1, high: 15 },
  cwRise: { low: 3, high: 20 },
  tubeVelocity: { low: 0.9, high: 3 },
  cleanlinessFactor: { low: 0.3, high: 1.1 },
  towerApproach: { low: 2, high: 15 },
  pH: { low: 6, high: 10 },
  cycles: { low: 1, high: 15 },
};

/** The design figures the flow ranges are fractions of. */
export type PlausibleDesign = { designCwFlowKgS: number; designDutyW: number };

/**
 * Design exhaust steam flow, kg/s: the design duty over HEI's 950 Btu/lb (2210 kJ/kg) — the same
 * convention the engine uses for steam-side duty.
 */
export const designSteamFlowKgS = (design: PlausibleDesign) => design.designDutyW / HEI_EXHAUST_HEAT_J_PER_KG;

/** A range in SI for this unit: flows become kg/s from their fractions of design. */
export function plausibleRangeSi(key: PlausibleKey, ranges: PlausibleRanges, design: PlausibleDesign): PlausibleRange {
  const range = ranges[key];
  if (key === 'cwFlow') return { low: range.low * design.designCwFlowKgS, high: range.high * design.designCwFlowKgS };
  if (key === 'steamFlow') return { low: range.low * designSteamFlowKgS(design), high: range.high * designSteamFlowKgS(design) };
  return range;
}

export type OutsidePlausible = {
  key: PlausibleKey;
  label: string;
  /** SI (kg/s for the flows). */
  value: number;
  low: number;
  high: number;
};

export function outsidePlausible(key: PlausibleKey, value: number, ranges: PlausibleRanges, design: PlausibleDesign): OutsidePlausible | null {
  const { low, high } = plausibleRangeSi(key, ranges, design);
  return value < low || value > high ? { key, label: plausibleCatalog[key].label, value, low, high } : null;
}

/** Why a check built on an implausible value is absent, in the operator's words. */
export const withheldReason = (key: PlausibleKey) => `not computed: ${plausibleCatalog[key].label} is outside the plausible range for this unit`;
