import { useEffect } from 'react';
import type { ReadingFormValues } from './reading-form';
import type { AbsolutePressureUnit, FlowUnit, PressureUnit, TemperatureUnit } from '../../../shared/units';

export type UnitChoices = { pressureUnit: PressureUnit; temperatureUnit: TemperatureUnit; flowUnit: FlowUnit; barometerUnit: AbsolutePressureUnit };
const KEY = 'hotwell.unit-choices';
const defaults: UnitChoices = { pressureUnit: 'kPa_a', temperatureUnit: 'degC', flowUnit: 'm3_h', barometerUnit: 'kPa_a' };

const keyFor = (userId: number | undefined) => (userId ? `${KEY}.${userId}` : KEY);

/** Each person's unit choices are remembered on the device they use, per person. */
export function loadUnitChoices(userId?: number): UnitChoices {
  try {
    return { ...defaults, ...(JSON.parse(localStorage.getItem(keyFor(userId)) ?? '{}') as Partial<UnitChoices>) };
  } catch {
    return defaults;
  }
}

export function saveUnitChoices(choices: UnitChoices, userId?: number) {
  localStorage.setItem(keyFor(userId), JSON.stringify(choices));
}

/** Saves the form's unit choices whenever one changes. */
export function useRememberUnitChoices(values: ReadingFormValues, userId: number | undefined) {
  useEffect(() => {
    saveUnitChoices({
      pressureUnit: values.pressureUnit,
      temperatureUnit: values.temperatureUnit,
      flowUnit: values.flowUnit,
      barometerUnit: values.barometerUnit,
    }, userId);
  }, [values.pressureUnit, values.temperatureUnit, values.flowUnit, values.barometerUnit, userId]);
}
