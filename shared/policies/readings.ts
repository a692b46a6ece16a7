// Who may do what to a round, given the person and the round: the role table first, then the round's own facts.
import type { Role } from '../roles';
import { can } from './permissions';

type Person = { id: number; role: Role };

/**
 * A round recorded by someone who may record but not countersign (a trainee) waits for a countersign;
 * the server marks it so when it is saved.
 */
export const roundWaitsForCountersign = (role: Role): boolean => can(role, 'reading.record') && !can(role, 'reading.countersign');

/** A qualified crew member countersigns a trainee's round that still waits for it, never their own (by person id, as the server checks). */
export const mayCountersignRound = (person: Person, round: { recordedById: number; needsCountersign: boolean }): boolean =>
  can(person.role, 'reading.countersign') && round.needsCountersign && round.recordedById !== person.id;
