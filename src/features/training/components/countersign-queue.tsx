import { useState } from 'react';
import { trainingLevelLabels } from '../../../../shared/schemas/training';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useCountersignQueue, useSettleEntry, type QueueEntry } from '../api/training';

function QueueItem({ entry }: { entry: QueueEntry }) {
  const settle = useSettleEntry();
  const [rejecting, setRejecting] = useState(false);
  const [reason, setReason] = useState('');
  const fields = settle.error instanceof ApiError ? settle.error.fields : {};
  return (
    <li className="rounded-md border border-line bg-panel p-2 text-sm" data-testid="countersign-entry">
      <p>
        <strong>{entry.trainee}</strong> · {entry.taskKey} {entry.taskTitle} · {entry.performedOn} · {trainingLevelLabels[entry.level]}
        {entry.supervisor ? ` · names ${entry.supervisor}` : ''}
      </p>
      <p>{entry.note}</p>
      {settle.error && !fields.reason ? <Notice kind="error">{settle.error.message}</Notice> : null}
      <div className="mt-1 flex flex-wrap items-end gap-2">
        <button type="button" className="rounded-md bg-accent px-3 py-1 font-bold text-on-accent" disabled={settle.isPending} onClick={() => settle.mutate({ id: entry.id, action: 'countersign' })}>
          Countersign
        </button>
        {rejecting ? (
          <form
            className="flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              settle.mutate({ id: entry.id, action: 'reject', reason });
            }}
          >
            <label className="flex flex-col">
              Reason
              <input className="rounded-md border border-line bg-field px-2 py-1" value={reason} onChange={(e) => setReason(e.target.value)} />
            </label>
            <button type="submit" className="rounded-md border border-alarm px-3 py-1 text-alarm">
              Reject
            </button>
            {fields.reason ? <span role="alert" className="text-alarm">⚠ {fields.reason}</span> : null}
          </form>
        ) : (
          <button type="button" className="rounded-md border border-line px-3 py-1" onClick={() => setRejecting(true)}>
            Reject…
          </button>
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
