import { useState, type ReactNode } from 'react';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { formatStationTime } from '../../../../shared/station-time';
import { useAddReviewComment, type ReviewCommentView } from '../api/logbook';

type Props = { documentId: number | undefined; comments: ReviewCommentView[]; mayComment: boolean; children: ReactNode; label: string; timeZone: string };

/** One past record with the review comments on it and, for trainers, a way to add one. */
export function ReviewedRecord({ documentId, comments, mayComment, children, label, timeZone }: Props) {
  const mine = comments.filter((c) => c.documentId === documentId);
  const [open, setOpen] = useState(false);
  const [body, setBody] = useState('');
  const add = useAddReviewComment();
  const fields = add.error instanceof ApiError ? add.error.fields : {};
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
          <form
            className="mt-2 flex flex-col gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              add.mutate({ documentId, body }, { onSuccess: () => { setBody(''); setOpen(false); } });
            }}
          >
            <label className="flex flex-col text-sm font-bold">
              Review comment
              <textarea className="rounded-md border border-line bg-field p-2 font-normal" rows={3} value={body} onChange={(e) => setBody(e.target.value)} aria-invalid={Boolean(fields.body)} />
            </label>
            {fields.body ? <p role="alert" className="text-sm font-bold text-alarm">⚠ {fields.body}</p> : null}
            {add.error && !fields.body ? <Notice kind="error">{add.error.message}</Notice> : null}
            <div className="flex gap-2">
              <button type="submit" className="rounded-md bg-accent px-3 py-1 font-bold text-on-accent" disabled={add.isPending}>
                Save comment
              </button>
              <button type="button" className="rounded-md border border-line px-3 py-1" onClick={() => setOpen(false)}>
                Cancel
              </button>
            </div>
          </form>
        ) : (
          <button type="button" className="mt-2 text-sm underline" onClick={() => setOpen(true)}>
            Add a review comment
          </button>
        )
      ) : null}
    </article>
  );
}
