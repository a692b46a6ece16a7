// Station time: the one place instants become the wall-clock text a station reads and types, and back.
// Records are stored as UTC instants; people see and enter them in the station's IANA zone, never the
// device's. Everything here works from tzOffset (the zone's UTC offset at an instant) and UTC getters, so
// the device's own zone never enters the result.
import { tzOffset } from '@date-fns/tz';

export type TimeStyle = 'date' | 'time' | 'time-seconds' | 'datetime' | 'datetime-seconds';

type Wall = { year: number; month: number; day: number; hour: number; minute: number; second: number };

const MINUTE = 60_000;
const DAY = 86_400_000;
const two = (n: number) => String(n).padStart(2, '0');

/** Whether the runtime knows the IANA zone (what station settings accept). */
export function isValidTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone });
    return true;
  } catch {
    return false;
  }
}

/** The zone's UTC offset in minutes (east positive) at `at`. */
function offsetAt(timeZone: string, ms: number): number {
  const minutes = tzOffset(timeZone, new Date(ms));
  if (!Number.isFinite(minutes)) throw new RangeError(`Unknown time zone “${timeZone}”`);
  return minutes;
}

function wallAt(ms: number, timeZone: string): Wall {
  const shifted = new Date(ms + offsetAt(timeZone, ms) * MINUTE);
  return {
    year: shifted.getUTCFullYear(),
    month: shifted.getUTCMonth() + 1,
    day: shifted.getUTCDate(),
    hour: shifted.getUTCHours(),
    minute: shifted.getUTCMinutes(),
    second: shifted.getUTCSeconds(),
  };
}

const dateText = (w: Wall) => `${String(w.year).padStart(4, '0')}-${two(w.month)}-${two(w.day)}`;
const timeText = (w: Wall, seconds = false) => `${two(w.hour)}:${two(w.minute)}${seconds ? `:${two(w.second)}` : ''}`;
const wallMs = (w: Wall) => Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);

/** "UTC+01:00", "UTC−05:00" style offset text for `at` in the zone. */
export function utcOffsetLabel(timeZone: string, at: Date | string | number = new Date()): string {
  const minutes = Math.round(offsetAt(timeZone, new Date(at).getTime()));
  const sign = minutes < 0 ? '-' : '+';
  const abs = Math.abs(minutes);
  return `UTC${sign}${two(Math.floor(abs / 60))}:${two(abs % 60)}`;
}

/** "Europe/Berlin, UTC+01:00": the zone and its offset at `at` (now by default), for labels beside times. */
export function zoneLabel(timeZone: string, at: Date | string | number = new Date()): string {
  return `${timeZone}, ${utcOffsetLabel(timeZone, at)}`;
}

/** Both instants a wall-clock time maps to (one normally, two in the repeated hour, none in the skipped one). */
function instantsFor(wall: Wall, timeZone: string): number[] {
  const naive = wallMs(wall);
  // Offsets a day either side cover both sides of any clock change near this time.
  const offsets = new Set([offsetAt(timeZone, naive - DAY), offsetAt(timeZone, naive), offsetAt(timeZone, naive + DAY)]);
  const found = new Set<number>();
  for (const offset of offsets) {
    const candidate = naive - offset * MINUTE;
    if (offsetAt(timeZone, candidate) === offset) found.add(candidate);
  }
  return [...found].sort((a, b) => a - b);
}

/**
 * An instant as the station's clock shows it: 'date' 2026-03-29, 'time' 06:00, 'datetime' 2026-03-29 06:00
 * (with -seconds variants). In the hour the clocks go back the same text names two instants, so there the
 * offset follows, e.g. "2026-10-25 02:30 (UTC+02:00)".
 */
export function formatStationTime(at: Date | string | number, timeZone: string, style: TimeStyle = 'datetime'): string {
  const ms = new Date(at).getTime();
  if (Number.isNaN(ms)) return '—';
  const wall = wallAt(ms, timeZone);
  if (style === 'date') return dateText(wall);
  const seconds = style === 'time-seconds' || style === 'datetime-seconds';
  const text = style === 'time' || style === 'time-seconds' ? timeText(wall, seconds) : `${dateText(wall)} ${timeText(wall, seconds)}`;
  return instantsFor(wall, timeZone).length > 1 ? `${text} (${utcOffsetLabel(timeZone, ms)})` : text;
}

/** "2026-03-29 06:00" in the station's zone, for labels (the shift pages and e-mails use this name). */
export function stationLocalLabel(at: Date, timeZone: string): string {
  return formatStationTime(at, timeZone, 'datetime');
}

/** The value an `<input type="datetime-local">` shows for `at` on the station's clock ("2026-03-29T06:00"). */
export function toStationInputValue(at: Date | string | number, timeZone: string): string {
  const wall = wallAt(new Date(at).getTime(), timeZone);
  return `${dateText(wall)}T${timeText(wall)}`;
}

/** Today's date on the station's clock ("2026-03-29"). */
export function stationToday(timeZone: string, now: Date = new Date()): string {
  return formatStationTime(now, timeZone, 'date');
}

export type RepeatedTime = { first: Date; second: Date; taken: 'first' | 'second' };
export type StationTimeParse = { ok: true; at: Date; repeated: RepeatedTime | null } | { ok: false; message: string };

const pattern = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:\.(\d+))?)?$/;
const datePattern = /^(\d{4})-(\d{2})-(\d{2})$/;

function validWall(parts: number[]): Wall | null {
  const [year, month, day, hour = 0, minute = 0, second = 0] = parts as [number, number, number, number?, number?, number?];
  if (month < 1 || month > 12 || hour > 23 || minute > 59 || second > 59) return null;
  const lastDay = new Date(Date.UTC(year, month, 0)).getUTCDate();
  if (day < 1 || day > lastDay) return null;
  return { year, month, day, hour, minute, second };
}

/** The first instant (to the minute) after `lo` whose offset differs from the offset at `lo`; `hi` has the new one. */
function changeBetween(timeZone: string, lo: number, hi: number): number {
  const before = offsetAt(timeZone, lo);
  while (hi - lo > MINUTE) {
    const mid = lo + Math.floor((hi - lo) / 2 / MINUTE) * MINUTE;
    if (offsetAt(timeZone, mid) === before) lo = mid;
    else hi = mid;
  }
  return hi;
}

/** A wall time the clocks skip: the instant of the jump, and the wall times just before and after it. */
function gapAround(wall: Wall, timeZone: string): { at: number; from: string; to: string } {
  const naive = wallMs({ ...wall, second: 0 });
  const before = offsetAt(timeZone, naive - DAY);
  const after = offsetAt(timeZone, naive + DAY);
  const at = changeBetween(timeZone, naive - after * MINUTE, naive - before * MINUTE);
  const clock = (offset: number) => {
    const d = new Date(at + offset * MINUTE);
    return `${two(d.getUTCHours())}:${two(d.getUTCMinutes())}`;
  };
  return { at, from: clock(before), to: clock(after) };
}

/**
 * A wall-clock time typed at the station ("2026-03-29T06:00", "2026-03-29 06:00" or with seconds) → the UTC
 * instant. The device's zone plays no part.
 *
 * - A time the clocks skip (spring forward, e.g. 02:30 on 2026-03-29 in Europe/Berlin) names no instant:
 *   the result is an error saying so, never a silently moved time.
 * - A time the clocks show twice (fall back, e.g. 02:30 on 2026-10-25 in Europe/Berlin) is read as the
 *   FIRST occurrence (still summer time) unless `repeated: 'second'` asks for the later one. The first is
 *   what RFC 5545 (§3.3.5) prescribes for a repeated local time and what ECMAScript's Date and Temporal's
 *   default do, so the same text means the same instant here as in other tools; the form says which was
 *   taken and offers the other (`repeated` in the result).
 */
export function parseStationTime(text: string, timeZone: string, options: { repeated?: 'first' | 'second' } = {}): StationTimeParse {
  const trimmed = text.trim();
  if (!trimmed) return { ok: false, message: 'Enter a date and time' };
  const match = pattern.exec(trimmed);
  if (!match) return { ok: false, message: 'Enter the date and time as yyyy-mm-dd hh:mm' };
  const wall = validWall(match.slice(1, 7).map((p) => (p === undefined ? 0 : Number(p))));
  if (!wall) return { ok: false, message: `${trimmed.slice(0, 10)} ${trimmed.slice(11, 16)} is not a valid date and time` };
  // A fraction of a second (historian exports) cannot change which offset applies; add it afterwards.
  const millis = match[7] ? Math.floor(Number(`0.${match[7]}`) * 1000) : 0;
  const instants = instantsFor(wall, timeZone).map((ms) => ms + millis);
  if (instants.length === 0) {
    const gap = gapAround(wall, timeZone);
    return {
      ok: false,
      message: `${dateText(wall)} ${timeText(wall)} does not exist in ${timeZone}: the clocks jump from ${gap.from} to ${gap.to} that night. Enter a time before ${gap.from} or from ${gap.to} on.`,
    };
  }
  if (instants.length === 1) return { ok: true, at: new Date(instants[0]!), repeated: null };
  const taken = options.repeated ?? 'first';
  const [first, second] = [new Date(instants[0]!), new Date(instants.at(-1)!)];
  return { ok: true, at: taken === 'first' ? first : second, repeated: { first, second, taken } };
}

/** What the form says about a time the clocks show twice, naming the one taken. */
export function repeatedTimeNote(parsed: { at: Date; repeated: RepeatedTime | null }, timeZone: string): string | null {
  if (!parsed.repeated) return null;
  const { first, second, taken } = parsed.repeated;
  const wall = formatStationTime(first, timeZone, 'datetime').replace(/ \(.*\)$/, '');
  return `${wall} occurs twice in ${timeZone} (the clocks go back that night). Read as the ${taken} one, ${utcOffsetLabel(timeZone, taken === 'first' ? first : second)}${
    taken === 'first' ? ' (before the change)' : ' (after the change)'
  }.`;
}

/** The instant a station day ("2026-03-29") starts, `addDays` later; the first instant of the day if midnight is skipped. */
export function stationDayStart(date: string, timeZone: string, addDays = 0): Date | null {
  const match = datePattern.exec(date.trim());
  if (!match) return null;
  const valid = validWall(match.slice(1, 4).map(Number));
  if (!valid) return null;
  const shifted = new Date(Date.UTC(valid.year, valid.month - 1, valid.day + addDays));
  const wall: Wall = { year: shifted.getUTCFullYear(), month: shifted.getUTCMonth() + 1, day: shifted.getUTCDate(), hour: 0, minute: 0, second: 0 };
  const instants = instantsFor(wall, timeZone);
  if (instants.length) return new Date(instants[0]!);
  // Midnight skipped (some zones change at 00:00): the day starts where the jump lands.
  return new Date(gapAround(wall, timeZone).at);
}
