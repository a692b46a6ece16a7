// The service worker is registered in the production build only (vite-plugin-pwa builds it there);
// `npm run dev` runs without one. A new version waits until the person chooses to reload, so a
// form being typed is never reloaded away.
import { announceUpdateReady, setUpdate } from './service-worker';

export function registerServiceWorker() {
  if (!import.meta.env.PROD || !('serviceWorker' in navigator)) return;
  void import('virtual:pwa-register').then(({ registerSW }) => {
    setUpdate(registerSW({ immediate: true, onNeedRefresh: announceUpdateReady }));
  });
}
