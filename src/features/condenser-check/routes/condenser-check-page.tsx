import { useEffect, useMemo } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { useSearchParams } from 'react-router';
import { evaluateReadingSet, type Evaluation } from '../../../../shared/calc/evaluate';
import { CalcInputError } from '../../../../shared/calc/input-error';
import { readingSetToSi } from '../../../../shared/calc/reading-set-si';
import { isVacuumUnit, type AbsolutePressureUnit } from '../../../../shared/units';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { useUnits } from '../../overview/api/get-units';
import { useCondenserDesign } from '../api/get-condenser-design';
import { CheckResults } from '../components/check-results';
import { ReadingFormFields } from '../components/reading-form-fields';
import { emptyReadingForm, fieldForPath, toReadingSet, type FormErrors, type ReadingFormValues } from '../lib/reading-form';
import { loadUnitChoices, saveUnitChoices } from '../lib/unit-choices';

export function CondenserCheckPage() {
  const [params, setParams] = useSearchParams();
  const units = useUnits();
  const requested = Number(params.get('unit'));
  const unitId = Number.isInteger(requested) && requested > 0 ? requested : (units.data?.[0]?.id ?? null);
  const design = useCondenserDesign(unitId);
  const form = useForm<ReadingFormValues>({ defaultValues: emptyReadingForm(loadUnitChoices()), mode: 'onChange' });
  const values = useWatch({ control: form.control }) as ReadingFormValues;

  useEffect(() => {
    saveUnitChoices({
      pressureUnit: values.pressureUnit,
      temperatureUnit: values.temperatureUnit,
      flowUnit: values.flowUnit,
      barometerUnit: values.barometerUnit,
    });
  }, [values.pressureUnit, values.temperatureUnit, values.flowUnit, values.barometerUnit]);

  // The checks recompute on every keystroke, with the same engine the server uses.
  const { evaluation, errors } = useMemo((): { evaluation: Evaluation | null; errors: FormErrors } => {
    if (!unitId || !design.data) return { evaluation: null, errors: {} };
    const { input, errors: schemaErrors } = toReadingSet(unitId, values);
    if (!input) return { evaluation: null, errors: schemaErrors };
    try {
      return { evaluation: evaluateReadingSet(readingSetToSi(input), design.data.design, design.data.limits), errors: {} };
    } catch (error) {
      if (error instanceof CalcInputError) {
        const field = fieldForPath[error.field];
        return { evaluation: null, errors: field ? { [field]: error.detail } : {} };
      }
      throw error;
    }
  }, [unitId, values, design.data]);

  // Required boxes that are still empty are not errors yet: the person has not got to them.
  const shownErrors = Object.fromEntries(
    Object.entries(errors).filter(([field]) => String(values[field as keyof ReadingFormValues] ?? '').trim() !== ''),
  ) as FormErrors;
  const pressureDisplay: AbsolutePressureUnit = isVacuumUnit(values.pressureUnit)
    ? ({ inHg_vac: 'inHgA', kPa_vac: 'kPa_a', mmHg_vac: 'mmHgA' } as const)[values.pressureUnit]
    : values.pressureUnit;

  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <h1 className="text-2xl font-bold">Condenser check</h1>
          <p className="text-muted">Type a round’s readings; the checks update as you type. Nothing is saved from this page.</p>
        </div>
        <label className="ml-auto flex flex-col text-sm">
          Unit
          <select
            className="rounded-md border border-line bg-field px-2 py-1"
            value={unitId ?? ''}
            onChange={(e) => setParams({ unit: e.target.value })}
          >
            {units.data?.map((u) => (
              <option key={u.id} value={u.id}>
                {u.name} · {u.station}
              </option>
            ))}
          </select>
        </label>
      </div>
      <CautionNote />
      {design.error ? <Notice kind="error">{design.error.message}</Notice> : null}
      <div className="grid gap-6 lg:grid-cols-2">
        <form onSubmit={(e) => e.preventDefault()} noValidate aria-label="Round readings" className="rounded-lg border border-line bg-panel p-4">
          <ReadingFormFields form={form} errors={shownErrors} values={values} />
        </form>
        <div aria-live="polite">
          {evaluation ? (
            <CheckResults
              evaluation={evaluation}
              prefs={{ temperature: values.temperatureUnit, pressure: pressureDisplay, currency: design.data?.design.currency ?? null }}
            />
          ) : (
            <Notice kind="info">
              Enter the condenser pressure, the hotwell and both CW temperatures to see the checks. Add CW flow (or steam
              flow) for duty, cleanliness and expected backpressure.
            </Notice>
          )}
        </div>
      </div>
    </section>
  );
}
