import { Suspense, lazy } from 'react';

// The shell shows this on every page, but it has something to say only now and then: its code (and
// the orders' fetchers) loads after the page, so the entry chunk stays small.
const Prompt = lazy(async () => ({ default: (await import('./pending-orders-prompt')).PendingOrdersPrompt }));

/** Shown after sign-in until every standing order addressed to this person is acknowledged. */
export function PendingOrdersPrompt({ enabled }: { enabled: boolean }) {
  return (
    <Suspense fallback={null}>
      <Prompt enabled={enabled} />
    </Suspense>
  );
}
