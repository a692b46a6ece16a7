import { describe, expect, it } from 'vitest';
import type { Transaction } from 'sequelize';
import { forgetReferenceData, noteTransactionBegun, referenceRead } from '../../server/lib/reference-cache';

let key = 0;
const freshKey = () => `test:${++key}`;

function counting(values: string[]) {
  let calls = 0;
  return { load: async () => values[Math.min(calls++, values.length - 1)]!, calls: () => calls };
}

describe('the reference data cache', () => {
  it('reads once and answers again from memory until reference data changes', async () => {
    const k = freshKey();
    const source = counting(['v1', 'v2']);
    expect(await referenceRead(k, source.load)).toBe('v1');
    expect(await referenceRead(k, source.load)).toBe('v1');
    expect(source.calls()).toBe(1);
    forgetReferenceData();
    expect(await referenceRead(k, source.load)).toBe('v2');
    expect(source.calls()).toBe(2);
  });

  it('does not keep a value read while a change happened (it may predate the change)', async () => {
    const k = freshKey();
    let release!: () => void;
    let calls = 0;
    const load = () => {
      calls += 1;
      return calls === 1 ? new Promise<string>((r) => (release = () => r('old'))) : Promise.resolve('new');
    };
    const reading = referenceRead(k, load);
    forgetReferenceData();
    release();
    expect(await reading).toBe('old');
    expect(await referenceRead(k, load)).toBe('new');
    expect(calls).toBe(2);
  });

  it('does not keep a failed read', async () => {
    const k = freshKey();
    let calls = 0;
    const load = async () => {
      calls += 1;
      if (calls === 1) throw new Error('database away');
      return 'v';
    };
    await expect(referenceRead(k, load)).rejects.toThrow('database away');
    expect(await referenceRead(k, load)).toBe('v');
    expect(calls).toBe(2);
  });

  it('inside a transaction begun before the last change, reads through it and keeps nothing', async () => {
    const k = freshKey();
    const tx = {} as Transaction;
    noteTransactionBegun(tx);
    forgetReferenceData();
    const source = counting(['through-tx', 'later']);
    expect(await referenceRead(k, source.load, tx)).toBe('through-tx');
    expect(await referenceRead(k, source.load)).toBe('later');
    expect(source.calls()).toBe(2);
  });

  it('inside a transaction begun after the last change, keeps what it read for everyone', async () => {
    const k = freshKey();
    forgetReferenceData();
    const tx = {} as Transaction;
    noteTransactionBegun(tx);
    const source = counting(['v1', 'v2']);
    expect(await referenceRead(k, source.load, tx)).toBe('v1');
    expect(await referenceRead(k, source.load)).toBe('v1');
    expect(source.calls()).toBe(1);
  });

  it('inside a transaction, never waits for a read still running outside it (that read may be queued for a connection the transaction holds)', async () => {
    const k = freshKey();
    forgetReferenceData();
    // A read outside any transaction that has not answered yet: under load it can be waiting for a
    // pooled connection while every connection is held by transactions that would wait for it.
    let release!: (value: string) => void;
    const outside = referenceRead(k, () => new Promise<string>((r) => (release = r)));
    const tx = {} as Transaction;
    noteTransactionBegun(tx);
    const source = counting(['through-tx']);
    const inside = await Promise.race([referenceRead(k, source.load, tx), new Promise((r) => setTimeout(() => r('waited for the outside read'), 50))]);
    expect(inside).toBe('through-tx');
    release('outside');
    expect(await outside).toBe('outside');
    // Once it has answered, a transaction takes the kept value like everyone else.
    expect(await referenceRead(k, source.load, tx)).toBe('outside');
  });
});
