// The queue as the pages see it: one copy in memory, read from the device's storage, that every
// list and the indicator subscribe to; and the two ways a record gets to the server (at once, or
// later from the queue).
import { useEffect, useSyncExternalStore } from 'react';
import { api, ApiError } from '../../../lib/api-client';
import { idbQueueStorage } from './idb-storage';
import { signedInPerson } from './session-person';
import { inEntryOrder, isUnreachable, sendWaiting, type QueueStorage, type QueuedKind, type QueuedRecord, type SendOutcome } from './queue';

let storage: QueueStorage = idbQueueStorage;
let records: QueuedRecord[] = [];
let loaded: Promise<void> | null = null;
const listeners = new Set<() => void>();

/** Tests put an in-memory storage here (happy-dom has no IndexedDB). */
export function replaceQueueStorage(replacement: QueueStorage) {
  storage = replacement;
  records = [];
  loaded = null;
}

async function reload() {
  records = (await storage.list()).sort(inEntryOrder);
  for (const listener of listeners) listener();
}
export const loadQueue = () => (loaded ??= reload().catch(() => undefined));

/** Every record kept on this device (all people's), oldest entry first. */
export function useQueuedRecords(): QueuedRecord[] {
  useEffect(() => void loadQueue(), []);
  return useSyncExternalStore(
    (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    () => records,
  );
}

export const pathFor = (kind: QueuedKind, unitId: number) => (kind === 'round' ? `/api/units/${unitId}/readings` : `/api/units/${unitId}/log`);

/** A random UUID; crypto.randomUUID where the page is a secure context, else the same from random bytes. */
export function newClientId(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, '0')).join('');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

let sequence = 0;
export type Draft = { kind: QueuedKind; userId: number; unitId: number; payload: Record<string, unknown>; summary: string; worstStatus?: QueuedRecord['worstStatus'] };

async function keep(draft: Draft, clientId: string, enteredAt: Date): Promise<QueuedRecord> {
  const record: QueuedRecord = { ...draft, clientId, enteredAt: enteredAt.toISOString(), sequence: (sequence += 1), state: 'waiting' };
  await storage.put(record);
  await reload();
  return record;
}

/**
 * Sends a round or log entry now, or keeps it on the device when the server cannot be reached
 * (offline, or the request failed on the network). Sent at once it carries only its client id, so
 * the server's clock is its time of entry; kept, it carries the time it was entered here too.
 */
export async function sendOrKeep<T>(draft: Draft): Promise<{ kept: QueuedRecord; saved?: undefined } | { saved: T; kept?: undefined }> {
  const clientId = newClientId();
  const enteredAt = new Date();
  if (typeof navigator !== 'undefined' && navigator.onLine === false) return { kept: await keep(draft, clientId, enteredAt) };
  try {
    return { saved: await api.post<T>(pathFor(draft.kind, draft.unitId), { ...draft.payload, clientId }) };
  } catch (error) {
    // The answer may have been lost after the server stored it: the same client id makes the later send return that record.
    if (isUnreachable(error)) return { kept: await keep(draft, clientId, enteredAt) };
    throw error;
  }
}

export async function discard(clientId: string) {
  await storage.remove(clientId);
  await reload();
}

// Who the page's session belongs to now. A record goes out with whatever session cookie the page
// holds at that moment, so each send first checks it is still its author's: at shift change one
// person signs out and the next signs in on the same tablet while a slow pass is still sending.

const sending = new Map<number, Promise<SendOutcome>>();

/** Sends the person's waiting records in order of entry (one pass per person at a time); `onSent` after each stored one. */
export function sendQueued(userId: number, onSent: (record: QueuedRecord, saved: { id: number }) => void): Promise<SendOutcome> {
  const running = sending.get(userId);
  if (running) return running;
  const pass = sendWaiting(storage, userId, async (record) => {
    // Treated as a signed-out answer: the pass stops and the record waits for its author.
    if (signedInPerson() !== userId) throw new ApiError(401, 'SIGNED_OUT', 'Sign in as the person who entered this record to send it');
    const saved = await api.post<{ id: number }>(pathFor(record.kind, record.unitId), { ...record.payload, clientId: record.clientId, enteredAt: record.enteredAt });
    onSent(record, saved);
  }).finally(() => {
    sending.delete(userId);
    void reload().catch(() => undefined);
  });
  sending.set(userId, pass);
  return pass;
}
