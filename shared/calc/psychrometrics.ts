// Wet-bulb temperature from dry bulb, relative humidity and station pressure.
// Source: ASHRAE Handbook — Fundamentals (2017), chapter 1: saturation pressure eqs. 5–6
// (Hyland & Wexler), humidity ratio eq. 20, wet-bulb relations eqs. 33 and 35.
import { requireInRange } from './input-error';

const TRIPLE_POINT_K = 273.16;

/** Saturation vapour pressure over ice (below the triple point) or liquid water, Pa. */
export function saturationVapourPressure(temperatureK: number): number {
  const T = temperatureK;
  if (T < TRIPLE_POINT_K) {
    return Math.exp(
      -5.6745359e3 / T + 6.3925247 - 9.677843e-3 * T + 6.2215701e-7 * T ** 2 + 2.0747825e-9 * T ** 3 - 9.484024e-13 * T ** 4 + 4.1635019 * Math.log(T),
    );
  }
  return Math.exp(-5.8002206e3 / T + 1.3914993 - 4.8640239e-2 * T + 4.1764768e-5 * T ** 2 - 1.4452093e-8 * T ** 3 + 6.5459673 * Math.log(T));
}

/** Humidity ratio, kg water / kg dry air, from vapour partial pressure: W = 0.621945 pw / (p − pw). */
export function humidityRatio(vapourPressurePa: number, pressurePa: number): number {
  return (0.621945 * vapourPressurePa) / (pressurePa - vapourPressurePa);
}

/** Humidity ratio that air at dry bulb t would have if its wet bulb were t* (ASHRAE eqs. 33/35), t in °C. */
export function humidityRatioForWetBulb(dryC: number, wetC: number, pressurePa: number): number {
  const wsStar = humidityRatio(saturationVapourPressure(wetC + 273.15), pressurePa);
  if (wetC >= 0) {
    return ((2501 - 2.326 * wetC) * wsStar - 1.006 * (dryC - wetC)) / (2501 + 1.86 * dryC - 4.186 * wetC);
  }
  return ((2830 - 0.24 * wetC) * wsStar - 1.006 * (dryC - wetC)) / (2830 + 1.86 * dryC - 2.1 * wetC);
}

/**
 * Thermodynamic wet-bulb temperature, K. Solves ASHRAE eq. 33/35 for t* by bisection between
 * −100 °C and the dry bulb (the humidity ratio rises monotonically with t*).
 * @param relativeHumidity fraction 0–1
 */
export function wetBulbTemperature(dryBulbK: number, relativeHumidity: number, pressurePa: number): number {
  requireInRange('dry-bulb temperature', dryBulbK, 233.15, 333.15, 'K');
  if (!(relativeHumidity >= 0 && relativeHumidity <= 1)) {
    requireInRange('relative humidity', relativeHumidity * 100, 0, 100, '%');
  }
  requireInRange('station pressure', pressurePa, 50_000, 110_000, 'Pa');
  const dryC = dryBulbK - 273.15;
  const target = humidityRatio(relativeHumidity * saturationVapourPressure(dryBulbK), pressurePa);
  let lo = -100;
  let hi = dryC;
  for (let i = 0; i < 60 && hi - lo > 1e-6; i++) {
    const mid = (lo + hi) / 2;
    if (humidityRatioForWetBulb(dryC, mid, pressurePa) > target) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2 + 273.15;
}
