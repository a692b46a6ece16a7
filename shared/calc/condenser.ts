// Condenser checks from one round of readings. Formulas are the trade's standard definitions
// (HEI Standards for Steam Surface Condensers; any heat-transfer text for LMTD and NTU).
import { CalcInputError, requireFinite, requirePositive } from './input-error';
import { WATER_CP, HEI_EXHAUST_HEAT_J_PER_KG } from './water';

/** Condensate subcooling (depression), K = Tsat − T_hotwell. May be slightly negative from instrument error. */
export function subcooling(saturationK: number, hotwellK: number): number {
  return requireFinite('saturation temperature', saturationK) - requireFinite('hotwell temperature', hotwellK);
}

/** Terminal temperature difference, K = Tsat − T_CW,out. */
export function terminalTemperatureDifference(saturationK: number, cwOutletK: number): number {
  return requireFinite('saturation temperature', saturationK) - requireFinite('CW outlet temperature', cwOutletK);
}

/** Initial temperature difference, K = Tsat − T_CW,in. */
export function initialTemperatureDifference(saturationK: number, cwInletK: number): number {
  return requireFinite('saturation temperature', saturationK) - requireFinite('CW inlet temperature', cwInletK);
}

/** CW temperature rise (range), K = T_out − T_in; the outlet of a working condenser is warmer. */
export function cwTemperatureRise(cwInletK: number, cwOutletK: number): number {
  const rise = requireFinite('CW outlet temperature', cwOutletK) - requireFinite('CW inlet temperature', cwInletK);
  if (rise <= 0) throw new CalcInputError('CW outlet temperature', 'must be warmer than the CW inlet in a condenser in service');
  return rise;
}

/** Log-mean temperature difference, K = rise / ln(ITD / TTD); needs ITD > TTD > 0. */
export function logMeanTemperatureDifference(itdK: number, ttdK: number): number {
  requireFinite('ITD', itdK);
  requireFinite('TTD', ttdK);
  if (ttdK <= 0) throw new CalcInputError('TTD', 'must be above zero: the CW outlet cannot be at or above the saturation temperature');
  if (itdK <= ttdK) throw new CalcInputError('ITD', 'must exceed the TTD');
  return (itdK - ttdK) / Math.log(itdK / ttdK);
}

export type DutyBasis = 'cw_side' | 'steam_side';

/** Heat duty, W: CW side Q = ṁ·cp·rise when the CW flow is measured, else steam flow × 2210 kJ/kg (HEI). */
export function heatDuty(params: { cwFlowKgS?: number | null; riseK: number; steamFlowKgS?: number | null }): {
  watts: number;
  basis: DutyBasis;
} {
  if (params.cwFlowKgS != null) {
    requirePositive('CW flow', params.cwFlowKgS);
    return { watts: params.cwFlowKgS * WATER_CP * requirePositive('CW rise', params.riseK), basis: 'cw_side' };
  }
  if (params.steamFlowKgS != null) {
    return { watts: requirePositive('steam flow', params.steamFlowKgS) * HEI_EXHAUST_HEAT_J_PER_KG, basis: 'steam_side' };
  }
  throw new CalcInputError('CW flow', 'needed for the duty (or give the exhaust steam flow)');
}

/** Overall heat-transfer coefficient, W/(m²·K) = Q / (A · LMTD). */
export function overallU(dutyW: number, surfaceAreaM2: number, lmtdK: number): number {
  return requirePositive('duty', dutyW) / (requirePositive('surface area', surfaceAreaM2) * requirePositive('LMTD', lmtdK));
}

/** CW flow implied by a duty, kg/s = Q / (cp · rise): used when only the steam side is known. */
export function cwFlowFromDuty(dutyW: number, riseK: number): number {
  return requirePositive('duty', dutyW) / (WATER_CP * requirePositive('CW rise', riseK));
}
