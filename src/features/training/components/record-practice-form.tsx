import { can } from '../../../../shared/policies/permissions';
import type { Role } from '../../../../shared/roles';
import { Link, useSearchParams } from 'react-router';
import { formatStationTime, stationToday } from '../../../../shared/station-time';
import { newTrainingEntrySchema, trainingLevelLabels, trainingLevels } from '../../../../shared/schemas/training';
import { Button } from '../../../components/ui/button';
import { FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { SelectField, TextField } from '../../../components/ui/form-field';
import { Notice } from '../../../components/ui/notice';
import { usePeople } from '../../../components/people/person-select';
import { useUnitList } from '../../../components/readings/unit-picker';
import { useUnitZone } from '../../../components/station-time/use-station-zone';
import { useRecordEntry, useTasks } from '../api/training';
import { groupBySystem } from '../lib/group-by-system';
import { useTrainingZone } from '../lib/use-training-zone';

type Values = { taskKey: string; performedOn: string; level: string; supervisorId: string; unitId: string; note: string };

/** What the practice came from, when the trainee arrived from a past shift (?unitId&shiftStart&readingSetId|handoverItemId). */
function useLinkedRecord() {
  const [params, setParams] = useSearchParams();
  const number = (key: string) => (Number(params.get(key)) > 0 ? Number(params.get(key)) : null);
  const shiftStart = params.get('shiftStart');
  const link = { unitId: number('unitId'), shiftStart: shiftStart && !Number.isNaN(Date.parse(shiftStart)) ? shiftStart : null, readingSetId: number('readingSetId'), handoverItemId: number('handoverItemId') };
  const clear = () => setParams(new URLSearchParams());
  return { link, linked: Boolean(link.shiftStart || link.readingSetId || link.handoverItemId), clear };
}

/** A trainee records one practice of a task; a supervising operator countersigns it later. */
export function RecordPracticeForm() {
  const linkedUnit = useLinkedRecord().link.unitId;
  // The date is a day on the station's clock: the linked unit's station, else the person's.
  const unitZone = useUnitZone(linkedUnit);
  const homeZone = useTrainingZone();
  const zone = linkedUnit ? unitZone : homeZone;
  if (!zone) return <p className="text-muted">Loading…</p>;
  return <PracticeForm timeZone={zone.timeZone} />;
}

function PracticeForm({ timeZone }: { timeZone: string }) {
  const { link, linked, clear } = useLinkedRecord();
  const tasks = useTasks();
  const people = usePeople();
  const units = useUnitList();
  const record = useRecordEntry();
  const performedOn = link.shiftStart ? formatStationTime(link.shiftStart, timeZone, 'date') : stationToday(timeZone);
  const schema = throughContract(
    (v: Values) => ({
      ...v,
      supervisorId: v.supervisorId ? Number(v.supervisorId) : null,
      unitId: v.unitId ? Number(v.unitId) : null,
      ...(linked ? { shiftStart: link.shiftStart, readingSetId: link.readingSetId, handoverItemId: link.handoverItemId } : {}),
    }),
    newTrainingEntrySchema,
  );
  const form = useSchemaForm(schema, { defaultValues: { taskKey: '', performedOn, level: 'supervised', supervisorId: '', unitId: link.unitId ? String(link.unitId) : '', note: '' } });
  const errors = form.formState.errors;
  const submit = form.submit(async (input) => {
    await record.mutateAsync(input);
    form.reset({ ...form.getValues(), note: '' });
  });
  return (
    <form onSubmit={submit} noValidate aria-label="Record a practice" className="grid gap-3 rounded-lg border border-line bg-panel p-3 sm:grid-cols-2">
      <h2 className="text-lg font-bold sm:col-span-2">Record a practice</h2>
      {linked ? (
        <p className="text-sm sm:col-span-2" data-testid="practice-link">
          Linked to {link.readingSetId ? `round #${link.readingSetId}` : link.handoverItemId ? `handover item #${link.handoverItemId}` : 'the shift'}
          {link.shiftStart ? ` of the shift starting ${formatStationTime(link.shiftStart, timeZone)} (station time)` : ''}.{' '}
          {link.unitId && link.shiftStart ? (
            <Link className="underline" to={`/logbook/units/${link.unitId}/shifts/${encodeURIComponent(link.shiftStart)}`}>
              Open it
            </Link>
          ) : null}{' '}
          <Button tone="link" onClick={clear}>
            Remove the link
          </Button>
        </p>
      ) : null}
      <FormFailure form={form} className="sm:col-span-2" />
      {record.isSuccess && !form.formState.isDirty ? <div className="sm:col-span-2"><Notice kind="success">Recorded; it now waits for a countersign.</Notice></div> : null}
      <SelectField label="Task" error={errors.taskKey?.message} {...form.register('taskKey')}>
        <option value="">Choose…</option>
        {groupBySystem(tasks.data ?? [], (t) => t.system).map((group) => (
          <optgroup key={group.system} label={group.label}>
            {group.items.map((t) => (
              <option key={t.taskKey} value={t.taskKey}>
                {t.taskKey} — {t.title}
              </option>
            ))}
          </optgroup>
        ))}
      </SelectField>
      <TextField label="Date" hint={`Station day, ${timeZone}`} type="date" error={errors.performedOn?.message} {...form.register('performedOn')} />
      <SelectField label="Level" error={errors.level?.message} {...form.register('level')}>
        {trainingLevels.map((l) => (
          <option key={l} value={l}>
            {trainingLevelLabels[l]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Supervising operator" hint="Optional: only they (or a shift lead) can then countersign." error={errors.supervisorId?.message} {...form.register('supervisorId')}>
        <option value="">Any operator</option>
        {people.data
          ?.filter((p) => can(p.role as Role, 'training.countersign'))
          .map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
      </SelectField>
      <SelectField label="Unit" error={errors.unitId?.message} {...form.register('unitId')}>
        <option value="">Not tied to a unit</option>
        {units.data?.map((u) => (
          <option key={u.id} value={u.id}>
            {u.name}
          </option>
        ))}
      </SelectField>
      <div className="sm:col-span-2">
        <TextField label="What you did" error={errors.note?.message} {...form.register('note')} />
      </div>
      <Button type="submit" className="sm:col-span-1" disabled={form.formState.isSubmitting}>
        Record practice
      </Button>
    </form>
  );
}
