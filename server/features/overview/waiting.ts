// "Waiting on you": what the person asking still has to do, gathered from the features that own
// each rule — handover items to acknowledge, trainee rounds and training entries to countersign,
// standing orders to read, review comments on their records.
import { Op, literal } from 'sequelize';
import type { ReviewCommentView } from '../../../shared/schemas/logbook';
import type { WaitingOnYou } from '../../../shared/schemas/overview';
import { can } from '../../../shared/policies/permissions';
import { mayAccept } from '../../../shared/policies/handover';
import { ReadingSet } from '../readings/index';
import { pendingFor } from '../standing-orders/index';
import { countersignQueue } from '../training/index';
import type { CurrentHandovers } from './unit-state';

const LIST_LIMIT = 10;
/** Review comments have no "read" mark; the front page shows the recent ones and the logbook keeps them all. */
const RECENT_COMMENTS_MS = 7 * 86_400_000;

export type ReviewCommentsFor = (viewer: Express.User, limit: number) => Promise<ReviewCommentView[]>;

/**
 * Handover items the viewer's incoming crew must acknowledge and the viewer has not (at the item's
 * current version): a submitted handover's items, and an accepted one's amended after the turnover.
 */
export function handoverItemsFor(viewer: Express.User, current: CurrentHandovers, unitName: (unitId: number) => string): WaitingOnYou['handoverItems'] {
  if (viewer.crewId === null || !can(viewer.role, 'handover.take-part')) return [];
  const mine = new Map(current.handovers.filter((h) => h.status !== 'draft' && h.incomingCrewId === viewer.crewId).map((h) => [h.id, h]));
  const acked = new Set(current.acks.filter((a) => a.userId === viewer.id).map((a) => a.itemId));
  return current.items
    .filter((i) => mine.has(i.handoverId) && !acked.has(i.id))
    .map((i) => {
      const unitId = mine.get(i.handoverId)!.unitId;
      return { itemId: i.id, handoverId: i.handoverId, unitId, unitName: unitName(unitId), title: i.title, priority: i.priority };
    });
}

/** Open questions on the viewer's crew's handover, for the outgoing operators and lead who answer them. */
export function handoverQuestionsFor(viewer: Express.User, current: CurrentHandovers, unitName: (unitId: number) => string): WaitingOnYou['handoverQuestions'] {
  if (viewer.crewId === null || !can(viewer.role, 'handover.attach')) return [];
  const mine = new Map(current.handovers.filter((h) => h.status === 'submitted' && h.outgoingCrewId === viewer.crewId).map((h) => [h.id, h]));
  const itemOf = new Map(current.items.map((i) => [i.id, i]));
  return current.openQuestions
    .filter((q) => mine.has(itemOf.get(q.itemId)?.handoverId ?? 0))
    .map((q) => {
      const item = itemOf.get(q.itemId)!;
      const unitId = mine.get(item.handoverId)!.unitId;
      return { queryId: q.id, unitId, unitName: unitName(unitId), itemTitle: item.title, question: q.question };
    });
}

/** Submitted handovers the viewer (the incoming shift lead) can accept now: every item acknowledged, no question open. */
export function handoversToAcceptFor(
  viewer: Express.User,
  current: CurrentHandovers,
  unitName: (unitId: number) => string,
  crewMembers: (crewId: number | null) => { id: number }[],
): WaitingOnYou['handoversToAccept'] {
  // The handovers this person would accept: the incoming lead's (shared/policies/handover.ts).
  if (viewer.crewId === null || !mayAccept(viewer, { outgoingCrewId: null, incomingCrewId: viewer.crewId })) return [];
  return current.handovers
    .filter((h) => h.status === 'submitted' && h.incomingCrewId === viewer.crewId)
    .filter((h) => {
      const items = current.items.filter((i) => i.handoverId === h.id);
      const allAcknowledged = items.every((i) => crewMembers(h.incomingCrewId).every((p) => current.acks.some((a) => a.itemId === i.id && a.userId === p.id)));
      return allAcknowledged && !current.openQuestions.some((q) => items.some((i) => i.id === q.itemId));
    })
    .map((h) => ({ handoverId: h.id, unitId: h.unitId, unitName: unitName(h.unitId) }));
}

/**
 * Trainee rounds not yet countersigned, newest first, for someone whose role countersigns — their
 * own crew's trainees when they belong to a crew, since those are the rounds they walked beside.
 */
export async function traineeRoundsFor(viewer: Express.User) {
  if (!can(viewer.role, 'reading.countersign')) return [];
  const recordedBy: Record<symbol, unknown> = { [Op.ne]: viewer.id };
  if (viewer.crewId !== null) recordedBy[Op.in] = literal(`(SELECT id FROM users WHERE crew_id = ${Number(viewer.crewId)})`);
  return ReadingSet.findAll({
    where: { recordedAsTrainee: true, recordedBy, id: { [Op.notIn]: literal('(SELECT reading_set_id FROM reading_countersigns)') } },
    attributes: ['id', 'unitId', 'takenAt', 'recordedBy'],
    order: [['takenAt', 'DESC'], ['id', 'DESC']],
    limit: LIST_LIMIT,
  });
}

export async function trainingEntriesFor(viewer: Express.User): Promise<WaitingOnYou['trainingEntries']> {
  if (!can(viewer.role, 'training.countersign')) return [];
  const queue = await countersignQueue(viewer);
  return queue.slice(0, LIST_LIMIT).map((e) => ({ id: e.id, trainee: e.trainee, taskTitle: e.taskTitle, performedOn: e.performedOn, level: e.level }));
}

export async function standingOrdersFor(viewer: Express.User): Promise<WaitingOnYou['standingOrders']> {
  return (await pendingFor(viewer.id)).slice(0, LIST_LIMIT).map((o) => ({ id: o.id, title: o.title, effectiveFrom: o.effectiveFrom }));
}

export async function reviewCommentsFor(viewer: Express.User, commentsFor: ReviewCommentsFor, now: Date): Promise<WaitingOnYou['reviewComments']> {
  const comments = await commentsFor(viewer, LIST_LIMIT);
  return comments
    .filter((c) => now.getTime() - Date.parse(c.createdAt) <= RECENT_COMMENTS_MS)
    .map((c) => ({ id: c.id, documentId: c.documentId, about: c.about, author: c.author, body: c.body, createdAt: c.createdAt, unitId: c.unitId, shiftStart: c.shiftStart }));
}
