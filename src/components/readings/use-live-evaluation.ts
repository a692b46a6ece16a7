import { useMemo } from 'react';
import type { Evaluation } from '../../../shared/calc/evaluate';
import { CalcInputError } from '../../../shared/calc/input-error';
import type { ImplausibleNotice } from '../../../shared/plausibility-display';
import type { ReadingSetInput } from '../../../shared/schemas/reading-set';
import { isVacuumUnit, type AbsolutePressureUnit } from '../../../shared/units';
import type { DisplayPreferences } from '../../../shared/display';
import type { DesignAndLimits } from './get-condenser-design';
import { fieldForPath, readingSetContract, toReadingSet, type FormErrors, type ReadingFormValues } from './reading-form';
import { useLoadedContract } from '../form/lazy-contract';
import { once, useLoaded } from '../../lib/load-on-demand';

const loadEngine = once(() => import('./live-engine'));

export type LiveEvaluation = {
  input: ReadingSetInput | null;
  evaluation: Evaluation | null;
  /** Messages for boxes that hold something wrong; empty required boxes are not errors yet. */
  shownErrors: FormErrors;
  prefs: DisplayPreferences;
  /** Readings and checks outside the unit's plausible ranges, in the round's units: saving asks to confirm them. */
  notices: ImplausibleNotice[];
  /** The same, on the boxes they belong to. */
  warnings: FormErrors;
};

/**
 * Recomputes every check on each keystroke with the same engine the server uses. Until the engine and
 * the shared contract have loaded (moments after the page opens) there is nothing to show yet, as with
 * an empty form; what was typed meanwhile is checked as soon as they are there.
 */
export function useLiveEvaluation(unitId: number | null, values: ReadingFormValues, data: DesignAndLimits | undefined): LiveEvaluation {
  const contract = useLoadedContract(readingSetContract);
  const engine = useLoaded(loadEngine);
  const { input, evaluation, errors, notices } = useMemo(() => {
    const none: ImplausibleNotice[] = [];
    if (!unitId || !data || !contract || !engine) return { input: null, evaluation: null, errors: {} as FormErrors, notices: none };
    const built = toReadingSet(unitId, values, contract);
    if (!built.input) return { input: null, evaluation: null, errors: built.errors, notices: none };
    try {
      const si = engine.readingSetToSi(built.input);
      const evaluation = engine.evaluateReadingSet(si, data.design, data.limits, data.plausible);
      return { input: built.input, evaluation, errors: {} as FormErrors, notices: engine.describeImplausible(evaluation.implausible, built.input, si.cwInletK, data.design) };
    } catch (error) {
      if (error instanceof CalcInputError) {
        const field = fieldForPath[error.field];
        return { input: null, evaluation: null, errors: (field ? { [field]: error.sentence } : {}) as FormErrors, notices: none };
      }
      throw error;
    }
  }, [unitId, values, data, contract, engine]);
  const warnings: FormErrors = {};
  for (const notice of notices) {
    const field = fieldForPath[notice.field];
    if (field) warnings[field] = warnings[field] ? `${warnings[field]} ${notice.message}` : notice.message;
  }

  const shownErrors = Object.fromEntries(
    Object.entries(errors).filter(([field]) => String(values[field as keyof ReadingFormValues] ?? '').trim() !== ''),
  ) as FormErrors;
  const pressure: AbsolutePressureUnit = isVacuumUnit(values.pressureUnit)
    ? ({ inHg_vac: 'inHgA', kPa_vac: 'kPa_a', mmHg_vac: 'mmHgA' } as const)[values.pressureUnit]
    : values.pressureUnit;
  return {
    input,
    evaluation,
    shownErrors,
    prefs: { temperature: values.temperatureUnit, pressure, currency: data?.design.currency ?? null },
    notices,
    warnings,
  };
}
