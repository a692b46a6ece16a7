import { useWatch } from 'react-hook-form';
import { readingSetInputSchema } from '../../../../shared/schemas/reading-set';
import { throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { CheckResults, EnterReadingsNotice } from '../../../components/readings/check-results';
import { ReadingFormFields } from '../../../components/readings/reading-form-fields';
import { useCondenserDesign } from '../../../components/readings/get-condenser-design';
import { emptyReadingForm, readingFieldFor, readingSetWire, type ReadingFormValues } from '../../../components/readings/reading-form';
import { loadUnitChoices, useRememberUnitChoices } from '../../../components/readings/unit-choices';
import { useLiveEvaluation } from '../../../components/readings/use-live-evaluation';
import { UnitPicker, useSelectedUnit } from '../../../components/readings/unit-picker';
import { useMe } from '../../session';

export function CondenserCheckPage() {
  const { data: me } = useMe();
  const { unitId } = useSelectedUnit();
  const design = useCondenserDesign(unitId);
  // Nothing is saved here, so the form is never submitted: the checks and messages come from the live evaluation,
  // which asks the same reading-set contract as a round.
  const form = useSchemaForm(
    throughContract((v: ReadingFormValues) => readingSetWire(unitId ?? 0, v), readingSetInputSchema, readingFieldFor),
    { defaultValues: emptyReadingForm(loadUnitChoices(me?.id)) },
  );
  const values = useWatch({ control: form.control }) as ReadingFormValues;
  useRememberUnitChoices(values, me?.id);
  const live = useLiveEvaluation(unitId, values, design.data);

  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <h1 className="text-2xl font-bold">Condenser check</h1>
          <p className="text-muted">Try readings and see the checks; nothing is saved here. Record real rounds under Rounds.</p>
        </div>
        <UnitPicker />
      </div>
      <CautionNote />
      {design.error ? <Notice kind="error">{design.error.message}</Notice> : null}
      <div className="grid gap-6 lg:grid-cols-2">
        <form onSubmit={(e) => e.preventDefault()} noValidate aria-label="Round readings" className="rounded-lg border border-line bg-panel p-4">
          <ReadingFormFields form={form} errors={live.shownErrors} values={values} />
        </form>
        <div aria-live="polite">
          {live.evaluation ? <CheckResults evaluation={live.evaluation} prefs={live.prefs} /> : <EnterReadingsNotice />}
        </div>
      </div>
    </section>
  );
}

