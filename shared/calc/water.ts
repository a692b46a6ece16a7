// Liquid-water properties used to turn flows and temperatures into duty.
import { requireInRange } from './input-error';

/**
 * Specific heat of cooling water, J/(kg·K). A constant is common practice for condenser duty:
 * over 5–45 °C liquid water's cp stays within 4.178–4.202 kJ/(kg·K) (steam tables), well inside
 * the uncertainty of a CW flow measurement.
 */
export const WATER_CP = 4180;

/**
 * HEI convention for turbine exhaust: about 950 Btu/lb of steam condensed (≈ 2210 kJ/kg),
 * used for duty when the CW flow is not measured.
 */
export const HEI_EXHAUST_HEAT_J_PER_KG = 950 * 2326;

/**
 * Density of air-free water at 1 atm, kg/m³, 0–100 °C. Kell (1975), J. Chem. Eng. Data 20, 97:
 * ρ = (999.83952 + 16.945176t − 7.9870401e-3t² − 46.170461e-6t³ + 105.56302e-9t⁴ − 280.54253e-12t⁵)
 *     / (1 + 16.879850e-3t), t in °C.
 */
export function waterDensity(temperatureK: number, field = 'water temperature'): number {
  requireInRange(field, temperatureK, 273.15, 373.15, 'K');
  const t = temperatureK - 273.15;
  const numerator =
    999.83952 + 16.945176 * t - 7.9870401e-3 * t ** 2 - 46.170461e-6 * t ** 3 + 105.56302e-9 * t ** 4 - 280.54253e-12 * t ** 5;
  return numerator / (1 + 16.87985e-3 * t);
}
