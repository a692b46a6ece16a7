import { useState } from 'react';
import { formatRemaining } from '../../../../shared/conditions';
import { Button } from '../../../components/ui/button';
import { answerContract, attachmentReasonContract, handoverAmendmentContract, questionContract } from '../lib/contracts';
import { ApiError } from '../../../lib/api-client';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
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

/** A correction to a submitted item, with its reason: an amendment the incoming crew acknowledges again. */
function AmendItemForm({ board, item }: { board: Board; item: BoardItem }) {
  const action = useHandoverAction(board.handover.unitId);
  const [clientKey, newClientKey] = useClientKey();
  const schema = throughContract((v: { text: string; reason: string }) => ({ itemId: item.id, ...v, clientKey }), handoverAmendmentContract);
  const form = useSchemaForm(schema, { defaultValues: { text: '', reason: '' } });
  return (
    <form
      aria-label={`Amend: ${item.title}`}
      noValidate
      className="mt-2 flex flex-wrap items-end gap-2 text-sm"
      onSubmit={form.submit(async (body) => {
        await action.mutateAsync({ kind: 'amend', id: board.handover.id, body });
        form.reset();
        newClientKey();
      })}
    >
      <label className="flex flex-col">
        Correction to this item
        <input className={field} {...form.register('text')} {...form.describe('text')} />
        <FieldMessage {...form.messageFor('text')} />
      </label>
      <label className="flex flex-col">
        Why
        <input className={field} {...form.register('reason')} {...form.describe('reason')} />
        <FieldMessage {...form.messageFor('reason')} />
      </label>
      <Button type="submit" tone="plain" size="sm" disabled={action.isPending}>
        Amend this item
      </Button>
      <FormFailure form={form} className="w-full" />
    </form>
  );
}

/** A photo or PDF on an item; after submit it is an amendment and needs a reason, checked before the file is sent. */
function AttachmentForm({ item, unitId, draft }: { item: BoardItem; unitId: number; draft: boolean }) {
  const upload = useUploadAttachment(unitId);
  const schema = throughContract((v: { reason: string }) => ({ reason: draft ? undefined : v.reason }), attachmentReasonContract);
  const form = useSchemaForm(schema, { defaultValues: { reason: '' }, placed: ['reason', 'file'] });
  const send = (file: File) =>
    form.submit(async ({ reason }) => {
      await upload.mutateAsync({ itemId: item.id, file, reason });
      form.reset();
    })();
  return (
    <form aria-label={`Attach to: ${item.title}`} noValidate className="mt-2 flex flex-wrap items-end gap-2 text-sm" onSubmit={(e) => e.preventDefault()}>
      {!draft ? (
        <label className="flex flex-col">
          Why the file is added now (an amendment)
          <input className={field} {...form.register('reason')} {...form.describe('reason')} />
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
            if (file) void send(file);
            e.target.value = '';
          }}
        />
      </label>
      <FieldMessage {...form.messageFor('reason')} className="block font-bold text-alarm" />
      <FieldMessage message={form.error('file')} className="block font-bold text-alarm" />
      <FormFailure form={form} className="w-full" />
    </form>
  );
}

function AnswerForm({ queryId, unitId }: { queryId: number; unitId: number }) {
  const action = useHandoverAction(unitId);
  const form = useSchemaForm(answerContract, { defaultValues: { answer: '' } });
  return (
    <form className="mt-1 flex flex-wrap gap-2" noValidate onSubmit={form.submit((v) => action.mutateAsync({ kind: 'answer', queryId, answer: v.answer }))}>
      <input aria-label="Answer" className="flex-1 rounded-md border border-line bg-field px-2" {...form.register('answer')} {...form.describe('answer')} />
      <Button type="submit" tone="plain" size="xs" disabled={action.isPending}>
        Answer
      </Button>
      <FieldMessage {...form.messageFor('answer')} className="w-full font-bold text-alarm" />
      <FormFailure form={form} className="w-full" />
    </form>
  );
}

function AskForm({ itemId, unitId }: { itemId: number; unitId: number }) {
  const action = useHandoverAction(unitId);
  const [clientKey, newClientKey] = useClientKey();
  const schema = throughContract((v: { question: string }) => ({ question: v.question, clientKey }), questionContract);
  const form = useSchemaForm(schema, { defaultValues: { question: '' } });
  return (
    <form
      className="flex flex-wrap gap-2"
      noValidate
      onSubmit={form.submit(async (v) => {
        await action.mutateAsync({ kind: 'ask', itemId, ...v });
        form.reset();
        newClientKey();
      })}
    >
      <input aria-label="Question" placeholder="Ask about this item" className="rounded-md border border-line bg-field px-2" {...form.register('question')} {...form.describe('question')} />
      <Button type="submit" tone="plain" size="xs" disabled={action.isPending}>
        Ask
      </Button>
      <FieldMessage {...form.messageFor('question')} className="w-full font-bold text-alarm" />
      <FormFailure form={form} className="w-full" />
    </form>
  );
}

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
  const [editing, setEditing] = useState(false);
  const status = board.handover.status;
  const draft = status === 'draft';
  const mine = item.acknowledgedBy.some((a) => a.userId === meId);
  const mustAgain = !mine && item.acknowledgedEarlierVersion.some((a) => a.userId === meId);
  const amendedAfterTurnover = status === 'accepted' && item.amendedAt !== null && board.handover.acceptedAt !== null && item.amendedAt > board.handover.acceptedAt;
  const mayAcknowledgeNow = may.acknowledge && !mine && (status === 'submitted' || amendedAfterTurnover);
  const amendments = board.amendments.filter((a) => a.itemId === item.id);
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
            <Button tone="plain" size="sm" onClick={() => setEditing(true)}>
              Edit
            </Button>
            <Button
              tone="danger"
              size="sm"
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

      {may.write && !draft ? <AmendItemForm board={board} item={item} /> : null}

      {may.write && item.attachments.length < 10 ? <AttachmentForm item={item} unitId={unitId} draft={draft} /> : null}

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
            <AnswerForm queryId={q.id} unitId={unitId} />
          ) : (
            <p className="font-bold text-watch">▲ open question</p>
          )}
        </div>
      ))}
      {may.acknowledge && (status === 'submitted' || mayAcknowledgeNow) ? (
        <div className="mt-2 flex flex-wrap gap-2">
          {mayAcknowledgeNow ? (
            <Button size="sm" disabled={action.isPending} onClick={() => action.mutate({ kind: 'acknowledge', itemId: item.id })}>
              {mustAgain ? 'Acknowledge the amended item' : 'Acknowledge'}
            </Button>
          ) : null}
          {status === 'submitted' ? <AskForm itemId={item.id} unitId={unitId} /> : null}
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
