// The queue's storage in the browser: one IndexedDB object store keyed by client id (idb wraps the
// request/event API in promises).
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { QueueStorage, QueuedRecord } from './queue';

interface OfflineDb extends DBSchema {
  records: { key: string; value: QueuedRecord };
}

export const OFFLINE_DB_NAME = 'hotwell-offline';

let opened: Promise<IDBPDatabase<OfflineDb>> | null = null;
const db = () =>
  (opened ??= openDB<OfflineDb>(OFFLINE_DB_NAME, 1, {
    upgrade(database) {
      database.createObjectStore('records', { keyPath: 'clientId' });
    },
  }));

export const idbQueueStorage: QueueStorage = {
  list: async () => (await db()).getAll('records'),
  put: async (record) => {
    await (await db()).put('records', record);
  },
  remove: async (clientId) => {
    await (await db()).delete('records', clientId);
  },
};
