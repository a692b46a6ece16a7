// The service worker is registered in the production build only (vite-plugin-pwa builds it there);
// `npm run dev` runs without one. A new version waits until the person chooses to reload, so a
// form being typed is never reloaded away.
import { useSyncExternalStore } from 'react';

let updateReady = false;
let applyUpdate: ((reload?: boolean) => Promise<void>) | null = null;
const listeners = new Set<() => void>();

export function registerServiceWorker() {
  if (!import.meta.env.PROD || !('serviceWorker' in navigator)) return;
  void import('virtual:pwa-register').then(({ registerSW }) => {
    applyUpdate = registerSW({
      immediate: true,
      onNeedRefresh() {
        updateReady = true;
        for (const listener of listeners) listener();
      },
    });
  });
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
