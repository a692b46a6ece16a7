// A job run every few seconds or minutes (the reminder check). One run at a time; `stop` lets the
// run under way finish its step and resolves when it has, so a stopping server never cuts one off.
import type { Logger } from './logger';

export type Periodic = { stop(): Promise<void> };

export function every(intervalMs: number, what: string, run: () => Promise<unknown>, log: Logger): Periodic {
  let running: Promise<void> | null = null;
  const tick = () => {
    if (running) return; // the last run is still going: skip rather than pile up
    running = run()
      .then(() => undefined)
      .catch((error: unknown) => log.error({ err: error }, `${what} failed (will try again)`))
      .finally(() => {
        running = null;
      });
  };
  const timer = setInterval(tick, intervalMs);
  timer.unref();
  return {
    async stop() {
      clearInterval(timer);
      await running;
    },
  };
}
