// The device's queue of rounds and log entries made without a network. Pure logic over a storage
// interface (IndexedDB in the browser, an in-memory map in tests): what is kept, in which order it
// is sent, and what an answer from the server does to it. Nothing here is ever dropped silently: a
// record leaves the queue only when the server has stored it or its author discards it.
import type { Status } from '../../../../shared/calc/limits';
import { ApiError, type FieldErrors } from '../../../lib/api-client';

export type QueuedKind = 'round' | 'log_entry';

export type QueuedRecord = {
  /** The device's id for the record, sent with it: a retry returns the record already stored. */
  clientId: string;
  kind: QueuedKind;
  /** Who entered it: it is sent only while this person is signed in. */
  userId: number;
  unitId: number;
  /** When it was entered on the device (ISO, UTC). */
  enteredAt: string;
  /** Entry order on this device, for records entered in the same millisecond. */
  sequence: number;
  /** The body the form made, without `clientId` and `enteredAt`. */
  payload: Record<string, unknown>;
  /** A line for the lists: the readings or the entry's text. */
  summary: string;
  /** A round's status as judged on the device when it was entered. */
  worstStatus?: Status;
  state: 'waiting' | 'refused';
  /** Why the server refused it on arrival: its message and the messages beside each field. */
  refusal?: { message: string; fields: FieldErrors };
};

export interface QueueStorage {
  list(): Promise<QueuedRecord[]>;
  put(record: QueuedRecord): Promise<void>;
  remove(clientId: string): Promise<void>;
}

/** Answers that mean "not this record, as it is": kept with the reason for its author to fix or discard. */
const REFUSED = new Set([400, 409, 422]);

export type SendOutcome = { sent: number; refused: number; stopped: 'network' | 'signed-out' | 'server' | null };

export const inEntryOrder = (a: QueuedRecord, b: QueuedRecord) => a.enteredAt.localeCompare(b.enteredAt) || a.sequence - b.sequence;

/**
 * Sends one person's waiting records, oldest entry first. Stops at the first network failure, sign-in
 * or permission answer (401/403) or server fault, so later records never overtake earlier ones; those
 * stay waiting. A refusal (400/409/422) is kept with the server's reason and the next is sent.
 */
export async function sendWaiting(storage: QueueStorage, userId: number, send: (record: QueuedRecord) => Promise<void>): Promise<SendOutcome> {
  const waiting = (await storage.list()).filter((r) => r.userId === userId && r.state === 'waiting').sort(inEntryOrder);
  const outcome: SendOutcome = { sent: 0, refused: 0, stopped: null };
  for (const record of waiting) {
    try {
      await send(record);
    } catch (error) {
      if (error instanceof ApiError && REFUSED.has(error.status)) {
        await storage.put({ ...record, state: 'refused', refusal: { message: error.message, fields: error.fields } });
        outcome.refused += 1;
        continue;
      }
      outcome.stopped = !(error instanceof ApiError) || isUnreachable(error) ? 'network' : error.status === 401 || error.status === 403 ? 'signed-out' : 'server';
      return outcome;
    }
    await storage.remove(record.clientId);
    outcome.sent += 1;
  }
  return outcome;
}

// What a proxy or balancer in front answers while the app behind it is down or restarting.
const GATEWAY_DOWN = new Set([502, 503, 504]);

/** A failure that means the app was never reached (no network, or its proxy says it is down): the record is kept on the device. */
export const isUnreachable = (error: unknown) => error instanceof ApiError && (error.status === 0 || GATEWAY_DOWN.has(error.status));
