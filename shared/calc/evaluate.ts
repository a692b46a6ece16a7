// Turns one reading set (SI) and the condenser's design data into every check, with statuses
// and possible-cause hints. Each check is computed on its own: a missing optional input or an
// impossible value leaves that check (and those built on it) absent with the reason. A reading or
// check outside the unit's plausible range is kept and marked, and every check computed from it is
// withheld: judging a duty from a CW flow nobody believes would show a confident "normal".
import { backpressureDeviationCost, expectedBackpressure, type CorrectionCurve } from './backpressure';
import { checkCatalog, checkKeys, siUnitOf, type CheckKey, type Quantity } from './check-catalog';
import { langelierIndex, ryznarIndex, type WaterSample } from './chemistry';
import {
  cwFlowFromDuty,
  cwTemperatureRise,
  heatDuty,
  initialTemperatureDifference,
  logMeanTemperatureDifference,
  overallU,
  subcooling,
  terminalTemperatureDifference,
} from './condenser';
import { blowdownForCycles, cyclesOfConcentration, evaporationRate, towerApproach, towerEffectiveness, towerRange } from './cooling-tower';
import { possibleCauses, type Hint } from './diagnosis';
import { cleanUFromDataSheet, cleanUHei, tubeVelocity, type TubeMaterial } from './hei';
import { checkComputer, need, type Source } from './check-computer';
import { judge, type LimitSet, type Status } from './limits';
import type { OutsidePlausible, PlausibleRanges } from './plausibility';
import { wetBulbTemperature } from './psychrometrics';
import { saturationTemperature } from './saturation';
import { waterDensity } from './water';

export type CondenserDesignSi = {
  surfaceAreaM2: number;
  tubeOdMm: number;
  tubeGaugeBwg: number;
  tubeMaterial: TubeMaterial;
  tubeCount: number;
  passes: number;
  designCwFlowKgS: number;
  designCwInletK: number;
  designBackpressurePa: number;
  designDutyW: number;
  designCleanliness: number;
  /** Clean U from the data sheet at design flow and inlet temperature; null = HEI tables. */
  designCleanUWM2K: number | null;
  backpressureCorrection: CorrectionCurve;
  energyPricePerMwh: number | null;
  currency: string | null;
};

export type TowerReadingsSi = {
  hotWaterK?: number | null;
  coldWaterK?: number | null;
  wetBulbK?: number | null;
  dryBulbK?: number | null;
  /** fraction 0–1 */
  relativeHumidity?: number | null;
  stationPressurePa?: number | null;
  circulatingKgS?: number | null;
  makeupConductivity?: number | null;
  towerConductivity?: number | null;
  targetCycles?: number | null;
};

export type ReadingSetSi = {
  pressurePa: number;
  assumedStandardBarometer?: boolean;
  hotwellK: number;
  cwInletK: number;
  cwOutletK: number;
  cwFlowKgS?: number | null;
  steamFlowKgS?: number | null;
  airRemovalKgS?: number | null;
  dissolvedOxygenPpb?: number | null;
  tower?: TowerReadingsSi | null;
  chemistry?: WaterSample | null;
};

export type CheckResult = {
  key: CheckKey;
  label: string;
  quantity: Quantity;
  unit: string;
  value: number | null;
  status: Status;
  /** Why the value is absent, or how it was obtained when that matters. */
  reason?: string;
  /** Present when the value lies outside the unit's plausible range (SI bounds). */
  outsidePlausible?: { low: number; high: number };
};

export type Evaluation = {
  checks: Record<CheckKey, CheckResult>;
  hints: Hint[];
  notes: string[];
  /** Readings and checks outside the unit's plausible ranges; empty when all are plausible. */
  implausible: OutsidePlausible[];
};

export function evaluateReadingSet(reading: ReadingSetSi, design: CondenserDesignSi, limits: LimitSet, plausible: PlausibleRanges): Evaluation {
  const notes: string[] = [];
  const { compute, assess, values, reasons, marked, implausible } = checkComputer(plausible, design);
  const optional = (value: number | null | undefined) => (value == null ? null : value);

  if (reading.assumedStandardBarometer) notes.push('No barometer reading: the standard atmosphere (101.325 kPa) was assumed to turn vacuum into absolute pressure.');

  // Condenser
  assess('steamFlow', reading.steamFlowKgS);
  assess('pH', reading.chemistry?.pH);
  const p = compute('backpressure', () => reading.pressurePa);
  // Measured values are listed too, so limits, flags and trends cover them like computed checks.
  compute('hotwellTemperature', () => reading.hotwellK);
  compute('cwInletTemperature', () => reading.cwInletK);
  compute('cwOutletTemperature', () => reading.cwOutletK);
  const tsat = compute('saturationTemperature', () => saturationTemperature(need(p, 'the absolute pressure'), 'condenser pressure'), undefined, ['backpressure']);
  compute('subcooling', () => subcooling(need(tsat, 'the saturation temperature'), reading.hotwellK), undefined, ['saturationTemperature', 'hotwellTemperature']);
  const ttd = compute('ttd', () => terminalTemperatureDifference(need(tsat, 'the saturation temperature'), reading.cwOutletK), undefined, ['saturationTemperature', 'cwOutletTemperature']);
  const itd = compute('itd', () => initialTemperatureDifference(need(tsat, 'the saturation temperature'), reading.cwInletK), undefined, ['saturationTemperature', 'cwInletTemperature']);
  const rise = compute('cwRise', () => cwTemperatureRise(reading.cwInletK, reading.cwOutletK), undefined, ['cwInletTemperature', 'cwOutletTemperature']);
  const lmtd = compute('lmtd', () => logMeanTemperatureDifference(need(itd, 'the ITD'), need(ttd, 'the TTD')), undefined, ['itd', 'ttd']);
  compute('cwFlow', () => optional(reading.cwFlowKgS), 'not measured');
  // The duty, and the flows that follow from it, rest on the measured CW flow or else the steam flow.
  const flowSource: Source = reading.cwFlowKgS != null ? 'cwFlow' : 'steamFlow';

  let dutyBasis: string | undefined;
  const duty = compute('duty', () => {
    const result = heatDuty({ cwFlowKgS: reading.cwFlowKgS, riseK: need(rise, 'the CW rise'), steamFlowKgS: reading.steamFlowKgS });
    dutyBasis =
      result.basis === 'cw_side'
        ? 'CW side: flow × cp × rise'
        : 'steam side: exhaust steam flow × 2210 kJ/kg (HEI), because the CW flow was not measured';
    return result.watts;
  }, undefined, ['cwRise', flowSource]);
  if (dutyBasis) reasons.duty = dutyBasis;
  const u = compute('overallU', () => overallU(need(duty, 'the duty'), design.surfaceAreaM2, need(lmtd, 'the LMTD')), undefined, ['duty', 'lmtd']);

  // With only the steam side known, the CW flow follows from duty and rise.
  const cwFlow = reading.cwFlowKgS ?? (duty !== null && rise !== null ? cwFlowFromDuty(duty, rise) : null);
  const cwFlowFrom: Source = reading.cwFlowKgS != null ? 'cwFlow' : 'duty';
  const density = waterDensity(Math.min(Math.max(reading.cwInletK, 273.15), 373.15));
  const velocity = compute('tubeVelocity', () => tubeVelocity(
    { tubeOdMm: design.tubeOdMm, gaugeBwg: design.tubeGaugeBwg, tubeCount: design.tubeCount, passes: design.passes },
    need(cwFlow, 'the CW flow or the steam flow'),
    density,
  ), undefined, [cwFlowFrom]);
  let cleanUBasis = '';
  const cleanU = compute('cleanU', () => {
    const v = need(velocity, 'the tube velocity');
    if (design.designCleanUWM2K != null) {
      const designVelocity = tubeVelocity(
        { tubeOdMm: design.tubeOdMm, gaugeBwg: design.tubeGaugeBwg, tubeCount: design.tubeCount, passes: design.passes },
        design.designCwFlowKgS,
        waterDensity(design.designCwInletK),
      );
      cleanUBasis = 'data-sheet clean U corrected for velocity and inlet temperature';
      return cleanUFromDataSheet({
        designCleanU: design.designCleanUWM2K,
        velocityMS: v,
        designVelocityMS: designVelocity,
        inletK: reading.cwInletK,
        designInletK: design.designCwInletK,
      });
    }
    cleanUBasis = 'HEI tables (C, Ft, Fm from memory; approximate)';
    return cleanUHei({
      tubeOdMm: design.tubeOdMm,
      gaugeBwg: design.tubeGaugeBwg,
      material: design.tubeMaterial,
      velocityMS: v,
      inletK: reading.cwInletK,
    });
  }, undefined, ['tubeVelocity', 'cwInletTemperature']);
  if (cleanU !== null) reasons.cleanU = cleanUBasis;
  compute('cleanlinessFactor', () => need(u, 'the overall U') / need(cleanU, 'the clean U'), undefined, ['overallU', 'cleanU']);
  const expected = compute('expectedBackpressure', () =>
    expectedBackpressure({
      uWM2K: need(cleanU, 'the clean U') * design.designCleanliness,
      surfaceAreaM2: design.surfaceAreaM2,
      cwFlowKgS: need(cwFlow, 'the CW flow or the steam flow'),
      cwInletK: reading.cwInletK,
      dutyW: need(duty, 'the duty'),
    }).pressurePa,
    undefined,
    ['cleanU', cwFlowFrom, 'cwInletTemperature', 'duty'],
  );
  compute('backpressureDeviation', () => need(p, 'the absolute pressure') - need(expected, 'the expected backpressure'), undefined, ['backpressure', 'expectedBackpressure']);
  let costReason: string | undefined;
  const costMw = compute('deviationCostPower', () => {
    const cost = backpressureDeviationCost(
      design.backpressureCorrection,
      need(p, 'the absolute pressure'),
      need(expected, 'the expected backpressure'),
      design.energyPricePerMwh,
    );
    return cost.megawatts * 1e6;
  }, undefined, ['backpressure', 'expectedBackpressure']);
  if (costMw === null) costReason = reasons.deviationCostPower;
  compute(
    'deviationCostMoney',
    () => {
      if (design.energyPricePerMwh == null) return null;
      return (need(costMw, 'the output lost') / 1e6) * design.energyPricePerMwh;
    },
    design.energyPricePerMwh == null ? 'no energy price in the unit’s design data' : costReason,
    ['deviationCostPower'],
  );
  compute('dissolvedOxygen', () => optional(reading.dissolvedOxygenPpb), 'not measured');
  compute('airRemovalFlow', () => optional(reading.airRemovalKgS), 'not measured');

  // Cooling tower
  const tower = reading.tower ?? {};
  const wetBulb = compute(
    'wetBulb',
    () => {
      if (tower.wetBulbK != null) return tower.wetBulbK;
      if (tower.dryBulbK == null || tower.relativeHumidity == null) return null;
      return wetBulbTemperature(tower.dryBulbK, tower.relativeHumidity, tower.stationPressurePa ?? 101_325);
    },
    'needs a wet-bulb reading, or dry bulb with relative humidity',
  );
  if (tower.wetBulbK == null && tower.dryBulbK != null && tower.stationPressurePa == null) {
    notes.push('No station pressure: the wet bulb assumes the standard atmosphere (101.325 kPa).');
  }
  compute('basinTemperature', () => optional(tower.coldWaterK), 'not measured');
  const hotWater = tower.hotWaterK ?? reading.cwOutletK;
  const range = compute(
    'towerRange',
    () => (tower.coldWaterK == null ? null : towerRange(hotWater, tower.coldWaterK)),
    'needs the basin (cold-water) temperature',
    tower.hotWaterK == null ? ['cwOutletTemperature'] : [],
  );
  const approach = compute(
    'towerApproach',
    () => (tower.coldWaterK == null ? null : towerApproach(tower.coldWaterK, need(wetBulb, 'the wet bulb'))),
    'needs the basin (cold-water) temperature',
  );
  compute('towerEffectiveness', () => towerEffectiveness(need(range, 'the range'), need(approach, 'the approach')), undefined, ['towerRange', 'towerApproach']);
  const circulating = tower.circulatingKgS ?? reading.cwFlowKgS ?? cwFlow;
  const circulatingFrom: Source[] = tower.circulatingKgS != null ? [] : [cwFlowFrom];
  const evaporation = compute(
    'evaporation',
    () => evaporationRate(need(circulating, 'the circulating flow'), need(range, 'the range')),
    undefined,
    ['towerRange', ...circulatingFrom],
  );
  compute(
    'cycles',
    () =>
      tower.towerConductivity == null || tower.makeupConductivity == null
        ? null
        : cyclesOfConcentration(tower.towerConductivity, tower.makeupConductivity),
    'needs basin and makeup conductivity',
  );
  compute(
    'blowdownNeeded',
    () => (tower.targetCycles == null ? null : blowdownForCycles(need(evaporation, 'the evaporation'), tower.targetCycles).blowdownKgS),
    'needs a target cycles',
    ['evaporation'],
  );
  compute(
    'makeupNeeded',
    () => (tower.targetCycles == null ? null : blowdownForCycles(need(evaporation, 'the evaporation'), tower.targetCycles).makeupKgS),
    'needs a target cycles',
    ['evaporation'],
  );

  // Chemistry
  const sample = reading.chemistry;
  compute('langelier', () => (sample ? langelierIndex(sample) : null), 'no water chemistry sample', ['pH']);
  compute('ryznar', () => (sample ? ryznarIndex(sample) : null), 'no water chemistry sample', ['pH']);

  const checks = Object.fromEntries(
    checkKeys.map((key) => {
      const value = values[key] ?? null;
      const { label, quantity } = checkCatalog[key];
      const result: CheckResult = { key, label, quantity, unit: siUnitOf[quantity], value, status: judge(value, limits[key]) };
      if (reasons[key]) result.reason = reasons[key];
      const outside = marked[key];
      if (outside) result.outsidePlausible = { low: outside.low, high: outside.high };
      return [key, result];
    }),
  ) as Record<CheckKey, CheckResult>;

  return { checks, hints: possibleCauses(checks), notes, implausible };
}
