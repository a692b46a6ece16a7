import { Suspense, lazy } from 'react';

// The training page shows these too; loaded on demand so the logbook's code (and station-time
// formatting) stays out of the entry chunk, which reaches this feature's index for its keys.
const Comments = lazy(async () => ({ default: (await import('./my-review-comments')).MyReviewComments }));

/** Trainers' comments on records the person wrote or their crew's shifts produced. */
export function MyReviewComments() {
  return (
    <Suspense fallback={null}>
      <Comments />
    </Suspense>
  );
}
