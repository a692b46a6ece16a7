import type { Socket } from 'socket.io-client';

// Each event has its own argument types (LiveEvent, BoardPresence); socket.io types its handlers the same way.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Listener = (...args: any[]) => void;

const RETRY_LOAD_MS = 5000;

/**
 * The tab's live connection. The socket.io client (~15 kB gzip'd) is loaded after the first page
 * has drawn, not with it: until it is there, listeners are kept and attached when it arrives, and an
 * emit is dropped as it would be on a socket not yet connected — the callers join their rooms again
 * on every 'connect' (see app/use-live-updates.ts), so nothing asked for early is lost.
 */
export class LiveConnection {
  private socket: Socket | null = null;
  private closed = false;
  private readonly listeners = new Map<string, Set<Listener>>();
  /** Settles once the client is loaded and the socket made (or the connection closed first). */
  readonly ready: Promise<void>;

  constructor(load: () => Promise<typeof import('socket.io-client')> = () => import('socket.io-client')) {
    // A client that could not be fetched (the network dropped first) is asked for again a little later;
    // until then the page is as it is with the connection down (the shell says so after a grace, see useConnected).
    const attempt = (): Promise<void> =>
      load().then(
        ({ io }) => {
          if (this.closed) return;
          this.socket = io({ withCredentials: true, transports: ['websocket', 'polling'] });
          for (const [event, fns] of this.listeners) for (const fn of fns) this.socket.on(event, fn);
        },
        () => (this.closed ? undefined : new Promise<void>((resolve) => setTimeout(resolve, RETRY_LOAD_MS)).then(attempt)),
      );
    this.ready = attempt();
  }

  get connected(): boolean {
    return this.socket?.connected ?? false;
  }

  on(event: string, fn: Listener) {
    if (!this.listeners.has(event)) this.listeners.set(event, new Set());
    this.listeners.get(event)!.add(fn);
    this.socket?.on(event, fn);
  }

  off(event: string, fn: Listener) {
    this.listeners.get(event)?.delete(fn);
    this.socket?.off(event, fn);
  }

  emit(event: string, ...args: unknown[]) {
    if (this.socket?.connected) this.socket.emit(event, ...args);
  }

  disconnect() {
    this.closed = true;
    this.socket?.disconnect();
  }
}

let connection: LiveConnection | null = null;

/** One connection per signed-in browser tab; the handshake carries the session cookie. */
export function getSocket(): LiveConnection {
  connection ??= new LiveConnection();
  return connection;
}

export function closeSocket() {
  connection?.disconnect();
  connection = null;
}
