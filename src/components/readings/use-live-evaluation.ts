import { useMemo } from 'react';
import { evaluateReadingSet, type Evaluation } from '../../../shared/calc/evaluate';
import { CalcInputError } from '../../../shared/calc/input-error';
import { readingSetToSi } from '../../../shared/calc/reading-set-si';
import type { ReadingSetInput } from '../../../shared/schemas/reading-set';
import { isVacuumUnit, type AbsolutePressureUnit } from '../../../shared/units';
import type { DisplayPreferences } from '../../../shared/display';
import type { DesignAndLimits } from './get-condenser-design';
import { fieldForPath, toReadingSet, type FormErrors, type ReadingFormValues } from './reading-form';

export type LiveEvaluation = {
  input: ReadingSetInput | null;
  evaluation: Evaluation | null;
  /** Messages for boxes that hold something wrong; empty required boxes are not errors yet. */
  shownErrors: FormErrors;
  allErrors: FormErrors;
  prefs: DisplayPreferences;
};

/** Recomputes every check on each keystroke with the same engine the server uses. */
export function useLiveEvaluation(unitId: number | null, values: ReadingFormValues, data: DesignAndLimits | undefined): LiveEvaluation {
  const { input, evaluation, errors } = useMemo(() => {
    if (!unitId || !data) return { input: null, evaluation: null, errors: {} as FormErrors };
    const built = toReadingSet(unitId, values);
    if (!built.input) return { input: null, evaluation: null, errors: built.errors };
    try {
      return { input: built.input, evaluation: evaluateReadingSet(readingSetToSi(built.input), data.design, data.limits, data.plausible), errors: {} as FormErrors };
    } catch (error) {
      if (error instanceof CalcInputError) {
        const field = fieldForPath[error.field];
        return { input: null, evaluation: null, errors: (field ? { [field]: error.detail } : {}) as FormErrors };
      }
      throw error;
    }
  }, [unitId, values, data]);

  const shownErrors = Object.fromEntries(
    Object.entries(errors).filter(([field]) => String(values[field as keyof ReadingFormValues] ?? '').trim() !== ''),
  ) as FormErrors;
  const pressure: AbsolutePressureUnit = isVacuumUnit(values.pressureUnit)
    ? ({ inHg_vac: 'inHgA', kPa_vac: 'kPa_a', mmHg_vac: 'mmHgA' } as const)[values.pressureUnit]
    : values.pressureUnit;
  return { input, evaluation, shownErrors, allErrors: errors, prefs: { temperature: values.temperatureUnit, pressure, currency: data?.design.currency ?? null } };
}
