// Who may amend a narrative log entry. An entry is a record of someone's shift: its author corrects
// it, and so does the shift lead of the crew that worked that shift (the station's rotation and swaps
// say which crew that was) — the lead answers for the shift's log. Nobody else, whatever their role.
import type { Role } from '../roles';
import { can } from './permissions';

export type LogActor = { id: number; role: Role; crewId: number | null };
/** The entry's author and the crew on shift when its event happened (null: no rotation says). */
export type LogEntryOwner = { authorId: number; crewOnShift: number | null };

export function mayAmendLogEntry(actor: LogActor, entry: LogEntryOwner): boolean {
  if (!can(actor.role, 'log.amend')) return false;
  if (entry.authorId === actor.id) return true;
  return actor.role === 'shift_lead' && actor.crewId !== null && entry.crewOnShift === actor.crewId;
}

/** The reason a person may not amend an entry, in their words. */
export function whyNotAmendLogEntry(actor: LogActor): string {
  if (!can(actor.role, 'log.amend')) return 'Your role does not amend log entries';
  if (actor.role === 'shift_lead') return 'A shift lead amends their own entries and those of shifts their crew worked';
  return 'You may amend only your own log entries';
}
