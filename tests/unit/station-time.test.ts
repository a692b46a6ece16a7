import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  formatStationTime,
  parseStationTime,
  repeatedTimeNote,
  stationDayStart,
  stationToday,
  toStationInputValue,
  utcOffsetLabel,
  zoneLabel,
} from '../../shared/station-time';
import { stationLocalLabel } from '../../shared/shift-time';

const HOUR = 3_600_000;
const BERLIN = 'Europe/Berlin';
const CHICAGO = 'America/Chicago';

// The n-th (1-based) or last (n = -1) Sunday of a month, as a UTC calendar date.
function sunday(year: number, month: number, n: number): number {
  if (n > 0) {
    const first = new Date(Date.UTC(year, month - 1, 1));
    return Date.UTC(year, month - 1, 1 + ((7 - first.getUTCDay()) % 7) + 7 * (n - 1));
  }
  const last = new Date(Date.UTC(year, month, 0));
  return Date.UTC(year, month - 1, last.getUTCDate() - last.getUTCDay());
}

// EU rule, Directive 2000/84/EC arts. 2–3: summer time from 01:00 UTC on the last Sunday of March
// to 01:00 UTC on the last Sunday of October. Germany: CET = UTC+1, CEST = UTC+2.
const euStart = sunday(2026, 3, -1) + 1 * HOUR;
const euEnd = sunday(2026, 10, -1) + 1 * HOUR;
// US rule, Energy Policy Act of 2005 §110 (15 U.S.C. 260a): daylight time from 02:00 local on the second
// Sunday of March to 02:00 local on the first Sunday of November. Chicago: CST = UTC−6, CDT = UTC−5.
const usStart = sunday(2026, 3, 2) + 2 * HOUR + 6 * HOUR; // 02:00 CST
const usEnd = sunday(2026, 11, 1) + 2 * HOUR + 5 * HOUR; // 02:00 CDT

const iso = (ms: number) => new Date(ms).toISOString();

describe('the 2026 clock-change dates the tests rely on', () => {
  it('fall on the dates the rules give (EU 29 March and 25 October, US 8 March and 1 November)', () => {
    expect(iso(euStart)).toBe('2026-03-29T01:00:00.000Z');
    expect(iso(euEnd)).toBe('2026-10-25T01:00:00.000Z');
    expect(iso(usStart)).toBe('2026-03-08T08:00:00.000Z');
    expect(iso(usEnd)).toBe('2026-11-01T07:00:00.000Z');
  });
});

// The device's own zone must never leak in: run everything with the device far from the station.
describe.each(['Asia/Kolkata', 'Pacific/Auckland'])('with the device in %s', (deviceZone) => {
  const saved = process.env.TZ;
  beforeAll(() => {
    process.env.TZ = deviceZone;
  });
  afterAll(() => {
    if (saved === undefined) delete process.env.TZ;
    else process.env.TZ = saved;
  });

  it('really runs in that device zone', () => {
    // Asia/Kolkata is UTC+05:30 all year; Pacific/Auckland is UTC+12 in July (NZST). From memory.
    const july = new Date(Date.UTC(2026, 6, 1)).getTimezoneOffset();
    expect(july).toBe(deviceZone === 'Asia/Kolkata' ? -330 : -720);
  });

  describe('Europe/Berlin, spring forward on 2026-03-29', () => {
    it('shows the minute before the change as 01:59 CET and the change itself as 03:00 CEST', () => {
      expect(formatStationTime(euStart - 60_000, BERLIN)).toBe('2026-03-29 01:59');
      expect(formatStationTime(euStart, BERLIN)).toBe('2026-03-29 03:00');
      expect(formatStationTime(euStart, BERLIN, 'time')).toBe('03:00');
      expect(formatStationTime(euStart, BERLIN, 'date')).toBe('2026-03-29');
      expect(formatStationTime(euStart + 30_000, BERLIN, 'datetime-seconds')).toBe('2026-03-29 03:00:30');
    });

    it('refuses every skipped minute 02:00–02:59 with a message naming the jump, and reads 01:59 and 03:00', () => {
      for (let minute = 0; minute < 60; minute += 1) {
        const text = `2026-03-29 02:${String(minute).padStart(2, '0')}`;
        const parsed = parseStationTime(text, BERLIN);
        expect(parsed.ok, text).toBe(false);
        if (!parsed.ok) expect(parsed.message).toBe(`${text} does not exist in Europe/Berlin: the clocks jump from 02:00 to 03:00 that night. Enter a time before 02:00 or from 03:00 on.`);
      }
      expect(parseStationTime('2026-03-29T01:59', BERLIN)).toEqual({ ok: true, at: new Date(euStart - 60_000), repeated: null });
      expect(parseStationTime('2026-03-29T03:00', BERLIN)).toEqual({ ok: true, at: new Date(euStart), repeated: null });
    });

    it('labels the zone with the offset in force: UTC+01:00 before, UTC+02:00 after', () => {
      expect(zoneLabel(BERLIN, euStart - 1)).toBe('Europe/Berlin, UTC+01:00');
      expect(zoneLabel(BERLIN, euStart)).toBe('Europe/Berlin, UTC+02:00');
    });

    it('makes the station day 23 hours long', () => {
      const start = stationDayStart('2026-03-29', BERLIN)!;
      const next = stationDayStart('2026-03-29', BERLIN, 1)!;
      expect(start.toISOString()).toBe('2026-03-28T23:00:00.000Z'); // 00:00 CET
      expect(next.getTime() - start.getTime()).toBe(23 * HOUR);
    });
  });

  describe('Europe/Berlin, fall back on 2026-10-25', () => {
    it('shows both 02:30s with their offsets, and other times without', () => {
      expect(formatStationTime(euEnd - 30 * 60_000, BERLIN)).toBe('2026-10-25 02:30 (UTC+02:00)');
      expect(formatStationTime(euEnd + 30 * 60_000, BERLIN)).toBe('2026-10-25 02:30 (UTC+01:00)');
      expect(formatStationTime(euEnd + 90 * 60_000, BERLIN)).toBe('2026-10-25 03:30');
      expect(formatStationTime(euEnd - 90 * 60_000, BERLIN)).toBe('2026-10-25 01:30');
    });

    it('reads a repeated time as its first occurrence (summer time) unless the second is asked for', () => {
      const first = parseStationTime('2026-10-25 02:30', BERLIN);
      expect(first).toEqual({ ok: true, at: new Date(euEnd - 30 * 60_000), repeated: { first: new Date(euEnd - 30 * 60_000), second: new Date(euEnd + 30 * 60_000), taken: 'first' } });
      const second = parseStationTime('2026-10-25 02:30', BERLIN, { repeated: 'second' });
      expect(second.ok && second.at.toISOString()).toBe(new Date(euEnd + 30 * 60_000).toISOString());
      expect(first.ok && repeatedTimeNote(first, BERLIN)).toBe(
        '2026-10-25 02:30 occurs twice in Europe/Berlin (the clocks go back that night). Read as the first one, UTC+02:00 (before the change).',
      );
      expect(parseStationTime('2026-10-25 03:00', BERLIN)).toEqual({ ok: true, at: new Date(euEnd + HOUR), repeated: null });
    });

    it('makes the station day 25 hours long', () => {
      const start = stationDayStart('2026-10-25', BERLIN)!;
      expect(stationDayStart('2026-10-25', BERLIN, 1)!.getTime() - start.getTime()).toBe(25 * HOUR);
    });
  });

  describe('America/Chicago, 2026-03-08 and 2026-11-01', () => {
    it('skips 02:00–02:59 CST in March and says so', () => {
      expect(formatStationTime(usStart - 60_000, CHICAGO)).toBe('2026-03-08 01:59');
      expect(formatStationTime(usStart, CHICAGO)).toBe('2026-03-08 03:00');
      const parsed = parseStationTime('2026-03-08T02:15', CHICAGO);
      expect(parsed.ok).toBe(false);
      if (!parsed.ok) expect(parsed.message).toContain('the clocks jump from 02:00 to 03:00');
      expect(zoneLabel(CHICAGO, usStart - 1)).toBe('America/Chicago, UTC-06:00');
      expect(zoneLabel(CHICAGO, usStart)).toBe('America/Chicago, UTC-05:00');
    });

    it('repeats 01:00–01:59 in November and takes the first (CDT) by default', () => {
      const parsed = parseStationTime('2026-11-01 01:30', CHICAGO);
      expect(parsed.ok && parsed.at.toISOString()).toBe(new Date(usEnd - 30 * 60_000).toISOString());
      expect(parsed.ok && parsed.repeated?.second.toISOString()).toBe(new Date(usEnd + 30 * 60_000).toISOString());
      expect(formatStationTime(usEnd + 30 * 60_000, CHICAGO, 'time')).toBe('01:30 (UTC-06:00)');
      expect(utcOffsetLabel(CHICAGO, usEnd)).toBe('UTC-06:00');
    });
  });

  it('round-trips every quarter hour for two days around each change through the input value', () => {
    for (const [zone, change] of [[BERLIN, euStart], [BERLIN, euEnd], [CHICAGO, usStart], [CHICAGO, usEnd]] as const) {
      for (let t = change - 24 * HOUR; t <= change + 24 * HOUR; t += 15 * 60_000) {
        const value = toStationInputValue(t, zone);
        const parsed = parseStationTime(value, zone);
        expect(parsed.ok, `${zone} ${iso(t)}`).toBe(true);
        if (!parsed.ok) continue;
        const expected = parsed.repeated && parsed.repeated.second.getTime() === t ? parseStationTime(value, zone, { repeated: 'second' }) : parsed;
        expect(expected.ok && expected.at.getTime(), `${zone} ${iso(t)} via ${value}`).toBe(t);
        expect(formatStationTime(t, zone).startsWith(value.replace('T', ' '))).toBe(true);
      }
    }
  });

  it('takes the space-separated form with seconds, and refuses what is not a date and time', () => {
    expect(parseStationTime(' 2026-07-01 12:15:30 ', BERLIN)).toEqual({ ok: true, at: new Date('2026-07-01T10:15:30Z'), repeated: null });
    expect(parseStationTime('', BERLIN)).toEqual({ ok: false, message: 'Enter a date and time' });
    expect(parseStationTime('01/07/2026 12:15', BERLIN)).toEqual({ ok: false, message: 'Enter the date and time as yyyy-mm-dd hh:mm' });
    expect(parseStationTime('2026-02-29 12:00', BERLIN)).toEqual({ ok: false, message: '2026-02-29 12:00 is not a valid date and time' });
  });

  it('gives the station’s date, not the device’s, near midnight', () => {
    // 2026-07-01 22:30 UTC is already 2 July in Berlin (CEST) and still 1 July in Chicago (CDT).
    const at = new Date('2026-07-01T22:30:00Z');
    expect(stationToday(BERLIN, at)).toBe('2026-07-02');
    expect(stationToday(CHICAGO, at)).toBe('2026-07-01');
  });

  it('keeps the shift helpers’ label working, now from the one formatter', () => {
    expect(stationLocalLabel(new Date(euStart), BERLIN)).toBe(formatStationTime(euStart, BERLIN));
  });
});
