import { useState } from 'react';
import { can } from '../../../../shared/policies/permissions';
import { useForm, useWatch } from 'react-hook-form';
import { Link } from 'react-router';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { Button } from '../../../components/ui/button';
import { CheckResults, EnterReadingsNotice } from '../../../components/readings/check-results';
import { ReadingFormFields } from '../../../components/readings/reading-form-fields';
import { ConfirmOutsidePlausible, useOutsidePlausibleQuestion } from '../../../components/readings/plausibility';
import { useCondenserDesign } from '../../../components/readings/get-condenser-design';
import { emptyReadingForm, fieldForPath, formErrorsFromServer, type FormErrors, type ReadingFormValues } from '../../../components/readings/reading-form';
import { fieldLabel } from '../../../../shared/schemas/field-labels';
import { loadUnitChoices, useRememberUnitChoices } from '../../../components/readings/unit-choices';
import { useLiveEvaluation } from '../../../components/readings/use-live-evaluation';
import { UnitPicker, useSelectedUnit } from '../../../components/readings/unit-picker';
import { StationTimeInput, readStationTime, useStationTimeField } from '../../../components/station-time/station-time-input';
import { formatStationTime } from '../../../../shared/station-time';
import { pressureUnitLabels, temperatureUnits, type PressureUnit, type TemperatureUnit } from '../../../../shared/units';
import { ApiError } from '../../../lib/api-client';
import { useMe } from '../../session/api/get-me';
import { useReadings, useRecordReading, type ReadingSummary } from '../api/readings';
import { RecentReadings } from '../components/recent-readings';
import { useWatchUnit } from '../../../app/use-live-updates';

function LastReadingHint({ last, timeZone }: { last: ReadingSummary | undefined; timeZone: string }) {
  if (!last) return null;
  const t = (q: { value: number; unit: string } | null | undefined) => (q ? `${q.value} ${temperatureUnits[q.unit as TemperatureUnit]?.label ?? q.unit}` : '—');
  return (
    <p className="rounded-md border border-line bg-panel px-3 py-2 text-sm" data-testid="last-reading">
      Last round {formatStationTime(last.takenAt, timeZone)} by {last.recordedBy}: pressure {last.raw.pressure.value}{' '}
      {pressureUnitLabels[last.raw.pressure.unit as PressureUnit]}, hotwell {t(last.raw.hotwellTemperature)}, CW in {t(last.raw.cwInletTemperature)}, CW out{' '}
      {t(last.raw.cwOutletTemperature)}
    </p>
  );
}

export function RoundsPage() {
  const { data: me } = useMe();
  const { unitId, unit } = useSelectedUnit();
  useWatchUnit(unitId);
  const design = useCondenserDesign(unitId);
  const readings = useReadings(unitId);
  const record = useRecordReading();
  const form = useForm<ReadingFormValues>({ defaultValues: emptyReadingForm(loadUnitChoices(me?.id)) });
  const values = useWatch({ control: form.control }) as ReadingFormValues;
  useRememberUnitChoices(values, me?.id);
  const live = useLiveEvaluation(unitId, values, design.data);
  const takenAt = useStationTimeField();
  const [serverErrors, setServerErrors] = useState<FormErrors>({});
  const [saveError, setSaveError] = useState<string | null>(null);
  const [takenAtError, setTakenAtError] = useState<string | undefined>();
  const question = useOutsidePlausibleQuestion(live.notices);
  const mayRecord = me && can(me.role, 'reading.record');

  /** `confirmed`: the person has seen the readings outside the plausible range and saves them anyway. */
  const save = (confirmed = false) => {
    setSaveError(null);
    setServerErrors({});
    setTakenAtError(undefined);
    if (!unitId || !live.input) {
      // Empty required boxes are quiet while typing; on save each says it is missing.
      setServerErrors(live.allErrors);
      const boxes = Object.keys(live.allErrors).map((box) => fieldLabel(Object.keys(fieldForPath).find((path) => fieldForPath[path] === box) ?? box));
      setSaveError(boxes.length ? `Nothing was saved; see the readings marked below: ${boxes.join(', ')}.` : 'Some readings are missing or wrong; see the messages beside them.');
      return;
    }
    const typed = unit ? readStationTime(takenAt, unit.timeZone) : { ok: true as const, at: null };
    if (!typed.ok) {
      setSaveError('Check the “Taken at” time; see the message beside it.');
      return;
    }
    if (question.mustAsk(confirmed)) return;
    const { unitId: _unit, ...reading } = live.input;
    const confirmOutsidePlausible = confirmed ? question.keys() : [];
    record.mutate(
      { unitId, reading: { ...reading, ...(typed.at ? { takenAt: typed.at.toISOString() } : {}), ...(confirmOutsidePlausible.length ? { confirmOutsidePlausible } : {}) } },
      {
        onSuccess: () => {
          form.reset(emptyReadingForm(loadUnitChoices(me?.id)));
          takenAt.reset();
          question.reset();
        },
        onError: (error) => {
          if (question.takeRefusal(error)) return;
          setSaveError(error.message);
          if (error instanceof ApiError) {
            setServerErrors(formErrorsFromServer(error.fields));
            setTakenAtError(error.fields.takenAt);
          }
        },
      },
    );
  };

  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <h1 className="text-2xl font-bold">Rounds</h1>
          <p className="text-muted">{unit ? `${unit.name} · ${unit.station}` : ''} — record a round; the checks update as you type.</p>
        </div>
        <UnitPicker />
      </div>
      <CautionNote />
      {me?.role === 'trainee' ? <Notice kind="info">Your rounds are marked as a trainee’s and wait for an operator’s countersign.</Notice> : null}
      {unit ? <LastReadingHint last={readings.data?.[0]} timeZone={unit.timeZone} /> : null}
      {record.isSuccess ? (
        <Notice kind="success">
          Round saved.{' '}
          <Link className="underline" to={`/rounds/${record.data.id}`}>
            Open it
          </Link>
          {record.data.flagsRaised ? ` — ${record.data.flagsRaised} new flag(s) raised.` : ''}
        </Notice>
      ) : null}
      {saveError ? <Notice kind="error">{saveError}</Notice> : null}
      {design.error ? <Notice kind="error">{design.error.message}</Notice> : null}
      <div className="grid gap-6 lg:grid-cols-2">
        <form
          aria-label="Record a round"
          noValidate
          className="flex flex-col gap-4 rounded-lg border border-line bg-panel p-4"
          onSubmit={(e) => {
            e.preventDefault();
            save();
          }}
        >
          {unit ? <StationTimeInput className="text-sm font-bold" label="Taken at (leave empty for now)" field={takenAt} timeZone={unit.timeZone} error={takenAtError} /> : null}
          <ReadingFormFields form={form} errors={{ ...live.shownErrors, ...serverErrors }} values={values} warnings={live.warnings} />
          {mayRecord && question.asking ? (
            <ConfirmOutsidePlausible notices={question.notices} pending={record.isPending} onConfirm={() => save(true)} onCancel={question.cancel} />
          ) : null}
          {mayRecord ? (
            <Button type="submit" disabled={record.isPending}>
              {record.isPending ? 'Saving…' : 'Save round'}
            </Button>
          ) : (
            <Notice kind="info">Your role reviews rounds; it does not record them.</Notice>
          )}
        </form>
        <div className="flex flex-col gap-4" aria-live="polite">
          {live.evaluation ? <CheckResults evaluation={live.evaluation} prefs={live.prefs} /> : <EnterReadingsNotice />}
        </div>
      </div>
      {readings.data && unit ? <RecentReadings readings={readings.data} timeZone={unit.timeZone} /> : null}
    </section>
  );
}
