import type { UseFormReturn } from 'react-hook-form';
import {
  absolutePressureUnits,
  flowUnits,
  isVacuumUnit,
  pressureUnitLabels,
  temperatureUnits,
  vacuumUnits,
  type PressureUnit,
} from '../../../shared/units';
import type { FormErrors, ReadingFormValues } from './reading-form';
import type { ReactNode } from 'react';
import { NumberField } from './number-field';
import { PlausibleWarning } from './plausibility';

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any form whose values include the reading boxes (a round adds its time, an amendment its reason)
type Props<T extends ReadingFormValues> = { form: UseFormReturn<T, any, any>; errors: FormErrors; values: ReadingFormValues; warnings?: FormErrors };

const selectClass = 'rounded-md border border-line bg-field px-2 py-1';

export function ReadingFormFields<T extends ReadingFormValues>({ form: anyForm, errors, values, warnings = {} }: Props<T>) {
  // The boxes are the same in every such form; only their names matter here.
  const form = anyForm as unknown as UseFormReturn<ReadingFormValues>;
  const { register } = form;
  // A box outside the plausible range says so beside it (an error, when there is one, says more).
  const warn = (field: keyof ReadingFormValues, hint?: ReactNode) => (warnings[field] ? <PlausibleWarning text={warnings[field]} /> : hint);
  const t = temperatureUnits[values.temperatureUnit].label;
  const vacuum = isVacuumUnit(values.pressureUnit);
  return (
    <div className="flex flex-col gap-5">
      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="mb-2 font-bold">Units for this round</legend>
        <label className="flex flex-col text-sm">
          Pressure gauge
          <select
            className={selectClass}
            {...register('pressureUnit', {
              // A vacuum gauge's barometer is usually read in the same family of units.
              onChange: (e: { target: { value: PressureUnit } }) => {
                const unit = e.target.value;
                if (isVacuumUnit(unit) && !form.getValues('barometer')) form.setValue('barometerUnit', vacuumUnits[unit].absolute);
              },
            })}
          >
            {(Object.keys(pressureUnitLabels) as PressureUnit[]).map((u) => (
              <option key={u} value={u}>
                {pressureUnitLabels[u]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm">
          Temperatures
          <select className={selectClass} {...register('temperatureUnit')}>
            {Object.entries(temperatureUnits).map(([u, { label }]) => (
              <option key={u} value={u}>
                {label}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm">
          CW flow
          <select className={selectClass} {...register('flowUnit')}>
            {Object.entries(flowUnits).map(([u, { label }]) => (
              <option key={u} value={u}>
                {label}
              </option>
            ))}
          </select>
        </label>
      </fieldset>

      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-2 font-bold">Condenser</legend>
        <NumberField
          label={vacuum ? 'Condenser vacuum' : 'Condenser absolute pressure'}
          unit={pressureUnitLabels[values.pressureUnit]}
          error={errors.pressure}
          hint={warn('pressure')}
          registration={register('pressure')}
        />
        {vacuum ? (
          <div className="flex flex-col gap-1">
            <NumberField
              label="Barometer"
              unit={
                <select aria-label="Barometer unit" className={selectClass} {...register('barometerUnit')}>
                  {Object.entries(absolutePressureUnits).map(([u, { label }]) => (
                    <option key={u} value={u}>
                      {label}
                    </option>
                  ))}
                </select>
              }
              hint="Leave empty to assume the standard atmosphere (101.325 kPa)."
              error={errors.barometer}
              registration={register('barometer')}
            />
          </div>
        ) : null}
        <NumberField label="Hotwell temperature" unit={t} error={errors.hotwell} hint={warn('hotwell')} registration={register('hotwell')} />
        <NumberField label="CW inlet temperature" unit={t} error={errors.cwInlet} hint={warn('cwInlet')} registration={register('cwInlet')} />
        <NumberField label="CW outlet temperature" unit={t} error={errors.cwOutlet} hint={warn('cwOutlet')} registration={register('cwOutlet')} />
        <NumberField label="CW flow" unit={flowUnits[values.flowUnit].label} error={errors.cwFlow} hint={warn('cwFlow')} registration={register('cwFlow')} />
        <NumberField
          label="Exhaust steam flow (if CW flow is not measured)"
          unit="t/h"
          error={errors.steamFlowTH}
          hint={warn('steamFlowTH')}
          registration={register('steamFlowTH')}
        />
        <NumberField label="Condensate dissolved oxygen" unit="ppb" error={errors.dissolvedOxygen} registration={register('dissolvedOxygen')} />
      </fieldset>

      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-2 font-bold">Cooling tower (optional)</legend>
        <NumberField label="Basin (cold-water) temperature" unit={t} error={errors.basin} hint={warn('basin')} registration={register('basin')} />
        <NumberField label="Wet bulb (if measured)" unit={t} error={errors.wetBulb} registration={register('wetBulb')} />
        <NumberField label="Dry bulb" unit={t} error={errors.dryBulb} registration={register('dryBulb')} />
        <NumberField label="Relative humidity" unit="%" error={errors.relativeHumidity} registration={register('relativeHumidity')} />
        <NumberField label="Station pressure" unit="kPa a" error={errors.stationPressureKPa} registration={register('stationPressureKPa')} />
        <NumberField label="Makeup conductivity" unit="µS/cm" error={errors.makeupConductivity} registration={register('makeupConductivity')} />
        <NumberField label="Basin conductivity" unit="µS/cm" error={errors.basinConductivity} hint={warn('basinConductivity')} registration={register('basinConductivity')} />
        <NumberField label="Target cycles" unit="(ratio)" error={errors.targetCycles} registration={register('targetCycles')} />
      </fieldset>

      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-2 font-bold">Circulating-water chemistry (optional)</legend>
        <NumberField label="pH" unit="(pH)" error={errors.pH} hint={warn('pH')} registration={register('pH')} />
        <NumberField label="Sample temperature" unit={t} error={errors.sampleTemperature} registration={register('sampleTemperature')} />
        <NumberField label="Total dissolved solids" unit="mg/L" error={errors.tds} registration={register('tds')} />
        <NumberField label="Calcium hardness" unit="mg/L as CaCO₃" error={errors.calciumHardness} registration={register('calciumHardness')} />
        <NumberField label="Total alkalinity" unit="mg/L as CaCO₃" error={errors.alkalinity} registration={register('alkalinity')} />
      </fieldset>
    </div>
  );
}
