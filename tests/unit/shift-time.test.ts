import { describe, expect, it } from 'vitest';
import { nextShiftStart, shiftStartFor } from '../../shared/shift-time';

// Reference: the latest instant at or before `at` whose wall-clock time in the zone is one of the
// change times, found by stepping back a minute at a time and reading the wall clock through the
// platform's Intl (ICU's zone data), independently of the helpers under test.
function referenceShiftStart(at: Date, timeZone: string, changeTimes: string[]): Date {
  const format = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
  let t = Math.floor(at.getTime() / 60_000) * 60_000;
  for (let i = 0; i < 27 * 60; i++, t -= 60_000) if (changeTimes.includes(format.format(new Date(t)))) return new Date(t);
  throw new Error('no change time within 27 h');
}

describe('shift windows across clock changes', () => {
  // EU summer time (Directive 2000/84/EC): from the last Sunday of March to the last Sunday of
  // October, changing at 01:00 UTC. In 2026: 29 March and 25 October.
  const berlin = { zone: 'Europe/Berlin', times: ['06:00', '18:00'] };

  it('the night shift into summer time is 11 h: 18:00 CET (17:00 UTC) to 06:00 CEST (04:00 UTC)', () => {
    expect(shiftStartFor(new Date('2026-03-29T03:59:59.999Z'), berlin.zone, berlin.times).toISOString()).toBe('2026-03-28T17:00:00.000Z');
    expect(shiftStartFor(new Date('2026-03-29T04:00:00.000Z'), berlin.zone, berlin.times).toISOString()).toBe('2026-03-29T04:00:00.000Z');
    expect(nextShiftStart(new Date('2026-03-28T17:00:00.000Z'), berlin.zone, berlin.times).toISOString()).toBe('2026-03-29T04:00:00.000Z');
  });

  it('the night shift out of summer time is 13 h: 18:00 CEST (16:00 UTC) to 06:00 CET (05:00 UTC)', () => {
    expect(shiftStartFor(new Date('2026-10-25T04:59:59.999Z'), berlin.zone, berlin.times).toISOString()).toBe('2026-10-24T16:00:00.000Z');
    expect(shiftStartFor(new Date('2026-10-25T05:00:00.000Z'), berlin.zone, berlin.times).toISOString()).toBe('2026-10-25T05:00:00.000Z');
  });

  it('answers the same as the wall clock whatever order times are asked in (windows already worked out are reused)', () => {
    // A fixed pseudo-random walk over 2026 in both directions, with times on and next to shift changes.
    const cases: [string, string[]][] = [
      ['Europe/Berlin', ['06:00', '18:00']],
      ['America/New_York', ['06:00', '14:00', '22:00']],
      ['Australia/Adelaide', ['07:00', '15:30', '23:00']],
    ];
    let seed = 12345;
    const random = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    for (const [zone, times] of cases) {
      const asked: Date[] = [];
      for (let i = 0; i < 40; i++) {
        const t = Date.UTC(2026, 0, 1) + Math.floor(random() * 365 * 86_400_000);
        asked.push(new Date(t));
        // The same window again, its start exactly and the instant before it.
        const start = referenceShiftStart(new Date(t), zone, times).getTime();
        asked.push(new Date(t - 3_600_000), new Date(start), new Date(start - 1));
      }
      for (const at of asked) expect(shiftStartFor(at, zone, times).toISOString(), `${zone} ${at.toISOString()}`).toBe(referenceShiftStart(at, zone, times).toISOString());
    }
  });
});
