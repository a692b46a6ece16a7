import { useEffect, useState } from 'react';
import { formatRemaining } from '../../../../shared/conditions';
import { StatusBadge } from '../../../components/ui/status-badge';
import { useWatch } from 'react-hook-form';
import { closeConditionSchema, newConditionSchema } from '../../../../shared/schemas/log';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { PersonSelect } from '../../../components/people/person-select';
import { useCloseCondition, useConditions, useOpenCondition, type ConditionView } from '../api/log';

const stateBadge = { running: 'normal', due_soon: 'watch', overdue: 'alarm', closed: 'unknown' } as const;
const stateWord = { running: 'time left', due_soon: 'due soon', overdue: 'OVERDUE', closed: 'closed' } as const;

/** Counts down from the server's figure; the server's clock, not this device's, sets the start. */
function Countdown({ condition }: { condition: ConditionView }) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), 30_000);
    return () => clearInterval(timer);
  }, []);
  const [loadedAt] = useState(() => Date.now());
  const remaining = condition.remainingMs - (now - loadedAt);
  return (
    <span className={`reading font-semibold ${remaining < 0 ? 'text-alarm' : ''}`} data-testid={`countdown-${condition.id}`}>
      {formatRemaining(remaining)}
    </span>
  );
}

function CloseForm({ condition, position }: { condition: ConditionView; position: string }) {
  const close = useCloseCondition();
  const schema = throughContract((v: { text: string }) => ({ text: v.text, position, version: condition.version }), closeConditionSchema);
  const form = useSchemaForm(schema, { defaultValues: { text: '' } });
  return (
    <form aria-label={`Close ${condition.title}`} noValidate className="mt-1 flex gap-2 text-sm" onSubmit={form.submit((input) => close.mutateAsync({ id: condition.id, ...input }))}>
      <input aria-label="Closing entry" placeholder="Closing entry: what was done" className="flex-1 rounded-md border border-line bg-field px-2 py-1" {...form.register('text')} {...form.describe('text')} />
      <Button type="submit" tone="plain" size="xs">
        Close
      </Button>
      <FieldMessage {...form.messageFor('text')} />
      <FormFailure form={form} />
    </form>
  );
}

type OpenValues = { title: string; requiredAction: string; hours: string; ownerId: string };

function OpenForm({ unitId }: { unitId: number }) {
  const open = useOpenCondition(unitId);
  // The deadline counts from the moment it is opened; the hours are typed, the contract takes a number.
  const schema = throughContract(
    (v: OpenValues) => ({ title: v.title, requiredAction: v.requiredAction, startedAt: new Date().toISOString(), limitHours: Number(v.hours.replace(',', '.')), ownerId: Number(v.ownerId) }),
    newConditionSchema,
    (path) => (path === 'limitHours' ? 'hours' : undefined),
  );
  const form = useSchemaForm(schema, { defaultValues: { title: '', requiredAction: '', hours: '72', ownerId: '' } });
  const owner = useWatch({ control: form.control, name: 'ownerId' });
  return (
    <form
      aria-label="Open a time-limited condition"
      noValidate
      className="grid gap-2 border-t border-line pt-2 text-sm sm:grid-cols-2"
      onSubmit={form.submit(async (condition) => {
        await open.mutateAsync(condition);
        form.reset({ ...form.getValues(), title: '', requiredAction: '' });
      })}
    >
      <label className="flex flex-col">
        Condition
        <input className="rounded-md border border-line bg-field px-2 py-1" {...form.register('title')} {...form.describe('title')} />
        <FieldMessage {...form.messageFor('title')} />
      </label>
      <label className="flex flex-col">
        Required action
        <input className="rounded-md border border-line bg-field px-2 py-1" {...form.register('requiredAction')} {...form.describe('requiredAction')} />
        <FieldMessage {...form.messageFor('requiredAction')} />
      </label>
      <label className="flex flex-col">
        Time allowed (hours from now)
        <input inputMode="decimal" className="rounded-md border border-line bg-field px-2 py-1" {...form.register('hours')} {...form.describe('hours')} />
        <FieldMessage {...form.messageFor('hours')} />
      </label>
      <PersonSelect label="Owner" value={owner} onChange={(id) => form.setValue('ownerId', id, { shouldDirty: true })} error={form.error('ownerId')} />
      <FormFailure form={form} className="sm:col-span-2" />
      <Button type="submit" size="sm" className="sm:col-span-2">
        Open condition
      </Button>
    </form>
  );
}

export function ConditionsPanel({ unitId, position, mayHandle }: { unitId: number; position: string; mayHandle: boolean }) {
  const conditions = useConditions(unitId);
  return (
    <section aria-label="Time-limited conditions" className="flex flex-col gap-2 rounded-lg border border-line bg-panel p-3">
      <h2 className="font-bold">Time-limited conditions</h2>
      {conditions.data?.length === 0 ? <p className="text-sm text-muted">None open.</p> : null}
      {conditions.data?.map((c) => (
        <article key={c.id} className="border-t border-line pt-2" aria-label={`Condition: ${c.title}`}>
          <div className="flex flex-wrap items-center gap-2">
            <StatusBadge status={stateBadge[c.state]} />
            <strong>{c.title}</strong>
            <span className="text-sm text-muted">{stateWord[c.state]}:</span>
            <Countdown condition={c} />
          </div>
          <p className="text-sm">
            {c.requiredAction} · deadline {c.limitLocal} (station time, {c.timeZone}) · owner {c.owner}
          </p>
          {mayHandle ? <CloseForm condition={c} position={position} /> : null}
        </article>
      ))}
      {mayHandle ? <OpenForm unitId={unitId} /> : null}
    </section>
  );
}
