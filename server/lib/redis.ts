// Redis, when REDIS_URL is set, is what several app nodes share besides the database: the Socket.IO
// adapter (an event published on one node reaches the browsers connected to every node), the
// counters of the sign-in form limit, and the word that reference data changed (each node caches it). Sessions, sign-in failures, reminders and the outbox are in
// MariaDB already, so nothing else needs it; one node runs without it.
import { createAdapter } from '@socket.io/redis-adapter';
import { createClient } from 'redis';
import type { Logger } from './logger';
import { forgetReferenceData, onReferenceChange } from './reference-cache';

// A change of reference data on one node empties every node's cache (lib/reference-cache.ts).
const REFERENCE_CHANNEL = 'hotwell.reference-data';

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
  await subscriber.subscribe(REFERENCE_CHANNEL, () => forgetReferenceData());
  const stopSharing = onReferenceChange(() => {
    client.publish(REFERENCE_CHANNEL, String(process.pid)).catch((error: unknown) => log.error({ err: error }, 'could not tell other nodes of a reference data change'));
  });
  return {
    client,
    adapter: createAdapter(client, subscriber, { key: 'hotwell.socket.io' }),
    async close() {
      stopSharing();
      await Promise.allSettled([client.close(), subscriber.close()]);
    },
  };
}
