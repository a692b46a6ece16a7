import { useState, type ReactNode } from 'react';
import { reviewCommentSchema } from '../../../../shared/schemas/logbook';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { formatStationTime } from '../../../../shared/station-time';
import { useAddReviewComment, type ReviewCommentView } from '../api/logbook';

type Props = { documentId: number | undefined; comments: ReviewCommentView[]; mayComment: boolean; children: ReactNode; label: string; timeZone: string };

function ReviewCommentForm({ documentId, onDone }: { documentId: number; onDone: () => void }) {
  const add = useAddReviewComment();
  const form = useSchemaForm(
    throughContract((v: { body: string }) => ({ documentId, body: v.body }), reviewCommentSchema),
    { defaultValues: { body: '' } },
  );
  const body = form.error('body');
  return (
    <form
      className="mt-2 flex flex-col gap-2"
      noValidate
      onSubmit={form.submit(async (input) => {
        await add.mutateAsync(input);
        onDone();
      })}
    >
      <label className="flex flex-col text-sm font-bold">
        Review comment
        <textarea className="rounded-md border border-line bg-field p-2 font-normal" rows={3} aria-invalid={Boolean(body)} {...form.register('body')} />
      </label>
      <FieldMessage message={body} className="text-sm font-bold text-alarm" />
      <FormFailure form={form} />
      <div className="flex gap-2">
        <Button type="submit" size="sm" disabled={add.isPending}>
          Save comment
        </Button>
        <Button tone="plain" size="sm" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** One past record with the review comments on it and, for trainers, a way to add one. */
export function ReviewedRecord({ documentId, comments, mayComment, children, label, timeZone }: Props) {
  const mine = comments.filter((c) => c.documentId === documentId);
  const [open, setOpen] = useState(false);
  return (
    <article id={documentId ? `record-${documentId}` : undefined} aria-label={label} className="rounded-md border border-line bg-panel p-3 target:border-2 target:border-accent">
      {children}
      {mine.length ? (
        <ul className="mt-2 flex flex-col gap-1 border-l-4 border-accent pl-3" aria-label="Review comments">
          {mine.map((c) => (
            <li key={c.id} className="text-sm" data-testid="review-comment">
              <strong>Review — {c.author}</strong> <span className="text-muted">{formatStationTime(c.createdAt, timeZone)}</span>
              <p>{c.body}</p>
            </li>
          ))}
        </ul>
      ) : null}
      {mayComment && documentId ? (
        open ? (
          <ReviewCommentForm documentId={documentId} onDone={() => setOpen(false)} />
        ) : (
          <Button tone="link" className="mt-2 text-sm" onClick={() => setOpen(true)}>
            Add a review comment
          </Button>
        )
      ) : null}
    </article>
  );
}
