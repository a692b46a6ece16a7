import { useState } from 'react';
import { rejectEntrySchema, trainingLevelLabels } from '../../../../shared/schemas/training';
import { Notice } from '../../../components/ui/notice';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, useSchemaForm } from '../../../components/form/schema-form';
import { useCountersignQueue, useSettleEntry, type QueueEntry } from '../api/training';

function RejectForm({ entryId }: { entryId: number }) {
  const settle = useSettleEntry();
  const form = useSchemaForm(rejectEntrySchema, { defaultValues: { reason: '' } });
  return (
    <form className="flex flex-wrap items-end gap-2" noValidate onSubmit={form.submit((v) => settle.mutateAsync({ id: entryId, action: 'reject', reason: v.reason }))}>
      <label className="flex flex-col">
        Reason
        <input className="rounded-md border border-line bg-field px-2 py-1" {...form.register('reason')} {...form.describe('reason')} />
      </label>
      <Button type="submit" tone="danger" size="sm">
        Reject
      </Button>
      <FieldMessage {...form.messageFor('reason')} />
      <FormFailure form={form} className="w-full" />
    </form>
  );
}

function QueueItem({ entry }: { entry: QueueEntry }) {
  const settle = useSettleEntry();
  const [rejecting, setRejecting] = useState(false);
  return (
    <li className="rounded-md border border-line bg-panel p-2 text-sm" data-testid="countersign-entry">
      <p>
        <strong>{entry.trainee}</strong> · {entry.taskKey} {entry.taskTitle} · {entry.performedOn} · {trainingLevelLabels[entry.level]}
        {entry.supervisor ? ` · names ${entry.supervisor}` : ''}
      </p>
      <p>{entry.note}</p>
      {settle.error ? <Notice kind="error">{settle.error.message}</Notice> : null}
      <div className="mt-1 flex flex-wrap items-end gap-2">
        <Button size="sm" disabled={settle.isPending} onClick={() => settle.mutate({ id: entry.id, action: 'countersign' })}>
          Countersign
        </Button>
        {rejecting ? (
          <RejectForm entryId={entry.id} />
        ) : (
          <Button tone="plain" size="sm" onClick={() => setRejecting(true)}>
            Reject…
          </Button>
        )}
      </div>
    </li>
  );
}

/** Practice entries waiting for this operator's countersign. */
export function CountersignQueue() {
  const queue = useCountersignQueue(true);
  return (
    <section aria-label="Waiting for your countersign" className="flex flex-col gap-2">
      <h2 className="text-lg font-bold">Waiting for your countersign</h2>
      <p className="text-sm text-muted">Countersign only what you saw the trainee do to the standard; reject with a reason otherwise.</p>
      {queue.error ? <Notice kind="error">{queue.error.message}</Notice> : null}
      {queue.data?.length === 0 ? <p className="text-muted">Nothing waiting.</p> : null}
      <ul className="flex flex-col gap-2">{queue.data?.map((e) => <QueueItem key={e.id} entry={e} />)}</ul>
    </section>
  );
}
