import { useId, useMemo, useState } from 'react';
import { can } from '../../../../shared/policies/permissions';
import { roundWaitsForCountersign } from '../../../../shared/policies/readings';
import { useWatch } from 'react-hook-form';
import { Link } from 'react-router';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { Button } from '../../../components/ui/button';
import { CheckResults, EnterReadingsNotice } from '../../../components/readings/check-results';
import { ChecksSummary } from '../../../components/readings/checks-summary';
import { ReadingFormFields } from '../../../components/readings/reading-form-fields';
import { ConfirmOutsidePlausible, useOutsidePlausibleQuestion } from '../../../components/readings/plausibility';
import { useCondenserDesign } from '../../../components/readings/get-condenser-design';
import { boxLabels, emptyReadingForm, formValuesFromReading, readingSetWire, roundFieldFor, type FormErrors, type ReadingFormValues } from '../../../components/readings/reading-form';
import { lazyContract } from '../../../components/form/lazy-contract';
import { FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { loadUnitChoices, useRememberUnitChoices } from '../../../components/readings/unit-choices';
import { useLiveEvaluation } from '../../../components/readings/use-live-evaluation';
import { UnitPicker, useSelectedUnit } from '../../../components/readings/unit-picker';
import { emptyStationTime, StationTimeInput, stationTimeToWire, useStationTimeFormField, type StationTimeValue } from '../../../components/station-time/station-time-input';
import { formatStationTime, toStationInputValue } from '../../../../shared/station-time';
import { pressureUnitLabels, temperatureUnits, type PressureUnit, type TemperatureUnit } from '../../../../shared/units';
import { useMe } from '../../session';
import { useReadings, useRecordReading, type ReadingSummary } from '../api/readings';
import { WaitingRecords, discard, type QueuedRecord } from '../../offline';
import { worstOf } from '../../../../shared/calc/worst-status';
import type { ReadingSetInput } from '../../../../shared/schemas/reading-set';
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

type RoundValues = ReadingFormValues & { takenAt: StationTimeValue };

/** The shared round contract, loaded as the page opens rather than with its code (form/lazy-contract.ts). */
const recordReadingContract = lazyContract(async () => (await import('../../../../shared/schemas/readings')).recordReadingSchema);

/** The line a round kept on the device shows while it waits: the readings a person checks it by. */
function roundSummary(reading: Omit<ReadingSetInput, 'unitId'>): string {
  const q = (v: { value: number; unit: string } | null | undefined, labels: Record<string, { label: string } | string>) => {
    if (!v) return '—';
    const label = labels[v.unit];
    return `${v.value} ${typeof label === 'string' ? label : (label?.label ?? v.unit)}`;
  };
  return `Pressure ${q(reading.pressure, pressureUnitLabels)}, hotwell ${q(reading.hotwellTemperature, temperatureUnits)}, CW in ${q(reading.cwInletTemperature, temperatureUnits)}, CW out ${q(reading.cwOutletTemperature, temperatureUnits)}`;
}

export function RoundsPage() {
  const { data: me } = useMe();
  const { unitId, unit } = useSelectedUnit();
  useWatchUnit(unitId);
  const design = useCondenserDesign(unitId);
  const readings = useReadings(unitId);
  const record = useRecordReading();
  const timeZone = unit?.timeZone ?? 'UTC';
  // The boxes hold text in the round's units; the shared round contract checks what they make, and its
  // messages come back beside the box that holds each value.
  const schema = useMemo(
    () =>
      throughContract(
        ({ takenAt, ...boxes }: RoundValues, fail) => {
          const { unitId: _unit, ...reading } = readingSetWire(unitId ?? 0, boxes);
          const at = stationTimeToWire(takenAt, timeZone, fail, 'takenAt');
          return { ...reading, ...(at ? { takenAt: at } : {}) };
        },
        recordReadingContract,
        roundFieldFor,
      ),
    [unitId, timeZone],
  );
  const blank = (): RoundValues => ({ ...emptyReadingForm(loadUnitChoices(me?.id)), takenAt: emptyStationTime });
  const form = useSchemaForm(schema, { defaultValues: blank(), fieldFor: roundFieldFor });
  const watched = useWatch({ control: form.control }) as RoundValues;
  const values = useMemo((): ReadingFormValues => {
    const { takenAt: _takenAt, ...boxes } = watched;
    return boxes;
  }, [watched]);
  useRememberUnitChoices(values, me?.id);
  const live = useLiveEvaluation(unitId, values, design.data);
  const takenAt = useStationTimeFormField(form, 'takenAt');
  const [refusal, setRefusal] = useState<string | null>(null);
  const checksPanelId = useId();
  // A round refused on arrival, put back in the form by its author: it leaves the device once the corrected one is saved or kept.
  const [fixing, setFixing] = useState<QueuedRecord | null>(null);
  const fix = (queued: QueuedRecord) => {
    const { takenAt: queuedTakenAt, confirmOutsidePlausible: _confirmed, ...raw } = queued.payload as Omit<ReadingSetInput, 'unitId'> & { takenAt?: string; confirmOutsidePlausible?: unknown };
    const at = queuedTakenAt ?? queued.enteredAt;
    form.reset({ ...formValuesFromReading({ ...raw, unitId: queued.unitId } as ReadingSetInput), takenAt: { text: toStationInputValue(at, timeZone), repeated: 'first' } });
    setFixing(queued);
  };
  const question = useOutsidePlausibleQuestion(live.notices);
  const mayRecord = me && can(me.role, 'reading.record');
  const boxErrors = Object.fromEntries(Object.keys(values).map((box) => [box, form.error(box)]).filter(([, message]) => message)) as FormErrors;

  /** `confirmed`: the person has seen the readings outside the plausible range and saves them anyway. */
  const save = (confirmed = false) =>
    form.submit(
      async (reading) => {
        setRefusal(null);
        if (!unitId || question.mustAsk(confirmed)) return;
        const confirmOutsidePlausible = confirmed ? question.keys() : [];
        try {
          await record.mutateAsync({
            unitId,
            userId: me!.id,
            reading: { ...reading, ...(confirmOutsidePlausible.length ? { confirmOutsidePlausible } : {}) },
            summary: roundSummary(reading),
            worstStatus: live.evaluation ? worstOf(live.evaluation) : 'unknown',
          });
        } catch (error) {
          if (question.takeRefusal(error)) return;
          throw error;
        }
        form.reset(blank());
        question.reset();
        // The refused copy goes only when its correction was saved on its own unit (the picker may have moved on).
        if (fixing && fixing.unitId === unitId) await discard(fixing.clientId);
        setFixing(null);
      },
      (errors) => {
        // Empty required boxes are quiet while typing; on save each says it is missing.
        const boxes = Object.keys(errors).filter((box) => box !== 'takenAt');
        setRefusal(
          boxes.length
            ? `Nothing was saved; see the readings marked below: ${boxLabels(boxes).join(', ')}.`
            : errors.takenAt
              ? 'Check the “Taken at” time; see the message beside it.'
              : 'Some readings are missing or wrong; see the messages beside them.',
        );
      },
    )();

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
      {me && roundWaitsForCountersign(me.role) ? <Notice kind="info">Your rounds are marked as a trainee’s and wait for an operator’s countersign.</Notice> : null}
      {unit ? <LastReadingHint last={readings.data?.[0]} timeZone={unit.timeZone} /> : null}
      {record.data?.saved ? (
        <Notice kind="success">
          Round saved.{' '}
          <Link className="underline" to={`/rounds/${record.data.saved.id}`}>
            Open it
          </Link>
          {record.data.saved.flagsRaised ? ` — ${record.data.saved.flagsRaised} new flag(s) raised.` : ''}
        </Notice>
      ) : null}
      {record.data?.kept ? (
        <Notice kind="info">
          No connection to the server: the round is kept on this device, waiting to send (entered {formatStationTime(record.data.kept.enteredAt, timeZone, 'datetime-seconds')}). It is
          sent by itself when the network is back.
        </Notice>
      ) : null}
      {fixing ? <Notice kind="info">The refused round is in the form: correct it and save; the refused copy is then removed from this device.</Notice> : null}
      {me && unitId ? <WaitingRecords kind="round" unitId={unitId} userId={me.id} timeZone={timeZone} onFix={fix} /> : null}
      {refusal ? <Notice kind="error">{refusal}</Notice> : null}
      <FormFailure form={form} summary={false} />
      {design.error ? <Notice kind="error">{design.error.message}</Notice> : null}
      <div className="grid gap-6 lg:grid-cols-2">
        <form
          aria-label="Record a round"
          noValidate
          className="with-checks-summary flex flex-col gap-4 rounded-lg border border-line bg-panel p-4"
          onSubmit={(e) => {
            e.preventDefault();
            void save();
          }}
        >
          <ChecksSummary evaluation={live.evaluation} prefs={live.prefs} panelId={checksPanelId} />
          {unit ? <StationTimeInput className="text-sm font-bold" label="Taken at (leave empty for now)" field={takenAt} timeZone={unit.timeZone} error={form.error('takenAt')} /> : null}
          <ReadingFormFields form={form} errors={{ ...live.shownErrors, ...boxErrors }} values={values} warnings={live.warnings} />
          {mayRecord && question.asking ? (
            <ConfirmOutsidePlausible notices={question.notices} pending={record.isPending} onConfirm={() => void save(true)} onCancel={question.cancel} />
          ) : null}
          {mayRecord ? (
            <Button type="submit" disabled={record.isPending}>
              {record.isPending ? 'Saving…' : 'Save round'}
            </Button>
          ) : (
            <Notice kind="info">Your role reviews rounds; it does not record them.</Notice>
          )}
        </form>
        <div id={checksPanelId} tabIndex={-1} role="region" aria-label="All checks" className="flex scroll-mt-2 flex-col gap-4 rounded-lg focus:outline-none focus-visible:ring-2 focus-visible:ring-focus" aria-live="polite">
          {live.evaluation ? <CheckResults evaluation={live.evaluation} prefs={live.prefs} /> : <EnterReadingsNotice />}
        </div>
      </div>
      {readings.data && unit ? <RecentReadings readings={readings.data} timeZone={unit.timeZone} /> : null}
    </section>
  );
}
