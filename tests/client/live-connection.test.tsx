// The tab's live connection loads the socket.io client after the page draws (src/lib/socket.ts):
// listeners given before it arrives are attached when it does, and a client that could not be
// fetched is asked for again, not given up on.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { io } from 'socket.io-client';
import { LiveConnection } from '../../src/lib/socket';

afterEach(() => vi.useRealTimers());

describe('the live connection', () => {
  it('attaches the listeners given before the client arrived, and fetches it again after a failed fetch', async () => {
    vi.useFakeTimers();
    let tries = 0;
    const load = vi.fn(async () => {
      tries += 1;
      if (tries === 1) throw new TypeError('Failed to fetch dynamically imported module');
      return { io } as unknown as typeof import('socket.io-client');
    });
    const connection = new LiveConnection(load);
    const heard: unknown[] = [];
    connection.on('changed', (event: unknown) => heard.push(event));
    await vi.advanceTimersByTimeAsync(5000);
    await connection.ready;
    expect(load).toHaveBeenCalledTimes(2);
    // The fake socket of tests/client/support/setup.ts: `receive` plays what the server would send.
    (io() as unknown as { receive: (event: string, ...args: unknown[]) => void }).receive('changed', { entity: 'flag', id: 1, unitId: 1 });
    expect(heard).toEqual([{ entity: 'flag', id: 1, unitId: 1 }]);
    connection.disconnect();
  });
});
