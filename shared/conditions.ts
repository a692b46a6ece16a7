// Time left on a time-limited condition. Absolute time (UTC milliseconds), so a clock change in
// the station's zone neither adds nor removes an hour from the limit.
export type ConditionState = 'running' | 'due_soon' | 'overdue' | 'closed';

export type Remaining = { remainingMs: number; state: ConditionState };

/** Due soon once a fifth of the allowed time or 4 hours is left, whichever is longer. Common practice, no source. */
export function remainingTime(startedAt: Date, limitAt: Date, now: Date, closedAt: Date | null): Remaining {
  const remainingMs = limitAt.getTime() - (closedAt ?? now).getTime();
  if (closedAt) return { remainingMs, state: 'closed' };
  if (remainingMs <= 0) return { remainingMs, state: 'overdue' };
  const warnWithin = Math.max((limitAt.getTime() - startedAt.getTime()) / 5, 4 * 3_600_000);
  return { remainingMs, state: remainingMs <= warnWithin ? 'due_soon' : 'running' };
}

/** "2 d 3 h 05 min" / "overdue by 1 h 10 min". */
export function formatRemaining(ms: number): string {
  const abs = Math.abs(ms);
  const days = Math.floor(abs / 86_400_000);
  const hours = Math.floor((abs % 86_400_000) / 3_600_000);
  const minutes = Math.floor((abs % 3_600_000) / 60_000);
  const text = `${days ? `${days} d ` : ''}${hours} h ${String(minutes).padStart(2, '0')} min`;
  return ms < 0 ? `overdue by ${text}` : text;
}
