// Who reads a trainer's review comment on a logbook record: trainers, shift leads and administrators
// read them all; anyone else those on records that are theirs or their crew's.
import type { Role } from '../roles';
import { can } from './permissions';

export type ReviewReader = { id: number; role: Role; crewId: number | null };
/** The record commented on: whose it is and which crew's shift (null: nobody's in particular). */
export type ReviewedRecord = { personId: number | null; crewId: number | null };

export const readsEveryReviewComment = (viewer: ReviewReader) => can(viewer.role, 'review.read-all');

export function mayReadReviewComment(viewer: ReviewReader, record: ReviewedRecord): boolean {
  return readsEveryReviewComment(viewer) || record.personId === viewer.id || (viewer.crewId !== null && record.crewId === viewer.crewId);
}
