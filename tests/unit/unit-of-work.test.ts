import { DatabaseError, type Sequelize, type Transaction } from 'sequelize';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { unitOfWork } from '../../server/lib/unit-of-work';

// MariaDB error numbers (MariaDB error reference, from memory): 1213 deadlock, 1205 lock wait
// timeout, 1467 auto-increment read failed (a deadlock on the auto-increment lock), 1062 duplicate key.
const dbError = (errno: number) => new DatabaseError(Object.assign(new Error(`errno ${errno}`), { errno, sql: '', parameters: {} }) as never);

/** A stand-in for Sequelize whose transactions fail with `failures` in turn, then succeed. */
function failingThen(failures: Error[]) {
  let calls = 0;
  const sequelize = {
    transaction: async <T>(work: (t: Transaction) => Promise<T>) => {
      calls += 1;
      const failure = failures.shift();
      if (failure) throw failure;
      return work({} as Transaction);
    },
  } as unknown as Sequelize;
  return { sequelize, calls: () => calls };
}

afterEach(() => vi.restoreAllMocks());

describe('unitOfWork', () => {
  it.each([1213, 1205, 1467])('runs the whole unit again after error %i', async (errno) => {
    vi.spyOn(console, 'warn').mockImplementation(() => {});
    const db = failingThen([dbError(errno), dbError(errno)]);
    await expect(unitOfWork(db.sequelize, async () => 'done')).resolves.toBe('done');
    expect(db.calls()).toBe(3);
  });

  it('gives up after four tries', async () => {
    vi.spyOn(console, 'warn').mockImplementation(() => {});
    const db = failingThen([dbError(1213), dbError(1213), dbError(1213), dbError(1213), dbError(1213)]);
    await expect(unitOfWork(db.sequelize, async () => 'done')).rejects.toThrow('errno 1213');
    expect(db.calls()).toBe(4);
  });

  it('does not run again after any other error', async () => {
    const db = failingThen([dbError(1062)]);
    await expect(unitOfWork(db.sequelize, async () => 'done')).rejects.toThrow('errno 1062');
    expect(db.calls()).toBe(1);
  });
});
