import { useState } from 'react';
import { ApiError } from '../../../lib/api-client';
import { formatRemaining } from '../../../../shared/conditions';
import { useHandoverAction, useUploadAttachment, type Board, type BoardItem } from '../api/handover';

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

type Props = { board: Board; item: BoardItem; meId: number; side: 'outgoing' | 'incoming' | 'other' };

export function BoardItemCard({ board, item, meId, side }: Props) {
  const action = useHandoverAction();
  const upload = useUploadAttachment();
  const [question, setQuestion] = useState('');
  const [answers, setAnswers] = useState<Record<number, string>>({});
  const submitted = board.handover.status === 'submitted';
  const mine = item.acknowledgedBy.some((a) => a.userId === meId);
  const amendments = board.amendments.filter((a) => a.itemId === item.id);
  return (
    <article className={`rounded-lg border bg-panel p-3 ${item.priority === 'high' ? 'border-2 border-alarm' : 'border-line'}`} aria-label={`Item: ${item.title}`}>
      <header className="flex flex-wrap items-baseline gap-2">
        <span className="text-xs font-bold uppercase text-muted">{kindLabels[item.kind] ?? item.kind}</span>
        <span className="text-xs font-bold">{priorityLook[item.priority]}</span>
        {item.reference ? <span className="reading text-xs">ref {item.reference}</span> : null}
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
          {a.text} <span className="text-xs text-muted">— amended by {a.author}: {a.reason}</span>
        </p>
      ))}
      {item.attachments.length ? (
        <ul className="mt-1 flex flex-wrap gap-2 text-sm" aria-label="Attachments">
          {item.attachments.map((a) => (
            <li key={a.id}>
              <a className="text-accent underline" href={`/api/attachments/${a.id}`} target="_blank" rel="noreferrer">
                {a.mime === 'application/pdf' ? '📄' : '🖼'} {a.fileName} ({Math.ceil(a.size / 1024)} kB)
              </a>
            </li>
          ))}
        </ul>
      ) : null}
      {side === 'outgoing' && board.handover.status !== 'accepted' ? (
        <label className="mt-1 block text-sm">
          Add a photo or PDF (max 10 MB):{' '}
          <input type="file" accept="image/jpeg,image/png,image/webp,application/pdf" onChange={(e) => e.target.files?.[0] && upload.mutate({ itemId: item.id, file: e.target.files[0] })} />
          {upload.error ? <span role="alert" className="block font-bold text-alarm">⚠ {(upload.error instanceof ApiError && upload.error.fields.file) || upload.error.message}</span> : null}
        </label>
      ) : null}
      <p className="mt-1 text-sm">
        {item.acknowledgedBy.map((a) => (
          <span key={a.userId} className="mr-2 font-bold text-normal">
            ✔ {a.name}
          </span>
        ))}
        {item.awaiting.length ? <span className="text-muted">awaiting {item.awaiting.join(', ')}</span> : null}
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
          ) : side === 'outgoing' ? (
            <form
              className="mt-1 flex gap-2"
              onSubmit={(e) => {
                e.preventDefault();
                action.mutate({ kind: 'answer', queryId: q.id, answer: answers[q.id] ?? '' });
              }}
            >
              <input aria-label="Answer" className="flex-1 rounded-md border border-line bg-field px-2" value={answers[q.id] ?? ''} onChange={(e) => setAnswers({ ...answers, [q.id]: e.target.value })} />
              <button type="submit" className="rounded-md border border-line px-2 font-bold">
                Answer
              </button>
            </form>
          ) : (
            <p className="font-bold text-watch">▲ open question</p>
          )}
        </div>
      ))}
      {side === 'incoming' && submitted ? (
        <div className="mt-2 flex flex-wrap gap-2">
          {!mine ? (
            <button type="button" className="rounded-md bg-accent px-3 py-1 font-bold text-on-accent" onClick={() => action.mutate({ kind: 'acknowledge', itemId: item.id })}>
              Acknowledge
            </button>
          ) : null}
          <form
            className="flex gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              action.mutate({ kind: 'ask', itemId: item.id, question }, { onSuccess: () => setQuestion('') });
            }}
          >
            <input aria-label="Question" placeholder="Ask about this item" className="rounded-md border border-line bg-field px-2" value={question} onChange={(e) => setQuestion(e.target.value)} />
            <button type="submit" className="rounded-md border border-line px-2 font-bold">
              Ask
            </button>
          </form>
        </div>
      ) : null}
      {action.error ? <p role="alert" className="text-sm font-bold text-alarm">⚠ {action.error.message}</p> : null}
    </article>
  );
}
