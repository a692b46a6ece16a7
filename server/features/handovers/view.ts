// The board as the browser shows it: the handover, its items with who acknowledged which version,
// questions, amendments, files and what still waits before the incoming shift lead may accept.
import { Op } from 'sequelize';
import { remainingTime } from '../../../shared/conditions';
import { shiftRoles } from '../../../shared/policies/handover';
import { NotFound } from '../../lib/errors';
import { Condition } from '../conditions/index';
import { Flag } from '../flags/index';
import { findPeople, namesOf } from '../users/index';
import { attachmentsOfItems } from '../attachments/index';
import { Handover, HandoverAck, HandoverAmendment, HandoverItem, HandoverQuery } from './model';

/** The incoming crew whose acknowledgements the turnover waits for. */
export const incomingCrewOf = (h: Handover) =>
  h.incomingCrewId ? findPeople({ crewIds: [h.incomingCrewId], activeOnly: true, roles: shiftRoles }) : Promise.resolve([]);

export async function viewHandover(id: number) {
  const h = await Handover.findByPk(id);
  if (!h) throw new NotFound('That handover');
  const items = await HandoverItem.findAll({ where: { handoverId: id, removedAt: { [Op.is]: null } }, order: [['id', 'ASC']] });
  const itemIds = items.map((i) => i.id);
  const [acks, queries, amendments, incomingCrew, attachments] = await Promise.all([
    itemIds.length ? HandoverAck.findAll({ where: { itemId: itemIds } }) : [],
    itemIds.length ? HandoverQuery.findAll({ where: { itemId: itemIds }, order: [['id', 'ASC']] }) : [],
    HandoverAmendment.findAll({ where: { handoverId: id }, order: [['id', 'ASC']] }),
    incomingCrewOf(h),
    attachmentsOfItems(itemIds),
  ]);
  // Items that mirror a flag or condition show that record's state now, not as it was when attached.
  const flagIds = items.filter((i) => i.kind === 'abnormal_reading' && i.sourceId).map((i) => i.sourceId!);
  const conditionIds = items.filter((i) => i.kind === 'condition' && i.sourceId).map((i) => i.sourceId!);
  const [flags, conditions] = await Promise.all([
    flagIds.length ? Flag.findAll({ where: { id: flagIds } }) : [],
    conditionIds.length ? Condition.findAll({ where: { id: conditionIds } }) : [],
  ]);
  const now = new Date();
  const liveState = (item: HandoverItem) => {
    if (item.kind === 'abnormal_reading') {
      const f = flags.find((x) => x.id === item.sourceId);
      return f ? { state: f.status === 'cleared' ? 'flag cleared' : `flag open (${f.severity})`, remainingMs: null } : null;
    }
    if (item.kind === 'condition') {
      const c = conditions.find((x) => x.id === item.sourceId);
      if (!c) return null;
      const r = remainingTime(c.startedAt, c.limitAt, now, c.closedAt);
      return { state: r.state === 'closed' ? 'condition closed' : r.state.replace('_', ' '), remainingMs: r.state === 'closed' ? null : r.remainingMs };
    }
    return null;
  };
  const ids = new Set<number>([
    h.createdBy,
    ...[h.submittedBy, h.acceptedBy].filter((x): x is number => x !== null),
    ...acks.map((a) => a.userId),
    ...queries.flatMap((q) => [q.askedBy, ...(q.answeredBy ? [q.answeredBy] : [])]),
    ...amendments.map((a) => a.authorId),
    ...items.map((i) => i.createdBy).filter((x): x is number => x !== null),
  ]);
  const names = await namesOf([...ids]);
  const name = (uid: number | null) => (uid ? (names.get(uid) ?? `#${uid}`) : null);
  const waiting: string[] = [];
  const shownItems = items.map((item) => {
    const itemAcks = acks.filter((a) => a.itemId === item.id);
    // Only an acknowledgement of the item as it stands now counts; one of an earlier version is shown apart.
    const current = itemAcks.filter((a) => a.itemVersion === item.version);
    const earlier = itemAcks.filter((a) => a.itemVersion < item.version && !current.some((c) => c.userId === a.userId));
    const missing = incomingCrew.filter((p) => !current.some((a) => a.userId === p.id)).map((p) => p.name);
    const itemQueries = queries.filter((q) => q.itemId === item.id);
    const short = item.title.length > 60 ? `${item.title.slice(0, 59).trimEnd()}…` : item.title;
    if (missing.length) waiting.push(`“${short}” awaits ${missing.join(', ')}`);
    if (itemQueries.some((q) => !q.answeredAt)) waiting.push(`“${short}” has an open question`);
    return {
      id: item.id,
      kind: item.kind,
      title: item.title,
      detail: item.detail,
      reference: item.reference,
      priority: item.priority,
      sourceId: item.sourceId,
      automatic: item.sourceId !== null,
      addedBy: name(item.createdBy),
      version: item.version,
      amendedAt: item.amendedAt?.toISOString() ?? null,
      live: liveState(item),
      attachments: attachments
        .filter((a) => a.itemId === item.id)
        .map((a) => ({ id: a.id, fileName: a.fileName, mime: a.mime, size: a.size, amendmentId: a.amendmentId, uploadedAt: a.uploadedAt.toISOString() })),
      acknowledgedBy: current.map((a) => ({ userId: a.userId, name: name(a.userId), at: a.acknowledgedAt.toISOString() })),
      acknowledgedEarlierVersion: earlier.map((a) => ({ userId: a.userId, name: name(a.userId), at: a.acknowledgedAt.toISOString() })),
      awaiting: missing,
      queries: itemQueries.map((q) => ({
        id: q.id,
        question: q.question,
        askedBy: name(q.askedBy),
        askedAt: q.askedAt.toISOString(),
        answer: q.answer,
        answeredBy: name(q.answeredBy),
        answeredAt: q.answeredAt?.toISOString() ?? null,
      })),
    };
  });
  return {
    handover: {
      id: h.id,
      unitId: h.unitId,
      shiftStart: h.shiftStart.toISOString(),
      handoverAt: h.handoverAt.toISOString(),
      outgoingCrewId: h.outgoingCrewId,
      incomingCrewId: h.incomingCrewId,
      notesHtml: h.notesHtml,
      notesVersion: h.notesVersion,
      status: h.status,
      startedBy: name(h.createdBy),
      submittedBy: name(h.submittedBy),
      submittedAt: h.submittedAt?.toISOString() ?? null,
      acceptedBy: name(h.acceptedBy),
      acceptedAt: h.acceptedAt?.toISOString() ?? null,
      condenserSnapshot: h.condenserSnapshot ?? null,
    },
    items: shownItems,
    amendments: amendments.map((a) => ({ id: a.id, itemId: a.itemId, author: name(a.authorId), at: a.amendedAt.toISOString(), reason: a.reason, text: a.text })),
    incomingCrew: incomingCrew.map((p) => ({ id: p.id, name: p.name, role: p.role })),
    waiting,
  };
}
export type BoardView = Awaited<ReturnType<typeof viewHandover>>;
