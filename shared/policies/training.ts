// Whose training records a person may amend or read. A trainee corrects their own practice entries;
// a trainer corrects any entry and any decision. Progress is the trainee's own to read, and shift
// leads, trainers and administrators read everyone's.
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
