// The round form holds text as typed; this turns it into the shared reading-set contract.
import type { ReadingSetInput, readingSetInputSchema } from '../../../shared/schemas/reading-set';
import { lazyContract } from '../form/lazy-contract';
import { fieldLabel } from '../../../shared/schemas/field-labels';
import type { AbsolutePressureUnit, FlowUnit, PressureUnit, TemperatureUnit } from '../../../shared/units';

export type ReadingFormValues = {
  pressure: string;
  pressureUnit: PressureUnit;
  barometer: string;
  barometerUnit: AbsolutePressureUnit;
  temperatureUnit: TemperatureUnit;
  hotwell: string;
  cwInlet: string;
  cwOutlet: string;
  cwFlow: string;
  flowUnit: FlowUnit;
  steamFlowTH: string;
  dissolvedOxygen: string;
  basin: string;
  wetBulb: string;
  dryBulb: string;
  relativeHumidity: string;
  stationPressureKPa: string;
  makeupConductivity: string;
  basinConductivity: string;
  targetCycles: string;
  pH: string;
  sampleTemperature: string;
  tds: string;
  calciumHardness: string;
  alkalinity: string;
};

export const emptyReadingForm = (units: Pick<ReadingFormValues, 'pressureUnit' | 'temperatureUnit' | 'flowUnit' | 'barometerUnit'>): ReadingFormValues => ({
  pressure: '',
  barometer: '',
  hotwell: '',
  cwInlet: '',
  cwOutlet: '',
  cwFlow: '',
  steamFlowTH: '',
  dissolvedOxygen: '',
  basin: '',
  wetBulb: '',
  dryBulb: '',
  relativeHumidity: '',
  stationPressureKPa: '',
  makeupConductivity: '',
  basinConductivity: '',
  targetCycles: '',
  pH: '',
  sampleTemperature: '',
  tds: '',
  calciumHardness: '',
  alkalinity: '',
  ...units,
});

/** '' → absent; anything else → a number (NaN when it is not one, which the schema reports). */
const num = (text: string): number | undefined => (text.trim() === '' ? undefined : Number(text.replace(',', '.')));
const given = (...texts: string[]) => texts.some((t) => t.trim() !== '');

/** Where each contract path is typed on the form, so a message lands beside the right box. */
export const fieldForPath: Record<string, keyof ReadingFormValues> = {
  'pressure.value': 'pressure',
  'barometer.value': 'barometer',
  'hotwellTemperature.value': 'hotwell',
  'cwInletTemperature.value': 'cwInlet',
  'cwOutletTemperature.value': 'cwOutlet',
  'cwFlow.value': 'cwFlow',
  'steamFlow.value': 'steamFlowTH',
  dissolvedOxygenPpb: 'dissolvedOxygen',
  'tower.coldWaterTemperature.value': 'basin',
  'tower.wetBulbTemperature.value': 'wetBulb',
  'tower.dryBulbTemperature.value': 'dryBulb',
  'tower.relativeHumidityPercent': 'relativeHumidity',
  'tower.stationPressure.value': 'stationPressureKPa',
  'tower.makeupConductivity.value': 'makeupConductivity',
  'tower.basinConductivity.value': 'basinConductivity',
  'tower.targetCycles': 'targetCycles',
  'chemistry.pH': 'pH',
  'chemistry.temperature.value': 'sampleTemperature',
  'chemistry.tdsMgL': 'tds',
  'chemistry.calciumHardnessMgL': 'calciumHardness',
  'chemistry.alkalinityMgL': 'alkalinity',
};

export type FormErrors = Partial<Record<keyof ReadingFormValues, string>>;

/** The box that holds a contract path ("pressure.value", or "pressure" for the quantity as a whole), if any. */
export const readingFieldFor = (path: string): keyof ReadingFormValues | undefined => fieldForPath[path] ?? fieldForPath[`${path}.value`];

/** The typed text in the contract's shape, unchecked: what the shared reading-set schema is asked about. */
export function readingSetWire(unitId: number, v: ReadingFormValues) {
  const t = (text: string) => (given(text) ? { value: num(text), unit: v.temperatureUnit } : null);
  return {
    unitId,
    pressure: { value: num(v.pressure), unit: v.pressureUnit },
    barometer: given(v.barometer) ? { value: num(v.barometer), unit: v.barometerUnit } : null,
    hotwellTemperature: { value: num(v.hotwell), unit: v.temperatureUnit },
    cwInletTemperature: { value: num(v.cwInlet), unit: v.temperatureUnit },
    cwOutletTemperature: { value: num(v.cwOutlet), unit: v.temperatureUnit },
    cwFlow: given(v.cwFlow) ? { value: num(v.cwFlow), unit: v.flowUnit } : null,
    steamFlow: given(v.steamFlowTH) ? { value: num(v.steamFlowTH), unit: 't_h' } : null,
    dissolvedOxygenPpb: num(v.dissolvedOxygen) ?? null,
    tower: {
      coldWaterTemperature: t(v.basin),
      wetBulbTemperature: t(v.wetBulb),
      dryBulbTemperature: t(v.dryBulb),
      relativeHumidityPercent: num(v.relativeHumidity) ?? null,
      stationPressure: given(v.stationPressureKPa) ? { value: num(v.stationPressureKPa), unit: 'kPa_a' } : null,
      makeupConductivity: given(v.makeupConductivity) ? { value: num(v.makeupConductivity), unit: 'uS_cm' } : null,
      basinConductivity: given(v.basinConductivity) ? { value: num(v.basinConductivity), unit: 'uS_cm' } : null,
      targetCycles: num(v.targetCycles) ?? null,
    },
    chemistry: given(v.pH, v.sampleTemperature, v.tds, v.calciumHardness, v.alkalinity)
      ? {
          pH: num(v.pH),
          temperature: { value: num(v.sampleTemperature), unit: v.temperatureUnit },
          tdsMgL: num(v.tds),
          calciumHardnessMgL: num(v.calciumHardness),
          alkalinityMgL: num(v.alkalinity),
        }
      : null,
  };
}

/** The shared reading-set contract, loaded as the page opens (see form/lazy-contract.ts). */
export const readingSetContract = lazyContract(async () => (await import('../../../shared/schemas/reading-set')).readingSetInputSchema);

/** The form's text as a checked reading set (for the live checks), or the message for each box. */
export function toReadingSet(unitId: number, v: ReadingFormValues, contract: typeof readingSetInputSchema): { input: ReadingSetInput | null; errors: FormErrors } {
  const parsed = contract.safeParse(readingSetWire(unitId, v));
  if (parsed.success) return { input: parsed.data, errors: {} };
  const errors: FormErrors = {};
  for (const issue of parsed.error.issues) {
    const field = fieldForPath[issue.path.join('.')];
    if (field) errors[field] ??= issue.message;
  }
  return { input: null, errors };
}

/** A stored reading's raw values back into form text, to start an amendment from them. */
export function formValuesFromReading(raw: ReadingSetInput): ReadingFormValues {
  const text = (q: { value: number } | null | undefined) => (q ? String(q.value) : '');
  const tower = raw.tower ?? {};
  const chemistry = raw.chemistry;
  return {
    pressure: text(raw.pressure),
    pressureUnit: raw.pressure.unit as PressureUnit,
    barometer: text(raw.barometer),
    barometerUnit: (raw.barometer?.unit ?? 'kPa_a') as AbsolutePressureUnit,
    temperatureUnit: raw.hotwellTemperature.unit as TemperatureUnit,
    hotwell: text(raw.hotwellTemperature),
    cwInlet: text(raw.cwInletTemperature),
    cwOutlet: text(raw.cwOutletTemperature),
    cwFlow: text(raw.cwFlow),
    flowUnit: (raw.cwFlow?.unit ?? 'm3_h') as FlowUnit,
    steamFlowTH: raw.steamFlow ? String(raw.steamFlow.unit === 't_h' ? raw.steamFlow.value : raw.steamFlow.value * 3.6) : '',
    dissolvedOxygen: raw.dissolvedOxygenPpb == null ? '' : String(raw.dissolvedOxygenPpb),
    basin: text(tower.coldWaterTemperature),
    wetBulb: text(tower.wetBulbTemperature),
    dryBulb: text(tower.dryBulbTemperature),
    relativeHumidity: tower.relativeHumidityPercent == null ? '' : String(tower.relativeHumidityPercent),
    stationPressureKPa: tower.stationPressure ? String(tower.stationPressure.value) : '',
    makeupConductivity: text(tower.makeupConductivity),
    basinConductivity: text(tower.basinConductivity),
    targetCycles: tower.targetCycles == null ? '' : String(tower.targetCycles),
    pH: chemistry ? String(chemistry.pH) : '',
    sampleTemperature: chemistry ? String(chemistry.temperature.value) : '',
    tds: chemistry ? String(chemistry.tdsMgL) : '',
    calciumHardness: chemistry ? String(chemistry.calciumHardnessMgL) : '',
    alkalinity: chemistry ? String(chemistry.alkalinityMgL) : '',
  };
}

/** The round's time box beside the readings; the rest of a message's path names a box. */
export const roundFieldFor = (path: string): string | undefined => (path === 'takenAt' ? 'takenAt' : readingFieldFor(path));

/** The labels of the boxes that hold a message, in the words the person reads. */
export const boxLabels = (boxes: readonly string[]) => boxes.map((box) => fieldLabel(Object.keys(fieldForPath).find((path) => fieldForPath[path] === box) ?? box));
