import { useState } from 'react';
import { Link } from 'react-router';
import { defaultDisplayPreferences, displayQuantity } from '../../../../shared/display';
import { formatStationTime } from '../../../../shared/station-time';
import { StatusBadge } from '../../../components/ui/status-badge';
import { useWatch } from 'react-hook-form';
import { assignFlagSchema, clearFlagSchema } from '../../../../shared/schemas/flags';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { useFlagAction, type FlagView } from '../api/flags';
import { PersonSelect } from '../../../components/people/person-select';

const textClass = 'rounded-md border border-line bg-field p-2';

function FormButtons({ label, pending, onCancel }: { label: string; pending: boolean; onCancel: () => void }) {
  return (
    <div className="flex gap-2">
      <Button type="submit" size="sm" disabled={pending}>
        {label}
      </Button>
      <Button tone="plain" size="sm" onClick={onCancel}>
        Cancel
      </Button>
    </div>
  );
}

function AssignForm({ flag, onDone }: { flag: FlagView; onDone: () => void }) {
  const action = useFlagAction();
  const schema = throughContract((v: { assignedTo: string; followUp: string }) => ({ assignedTo: Number(v.assignedTo), followUp: v.followUp, version: flag.version }), assignFlagSchema);
  const form = useSchemaForm(schema, { defaultValues: { assignedTo: '', followUp: '' } });
  const assignee = useWatch({ control: form.control, name: 'assignedTo' });
  return (
    <form
      className="flex flex-col gap-2"
      noValidate
      onSubmit={form.submit(async (input) => {
        await action.mutateAsync({ kind: 'assign', id: flag.id, input });
        onDone();
      })}
    >
      <FormFailure form={form} />
      <PersonSelect label="Who follows it up" value={assignee} onChange={(id) => form.setValue('assignedTo', id, { shouldDirty: true })} error={form.error('assignedTo')} />
      <label className="flex flex-col text-sm">
        What to do
        <textarea className={textClass} rows={2} {...form.register('followUp')} {...form.describe('followUp')} />
        <FieldMessage {...form.messageFor('followUp')} />
      </label>
      <FormButtons label="Assign" pending={action.isPending} onCancel={onDone} />
    </form>
  );
}

function ClearForm({ flag, onDone }: { flag: FlagView; onDone: () => void }) {
  const action = useFlagAction();
  const schema = throughContract((v: { comment: string }) => ({ comment: v.comment, version: flag.version }), clearFlagSchema);
  const form = useSchemaForm(schema, { defaultValues: { comment: '' } });
  return (
    <form
      className="flex flex-col gap-2"
      noValidate
      onSubmit={form.submit(async (input) => {
        await action.mutateAsync({ kind: 'clear', id: flag.id, input });
        onDone();
      })}
    >
      <FormFailure form={form} />
      <label className="flex flex-col text-sm">
        Closing comment
        <textarea className={textClass} rows={2} {...form.register('comment')} {...form.describe('comment')} />
        <FieldMessage {...form.messageFor('comment')} />
      </label>
      <FormButtons label="Clear with this comment" pending={action.isPending} onCancel={onDone} />
    </form>
  );
}

export function FlagCard({ flag, mayLead, timeZone }: { flag: FlagView; mayLead: boolean; timeZone: string }) {
  const stamp = (iso: string) => formatStationTime(iso, timeZone);
  const [mode, setMode] = useState<'none' | 'assign' | 'clear'>('none');
  const value = flag.lastValue !== null && flag.quantity ? displayQuantity(flag.lastValue, flag.quantity, defaultDisplayPreferences) : null;

  return (
    <article className="rounded-lg border border-line bg-panel p-3" data-testid={`flag-${flag.id}`} aria-label={`Flag: ${flag.parameterLabel}`}>
      <header className="flex flex-wrap items-center gap-2">
        <StatusBadge status={flag.status === 'cleared' ? 'normal' : flag.severity} />
        <h3 className="font-bold">{flag.parameterLabel}</h3>
        <span className="text-sm text-muted">
          {flag.origin === 'automatic' ? 'outside limits' : `raised by ${flag.raisedBy}`} · {stamp(flag.raisedAt)}
          {flag.status === 'cleared' ? ' · cleared' : ''}
        </span>
        {value ? (
          <span className="reading ml-auto text-lg font-semibold">
            {value.text} <span className="text-sm font-normal text-muted">{value.unit}</span>
          </span>
        ) : null}
      </header>
      {flag.comment ? <p className="mt-1">{flag.comment}</p> : null}
      {flag.lastReadingSetId ? (
        <p className="text-sm">
          Latest reading:{' '}
          <Link className="text-accent underline" to={`/rounds/${flag.lastReadingSetId}`}>
            {stamp(flag.lastSeenAt)}
          </Link>
        </p>
      ) : null}
      {flag.assignedTo ? (
        <p className="text-sm">
          <strong>Follow-up by {flag.assignedTo}:</strong> {flag.followUp}
        </p>
      ) : null}
      {flag.status === 'cleared' ? (
        <p className="text-sm">
          <strong>
            Cleared by {flag.clearedBy} at {flag.clearedAt ? stamp(flag.clearedAt) : ''}:
          </strong>{' '}
          {flag.clearComment}
        </p>
      ) : null}
      {mayLead && flag.status === 'open' ? (
        <div className="mt-2 flex flex-col gap-2">
          {mode === 'none' ? (
            <div className="flex gap-2">
              <Button tone="plain" size="xs" className="text-sm" onClick={() => setMode('assign')}>
                Assign follow-up
              </Button>
              <Button tone="plain" size="xs" className="text-sm" onClick={() => setMode('clear')}>
                Clear flag
              </Button>
            </div>
          ) : mode === 'assign' ? (
            <AssignForm flag={flag} onDone={() => setMode('none')} />
          ) : (
            <ClearForm flag={flag} onDone={() => setMode('none')} />
          )}
        </div>
      ) : null}
    </article>
  );
}
