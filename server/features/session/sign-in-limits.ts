// The sign-in limit counts failures, never successes, in the database (sign_in_failures) so that it
// holds across server processes and restarts:
// - per account (the e-mail as typed, known or not): after `accountFailures` failures in a row the
//   account is locked for `accountLockSeconds`, twice as long after each further failure (at most
//   `accountLockMaxSeconds`), until it signs in;
// - per address: `addressFailures` failures within `addressWindowMinutes` refuse every sign-in from
//   it until the oldest of them has aged out. High enough for one control-room PC that the whole
//   crew signs in on at shift change, typos included.
// An attempt is written as a failure before the password is checked and taken back on success, so
// a burst of simultaneous guesses is counted in full, not only the ones that finished first.
import { QueryTypes, type Sequelize } from 'sequelize';

export type SignInLimits = {
  accountFailures: number;
  accountLockSeconds: number;
  accountLockMaxSeconds: number;
  addressFailures: number;
  addressWindowMinutes: number;
};

export const defaultSignInLimits: SignInLimits = {
  accountFailures: 5,
  accountLockSeconds: 60,
  accountLockMaxSeconds: 3600,
  addressFailures: 50,
  addressWindowMinutes: 15,
};

/** An account's failures are forgotten a day after the last of them. */
const ACCOUNT_MEMORY_MS = 24 * 3_600_000;

export type Refusal = { message: string; retryAfterSeconds: number };
export type Attempt = { succeeded: () => Promise<void> };

const inWords = (ms: number) => {
  const minutes = Math.max(1, Math.ceil(ms / 60_000));
  return minutes === 1 ? '1 minute' : `${minutes} minutes`;
};

export function makeSignInLimits(sequelize: Sequelize, limits: SignInLimits) {
  /** How long the account stays locked after `failures` failures, the last at `last` (0: not locked). */
  function accountLockLeft(failures: number, last: Date | null, now: Date): number {
    if (failures < limits.accountFailures || !last) return 0;
    const lockMs = Math.min(limits.accountLockMaxSeconds, limits.accountLockSeconds * 2 ** (failures - limits.accountFailures)) * 1000;
    return Math.max(0, new Date(last).getTime() + lockMs - now.getTime());
  }

  async function addressLockLeft(address: string, beforeId: number, now: Date): Promise<number> {
    const windowMs = limits.addressWindowMinutes * 60_000;
    // The newest `addressFailures` failures in the window; the oldest of them decides when one ages out.
    const recent = await sequelize.query<{ failedAt: Date }>(
      `SELECT failed_at AS failedAt FROM sign_in_failures
       WHERE address = ? AND id < ? AND failed_at > ? ORDER BY failed_at DESC LIMIT ?`,
      { replacements: [address, beforeId, new Date(now.getTime() - windowMs), limits.addressFailures], type: QueryTypes.SELECT },
    );
    if (recent.length < limits.addressFailures) return 0;
    return Math.max(0, new Date(recent.at(-1)!.failedAt).getTime() + windowMs - now.getTime());
  }

  /**
   * Starts a sign-in attempt. Refused (nothing counted) while the account is locked or the address
   * is over its ceiling; otherwise the attempt counts as a failure unless `succeeded` is called.
   */
  async function begin(email: string, address: string): Promise<Attempt | Refusal> {
    const now = new Date();
    const key = email.trim().toLowerCase();
    const [insertId] = await sequelize.query('INSERT INTO sign_in_failures (email, address, failed_at) VALUES (?, ?, ?)', {
      replacements: [key, address, now],
      type: QueryTypes.INSERT,
    });
    const id = Number(insertId);
    const [account] = await sequelize.query<{ failures: number; last: Date | null }>(
      `SELECT COUNT(*) AS failures, MAX(failed_at) AS last FROM sign_in_failures
       WHERE email = ? AND account_reset = 0 AND id < ? AND failed_at > ?`,
      { replacements: [key, id, new Date(now.getTime() - ACCOUNT_MEMORY_MS)], type: QueryTypes.SELECT },
    );
    const accountWait = accountLockLeft(Number(account?.failures ?? 0), account?.last ?? null, now);
    const addressWait = accountWait ? 0 : await addressLockLeft(address, id, now);
    if (accountWait || addressWait) {
      await sequelize.query('DELETE FROM sign_in_failures WHERE id = ?', { replacements: [id] });
      const wait = Math.max(accountWait, addressWait);
      const message = accountWait
        ? `Too many failed sign-ins for this e-mail address: try again in ${inWords(wait)}`
        : `Too many failed sign-ins from this computer: try again in ${inWords(wait)}`;
      return { message, retryAfterSeconds: Math.ceil(wait / 1000) };
    }
    // Old rows go with the next attempts (by the failed_at index); none is ever needed after a day.
    await sequelize.query('DELETE FROM sign_in_failures WHERE failed_at < ? LIMIT 500', { replacements: [new Date(now.getTime() - ACCOUNT_MEMORY_MS)] });
    return {
      async succeeded() {
        // A success never counts, and clears the account's failures; the address keeps its count.
        await sequelize.query('DELETE FROM sign_in_failures WHERE id = ?', { replacements: [id] });
        await sequelize.query('UPDATE sign_in_failures SET account_reset = 1 WHERE email = ? AND account_reset = 0', { replacements: [key] });
      },
    };
  }

  return { begin };
}
export type SignInLimiter = ReturnType<typeof makeSignInLimits>;
export const isRefusal = (result: Attempt | Refusal): result is Refusal => 'message' in result;
