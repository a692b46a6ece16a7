// Saturation line of water, IAPWS-IF97 region 4.
// Source: IAPWS R7-97(2012), "Revised Release on the IAPWS Industrial Formulation 1997 for the
// Thermodynamic Properties of Water and Steam", equations 29–31 and table 34 (coefficients).
import { requireInRange } from './input-error';

const n = [
  0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.12020824702470e5, -0.32325550322333e7,
  0.1491510861353e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
] as const;
const [n1, n2, n3, n4, n5, n6, n7, n8, n9, n10] = n;

/** Triple point to critical point, the validity range of region 4. */
export const SATURATION_T_MIN_K = 273.15;
export const SATURATION_T_MAX_K = 647.096;
// ps(273.15 K) by eq. 30 itself (the release rounds it to 611.213 Pa), so the two ranges match exactly.
export const SATURATION_P_MIN_PA = 611.212677;
export const SATURATION_P_MAX_PA = 22.064e6;

/** A value a rounding error outside an end of the range (as ps(647.096 K) is) counts as that end. */
function snapToRange(value: number, min: number, max: number): number {
  if (value < min && value >= min * (1 - 1e-9)) return min;
  if (value > max && value <= max * (1 + 1e-9)) return max;
  return value;
}

/**
 * Saturation pressure ps(T), Pa. IAPWS-IF97 eq. 30:
 * θ = T + n9/(T − n10); A = θ² + n1θ + n2; B = n3θ² + n4θ + n5; C = n6θ² + n7θ + n8;
 * ps = 1 MPa · [2C / (−B + √(B² − 4AC))]⁴.
 */
export function saturationPressure(temperatureK: number, field = 'temperature'): number {
  requireInRange(field, temperatureK, SATURATION_T_MIN_K, SATURATION_T_MAX_K, 'K');
  const theta = temperatureK + n9 / (temperatureK - n10);
  const A = theta * theta + n1 * theta + n2;
  const B = n3 * theta * theta + n4 * theta + n5;
  const C = n6 * theta * theta + n7 * theta + n8;
  return 1e6 * Math.pow((2 * C) / (-B + Math.sqrt(B * B - 4 * A * C)), 4);
}

/**
 * Saturation temperature Ts(p), K. IAPWS-IF97 eq. 31:
 * β = (p / 1 MPa)^¼; E = β² + n3β + n6; F = n1β² + n4β + n7; G = n2β² + n5β + n8;
 * D = 2G / (−F − √(F² − 4EG)); Ts = [n10 + D − √((n10 + D)² − 4(n9 + n10·D))] / 2.
 */
export function saturationTemperature(pressurePa: number, field = 'pressure'): number {
  requireInRange(field, snapToRange(pressurePa, SATURATION_P_MIN_PA, SATURATION_P_MAX_PA), SATURATION_P_MIN_PA, SATURATION_P_MAX_PA, 'Pa');
  pressurePa = snapToRange(pressurePa, SATURATION_P_MIN_PA, SATURATION_P_MAX_PA);
  const beta = Math.pow(pressurePa / 1e6, 0.25);
  const E = beta * beta + n3 * beta + n6;
  const F = n1 * beta * beta + n4 * beta + n7;
  const G = n2 * beta * beta + n5 * beta + n8;
  const D = (2 * G) / (-F - Math.sqrt(F * F - 4 * E * G));
  return (n10 + D - Math.sqrt((n10 + D) * (n10 + D) - 4 * (n9 + n10 * D))) / 2;
}
