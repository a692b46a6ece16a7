// Offline rounds and log entries as the pages use them: the device's queue and the lists of what waits.
// The shell's part (who is signed in, the indicator) is in shell.ts. The queue's code (with IndexedDB's
// wrapper) is fetched on first use, not with the pages: the shell's indicator asks for it on every
// signed-in page, so it is on hand before a record can be kept offline.
import { once } from '../../lib/load-on-demand';
import type { Draft } from './api/offline-store';
import type { QueuedRecord } from './api/queue';

export type { QueuedRecord };
export { WaitingRecords } from './components/waiting-records-on-demand';

const queue = once(() => import('./api/offline-store'));

/** See offline-store.ts's sendOrKeep. */
export const sendOrKeep = async <T,>(draft: Draft) => (await queue()).sendOrKeep<T>(draft);
export const discard = async (clientId: string) => (await queue()).discard(clientId);
