// Scaling tendency of the circulating water.
// Langelier Saturation Index with the common approximation for pHs:
// pHs = (9.3 + A + B) − (C + D); A = (log10 TDS − 1)/10; B = −13.12·log10(T °C + 273) + 34.55;
// C = log10(Ca hardness as CaCO3) − 0.4; D = log10(total alkalinity as CaCO3). LSI = pH − pHs.
// Ryznar Stability Index RSI = 2·pHs − pH (Ryznar, 1944).
import { requireInRange, requirePositive } from './input-error';

export type WaterSample = {
  pH: number;
  temperatureK: number;
  /** mg/L */
  totalDissolvedSolids: number;
  /** mg/L as CaCO3 */
  calciumHardness: number;
  /** mg/L as CaCO3 */
  totalAlkalinity: number;
};

export function saturationPH(sample: WaterSample): number {
  requireInRange('water temperature', sample.temperatureK, 273.15, 373.15, 'K');
  const A = (Math.log10(requirePositive('TDS', sample.totalDissolvedSolids)) - 1) / 10;
  const B = -13.12 * Math.log10(sample.temperatureK - 273.15 + 273) + 34.55;
  const C = Math.log10(requirePositive('calcium hardness', sample.calciumHardness)) - 0.4;
  const D = Math.log10(requirePositive('total alkalinity', sample.totalAlkalinity));
  return 9.3 + A + B - (C + D);
}

export function langelierIndex(sample: WaterSample): number {
  requireInRange('pH', sample.pH, 0, 14, '');
  return sample.pH - saturationPH(sample);
}

export function ryznarIndex(sample: WaterSample): number {
  requireInRange('pH', sample.pH, 0, 14, '');
  return 2 * saturationPH(sample) - sample.pH;
}
