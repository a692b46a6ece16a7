// Every client test: a clean DOM, storage and fetch stub, and no real live connection (the
// socket.io client is replaced by an inert fake; the server is the fetch stub of each test).
import { cleanup } from '@testing-library/react';
import { afterEach, vi } from 'vitest';

vi.mock('socket.io-client', () => {
  const handlers = new Map<string, Set<(...args: unknown[]) => void>>();
  const socket = {
    connected: true,
    on: (event: string, fn: (...args: unknown[]) => void) => {
      if (!handlers.has(event)) handlers.set(event, new Set());
      handlers.get(event)!.add(fn);
      return socket;
    },
    off: (event: string, fn: (...args: unknown[]) => void) => {
      handlers.get(event)?.delete(fn);
      return socket;
    },
    emit: () => socket,
    disconnect: () => socket,
    /** For tests: what the server would send on this socket. */
    receive: (event: string, ...args: unknown[]) => {
      for (const fn of handlers.get(event) ?? []) fn(...args);
    },
  };
  return { io: () => socket };
});

afterEach(() => {
  cleanup();
  // A selection left in a removed editor would keep the next test's clicks from placing the caret.
  document.getSelection()?.removeAllRanges();
  localStorage.clear();
  vi.unstubAllGlobals();
  vi.useRealTimers();
});
