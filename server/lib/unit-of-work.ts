// One transaction per unit of work. InnoDB may pick any of two concurrent transactions as a
// deadlock victim (two rounds opening flags on one unit, say); the victim's work is rolled back
// whole, so running it again from the start is safe. A few tries, then the error stands.
import { DatabaseError, type Sequelize, type Transaction } from 'sequelize';
import { logger } from './logger';
import { noteTransactionBegun } from './reference-cache';

const RETRYABLE = new Set([
  1213, // ER_LOCK_DEADLOCK
  1205, // ER_LOCK_WAIT_TIMEOUT
  // ER_AUTOINC_READ_FAILED: what InnoDB reports when an INSERT … SELECT meets a deadlock or lock
  // wait on the table's auto-increment lock (seen under concurrent rounds before index refreshes
  // stopped using INSERT … SELECT). The transaction is rolled back like any other victim.
  1467,
]);
const MAX_TRIES = 4;

/** A deadlock or lock timeout: the statement (or the whole unit of work) may simply be run again. */
export function isRetryable(error: unknown): boolean {
  if (!(error instanceof DatabaseError)) return false;
  const errno = (error.parent as { errno?: number } | undefined)?.errno;
  return errno !== undefined && RETRYABLE.has(errno);
}

export async function unitOfWork<T>(sequelize: Sequelize, work: (transaction: Transaction) => Promise<T>, label = 'unit of work'): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await sequelize.transaction((transaction) => {
        noteTransactionBegun(transaction);
        return work(transaction);
      });
    } catch (error) {
      if (!isRetryable(error) || attempt >= MAX_TRIES) throw error;
      logger.warn({ unitOfWork: label, attempt, err: error }, `${label}: ${(error as Error).message} — retrying (${attempt} of ${MAX_TRIES - 1})`);
      // A short random pause so the two transactions do not collide again in step.
      await new Promise((resolve) => setTimeout(resolve, 5 + Math.random() * 20 * attempt));
    }
  }
}
