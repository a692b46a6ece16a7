// Raw readings (operator's units) → SI, at the edge. Errors name the input's field path.
import { isWithin, rangeMessage, temperatureRangeIn, vacuumRangeIn } from '../physical-ranges';
import type { ReadingSetInput } from '../schemas/reading-set';
import {
  STANDARD_ATMOSPHERE_PA,
  isVacuumUnit,
  microSiemensPerCmToSiPerM,
  pressureReadingToPa,
  absolutePressureToPa,
  flowToKgS,
  temperatureToK,
  type AbsolutePressureUnit,
  type FlowUnit,
  type PressureUnit,
  type TemperatureUnit,
} from '../units';
import type { ReadingSetSi } from './evaluate';
import { CalcInputError } from './input-error';
import { waterDensity } from './water';

type Temp = { value: number; unit: string } | null | undefined;
const toK = (t: Temp, field: string) => (t ? temperatureToK(t.value, t.unit as TemperatureUnit, field) : null);

export function readingSetToSi(input: ReadingSetInput): ReadingSetSi {
  const pressureUnit = input.pressure.unit as PressureUnit;
  if (isVacuumUnit(pressureUnit)) {
    const barometerPa = input.barometer
      ? absolutePressureToPa(input.barometer.value, input.barometer.unit as AbsolutePressureUnit, 'barometer.value')
      : STANDARD_ATMOSPHERE_PA;
    const range = vacuumRangeIn(pressureUnit, barometerPa);
    if (!isWithin(input.pressure.value, range)) {
      const against = input.barometer ? 'with this barometer' : 'against the standard atmosphere (no barometer given)';
      throw new CalcInputError('pressure.value', `${rangeMessage('Condenser vacuum', range)} ${against}`);
    }
  }
  const pressure = pressureReadingToPa(
    input.pressure.value,
    input.pressure.unit as PressureUnit,
    input.barometer ? { value: input.barometer.value, unit: input.barometer.unit as AbsolutePressureUnit } : null,
    'pressure.value',
  );
  const inletRange = temperatureRangeIn('waterTemperature', input.cwInletTemperature.unit as TemperatureUnit);
  if (!isWithin(input.cwInletTemperature.value, inletRange)) {
    throw new CalcInputError('cwInletTemperature.value', rangeMessage('CW inlet temperature', inletRange));
  }
  const cwInletK = toK(input.cwInletTemperature, 'cwInletTemperature.value')!;
  // Volume flows of CW become mass flows at the inlet water's density.
  const density = waterDensity(cwInletK, 'cwInletTemperature.value');
  const flow = (f: { value: number; unit: string } | null | undefined, field: string) =>
    f ? flowToKgS(f.value, f.unit as FlowUnit, density, field) : null;
  const tower = input.tower;
  const conductivity = (c: { value: number } | null | undefined) => (c ? microSiemensPerCmToSiPerM(c.value) : null);

  return {
    pressurePa: pressure.pa,
    assumedStandardBarometer: pressure.assumedStandardBarometer,
    hotwellK: toK(input.hotwellTemperature, 'hotwellTemperature.value')!,
    cwInletK,
    cwOutletK: toK(input.cwOutletTemperature, 'cwOutletTemperature.value')!,
    cwFlowKgS: flow(input.cwFlow, 'cwFlow.value'),
    steamFlowKgS: input.steamFlow ? (input.steamFlow.unit === 't_h' ? (input.steamFlow.value * 1000) / 3600 : input.steamFlow.value) : null,
    airRemovalKgS: input.airRemovalFlow
      ? input.airRemovalFlow.unit === 'kg_h'
        ? input.airRemovalFlow.value / 3600
        : input.airRemovalFlow.value
      : null,
    dissolvedOxygenPpb: input.dissolvedOxygenPpb ?? null,
    tower: tower
      ? {
          hotWaterK: toK(tower.hotWaterTemperature, 'tower.hotWaterTemperature.value'),
          coldWaterK: toK(tower.coldWaterTemperature, 'tower.coldWaterTemperature.value'),
          wetBulbK: toK(tower.wetBulbTemperature, 'tower.wetBulbTemperature.value'),
          dryBulbK: toK(tower.dryBulbTemperature, 'tower.dryBulbTemperature.value'),
          relativeHumidity: tower.relativeHumidityPercent == null ? null : tower.relativeHumidityPercent / 100,
          stationPressurePa: tower.stationPressure
            ? absolutePressureToPa(tower.stationPressure.value, tower.stationPressure.unit as AbsolutePressureUnit, 'tower.stationPressure.value')
            : null,
          circulatingKgS: flow(tower.circulatingFlow, 'tower.circulatingFlow.value'),
          makeupConductivity: conductivity(tower.makeupConductivity),
          towerConductivity: conductivity(tower.basinConductivity),
          targetCycles: tower.targetCycles ?? null,
        }
      : null,
    chemistry: input.chemistry
      ? {
          pH: input.chemistry.pH,
          temperatureK: toK(input.chemistry.temperature, 'chemistry.temperature.value')!,
          totalDissolvedSolids: input.chemistry.tdsMgL,
          calciumHardness: input.chemistry.calciumHardnessMgL,
          totalAlkalinity: input.chemistry.alkalinityMgL,
        }
      : null,
  };
}
