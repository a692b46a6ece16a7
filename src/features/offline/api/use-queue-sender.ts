import { useEffect, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { invalidateForChange } from '../../../app/live-keys';
import { loadQueue, sendQueued } from './offline-store';
import { noteSignedInPerson } from './session-person';

/** How often waiting records are tried while the page is open, besides `online` and app start. */
export const RETRY_INTERVAL_MS = 30_000;

const onNetworkChange = (listener: () => void) => {
  window.addEventListener('online', listener);
  window.addEventListener('offline', listener);
  return () => {
    window.removeEventListener('online', listener);
    window.removeEventListener('offline', listener);
  };
};

/**
 * Whether the browser says it has a network (it may still fail a request: the queue copes). Read
 * afresh on every draw, not only on the events: one that came before the indicator listened (it loads
 * after the page) must not leave it saying "Offline".
 */
export function useOnline(): boolean {
  return useSyncExternalStore(onNetworkChange, () => navigator.onLine);
}

/**
 * Sends the signed-in person's waiting records: when the app starts, when the network returns and
 * every 30 s. Other people's records stay until they sign in on this device.
 */
export function useQueueSender(userId: number | null) {
  const queryClient = useQueryClient();
  useEffect(() => {
    noteSignedInPerson(userId);
    if (userId === null) return;
    const send = () => {
      if (!navigator.onLine) return;
      loadQueue()
        .then(() =>
          sendQueued(userId, (record, saved) =>
            invalidateForChange(queryClient, { entity: record.kind === 'round' ? 'reading' : 'log_entry', id: saved.id, unitId: record.unitId }),
          ),
        )
        // A device without IndexedDB (or with it refused) keeps nothing to send; the next try asks again.
        .catch(() => undefined);
    };
    send();
    window.addEventListener('online', send);
    const timer = setInterval(send, RETRY_INTERVAL_MS);
    return () => {
      noteSignedInPerson(null);
      window.removeEventListener('online', send);
      clearInterval(timer);
    };
  }, [userId, queryClient]);
}
