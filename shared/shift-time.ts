// Shift windows in the station's own time zone. Stored times are UTC; a shift starts at one of the
// station's local change times (e.g. 06:00 and 18:00), so a shift across a clock change is 11 or 13 h.
import { TZDate } from '@date-fns/tz';

const parse = (hhmm: string) => hhmm.split(':').map(Number) as [number, number];

/** Start (UTC) of the shift containing `at`, worked out from the zone's calendar (seven zone conversions). */
function computeShiftStart(at: number, timeZone: string, changeTimes: readonly string[]): number {
  const local = new TZDate(at, timeZone);
  let best = -Infinity;
  for (const dayOffset of [-1, 0, 1]) {
    for (const time of changeTimes) {
      const [h, m] = parse(time);
      const start = new TZDate(local.getFullYear(), local.getMonth(), local.getDate() + dayOffset, h, m, 0, timeZone).getTime();
      if (start <= at && start > best) best = start;
    }
  }
  return best;
}

// Shift windows [start, next start) already worked out, per zone and change times. Nearly every
// request asks for the shift of "now" or of a time close to it (a log entry's event, a round, the
// search index's documents), so one window answers thousands of questions; each answer worked out
// afresh took seven zone conversions. A time inside a known window has exactly that window's start
// (no change time lies between the window's ends), so the answer is the same as working it out.
const windows = new Map<string, { start: number; end: number }[]>();
const WINDOWS_KEPT = 64;

/** Start (UTC) of the shift containing `at`. */
export function shiftStartFor(at: Date, timeZone: string, changeTimes: readonly string[]): Date {
  const t = at.getTime();
  const key = `${timeZone}|${changeTimes.join(',')}`;
  let known = windows.get(key);
  if (known) for (const w of known) if (t >= w.start && t < w.end) return new Date(w.start);
  const start = computeShiftStart(t, timeZone, changeTimes);
  if (!Number.isFinite(start)) return new Date(start);
  const end = nextShiftStart(new Date(start), timeZone, changeTimes).getTime();
  if (!known) windows.set(key, (known = []));
  if (known.length >= WINDOWS_KEPT) known.shift();
  known.push({ start, end });
  return new Date(start);
}

// nextShiftStart's answers by their exact inputs: it is asked on nearly every request (the crew on shift,
// the shift picture) and each answer takes up to 26 × 7 zone conversions; its inputs are shift starts,
// a handful a day, so the same few answers are asked again and again. Bounded: emptied when full.
const nextStarts = new Map<string, number>();
const NEXT_STARTS_KEPT = 2000;

/** Start (UTC) of the shift after the one starting at `shiftStart`. */
export function nextShiftStart(shiftStart: Date, timeZone: string, changeTimes: readonly string[]): Date {
  const key = `${shiftStart.getTime()}|${timeZone}|${changeTimes.join(',')}`;
  const known = nextStarts.get(key);
  if (known !== undefined) return new Date(known);
  // Half an hour past the longest possible shift gap lands inside the next shift or the one after;
  // stepping forward an hour at a time finds the first change after `shiftStart`.
  for (let hours = 1; hours <= 26; hours++) {
    const probe = new Date(shiftStart.getTime() + hours * 3_600_000);
    // Worked out, not through shiftStartFor: its window cache asks this function for a window's end.
    const start = computeShiftStart(probe.getTime(), timeZone, changeTimes);
    if (start > shiftStart.getTime()) {
      if (nextStarts.size >= NEXT_STARTS_KEPT) nextStarts.clear();
      nextStarts.set(key, start);
      return new Date(start);
    }
  }
  throw new Error('no shift change within 26 hours');
}

/** The last `count` shift starts up to `now`, newest first. */
export function recentShiftStarts(now: Date, timeZone: string, changeTimes: readonly string[], count: number): Date[] {
  const starts: Date[] = [];
  let at = shiftStartFor(now, timeZone, changeTimes);
  for (let i = 0; i < count; i++) {
    starts.push(at);
    at = shiftStartFor(new Date(at.getTime() - 1), timeZone, changeTimes);
  }
  return starts;
}

// Kept here for the callers that import it with the shift helpers; the formatting lives in station-time.ts.
export { stationLocalLabel } from './station-time';
