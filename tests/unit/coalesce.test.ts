import { describe, expect, it } from 'vitest';
import { coalesced } from '../../server/lib/coalesce';

/** A read the test finishes by hand, counting how many were started. */
function manualReads() {
  const started: { arg: string; finish: (value: string) => void; fail: (error: Error) => void }[] = [];
  const read = (arg: string) =>
    new Promise<string>((resolve, reject) => {
      started.push({ arg, finish: resolve, fail: reject });
    });
  return { read, started };
}
const tick = () => new Promise((r) => setTimeout(r, 0));

describe('coalesced reads', () => {
  it('reads alone when nothing is running', async () => {
    const { read, started } = manualReads();
    const get = coalesced(read, (a) => a);
    const first = get('u1');
    expect(started).toHaveLength(1);
    started[0]!.finish('v1');
    await expect(first).resolves.toBe('v1');
    const second = get('u1');
    expect(started).toHaveLength(2);
    started[1]!.finish('v2');
    await expect(second).resolves.toBe('v2');
  });

  it('answers everyone who asked while a read ran with one read begun after they asked, never the running one', async () => {
    const { read, started } = manualReads();
    const get = coalesced(read, (a) => a);
    const early = get('u1');
    // Asked while the first read runs: it may have begun before a change these people just made.
    const late = [get('u1'), get('u1'), get('u1')];
    expect(started).toHaveLength(1);
    started[0]!.finish('before');
    await expect(early).resolves.toBe('before');
    await tick();
    expect(started).toHaveLength(2);
    started[1]!.finish('after');
    expect(await Promise.all(late)).toEqual(['after', 'after', 'after']);
  });

  it('keeps different keys apart', async () => {
    const { read, started } = manualReads();
    const get = coalesced(read, (a) => a);
    const one = get('u1');
    const two = get('u2');
    expect(started.map((s) => s.arg)).toEqual(['u1', 'u2']);
    started[0]!.finish('one');
    started[1]!.finish('two');
    expect(await Promise.all([one, two])).toEqual(['one', 'two']);
  });

  it('passes a failure to those who shared the read, and the next asker reads again', async () => {
    const { read, started } = manualReads();
    const get = coalesced(read, (a) => a);
    const first = get('u1');
    const waiting = get('u1');
    started[0]!.fail(new Error('database away'));
    await expect(first).rejects.toThrow('database away');
    await tick();
    started[1]!.fail(new Error('still away'));
    await expect(waiting).rejects.toThrow('still away');
    const again = get('u1');
    expect(started).toHaveLength(3);
    started[2]!.finish('back');
    await expect(again).resolves.toBe('back');
  });
});
