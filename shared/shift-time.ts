// Shift windows in the station's own time zone. Stored times are UTC; a shift starts at one of the
// station's local change times (e.g. 06:00 and 18:00), so a shift across a clock change is 11 or 13 h.
import { TZDate } from '@date-fns/tz';

const parse = (hhmm: string) => hhmm.split(':').map(Number) as [number, number];

/** Start (UTC) of the shift containing `at`. */
export function shiftStartFor(at: Date, timeZone: string, changeTimes: readonly string[]): Date {
  const local = new TZDate(at.getTime(), timeZone);
  let best = -Infinity;
  for (const dayOffset of [-1, 0, 1]) {
    for (const time of changeTimes) {
      const [h, m] = parse(time);
      const start = new TZDate(local.getFullYear(), local.getMonth(), local.getDate() + dayOffset, h, m, 0, timeZone).getTime();
      if (start <= at.getTime() && start > best) best = start;
    }
  }
  return new Date(best);
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
    const start = shiftStartFor(probe, timeZone, changeTimes);
    if (start.getTime() > shiftStart.getTime()) {
      if (nextStarts.size >= NEXT_STARTS_KEPT) nextStarts.clear();
      nextStarts.set(key, start.getTime());
      return start;
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
