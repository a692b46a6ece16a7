// Shift handover: the outgoing crew writes (notes and items) and submits; the incoming crew
// acknowledges each item or queries it; the incoming shift lead accepts, and that moment is the
// recorded turnover. After submit nothing is edited: corrections are amendments.
import { Op, QueryTypes, UniqueConstraintError, literal as sequelizeLiteral, type Sequelize } from 'sequelize';
import { recordAudit } from '../../lib/audit';
import { sanitizeRichText } from '../../lib/rich-text';
import { Conflict, Forbidden, HttpError, NotFound, ValidationError } from '../../lib/errors';
import type { RealtimeHub } from '../../lib/realtime';
import { PlantUnit } from '../plant/model';
import { shiftChangeAt } from '../shifts/crews';
import { User } from '../users/model';
import { syncAutomaticItems } from './auto-items';
import type { Notices } from './notices';
import { remainingTime } from '../../../shared/conditions';
import { Flag } from '../flags/model';
import { Condition } from '../conditions/model';
import { freezeCondenserState } from '../shift-condenser/snapshot';
import { Handover, HandoverAck, HandoverAmendment, HandoverAttachment, HandoverItem, HandoverQuery } from './model';

type Actor = Express.User;
const crewRoles = ['trainee', 'operator', 'shift_lead'];

const isOutgoing = (actor: Actor, h: Handover) => h.outgoingCrewId !== null && actor.crewId === h.outgoingCrewId && crewRoles.includes(actor.role);
const isIncoming = (actor: Actor, h: Handover) => h.incomingCrewId !== null && actor.crewId === h.incomingCrewId && crewRoles.includes(actor.role);

function requireWriter(actor: Actor, h: Handover) {
  if (!isOutgoing(actor, h) || actor.role === 'trainee') throw new Forbidden('Only the outgoing crew’s operators and shift lead write this handover');
  if (h.status !== 'draft') throw new Conflict('This handover is submitted: add an amendment instead of editing it');
}

async function handoverOfItem(itemId: number) {
  // One round trip: this sits on the acknowledgement path every open board waits on.
  const handover = await Handover.findOne({ where: { id: { [Op.eq]: sequelizeLiteral(`(SELECT handover_id FROM handover_items WHERE id = ${Number(itemId)})`) } } });
  if (!handover) throw new NotFound('That handover item');
  return { handover };
}

export function makeHandoverService(sequelize: Sequelize, realtime: RealtimeHub, notices: Notices) {
  const changed = (h: Handover) => realtime.toUnit(h.unitId, { entity: 'handover', id: h.id });

  /** The shift change in progress and its handover; created as a draft when an outgoing writer opens it. */
  async function current(actor: Actor, unitId: number): Promise<{ change: Awaited<ReturnType<typeof shiftChangeAt>>; handover: Handover | null }> {
    const unit = await PlantUnit.findByPk(unitId);
    if (!unit) throw new NotFound('That unit');
    const change = await shiftChangeAt(unit.stationId);
    const existing = await Handover.findOne({ where: { unitId, shiftStart: change.shiftStart } });
    if (existing) {
      if (existing.status === 'draft') await sequelize.transaction((t) => syncAutomaticItems(existing, actor.id, t));
      return { change, handover: existing };
    }
    const mayStart = change.outgoingCrewId !== null && actor.crewId === change.outgoingCrewId && ['operator', 'shift_lead'].includes(actor.role);
    if (!mayStart) return { change, handover: null };
    const created = await sequelize.transaction(async (transaction) => {
      const h = await Handover.create(
        {
          unitId,
          shiftStart: change.shiftStart,
          handoverAt: change.handoverAt,
          outgoingCrewId: change.outgoingCrewId,
          incomingCrewId: change.incomingCrewId,
          notesHtml: '',
          status: 'draft',
          createdBy: actor.id,
          createdAt: new Date(),
          submittedBy: null,
          submittedAt: null,
          acceptedBy: null,
          acceptedAt: null,
        },
        { transaction },
      );
      await syncAutomaticItems(h, actor.id, transaction);
      return h;
    });
    changed(created);
    return { change, handover: created };
  }

  /** Saves the draft notes under a version check; a stale save gets 409 with the stored text. */
  async function saveNotes(actor: Actor, id: number, input: { html: string; version: number }) {
    const h = await Handover.findByPk(id);
    if (!h) throw new NotFound('That handover');
    requireWriter(actor, h);
    const [updated] = await Handover.update({ notesHtml: sanitizeRichText(input.html), notesVersion: input.version + 1 }, { where: { id, notesVersion: input.version, status: 'draft' } });
    if (!updated) {
      const stored = await Handover.findByPk(id);
      throw new HttpError(409, 'NOTES_CONFLICT', 'Someone else saved these notes first. Your text is kept below theirs; merge the two and save again.', {
        storedVersion: String(stored!.notesVersion),
      });
    }
    changed(h);
    return { version: input.version + 1 };
  }

  async function addItem(actor: Actor, id: number, input: { kind: string; title: string; detail?: string | null; reference?: string | null; priority: 'low' | 'normal' | 'high' }) {
    const h = await Handover.findByPk(id);
    if (!h) throw new NotFound('That handover');
    requireWriter(actor, h);
    const item = await HandoverItem.create({
      handoverId: id,
      kind: input.kind as HandoverItem['kind'],
      title: input.title,
      detail: input.detail ?? null,
      reference: input.reference ?? null,
      priority: input.priority,
      sourceId: null,
      createdBy: actor.id,
      createdAt: new Date(),
    });
    changed(h);
    return item;
  }

  async function submit(actor: Actor, id: number) {
    const h = await Handover.findByPk(id);
    if (!h) throw new NotFound('That handover');
    requireWriter(actor, h);
    await sequelize.transaction(async (transaction) => {
      await syncAutomaticItems(h, actor.id, transaction);
      const submittedAt = new Date();
      const condenserSnapshot = await freezeCondenserState(sequelize, h, submittedAt, transaction);
      const [updated] = await Handover.update({ status: 'submitted', submittedBy: actor.id, submittedAt, condenserSnapshot }, { where: { id, status: 'draft' }, transaction });
      if (!updated) throw new Conflict('This handover was submitted already');
      await recordAudit({ actorId: actor.id, action: 'handover.submit', entity: 'handover', entityId: id }, transaction);
    });
    changed(h);
    // After the commit; a mail failure must not undo the submit.
    notices.handoverSubmitted(id).catch((error: unknown) => console.error('[mail] submit notice failed', error));
  }

  async function amend(actor: Actor, id: number, input: { itemId?: number | null; reason: string; text: string }) {
    const h = await Handover.findByPk(id);
    if (!h) throw new NotFound('That handover');
    if (h.status === 'draft') throw new Conflict('A draft is edited, not amended');
    if (!isOutgoing(actor, h) || actor.role === 'trainee') throw new Forbidden('Only the outgoing crew amends its handover');
    if (input.itemId && !(await HandoverItem.findOne({ where: { id: input.itemId, handoverId: id } }))) throw new ValidationError({ itemId: 'Not an item of this handover' });
    const amendment = await HandoverAmendment.create({ handoverId: id, itemId: input.itemId ?? null, authorId: actor.id, amendedAt: new Date(), reason: input.reason, text: input.text });
    changed(h);
    return amendment;
  }

  async function acknowledge(actor: Actor, itemId: number) {
    // The insert carries its own rules (submitted, the actor's crew incoming), so an acceptance
    // landing in between cannot slip an acknowledgement in; the lookup runs beside it rather than
    // before it, for the room to notify and for the reason when nothing was inserted.
    const [{ handover }, inserted] = await Promise.all([
      handoverOfItem(itemId),
      crewRoles.includes(actor.role) && actor.crewId !== null ? insertAcknowledgement(actor, itemId) : Promise.resolve(0),
    ]);
    if (!inserted) {
      if (!isIncoming(actor, handover)) throw new Forbidden('Only the incoming crew acknowledges handover items');
      throw new Conflict(handover.status === 'draft' ? 'The handover is not submitted yet' : 'The handover is already accepted');
    }
    changed(handover);
  }

  async function insertAcknowledgement(actor: Actor, itemId: number): Promise<number> {
    try {
      const [, affected] = await sequelize.query(
        `INSERT INTO handover_acks (item_id, user_id, acknowledged_at)
         SELECT i.id, ?, ? FROM handover_items i JOIN handovers h ON h.id = i.handover_id
         WHERE i.id = ? AND h.status = 'submitted' AND h.incoming_crew_id = ?`,
        { replacements: [actor.id, new Date(), itemId, actor.crewId], type: QueryTypes.INSERT },
      );
      return Number(affected);
    } catch (error) {
      // The primary key (item, person) is the check: one acknowledgement each.
      if (error instanceof UniqueConstraintError) throw new Conflict('You have acknowledged this item already');
      throw error;
    }
  }

  async function ask(actor: Actor, itemId: number, question: string) {
    const { handover } = await handoverOfItem(itemId);
    if (!isIncoming(actor, handover)) throw new Forbidden('Only the incoming crew queries handover items');
    if (handover.status !== 'submitted') throw new Conflict('Questions are asked on a submitted handover');
    const query = await HandoverQuery.create({ itemId, askedBy: actor.id, askedAt: new Date(), question, answeredBy: null, answeredAt: null, answer: null });
    changed(handover);
    return query;
  }

  async function answer(actor: Actor, queryId: number, text: string) {
    const query = await HandoverQuery.findByPk(queryId);
    if (!query) throw new NotFound('That question');
    const { handover } = await handoverOfItem(query.itemId);
    if (!isOutgoing(actor, handover)) throw new Forbidden('The outgoing crew answers questions on its handover');
    if (query.answeredAt) throw new Conflict('This question is answered already');
    await query.update({ answer: text, answeredBy: actor.id, answeredAt: new Date() });
    changed(handover);
  }

  /** Turnover: the incoming shift lead accepts when every item is acknowledged by the whole incoming crew and no question is open. */
  async function accept(actor: Actor, id: number) {
    const h = await Handover.findByPk(id);
    if (!h) throw new NotFound('That handover');
    if (!isIncoming(actor, h) || actor.role !== 'shift_lead') throw new Forbidden('Only the incoming shift lead accepts the handover');
    if (h.status !== 'submitted') throw new Conflict(h.status === 'draft' ? 'The handover is not submitted yet' : 'The handover is already accepted');
    const view = await viewHandover(id);
    if (view.waiting.length) {
      throw new HttpError(409, 'NOT_READY', `Not every item is acknowledged by the incoming crew or some questions are open (${view.waiting.join('; ')})`);
    }
    await sequelize.transaction(async (transaction) => {
      const [updated] = await Handover.update({ status: 'accepted', acceptedBy: actor.id, acceptedAt: new Date() }, { where: { id, status: 'submitted' }, transaction });
      if (!updated) throw new Conflict('The handover changed meanwhile; reload');
      await recordAudit({ actorId: actor.id, action: 'handover.accept', entity: 'handover', entityId: id }, transaction);
    });
    changed(h);
  }

  return { current, saveNotes, addItem, submit, amend, acknowledge, ask, answer, accept };
}
export type HandoverService = ReturnType<typeof makeHandoverService>;

/** The board: handover, items with who acknowledged them, questions, amendments and what still waits. */
export async function viewHandover(id: number) {
  const h = await Handover.findByPk(id);
  if (!h) throw new NotFound('That handover');
  const items = await HandoverItem.findAll({ where: { handoverId: id }, order: [['id', 'ASC']] });
  const itemIds = items.map((i) => i.id);
  const [acks, queries, amendments, incomingCrew, attachments] = await Promise.all([
    itemIds.length ? HandoverAck.findAll({ where: { itemId: itemIds } }) : [],
    itemIds.length ? HandoverQuery.findAll({ where: { itemId: itemIds }, order: [['id', 'ASC']] }) : [],
    HandoverAmendment.findAll({ where: { handoverId: id }, order: [['id', 'ASC']] }),
    h.incomingCrewId ? User.findAll({ where: { crewId: h.incomingCrewId, active: true, role: crewRoles }, attributes: ['id', 'name', 'role'] }) : [],
    itemIds.length ? HandoverAttachment.findAll({ where: { itemId: itemIds }, order: [['id', 'ASC']] }) : [],
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
  const ids = new Set<number>([h.createdBy, ...[h.submittedBy, h.acceptedBy].filter((x): x is number => x !== null), ...acks.map((a) => a.userId), ...queries.flatMap((q) => [q.askedBy, ...(q.answeredBy ? [q.answeredBy] : [])]), ...amendments.map((a) => a.authorId)]);
  const names = new Map((await User.findAll({ where: { id: [...ids] }, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]));
  const name = (uid: number | null) => (uid ? (names.get(uid) ?? `#${uid}`) : null);
  const waiting: string[] = [];
  const shownItems = items.map((item) => {
    const itemAcks = acks.filter((a) => a.itemId === item.id);
    const missing = incomingCrew.filter((p) => !itemAcks.some((a) => a.userId === p.id)).map((p) => p.name);
    const itemQueries = queries.filter((q) => q.itemId === item.id);
    if (missing.length) waiting.push(`“${item.title.slice(0, 40)}” awaits ${missing.join(', ')}`);
    if (itemQueries.some((q) => !q.answeredAt)) waiting.push(`“${item.title.slice(0, 40)}” has an open question`);
    return {
      id: item.id,
      kind: item.kind,
      title: item.title,
      detail: item.detail,
      reference: item.reference,
      priority: item.priority,
      sourceId: item.sourceId,
      live: liveState(item),
      attachments: attachments.filter((a) => a.itemId === item.id).map((a) => ({ id: a.id, fileName: a.fileName, mime: a.mime, size: a.size })),
      acknowledgedBy: itemAcks.map((a) => ({ userId: a.userId, name: name(a.userId), at: a.acknowledgedAt.toISOString() })),
      awaiting: missing,
      queries: itemQueries.map((q) => ({ id: q.id, question: q.question, askedBy: name(q.askedBy), askedAt: q.askedAt.toISOString(), answer: q.answer, answeredBy: name(q.answeredBy), answeredAt: q.answeredAt?.toISOString() ?? null })),
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
