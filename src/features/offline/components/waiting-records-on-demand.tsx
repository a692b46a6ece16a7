import { lazy, Suspense, type ComponentProps } from 'react';

const Loaded = lazy(async () => ({ default: (await import('./waiting-records')).WaitingRecords }));

/**
 * The list of what waits on this device, loaded just after its page draws (with the queue and
 * IndexedDB's wrapper). The shell's indicator has loaded the queue already on any signed-in page,
 * so it is there before anyone can save a round offline.
 */
export function WaitingRecords(props: ComponentProps<typeof Loaded>) {
  return (
    <Suspense fallback={null}>
      <Loaded {...props} />
    </Suspense>
  );
}
