// Cooling-tower checks. Definitions as used across the trade (e.g. CTI and handbook usage):
// range = hot − cold water; approach = cold water − wet bulb; effectiveness = range/(range+approach).
import { CalcInputError, requireFinite, requirePositive } from './input-error';

export function towerRange(hotWaterK: number, coldWaterK: number): number {
  const range = requireFinite('hot-water temperature', hotWaterK) - requireFinite('cold-water temperature', coldWaterK);
  if (range <= 0) throw new CalcInputError('hot-water temperature', 'must be warmer than the cold (basin) water');
  return range;
}

export function towerApproach(coldWaterK: number, wetBulbK: number): number {
  const approach = requireFinite('cold-water temperature', coldWaterK) - requireFinite('wet-bulb temperature', wetBulbK);
  if (approach <= 0) throw new CalcInputError('cold-water temperature', 'cannot be at or below the wet bulb: check the readings');
  return approach;
}

export function towerEffectiveness(rangeK: number, approachK: number): number {
  return requirePositive('range', rangeK) / (requirePositive('range', rangeK) + requirePositive('approach', approachK));
}

/**
 * Evaporation, kg/s ≈ 0.00153 per K of range × circulating flow — the rule of thumb of about
 * 1 % of flow per 10 °F of range (0.00085 × gpm × °F in US units). Common practice.
 */
export function evaporationRate(circulatingKgS: number, rangeK: number): number {
  return 0.00153 * requirePositive('circulating flow', circulatingKgS) * requirePositive('range', rangeK);
}

/** Cycles of concentration = tower-water / makeup concentration (conductivity, chloride or silica). */
export function cyclesOfConcentration(towerConcentration: number, makeupConcentration: number): number {
  const cycles = requirePositive('tower-water concentration', towerConcentration) / requirePositive('makeup concentration', makeupConcentration);
  if (cycles < 1) throw new CalcInputError('tower-water concentration', 'is below the makeup: the tower water cannot be more dilute than its makeup');
  return cycles;
}

/**
 * Blowdown (including drift) and makeup needed to hold a target cycles: B = E / (COC − 1),
 * makeup = E + B. Common practice.
 */
export function blowdownForCycles(evaporationKgS: number, targetCycles: number): { blowdownKgS: number; makeupKgS: number } {
  requirePositive('evaporation', evaporationKgS);
  requireFinite('target cycles', targetCycles);
  if (targetCycles <= 1) throw new CalcInputError('target cycles', 'must be greater than 1');
  const blowdownKgS = evaporationKgS / (targetCycles - 1);
  return { blowdownKgS, makeupKgS: evaporationKgS + blowdownKgS };
}
