// What the page knows of its service worker: whether a new version waits (shown as a prompt), and
// the worker's copies of API answers to drop at sign-out. The registration itself is in
// register-service-worker.ts, imported by main.tsx only (the virtual module exists in Vite builds).
import { useSyncExternalStore } from 'react';

let updateReady = false;
let applyUpdate: ((reload?: boolean) => Promise<void>) | null = null;
const listeners = new Set<() => void>();

export function setUpdate(apply: (reload?: boolean) => Promise<void>) {
  applyUpdate = apply;
}

export function announceUpdateReady() {
  updateReady = true;
  for (const listener of listeners) listener();
}

/** Whether a new version is waiting, and how to take it (reloads the page). */
export function useUpdateReady(): { ready: boolean; reload: () => void } {
  const ready = useSyncExternalStore(
    (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    () => updateReady,
  );
  return { ready, reload: () => void applyUpdate?.(true) };
}

/** The worker's copies of API answers: dropped at sign-out, so the next person on this device never sees them offline. */
export async function forgetOfflineCopies() {
  if (typeof caches === 'undefined') return;
  await Promise.all(['hotwell-me', 'hotwell-round-data'].map((name) => caches.delete(name).catch(() => false)));
}
