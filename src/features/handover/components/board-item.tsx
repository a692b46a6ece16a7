import { useState } from 'react';
import { formatRemaining } from '../../../../shared/conditions';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { useClientKey, useHandoverAction, useUploadAttachment, type Board, type BoardItem } from '../api/handover';
import { ItemEditor } from './item-editor';

export const kindLabels: Record<string, string> = {
  equipment: 'Equipment out of service / degraded',
  abnormal_reading: 'Abnormal reading (open flag)',
  condition: 'Time-limited condition',
  log_entry: 'From the log',
  standing_order: 'Standing order',
  work_in_progress: 'Work in progress / isolation / permit',
  chemistry: 'Chemistry addition',
  follow_up: 'Follow-up for the next shift',
};
const priorityLook = { high: '◆ High', normal: '● Normal', low: '○ Low' };
const field = 'rounded-md border border-line bg-field px-2 py-1';

type Props = {
  board: Board;
  item: BoardItem;
  meId: number;
  /** What this person may do here, from the shared handover policy. */
  may: { write: boolean; acknowledge: boolean };
  stationTime: (iso: string) => string;
};

export function BoardItemCard({ board, item, meId, may, stationTime }: Props) {
  const unitId = board.handover.unitId;
  const action = useHandoverAction(unitId);
  const upload = useUploadAttachment(unitId);
  const [askKey, newAskKey] = useClientKey();
  const [question, setQuestion] = useState('');
  const [answers, setAnswers] = useState<Record<number, string>>({});
  const [editing, setEditing] = useState(false);
  const [fileReason, setFileReason] = useState('');
  const [amendKey, newAmendKey] = useClientKey();
  const [amendment, setAmendment] = useState({ text: '', reason: '' });
  const status = board.handover.status;
  const draft = status === 'draft';
  const mine = item.acknowledgedBy.some((a) => a.userId === meId);
  const mustAgain = !mine && item.acknowledgedEarlierVersion.some((a) => a.userId === meId);
  const amendedAfterTurnover = status === 'accepted' && item.amendedAt !== null && board.handover.acceptedAt !== null && item.amendedAt > board.handover.acceptedAt;
  const mayAcknowledgeNow = may.acknowledge && !mine && (status === 'submitted' || amendedAfterTurnover);
  const amendments = board.amendments.filter((a) => a.itemId === item.id);
  const uploadError = upload.error instanceof ApiError ? (upload.error.fields.reason ?? upload.error.fields.file ?? upload.error.message) : upload.error?.message;
  return (
    <article className={`rounded-lg border bg-panel p-3 ${item.priority === 'high' ? 'border-2 border-alarm' : 'border-line'}`} aria-label={`Item: ${item.title}`}>
      <header className="flex flex-wrap items-baseline gap-2">
        <span className="text-xs font-bold uppercase text-muted">{kindLabels[item.kind] ?? item.kind}</span>
        <span className="text-xs font-bold">{priorityLook[item.priority]}</span>
        {item.reference ? <span className="reading text-xs">ref {item.reference}</span> : null}
        <span className="text-xs text-muted">{item.automatic ? 'attached by itself' : `added by ${item.addedBy ?? 'someone'}`}</span>
        {item.amendedAt && !draft ? (
          <span className="text-xs font-bold text-watch">{item.awaiting.length ? '▲ amended — to be acknowledged again' : '✎ amended'}</span>
        ) : null}
      </header>
      <h3 className="font-bold">{item.title}</h3>
      {item.live ? (
        <p className="text-sm font-bold" data-testid={`live-${item.id}`}>
          Now: {item.live.state}
          {item.live.remainingMs !== null ? ` · ${formatRemaining(item.live.remainingMs)}` : ''}
        </p>
      ) : null}
      {item.detail ? <p className="text-sm">{item.detail}</p> : null}
      {amendments.map((a) => (
        <p key={a.id} className="mt-1 border-l-4 border-accent pl-2 text-sm">
          {a.text} <span className="text-xs text-muted">— amended by {a.author} at {stationTime(a.at)}: {a.reason}</span>
        </p>
      ))}
      {item.attachments.length ? (
        <ul className="mt-1 flex flex-wrap gap-2 text-sm" aria-label="Attachments">
          {item.attachments.map((a) => (
            <li key={a.id}>
              <a className="text-accent underline" href={`/api/attachments/${a.id}`} target="_blank" rel="noreferrer">
                {a.mime === 'application/pdf' ? '📄' : '🖼'} {a.fileName} ({Math.ceil(a.size / 1024)} kB)
              </a>
              {a.amendmentId ? <span className="text-xs text-muted"> added after submit</span> : null}
            </li>
          ))}
        </ul>
      ) : null}

      {may.write && draft ? (
        editing ? (
          <ItemEditor item={item} unitId={unitId} onDone={() => setEditing(false)} />
        ) : (
          <div className="mt-2 flex flex-wrap gap-2">
            <Button tone="plain" className="px-3 py-1" onClick={() => setEditing(true)}>
              Edit
            </Button>
            <Button
              tone="danger"
              className="px-3 py-1"
              disabled={action.isPending}
              onClick={() => {
                if (window.confirm(`Take “${item.title}” off this handover?`)) action.mutate({ kind: 'remove-item', itemId: item.id });
              }}
            >
              Remove
            </Button>
          </div>
        )
      ) : null}

      {may.write && !draft ? (
        <form
          aria-label={`Amend: ${item.title}`}
          className="mt-2 flex flex-wrap items-end gap-2 text-sm"
          onSubmit={(e) => {
            e.preventDefault();
            action.mutate(
              { kind: 'amend', id: board.handover.id, body: { itemId: item.id, ...amendment, clientKey: amendKey } },
              {
                onSuccess: () => {
                  setAmendment({ text: '', reason: '' });
                  newAmendKey();
                },
              },
            );
          }}
        >
          <label className="flex flex-col">
            Correction to this item
            <input className={field} value={amendment.text} onChange={(e) => setAmendment({ ...amendment, text: e.target.value })} />
          </label>
          <label className="flex flex-col">
            Why
            <input className={field} value={amendment.reason} onChange={(e) => setAmendment({ ...amendment, reason: e.target.value })} />
          </label>
          <Button type="submit" tone="plain" className="px-3 py-1" disabled={action.isPending}>
            Amend this item
          </Button>
        </form>
      ) : null}

      {may.write && item.attachments.length < 10 ? (
        <div className="mt-2 flex flex-wrap items-end gap-2 text-sm">
          {!draft ? (
            <label className="flex flex-col">
              Why the file is added now (an amendment)
              <input className={field} value={fileReason} onChange={(e) => setFileReason(e.target.value)} />
            </label>
          ) : null}
          <label className="flex flex-col">
            Add a photo or PDF (max 10 MB)
            <input
              type="file"
              accept="image/jpeg,image/png,image/webp,application/pdf"
              disabled={upload.isPending}
              onChange={(e) => {
                const file = e.target.files?.[0];
                if (file) upload.mutate({ itemId: item.id, file, reason: draft ? undefined : fileReason }, { onSuccess: () => setFileReason('') });
                e.target.value = '';
              }}
            />
          </label>
          {uploadError ? (
            <span role="alert" className="block font-bold text-alarm">
              ⚠ {uploadError}
            </span>
          ) : null}
        </div>
      ) : null}

      <p className="mt-1 text-sm">
        {item.acknowledgedBy.map((a) => (
          <span key={a.userId} className="mr-2 font-bold text-normal">
            ✔ {a.name}
          </span>
        ))}
        {item.awaiting.length && !draft ? <span className="text-muted">awaiting {item.awaiting.join(', ')}</span> : null}
      </p>
      {item.queries.map((q) => (
        <div key={q.id} className="mt-1 rounded-md border border-line p-2 text-sm">
          <p>
            <strong>? {q.askedBy}:</strong> {q.question}
          </p>
          {q.answer ? (
            <p>
              <strong>↳ {q.answeredBy}:</strong> {q.answer}
            </p>
          ) : may.write ? (
            <form
              className="mt-1 flex gap-2"
              onSubmit={(e) => {
                e.preventDefault();
                action.mutate({ kind: 'answer', queryId: q.id, answer: answers[q.id] ?? '' });
              }}
            >
              <input aria-label="Answer" className="flex-1 rounded-md border border-line bg-field px-2" value={answers[q.id] ?? ''} onChange={(e) => setAnswers({ ...answers, [q.id]: e.target.value })} />
              <Button type="submit" tone="plain" className="px-2 py-1" disabled={action.isPending}>
                Answer
              </Button>
            </form>
          ) : (
            <p className="font-bold text-watch">▲ open question</p>
          )}
        </div>
      ))}
      {may.acknowledge && (status === 'submitted' || mayAcknowledgeNow) ? (
        <div className="mt-2 flex flex-wrap gap-2">
          {mayAcknowledgeNow ? (
            <Button className="px-3 py-1" disabled={action.isPending} onClick={() => action.mutate({ kind: 'acknowledge', itemId: item.id })}>
              {mustAgain ? 'Acknowledge the amended item' : 'Acknowledge'}
            </Button>
          ) : null}
          {status === 'submitted' ? (
            <form
              className="flex gap-2"
              onSubmit={(e) => {
                e.preventDefault();
                action.mutate({ kind: 'ask', itemId: item.id, question, clientKey: askKey }, { onSuccess: () => { setQuestion(''); newAskKey(); } });
              }}
            >
              <input aria-label="Question" placeholder="Ask about this item" className="rounded-md border border-line bg-field px-2" value={question} onChange={(e) => setQuestion(e.target.value)} />
              <Button type="submit" tone="plain" className="px-2 py-1" disabled={action.isPending}>
                Ask
              </Button>
            </form>
          ) : null}
        </div>
      ) : null}
      {action.error ? (
        <p role="alert" className="text-sm font-bold text-alarm">
          ⚠ {action.error instanceof ApiError ? Object.values(action.error.fields)[0] ?? action.error.message : action.error.message}
        </p>
      ) : null}
    </article>
  );
}
