// Who may do what on a handover, given the person's role and crew and the handover's crews. The
// server enforces these in the handover service; the board asks the same functions what to offer.
import type { Role } from '../roles';
import { rolesFor } from './permissions';

export type HandoverActor = { id: number; role: Role; crewId: number | null };
export type HandoverCrews = { outgoingCrewId: number | null; incomingCrewId: number | null };

/** Roles that work shifts; trainers and administrators read handovers but are not on a crew's side. */
export const shiftRoles: readonly Role[] = rolesFor('handover.take-part');

export type HandoverSide = 'outgoing' | 'incoming' | 'other';

export function handoverSide(actor: HandoverActor, h: HandoverCrews): HandoverSide {
  if (!shiftRoles.includes(actor.role) || actor.crewId === null) return 'other';
  if (h.outgoingCrewId !== null && actor.crewId === h.outgoingCrewId) return 'outgoing';
  if (h.incomingCrewId !== null && actor.crewId === h.incomingCrewId) return 'incoming';
  return 'other';
}

/** Writes the notes and items, submits, amends, answers questions: the outgoing crew's operators and lead. */
export const mayWriteHandover = (actor: HandoverActor, h: HandoverCrews) => handoverSide(actor, h) === 'outgoing' && actor.role !== 'trainee';

/** Acknowledges items and asks questions: every member of the incoming crew, trainees included. */
export const mayAcknowledge = (actor: HandoverActor, h: HandoverCrews) => handoverSide(actor, h) === 'incoming';

/** Accepts the turnover: the incoming shift lead only. */
export const mayAccept = (actor: HandoverActor, h: HandoverCrews) => handoverSide(actor, h) === 'incoming' && actor.role === 'shift_lead';

/** The window around the shift change in which a handover may be submitted and accepted. */
export type HandoverWindow = { opensAt: Date; closesAt: Date };
export function handoverWindow(handoverAt: Date, beforeMinutes: number, afterMinutes: number): HandoverWindow {
  return { opensAt: new Date(handoverAt.getTime() - beforeMinutes * 60_000), closesAt: new Date(handoverAt.getTime() + afterMinutes * 60_000) };
}
export const withinWindow = (w: HandoverWindow, at: Date) => at.getTime() >= w.opensAt.getTime() && at.getTime() <= w.closesAt.getTime();
