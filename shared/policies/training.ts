// Whose training records a person may amend, countersign or read. A trainee corrects their own
// practice entries; a trainer corrects any entry and any decision. An entry is countersigned by the
// supervisor it names (any qualified crew member when it names none) or by a shift lead, never by
// the trainee. Progress is the trainee's own to read, and shift leads, trainers and administrators
// read everyone's.
import type { Role } from '../roles';
import { can } from './permissions';

export type TrainingActor = { id: number; role: Role };
export type TrainingTarget = { kind: 'entry'; traineeId: number } | { kind: 'decision' };

export function mayAmendTraining(actor: TrainingActor, target: TrainingTarget): boolean {
  if (!can(actor.role, 'training.amend')) return false;
  if (actor.role === 'trainer') return true;
  return target.kind === 'entry' && target.traineeId === actor.id;
}

export function mayReadTrainingOf(actor: TrainingActor, traineeId: number): boolean {
  return actor.id === traineeId || can(actor.role, 'training.progress-of-others');
}

/** The entry as countersigning sees it: whose practice it is and which supervisor it names (null: none). */
export type CountersignTarget = { traineeId: number; supervisorId: number | null };

/** Countersigns any entry whatever supervisor it names: the shift lead answers for the crew's practice. */
export const countersignsAnyEntry = (actor: TrainingActor) => actor.role === 'shift_lead';

export function mayCountersignEntry(actor: TrainingActor, entry: CountersignTarget): boolean {
  if (!can(actor.role, 'training.countersign') || entry.traineeId === actor.id) return false;
  return entry.supervisorId === null || entry.supervisorId === actor.id || countersignsAnyEntry(actor);
}

/** Why a person may not countersign an entry, in their words. */
export function whyNotCountersign(actor: TrainingActor, entry: CountersignTarget): string {
  if (entry.traineeId === actor.id) return 'Nobody countersigns their own training entry';
  if (!can(actor.role, 'training.countersign')) return 'Your role does not countersign training entries';
  return 'The supervisor named on the entry (or a shift lead) countersigns it';
}
