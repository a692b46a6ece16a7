import { useMemo, useState } from 'react';
import { can } from '../../../../shared/policies/permissions';
import { mayCountersignRound } from '../../../../shared/policies/readings';
import { useWatch } from 'react-hook-form';
import { Link, useParams } from 'react-router';
import type { Evaluation } from '../../../../shared/calc/evaluate';
import { CheckResults } from '../../../components/readings/check-results';
import { ReadingFormFields } from '../../../components/readings/reading-form-fields';
import { ConfirmOutsidePlausible, OutsidePlausibleTag, useOutsidePlausibleQuestion } from '../../../components/readings/plausibility';
import type { PlausibleKey } from '../../../../shared/calc/plausibility';
import { useCondenserDesign } from '../../../components/readings/get-condenser-design';
import { formValuesFromReading, readingFieldFor, readingSetWire, type FormErrors, type ReadingFormValues } from '../../../components/readings/reading-form';
import { amendReadingSchema } from '../../../../shared/schemas/readings';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { useLiveEvaluation } from '../../../components/readings/use-live-evaluation';
import { Button } from '../../../components/ui/button';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { StatusBadge } from '../../../components/ui/status-badge';
import { useUnitZone } from '../../../components/station-time/use-station-zone';
import { ZoneNote } from '../../../components/station-time/zone-note';
import { formatStationTime } from '../../../../shared/station-time';
import type { DisplayPreferences } from '../../../../shared/display';
import { useMe } from '../../session';
import { useAmendReading, useCountersign, useReading, type ReadingDetail } from '../api/readings';
import { useSelectedUnit } from '../../../components/readings/unit-picker';
import { useWatchUnit } from '../../../app/use-live-updates';

const prefsOf = (detail: ReadingDetail): DisplayPreferences => ({
  temperature: detail.reading.raw.hotwellTemperature.unit as DisplayPreferences['temperature'],
  pressure: 'kPa_a',
  currency: null,
});

type VersionProps = { title: string; superseded: boolean; results: Evaluation; outsidePlausible: PlausibleKey[]; prefs: DisplayPreferences; children?: React.ReactNode };

function Version({ title, superseded, results, outsidePlausible, prefs, children }: VersionProps) {
  const [open, setOpen] = useState(!superseded);
  return (
    <article className={`rounded-lg border p-3 ${superseded ? 'border-line opacity-80' : 'border-accent'}`}>
      <header className="flex flex-wrap items-center gap-2">
        <h2 className={`font-bold ${superseded ? 'line-through' : ''}`}>{title}</h2>
        {superseded ? <span className="text-xs font-bold text-muted">superseded by a later amendment — kept as recorded</span> : <span className="text-xs font-bold text-accent">current</span>}
        {outsidePlausible.length ? <OutsidePlausibleTag keys={outsidePlausible} /> : null}
        <Button tone="link" className="ml-auto text-sm" onClick={() => setOpen(!open)}>
          {open ? 'Hide checks' : 'Show checks'}
        </Button>
      </header>
      {children}
      {open ? (
        <div className="mt-3">
          <CheckResults evaluation={results} prefs={prefs} />
        </div>
      ) : null}
    </article>
  );
}

type AmendValues = ReadingFormValues & { reason: string };

// An amendment's messages: the reason beside its box, each reading beside the box that holds it.
const amendFieldFor = (path: string) => (path === 'reason' ? 'reason' : path.startsWith('reading.') ? readingFieldFor(path.slice('reading.'.length)) : undefined);

function AmendForm({ detail, onDone }: { detail: ReadingDetail; onDone: () => void }) {
  const latest = detail.amendments.at(-1)?.raw ?? detail.reading.raw;
  const schema = throughContract(
    ({ reason, ...boxes }: AmendValues) => {
      const { unitId: _unit, ...reading } = readingSetWire(detail.reading.unitId, boxes);
      return { reason, reading };
    },
    amendReadingSchema,
    amendFieldFor,
  );
  const form = useSchemaForm(schema, { defaultValues: { ...formValuesFromReading(latest), reason: '' }, fieldFor: amendFieldFor });
  const watched = useWatch({ control: form.control }) as AmendValues;
  const values = useMemo((): ReadingFormValues => {
    const { reason: _reason, ...boxes } = watched;
    return boxes;
  }, [watched]);
  const design = useCondenserDesign(detail.reading.unitId);
  const live = useLiveEvaluation(detail.reading.unitId, values, design.data);
  const amend = useAmendReading(detail.reading.id);
  const [refusal, setRefusal] = useState<string | null>(null);
  const question = useOutsidePlausibleQuestion(live.notices);
  const boxErrors = Object.fromEntries(Object.keys(values).map((box) => [box, form.error(box)]).filter(([, message]) => message)) as FormErrors;

  const submit = (confirmed = false) =>
    form.submit(
      async (input) => {
        setRefusal(null);
        if (question.mustAsk(confirmed)) return;
        const confirmOutsidePlausible = confirmed ? question.keys() : [];
        try {
          await amend.mutateAsync({ ...input, ...(confirmOutsidePlausible.length ? { confirmOutsidePlausible } : {}) });
        } catch (error) {
          if (question.takeRefusal(error)) return;
          throw error;
        }
        onDone();
      },
      () => setRefusal('Some readings are missing or wrong; see the messages beside them.'),
    )();

  return (
    <form
      aria-label="Amend this round"
      noValidate
      className="flex flex-col gap-4 rounded-lg border-2 border-watch bg-panel p-4"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
    >
      <h2 className="text-lg font-bold">Amend this round</h2>
      <p className="text-sm text-muted">The round as recorded stays visible; your correction is added beside it with your name, the time and your reason.</p>
      {refusal ? <Notice kind="error">{refusal}</Notice> : null}
      <FormFailure form={form} />
      <label className="flex flex-col gap-1 text-sm font-bold">
        Reason for the correction
        <textarea className="rounded-md border border-line bg-field p-2 font-normal" rows={2} {...form.register('reason')} {...form.describe('reason')} />
        <FieldMessage {...form.messageFor('reason')} />
      </label>
      <ReadingFormFields form={form} errors={{ ...live.shownErrors, ...boxErrors }} values={values} warnings={live.warnings} />
      {question.asking ? <ConfirmOutsidePlausible notices={question.notices} pending={amend.isPending} onConfirm={() => void submit(true)} onCancel={question.cancel} /> : null}
      <Button type="submit" disabled={amend.isPending}>
        Save amendment
      </Button>
    </form>
  );
}

export function ReadingPage() {
  const id = Number(useParams().id);
  const { data: me } = useMe();
  const reading = useReading(id);
  useWatchUnit(reading.data?.reading.unitId ?? null);
  const [amending, setAmending] = useState(false);
  const zone = useUnitZone(reading.data?.reading.unitId);
  const { units } = useSelectedUnit();
  const countersign = useCountersign();
  if (reading.error) return <Notice kind="error">{reading.error.message}</Notice>;
  if (reading.isPending || !zone) return <p className="text-muted">Loading…</p>;
  const detail = reading.data;
  const stamp = (iso: string) => formatStationTime(iso, zone.timeZone);
  const prefs = prefsOf(detail);
  const mayAmend = me && can(me.role, 'reading.amend');
  return (
    <section className="flex flex-col gap-4">
      <Link to={`/rounds?unit=${detail.reading.unitId}`} className="text-accent underline">
        ← Rounds
      </Link>
      <h1 className="text-2xl font-bold">
        {units.find((u) => u.id === detail.reading.unitId)?.name ?? 'Unit'} — round of {stamp(detail.reading.takenAt)} <StatusBadge status={detail.current.worstStatus} />
      </h1>
      <ZoneNote zone={zone} />
      <CautionNote />
      {detail.current.outsidePlausible.length ? (
        <Notice kind="info">
          <OutsidePlausibleTag keys={detail.current.outsidePlausible} /> {detail.reading.source === 'import' ? 'Imported as the historian kept it' : 'Confirmed by whoever saved it'}
          ; the checks computed from these values are withheld rather than judged. Check the instrument before relying on them.
        </Notice>
      ) : null}
      {detail.reading.recordedAsTrainee ? (
        detail.countersign ? (
          <Notice kind="success">
            Trainee round, countersigned by {detail.countersign.by} at {stamp(detail.countersign.at)}.
          </Notice>
        ) : (
          <div className="flex flex-col items-start gap-2">
            <Notice kind="info">Trainee round, awaiting an operator’s countersign.</Notice>
            {me && mayCountersignRound(me, { recordedById: detail.reading.recordedById, needsCountersign: !detail.countersign }) ? (
              <Button disabled={countersign.isPending} onClick={() => countersign.mutate(detail.reading.id)}>
                Countersign this round
              </Button>
            ) : null}
            {countersign.error ? <Notice kind="error">{countersign.error.message}</Notice> : null}
          </div>
        )
      ) : null}
      <Version title={`As recorded by ${detail.reading.recordedBy} at ${stamp(detail.reading.recordedAt)}`} superseded={detail.amendments.length > 0} results={detail.reading.results} outsidePlausible={detail.reading.outsidePlausible} prefs={prefs} />
      {detail.amendments.map((a, i) => (
        <Version key={a.id} title={`Amendment ${i + 1} by ${a.amendedBy} at ${stamp(a.amendedAt)}`} superseded={i < detail.amendments.length - 1} results={a.results} outsidePlausible={a.outsidePlausible} prefs={prefs}>
          <p className="mt-1 text-sm">
            <strong>Reason:</strong> {a.reason}
          </p>
        </Version>
      ))}
      {mayAmend && !amending ? (
        <Button tone="plain" onClick={() => setAmending(true)}>
          Amend this round
        </Button>
      ) : null}
      {amending ? <AmendForm detail={detail} onDone={() => setAmending(false)} /> : null}
    </section>
  );
}
