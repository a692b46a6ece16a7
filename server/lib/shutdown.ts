// Stopping one node without losing work, so a plant can restart or replace nodes one at a time:
// 1. readiness answers 503 (a balancer stops sending new work here);
// 2. the listener closes (new connections are refused, and a balancer retries them on another node);
//    live sockets are closed, so browsers reconnect — through the balancer, to a node still serving —
//    and refetch what they show;
// 3. requests under way finish; the reminder check and the outbox finish their current step;
// 4. the database pool and Redis close, and the process exits 0.
// Past `graceMs` whatever is left is cut off and the process exits 1, so a supervisor can tell.
import type { Server as HttpServer } from 'node:http';
import type { Server as SocketServer } from 'socket.io';
import type { Logger } from './logger';

export type ShutdownParts = {
  server: HttpServer;
  io: SocketServer;
  log: Logger;
  graceMs: number;
  /** Readiness goes 503 from here on. */
  startDraining(): void;
  /** Loops that must finish their current step (the reminder check, the outbox sender). */
  stopJobs(): Promise<unknown>;
  /** Last: the database pool, Redis, timers. */
  closeResources(): Promise<unknown>;
  exit(code: number): void;
};

export function makeShutdown(parts: ShutdownParts) {
  let started: Promise<void> | null = null;

  async function drain(reason: string): Promise<void> {
    const { server, io, log } = parts;
    const t0 = Date.now();
    log.info({ reason, graceMs: parts.graceMs }, 'stopping: draining requests');
    const forced = setTimeout(() => {
      log.error({ graceMs: parts.graceMs }, 'stopping took longer than the grace period; cutting off what is left');
      server.closeAllConnections();
      parts.exit(1);
    }, parts.graceMs);
    forced.unref();

    parts.startDraining();
    const listenerClosed = new Promise<void>((resolve) => server.close(() => resolve()));
    // Keep-alive connections between requests would hold the close open: end each as it goes idle.
    const idleSweep = setInterval(() => server.closeIdleConnections(), 100);
    idleSweep.unref();
    // Socket.IO closes its sockets and engine (browsers see a transport close and reconnect elsewhere).
    const socketsClosed = io.close().catch((error: unknown) => log.warn({ err: error }, 'closing live connections'));
    await Promise.all([listenerClosed, socketsClosed, parts.stopJobs()]);
    clearInterval(idleSweep);
    await parts.closeResources();
    clearTimeout(forced);
    log.info({ ms: Date.now() - t0 }, 'stopped');
    parts.exit(0);
  }

  return {
    /** Starts the stop once; later calls (a second signal) wait for the same one. */
    shutdown(reason: string): Promise<void> {
      started ??= drain(reason).catch((error: unknown) => {
        parts.log.error({ err: error }, 'stopping failed');
        parts.exit(1);
      });
      return started;
    },
  };
}
