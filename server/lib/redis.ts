// Redis, when REDIS_URL is set, is what several app nodes share besides the database: the Socket.IO
// adapter (an event published on one node reaches the browsers connected to every node) and the
// counters of the sign-in form limit. Sessions, sign-in failures, reminders and the outbox are in
// MariaDB already, so nothing else needs it; one node runs without it.
import { createAdapter } from '@socket.io/redis-adapter';
import { createClient } from 'redis';
import type { Logger } from './logger';

/** Only what Hotwell calls on its connection (the full client type is one of many generic variants). */
export type RedisClient = { sendCommand(args: string[]): Promise<unknown> };

export type SharedRedis = {
  /** For commands (the rate-limit store). */
  client: RedisClient;
  /** The Socket.IO adapter factory over this connection and a subscriber of its own. */
  adapter: ReturnType<typeof createAdapter>;
  close(): Promise<void>;
};

export async function connectRedis(url: string, log: Logger): Promise<SharedRedis> {
  const client = createClient({ url });
  const subscriber = client.duplicate();
  // The clients reconnect by themselves; an error while away is logged, never a crash.
  let reported = false;
  for (const connection of [client, subscriber]) {
    connection.on('error', (error: unknown) => {
      if (reported) return;
      reported = true;
      log.error({ err: error }, 'redis connection lost; reconnecting');
    });
    connection.on('ready', () => {
      if (reported) log.info('redis connection back');
      reported = false;
    });
  }
  await Promise.all([client.connect(), subscriber.connect()]);
  return {
    client,
    adapter: createAdapter(client, subscriber, { key: 'hotwell.socket.io' }),
    async close() {
      await Promise.allSettled([client.close(), subscriber.close()]);
    },
  };
}
