// Clean overall heat-transfer coefficient by the HEI method: U = C · √v · Ft · Fm
// (Heat Exchange Institute, Standards for Steam Surface Condensers), US units inside:
// U in Btu/(h·ft²·°F), v in ft/s. Converted to W/(m²·K) at the end.
//
// The C, Ft and Fm tables below are FROM MEMORY of the HEI tables (editions differ, and our
// copies were not at hand): treat them as approximate. Where the condenser's data sheet gives a
// design clean U, use `cleanUFromDataSheet`, which only corrects that figure for velocity and
// inlet temperature.
import { CalcInputError, requireInRange, requirePositive } from './input-error';
import { interpolate } from './interpolate';

const BTU_H_FT2_F_TO_W_M2_K = 5.678263337; // NIST SP 811
const FT_PER_M = 1 / 0.3048;

/** C by tube outside diameter (inches), from memory. */
const cByOdInches: { maxOd: number; c: number }[] = [
  { maxOd: 0.75, c: 263 },
  { maxOd: 1.0, c: 259 },
  { maxOd: 1.25, c: 256 },
  { maxOd: 1.5, c: 251 },
  { maxOd: 1.75, c: 245 },
  { maxOd: 2.0, c: 239 },
];

/** Inlet water temperature correction Ft by inlet temperature (°F), from memory. */
const ftTable: [number, number][] = [
  [35, 0.62], [40, 0.69], [45, 0.75], [50, 0.8], [55, 0.85], [60, 0.9], [65, 0.95], [70, 1.0],
  [75, 1.03], [80, 1.06], [85, 1.08], [90, 1.1], [95, 1.12], [100, 1.14], [105, 1.15], [110, 1.16],
  [115, 1.17], [120, 1.18],
];

export const tubeGauges = [24, 22, 20, 18, 16, 14, 12] as const;

/** Tube material and gauge correction Fm, from memory; columns follow `tubeGauges`. */
export const fmByMaterial = {
  admiralty: [1.06, 1.04, 1.02, 1.0, 0.96, 0.92, 0.87],
  aluminium_brass: [1.03, 1.02, 0.99, 0.96, 0.92, 0.88, 0.82],
  copper_nickel_90_10: [0.99, 0.97, 0.94, 0.9, 0.85, 0.8, 0.74],
  copper_nickel_70_30: [0.93, 0.9, 0.87, 0.82, 0.77, 0.71, 0.64],
  stainless_304_316: [0.83, 0.79, 0.75, 0.69, 0.63, 0.56, 0.49],
  titanium: [0.85, 0.81, 0.77, 0.71, 0.64, 0.57, 0.5],
} as const;
export type TubeMaterial = keyof typeof fmByMaterial;
export const tubeMaterials = Object.keys(fmByMaterial) as TubeMaterial[];

/** Birmingham wire gauge wall thickness, inches (the standard BWG table). */
const bwgWallInches: Record<number, number> = { 12: 0.109, 14: 0.083, 16: 0.065, 18: 0.049, 20: 0.035, 22: 0.028, 24: 0.022 };

export function tubeInsideDiameterM(tubeOdMm: number, gaugeBwg: number): number {
  requirePositive('tube OD', tubeOdMm);
  const wall = bwgWallInches[gaugeBwg];
  if (wall === undefined) throw new CalcInputError('tube gauge', `BWG ${gaugeBwg} is not one of ${tubeGauges.join(', ')}`);
  const idMm = tubeOdMm - 2 * wall * 25.4;
  if (idMm <= 0) throw new CalcInputError('tube gauge', 'the wall is thicker than the tube');
  return idMm / 1000;
}

export type TubeBundle = { tubeOdMm: number; gaugeBwg: number; tubeCount: number; passes: number };

/** Mean water velocity in the tubes, m/s: v = ṁ / (ρ · (N / passes) · π d_i² / 4). */
export function tubeVelocity(bundle: TubeBundle, flowKgS: number, densityKgM3: number): number {
  requirePositive('tube count', bundle.tubeCount);
  requirePositive('passes', bundle.passes);
  const di = tubeInsideDiameterM(bundle.tubeOdMm, bundle.gaugeBwg);
  const flowArea = (bundle.tubeCount / bundle.passes) * (Math.PI * di * di) / 4;
  return flowKgS / (densityKgM3 * flowArea);
}

export function heiC(tubeOdMm: number): number {
  const odInches = tubeOdMm / 25.4;
  requireInRange('tube OD', odInches, 0.5, 2.0, 'in');
  return cByOdInches.find((row) => odInches <= row.maxOd + 1e-9)!.c;
}

export function heiFt(inletK: number): number {
  const inletF = ((inletK - 273.15) * 9) / 5 + 32;
  if (inletF < 35 || inletF > 120) {
    throw new CalcInputError(
      'CW inlet temperature',
      `${inletF.toFixed(1)} °F is outside the HEI inlet-temperature table (35–120 °F); enter a data-sheet clean U`,
    );
  }
  return interpolate(ftTable, inletF);
}

export function heiFm(material: TubeMaterial, gaugeBwg: number): number {
  const row = fmByMaterial[material];
  if (!row) throw new CalcInputError('tube material', `unknown material ${String(material)}`);
  const column = tubeGauges.indexOf(gaugeBwg as (typeof tubeGauges)[number]);
  if (column < 0) throw new CalcInputError('tube gauge', `BWG ${gaugeBwg} is not one of ${tubeGauges.join(', ')}`);
  return row[column]!;
}

/** HEI clean U, W/(m²·K), at tube velocity v (m/s) and CW inlet temperature. */
export function cleanUHei(params: { tubeOdMm: number; gaugeBwg: number; material: TubeMaterial; velocityMS: number; inletK: number }): number {
  requirePositive('tube velocity', params.velocityMS);
  const vFtS = params.velocityMS * FT_PER_M;
  const uUs = heiC(params.tubeOdMm) * Math.sqrt(vFtS) * heiFt(params.inletK) * heiFm(params.material, params.gaugeBwg);
  return uUs * BTU_H_FT2_F_TO_W_M2_K;
}

/**
 * Data-sheet clean U corrected to today's velocity and inlet temperature, by the same HEI
 * dependences: U = U_ds · √(v / v_design) · Ft(T_in) / Ft(T_in,design).
 */
export function cleanUFromDataSheet(params: {
  designCleanU: number;
  velocityMS: number;
  designVelocityMS: number;
  inletK: number;
  designInletK: number;
}): number {
  requirePositive('design clean U', params.designCleanU);
  requirePositive('tube velocity', params.velocityMS);
  requirePositive('design tube velocity', params.designVelocityMS);
  return (
    params.designCleanU *
    Math.sqrt(params.velocityMS / params.designVelocityMS) *
    (heiFt(params.inletK) / heiFt(params.designInletK))
  );
}
