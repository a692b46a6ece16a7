// Expected backpressure and what a deviation from it costs.
import { CalcInputError, requireFinite, requirePositive } from './input-error';
import { interpolate, withinTable } from './interpolate';
import { saturationPressure } from './saturation';
import { WATER_CP } from './water';

/**
 * Backpressure the condenser should hold for this duty, CW flow and inlet temperature at a
 * given U (clean U × design cleanliness). NTU method, condensing shell side (effectiveness
 * ε = 1 − e^−NTU): NTU = U·A / (ṁ·cp); rise = Q / (ṁ·cp); Tsat = T_in + rise / ε; p = ps(Tsat).
 */
export function expectedBackpressure(params: {
  uWM2K: number;
  surfaceAreaM2: number;
  cwFlowKgS: number;
  cwInletK: number;
  dutyW: number;
}): { pressurePa: number; saturationK: number; ntu: number } {
  const capacity = requirePositive('CW flow', params.cwFlowKgS) * WATER_CP;
  const ntu = (requirePositive('U', params.uWM2K) * requirePositive('surface area', params.surfaceAreaM2)) / capacity;
  const rise = requirePositive('duty', params.dutyW) / capacity;
  const saturationK = requireFinite('CW inlet temperature', params.cwInletK) + rise / (1 - Math.exp(-ntu));
  return { pressurePa: saturationPressure(saturationK, 'expected saturation temperature'), saturationK, ntu };
}

export type CorrectionCurve = readonly (readonly [pressurePa: number, megawatts: number])[];

export function validateCorrectionCurve(curve: CorrectionCurve): void {
  if (curve.length < 2) throw new CalcInputError('backpressure correction curve', 'needs at least two points');
  for (let i = 1; i < curve.length; i++) {
    if (!(curve[i]![0] > curve[i - 1]![0])) {
      throw new CalcInputError('backpressure correction curve', 'pressures must rise from point to point');
    }
  }
}

export type DeviationCost = { megawatts: number; moneyPerHour: number | null };

/**
 * MW lost to running at `actualPa` instead of `expectedPa`, from the unit's correction curve
 * (backpressure → MW correction, linear between points). Never extrapolates: outside the table
 * it throws, and the caller reports the result as unavailable with the table's range.
 */
export function backpressureDeviationCost(
  curve: CorrectionCurve,
  actualPa: number,
  expectedPa: number,
  pricePerMwh: number | null,
): DeviationCost {
  validateCorrectionCurve(curve);
  for (const [field, value] of [['backpressure', actualPa], ['expected backpressure', expectedPa]] as const) {
    if (!withinTable(curve, value)) {
      const lo = (curve[0]![0] / 1000).toFixed(1);
      const hi = (curve[curve.length - 1]![0] / 1000).toFixed(1);
      throw new CalcInputError(field, `${(value / 1000).toFixed(2)} kPa a is outside the correction curve (${lo}–${hi} kPa a); not extrapolated`);
    }
  }
  const megawatts = interpolate(curve, actualPa) - interpolate(curve, expectedPa);
  return { megawatts, moneyPerHour: pricePerMwh == null ? null : megawatts * pricePerMwh };
}
