// The outbox. A notice is written in the transaction of the change it tells about, so a change that
// rolls back tells nobody and one that commits is not lost with the process that made it. A sender
// (started by the server, woken after each commit that wrote one) claims due rows with one guarded
// UPDATE, so of several senders, in one process or many, exactly one holds each row; it sends,
// marks the row sent, and on failure puts it back with a growing delay and the error.
import { randomUUID } from 'node:crypto';
import { isRetryable } from './unit-of-work';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { Mailer } from './mailer';
import { logger } from './logger';
import { jsonColumn } from './json-column';

export type Notice = { kind: string; refId: number; to: string[]; subject: string; text: string };

/**
 * Writes `notice` inside `transaction`, due at once. One notice per kind and record (a unique key):
 * false when it exists already, or when there is nobody to tell.
 */
export async function enqueueNotice(notice: Notice, transaction: Transaction): Promise<boolean> {
  if (notice.to.length === 0) return false;
  const sequelize = (transaction as Transaction & { sequelize: Sequelize }).sequelize;
  const now = new Date();
  const [, affected] = await sequelize.query(
    `INSERT INTO outbox (kind, ref_id, recipients, subject, body, created_at, due_at, attempts)
     VALUES (?, ?, ?, ?, ?, ?, ?, 0) ON DUPLICATE KEY UPDATE id = id`,
    { replacements: [notice.kind, notice.refId, JSON.stringify(notice.to), notice.subject.slice(0, 300), notice.text, now, now], type: QueryTypes.INSERT, transaction },
  );
  return Number(affected) === 1;
}

export type OutboxOptions = {
  /** How long a claim holds a row; a sender that died holding one releases it when this runs out. */
  leaseMs?: number;
  /** Rows claimed at a time. */
  batch?: number;
  /** First retry after this, doubling each attempt up to `retryMaxMs`. */
  retryBaseMs?: number;
  retryMaxMs?: number;
};

type Claimed = { id: number; recipients: string | string[]; subject: string; body: string; attempts: number };

export type OutboxSender = ReturnType<typeof makeOutboxSender>;

export function makeOutboxSender(sequelize: Sequelize, mailer: Mailer, options: OutboxOptions = {}) {
  const leaseMs = options.leaseMs ?? 120_000;
  const batch = options.batch ?? 20;
  const retryBaseMs = options.retryBaseMs ?? 30_000;
  const retryMaxMs = options.retryMaxMs ?? 30 * 60_000;
  // Sent, but the database has not yet taken the mark (it may be down). Kept here and written first
  // on every pass; nothing new is claimed until it is, so this process never sends one row twice.
  const unmarked = new Map<number, Date>();

  async function writeMarks() {
    for (const [id, at] of unmarked) {
      await sequelize.query('UPDATE outbox SET sent_at = ?, claim_token = NULL, claimed_until = NULL, last_error = NULL WHERE id = ? AND sent_at IS NULL', {
        replacements: [at, id],
        type: QueryTypes.UPDATE,
      });
      unmarked.delete(id);
    }
  }

  async function putBack(row: Claimed, token: string, error: unknown, now: Date) {
    const delay = Math.min(retryBaseMs * 2 ** Math.max(0, row.attempts - 1), retryMaxMs);
    const message = (error instanceof Error ? error.message : String(error)).slice(0, 1000);
    logger.warn({ noticeId: row.id, attempt: row.attempts, retryInSeconds: Math.round(delay / 1000) }, `notice not sent: ${message}`);
    try {
      await sequelize.query('UPDATE outbox SET claim_token = NULL, claimed_until = NULL, due_at = ?, last_error = ? WHERE id = ? AND claim_token = ?', {
        replacements: [new Date(now.getTime() + delay), message, row.id, token],
        type: QueryTypes.UPDATE,
      });
    } catch {
      // The database is away too: the claim runs out and the row is tried again then.
    }
  }

  /** One pass: claims what is due at `now`, sends it, marks it. Returns how many were sent and failed. */
  async function sendDue(now = new Date()): Promise<{ sent: number; failed: number }> {
    const { sent, failed } = await pass(now);
    return { sent, failed };
  }

  /** `more`: the pass found a full batch due, so there may be more behind it. */
  async function pass(now: Date): Promise<{ sent: number; failed: number; more: boolean }> {
    await writeMarks();
    const token = randomUUID();
    // Two steps, so senders never lock rows they do not take: a plain read (no locks) picks the
    // candidates, then an UPDATE by primary key takes those still free. A row another sender took
    // in between fails the guard and is skipped; a single UPDATE … ORDER BY … LIMIT locked every row
    // it scanned and two senders deadlocked on the index.
    const candidates = await sequelize.query<{ id: number }>(
      `SELECT id FROM outbox WHERE sent_at IS NULL AND due_at <= ? AND (claim_token IS NULL OR claimed_until < ?) ORDER BY due_at, id LIMIT ?`,
      { replacements: [now, now, batch], type: QueryTypes.SELECT },
    );
    if (candidates.length === 0) return { sent: 0, failed: 0, more: false };
    const more = candidates.length >= batch;
    const ids = candidates.map((c) => Number(c.id)).sort((a, b) => a - b);
    const claim = () =>
      sequelize.query(
        `UPDATE outbox SET claim_token = ?, claimed_until = ?, attempts = attempts + 1
         WHERE id IN (${ids.map(() => '?').join(',')}) AND sent_at IS NULL AND (claim_token IS NULL OR claimed_until < ?)`,
        { replacements: [token, new Date(now.getTime() + leaseMs), ...ids, now], type: QueryTypes.UPDATE },
      );
    // Rows locked in key order by both sides cannot deadlock; a lock wait timeout still can happen.
    let result;
    for (let attempt = 1; ; attempt++) {
      try {
        result = await claim();
        break;
      } catch (error) {
        if (!isRetryable(error) || attempt >= 4) throw error;
        await new Promise((resolve) => setTimeout(resolve, 5 + Math.random() * 20 * attempt));
      }
    }
    const [, claimed] = result;
    if (!Number(claimed)) return { sent: 0, failed: 0, more };
    const rows = await sequelize.query<Claimed>('SELECT id, recipients, subject, body, attempts FROM outbox WHERE claim_token = ? ORDER BY id', {
      replacements: [token],
      type: QueryTypes.SELECT,
    });
    let sent = 0;
    let failed = 0;
    for (const row of rows) {
      const to = jsonColumn<string[]>(row.recipients);
      try {
        // A stable Message-ID: should a row ever go out twice (a sender killed between the SMTP
        // reply and the mark), the receiving side can tell it is the same message.
        await mailer.send({ to, subject: row.subject, text: row.body, messageId: `<notice-${row.id}@hotwell.invalid>` });
      } catch (error) {
        failed += 1;
        await putBack(row, token, error, now);
        continue;
      }
      unmarked.set(Number(row.id), new Date());
      sent += 1;
    }
    await writeMarks();
    return { sent, failed, more };
  }

  // One pass at a time per process; a wake during a pass asks for another one after it.
  let running: Promise<void> | null = null;
  let again = false;
  function wake(): Promise<void> {
    if (running) {
      again = true;
      return running;
    }
    running = (async () => {
      do {
        again = false;
        try {
          let result;
          do result = await pass(new Date());
          while (result.more);
        } catch (error) {
          logger.error({ err: error }, 'outbox pass failed (will try again)');
        }
      } while (again);
    })().finally(() => {
      running = null;
    });
    return running;
  }

  let timer: NodeJS.Timeout | null = null;
  return {
    sendDue,
    wake,
    /** Sends every `intervalMs` (and whenever woken). */
    start(intervalMs = 5_000) {
      timer ??= setInterval(() => void wake(), intervalMs);
      timer.unref();
    },
    async stop() {
      if (timer) clearInterval(timer);
      timer = null;
      await running;
    },
    /** Sent rows not yet marked (the database was away); for the shutdown message and tests. */
    unmarkedCount: () => unmarked.size,
  };
}
