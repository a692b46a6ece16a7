// Shift handover: the outgoing crew starts the draft, writes notes and items and submits; the
// incoming crew acknowledges each item or queries it; the incoming shift lead accepts, and that
// moment is the recorded turnover. Submit and acceptance happen within a window around the shift
// change. After submit nothing is edited: every change is an amendment, and an amended item must
// be acknowledged again. Every create carries the browser's key, so a double click makes one record.
import { Op, QueryTypes, UniqueConstraintError, literal, type Sequelize, type Transaction } from 'sequelize';
import { handoverWindow, mayAccept, mayAcknowledge, mayWriteHandover, withinWindow, type HandoverActor } from '../../../shared/policies/handover';
import { stationLocalLabel } from '../../../shared/shift-time';
import type { StationSettings } from '../../../shared/schemas/log';
import { recordAudit } from '../../lib/audit';
import { Conflict, Forbidden, HttpError, NotFound, ValidationError } from '../../lib/errors';
import { publish, publishCommitted } from '../../lib/live';
import { sanitizeRichText } from '../../lib/rich-text';
import { unitOfWork } from '../../lib/unit-of-work';
import { findUnit } from '../plant/index';
import { shiftChangeAt } from '../shifts/index';
import { settingsForStation } from '../stations/index';
import { syncAutomaticItems } from './auto-items';
import { Handover, HandoverAmendment, HandoverItem, HandoverQuery } from './model';
import type { Notices } from './notices';
import { viewHandover } from './view';
import { freezeCondenserState } from '../shift-condenser/index';

type Actor = Express.User;
const asActor = (user: Actor): HandoverActor => ({ id: user.id, role: user.role, crewId: user.crewId });

/** The station's window around a shift change for submit and acceptance (station settings). */
export const windowOf = (settings: StationSettings, handoverAt: Date) => handoverWindow(handoverAt, settings.handoverWindowBeforeMinutes, settings.handoverWindowAfterMinutes);

async function requireWindow(h: Handover, what: 'submitted' | 'accepted', now: Date) {
  const unit = await findUnit(h.unitId);
  const settings = await settingsForStation(unit!.stationId);
  const window = windowOf(settings, h.handoverAt);
  if (withinWindow(window, now)) return;
  const at = (d: Date) => `${stationLocalLabel(d, settings.timeZone)} (${settings.timeZone})`;
  throw new HttpError(
    409,
    'OUTSIDE_HANDOVER_WINDOW',
    now < window.opensAt
      ? `The handover can be ${what} from ${at(window.opensAt)}, ahead of the shift change at ${at(h.handoverAt)}. Keep writing until then.`
      : `The window for this shift change closed at ${at(window.closesAt)}; record what happened in the shift log and tell the shift lead.`,
  );
}

async function loadHandover(id: number, transaction?: Transaction, lock = false) {
  const h = await Handover.findByPk(id, { transaction, lock: lock && transaction ? transaction.LOCK.UPDATE : undefined });
  if (!h) throw new NotFound('That handover');
  return h;
}

function requireWriter(actor: Actor, h: Handover) {
  if (!mayWriteHandover(asActor(actor), h)) throw new Forbidden('Only the outgoing crew’s operators and shift lead write this handover');
}
function requireDraft(h: Handover) {
  if (h.status !== 'draft') throw new Conflict('This handover is submitted: add an amendment instead of editing it');
}

/**
 * Runs a unit of work that creates a row under a unique key (the shift change, the browser's key).
 * When a concurrent request made that row first, this one's work is rolled back whole and the row
 * already there is returned: read after the rollback, so it is the committed one.
 */
async function createOnce<T>(sequelize: Sequelize, work: (transaction: Transaction) => Promise<T>, existing: () => Promise<T | null>, label: string): Promise<T> {
  try {
    return await unitOfWork(sequelize, work, label);
  } catch (error) {
    if (!(error instanceof UniqueConstraintError)) throw error;
    const found = await existing();
    if (!found) throw error;
    return found;
  }
}

export function makeHandoverService(sequelize: Sequelize, notices: Notices) {
  const changed = (transaction: Transaction, h: Handover) => publish(transaction, { entity: 'handover', id: h.id, unitId: h.unitId });

  /** The shift change in progress and its handover, if started. Reads only. */
  async function current(actor: Actor, unitId: number) {
    const unit = await findUnit(unitId);
    if (!unit) throw new NotFound('That unit');
    const change = await shiftChangeAt(unit.stationId);
    const handover = await Handover.findOne({ where: { unitId, shiftStart: change.shiftStart } });
    const crews = { outgoingCrewId: change.outgoingCrewId, incomingCrewId: change.incomingCrewId };
    return { change, handover, mayStart: !handover && mayWriteHandover(asActor(actor), crews), window: windowOf(change.settings, change.handoverAt) };
  }

  /** Starts the draft for the shift change in progress (once: a second start returns the same draft). */
  async function start(actor: Actor, unitId: number) {
    const unit = await findUnit(unitId);
    if (!unit) throw new NotFound('That unit');
    const change = await shiftChangeAt(unit.stationId);
    if (!mayWriteHandover(asActor(actor), change)) throw new Forbidden('Only the outgoing crew’s operators and shift lead start this shift’s handover');
    const where = { unitId, shiftStart: change.shiftStart };
    return createOnce(
      sequelize,
      async (transaction) => {
        const h = await Handover.create(
              {
                ...where,
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
        await syncAutomaticItems(h, transaction);
        changed(transaction, h);
        return h;
      },
      () => Handover.findOne({ where }),
      'start handover',
    );
  }

  /** Saves the draft notes under a version check; a stale save gets 409 with the stored text. */
  async function saveNotes(actor: Actor, id: number, input: { html: string; version: number }) {
    const h = await loadHandover(id);
    requireWriter(actor, h);
    requireDraft(h);
    return unitOfWork(sequelize, async (transaction) => {
      const [updated] = await Handover.update(
        { notesHtml: sanitizeRichText(input.html), notesVersion: input.version + 1 },
        { where: { id, notesVersion: input.version, status: 'draft' }, transaction },
      );
      if (!updated) {
        const stored = await Handover.findByPk(id, { transaction });
        if (stored?.status !== 'draft') throw new Conflict('This handover was submitted meanwhile: add an amendment instead of editing it');
        throw new HttpError(409, 'NOTES_CONFLICT', 'Someone else saved these notes first. Your text stays in the editor and theirs is shown with it; merge the two and save again.', {
          storedVersion: String(stored.notesVersion),
        });
      }
      changed(transaction, h);
      return { version: input.version + 1 };
    });
  }

  async function addItem(actor: Actor, id: number, input: { kind: string; title: string; detail?: string | null; reference?: string | null; priority: 'low' | 'normal' | 'high'; clientKey?: string }) {
    const h = await loadHandover(id);
    requireWriter(actor, h);
    requireDraft(h);
    return createOnce(
      sequelize,
      async (transaction) => {
        const item = await HandoverItem.create(
            {
              handoverId: id,
              kind: input.kind as HandoverItem['kind'],
              title: input.title,
              detail: input.detail ?? null,
              reference: input.reference ?? null,
              priority: input.priority,
              sourceId: null,
              createdBy: actor.id,
              createdAt: new Date(),
              clientKey: input.clientKey ?? null,
            },
          { transaction },
        );
        changed(transaction, h);
        return item;
      },
      async () => (input.clientKey ? HandoverItem.findOne({ where: { handoverId: id, clientKey: input.clientKey } }) : null),
      'add handover item',
    );
  }

  /** Changes a draft item's words or priority; an automatic item keeps the title and priority of its source. */
  async function editItem(actor: Actor, itemId: number, input: { title?: string; detail?: string | null; priority?: 'low' | 'normal' | 'high'; version: number }) {
    const item = await HandoverItem.findByPk(itemId);
    if (!item || item.removedAt) throw new NotFound('That handover item');
    const h = await loadHandover(item.handoverId);
    requireWriter(actor, h);
    requireDraft(h);
    if (item.sourceId !== null && (input.title !== undefined || input.priority !== undefined)) {
      throw new ValidationError({ title: 'This item follows its flag, condition or order: only its detail can be changed here' });
    }
    return unitOfWork(sequelize, async (transaction) => {
      const changes = { ...(input.title !== undefined ? { title: input.title } : {}), ...(input.detail !== undefined ? { detail: input.detail } : {}), ...(input.priority ? { priority: input.priority } : {}) };
      const [updated] = await HandoverItem.update({ ...changes, version: input.version + 1 }, { where: { id: itemId, version: input.version, removedAt: null }, transaction });
      if (!updated) throw new Conflict('Someone else changed this item since you opened it; reload and try again');
      changed(transaction, h);
    });
  }

  /** Takes an item off the draft. The row stays (marked removed) so an automatic item is not attached again. */
  async function removeItem(actor: Actor, itemId: number) {
    const item = await HandoverItem.findByPk(itemId);
    if (!item) throw new NotFound('That handover item');
    const h = await loadHandover(item.handoverId);
    requireWriter(actor, h);
    requireDraft(h);
    if (item.removedAt) return;
    await unitOfWork(sequelize, async (transaction) => {
      await HandoverItem.update({ removedAt: new Date(), removedBy: actor.id }, { where: { id: itemId, removedAt: null }, transaction });
      await recordAudit({ actorId: actor.id, action: 'handover.item.remove', entity: 'handover_item', entityId: itemId, before: { title: item.title, kind: item.kind } }, transaction);
      changed(transaction, h);
    });
  }

  async function submit(actor: Actor, id: number, now = new Date()) {
    const first = await loadHandover(id);
    requireWriter(actor, first);
    // A second click on "Submit" finds the work done: that is not an error.
    if (first.status !== 'draft') return { alreadySubmitted: true };
    await requireWindow(first, 'submitted', now);
    const done = await unitOfWork(
      sequelize,
      async (transaction) => {
        const h = await loadHandover(id, transaction, true);
        if (h.status !== 'draft') return false;
        await syncAutomaticItems(h, transaction);
        // What the outgoing crew saw of the condenser, kept with the record as it stood at submit.
        const condenserSnapshot = await freezeCondenserState(sequelize, h, now, transaction);
        await h.update({ status: 'submitted', submittedBy: actor.id, submittedAt: now, condenserSnapshot }, { transaction });
        // The incoming crew's e-mail goes to the outbox with the submit: sent once it commits, never for a rollback.
        await notices.handoverSubmitted(id, transaction);
        await recordAudit({ actorId: actor.id, action: 'handover.submit', entity: 'handover', entityId: id }, transaction);
        changed(transaction, h);
        return true;
      },
      'submit handover',
    );
    return { alreadySubmitted: !done };
  }

  /** After submit every change is an amendment; one about an item moves the item on, so it needs acknowledging again. */
  async function amend(actor: Actor, id: number, input: { itemId?: number | null; reason: string; text: string; clientKey?: string }, transactionOf?: Transaction) {
    const h = await loadHandover(id, transactionOf);
    if (h.status === 'draft') throw new Conflict('A draft is edited, not amended');
    requireWriter(actor, h);
    const work = async (transaction: Transaction) => {
      if (input.itemId) {
        const item = await HandoverItem.findOne({ where: { id: input.itemId, handoverId: id, removedAt: null }, transaction });
        if (!item) throw new ValidationError({ itemId: 'Not an item of this handover' });
      }
      const amendment = await HandoverAmendment.create(
        { handoverId: id, itemId: input.itemId ?? null, authorId: actor.id, amendedAt: new Date(), reason: input.reason, text: input.text, clientKey: input.clientKey ?? null },
        { transaction },
      );
      if (input.itemId) {
        await sequelize.query('UPDATE handover_items SET version = version + 1, amended_at = ? WHERE id = ?', { replacements: [amendment.amendedAt, input.itemId], transaction });
      }
      await recordAudit({ actorId: actor.id, action: 'handover.amend', entity: 'handover', entityId: id, after: { amendmentId: amendment.id, itemId: input.itemId ?? null } }, transaction);
      changed(transaction, h);
      return amendment;
    };
    if (transactionOf) return work(transactionOf);
    return createOnce(sequelize, work, async () => (input.clientKey ? HandoverAmendment.findOne({ where: { authorId: actor.id, clientKey: input.clientKey } }) : null), 'amend handover');
  }

  async function acknowledge(actor: Actor, itemId: number) {
    // The insert carries its own rules (submitted, or an item amended after acceptance; the actor's
    // crew incoming), so an acceptance landing in between cannot slip an acknowledgement in. The
    // lookup runs beside it, for the room to notify and for the reason when nothing was inserted.
    const [h, inserted] = await Promise.all([handoverOfItem(itemId), actor.crewId !== null ? insertAcknowledgement(actor, itemId) : Promise.resolve(0)]);
    if (inserted === -1) return { already: true };
    if (!inserted) {
      if (!mayAcknowledge(asActor(actor), h)) throw new Forbidden('Only the incoming crew acknowledges handover items');
      throw new Conflict(h.status === 'draft' ? 'The handover is not submitted yet' : 'The handover is already accepted');
    }
    // The insert committed on its own (one statement), so it is told at once.
    publishCommitted(sequelize, { entity: 'handover', id: h.id, unitId: h.unitId });
    return { already: false };
  }

  async function insertAcknowledgement(actor: Actor, itemId: number): Promise<number> {
    if (!mayAcknowledge(asActor(actor), { outgoingCrewId: null, incomingCrewId: actor.crewId })) return 0;
    try {
      const [, affected] = await sequelize.query(
        `INSERT INTO handover_acks (item_id, user_id, item_version, acknowledged_at)
         SELECT i.id, ?, i.version, ? FROM handover_items i JOIN handovers h ON h.id = i.handover_id
         WHERE i.id = ? AND i.removed_at IS NULL AND h.incoming_crew_id = ?
           AND (h.status = 'submitted' OR (h.status = 'accepted' AND i.amended_at > h.accepted_at))`,
        { replacements: [actor.id, new Date(), itemId, actor.crewId], type: QueryTypes.INSERT },
      );
      return Number(affected);
    } catch (error) {
      // The primary key (item, person, version) is the check: one acknowledgement each per version.
      // Acknowledging again what one has acknowledged (a double click) changes nothing and is no error.
      if (error instanceof UniqueConstraintError) return -1;
      throw error;
    }
  }

  async function ask(actor: Actor, itemId: number, input: { question: string; clientKey?: string }) {
    const h = await handoverOfItem(itemId);
    if (!mayAcknowledge(asActor(actor), h)) throw new Forbidden('Only the incoming crew queries handover items');
    return unitOfWork(sequelize, async (transaction) => {
      if (input.clientKey) {
        const again = await HandoverQuery.findOne({ where: { askedBy: actor.id, clientKey: input.clientKey }, transaction });
        if (again) return again;
      }
      // Guarded in SQL like the acknowledgement: only while the handover is submitted and not yet
      // accepted. The read locks the handover row against an acceptance running at the same time.
      const [, affected] = await sequelize.query(
        `INSERT INTO handover_queries (item_id, asked_by, asked_at, question, client_key)
         SELECT i.id, ?, ?, ?, ? FROM handover_items i JOIN handovers h ON h.id = i.handover_id
         WHERE i.id = ? AND i.removed_at IS NULL AND h.status = 'submitted'`,
        { replacements: [actor.id, new Date(), input.question, input.clientKey ?? null, itemId], type: QueryTypes.INSERT, transaction },
      );
      if (!Number(affected)) throw new Conflict(h.status === 'draft' ? 'Questions are asked on a submitted handover' : 'The handover is already accepted; talk to the outgoing shift lead');
      const query = await HandoverQuery.findOne({ where: { itemId, askedBy: actor.id }, order: [['id', 'DESC']], transaction });
      changed(transaction, h);
      return query!;
    });
  }

  async function answer(actor: Actor, queryId: number, text: string) {
    const query = await HandoverQuery.findByPk(queryId);
    if (!query) throw new NotFound('That question');
    const h = await handoverOfItem(query.itemId);
    if (!mayWriteHandover(asActor(actor), h)) throw new Forbidden('The outgoing crew’s operators and shift lead answer questions on its handover');
    // The same person sending the same answer twice (a double click) finds it done.
    if (query.answeredAt && query.answeredBy === actor.id && query.answer === text) return;
    await unitOfWork(sequelize, async (transaction) => {
      const [updated] = await HandoverQuery.update({ answer: text, answeredBy: actor.id, answeredAt: new Date() }, { where: { id: queryId, answeredAt: null }, transaction });
      if (!updated) throw new Conflict('This question is answered already');
      changed(transaction, h);
    });
  }

  /**
   * Turnover: the incoming shift lead accepts when every item is acknowledged, at its current
   * version, by the whole incoming crew and no question is open. The UPDATE re-checks all of it in
   * SQL, so a question asked or an item amended at the same moment cannot slip past.
   */
  async function accept(actor: Actor, id: number, now = new Date()) {
    const h = await loadHandover(id);
    if (!mayAccept(asActor(actor), h)) throw new Forbidden('Only the incoming shift lead accepts the handover');
    if (h.status === 'accepted') return { alreadyAccepted: true };
    if (h.status !== 'submitted') throw new Conflict('The handover is not submitted yet');
    await requireWindow(h, 'accepted', now);
    const accepted = await unitOfWork(
      sequelize,
      async (transaction) => {
        const [, affected] = await sequelize.query(
          `UPDATE handovers h SET h.status = 'accepted', h.accepted_by = ?, h.accepted_at = ?
           WHERE h.id = ? AND h.status = 'submitted'
             AND NOT EXISTS (SELECT 1 FROM handover_queries q JOIN handover_items i ON i.id = q.item_id
                             WHERE i.handover_id = h.id AND i.removed_at IS NULL AND q.answered_at IS NULL)
             AND NOT EXISTS (SELECT 1 FROM handover_items i JOIN users u ON u.crew_id = h.incoming_crew_id AND u.active = 1 AND u.role IN ('trainee', 'operator', 'shift_lead')
                             WHERE i.handover_id = h.id AND i.removed_at IS NULL
                               AND NOT EXISTS (SELECT 1 FROM handover_acks a WHERE a.item_id = i.id AND a.user_id = u.id AND a.item_version = i.version))`,
          { replacements: [actor.id, now, id], type: QueryTypes.UPDATE, transaction },
        );
        if (!Number(affected)) return false;
        await recordAudit({ actorId: actor.id, action: 'handover.accept', entity: 'handover', entityId: id }, transaction);
        changed(transaction, h);
        return true;
      },
      'accept handover',
    );
    if (!accepted) {
      const view = await viewHandover(id);
      if (view.handover.status === 'accepted') return { alreadyAccepted: true };
      throw new HttpError(409, 'NOT_READY', `Not every item is acknowledged by the incoming crew or some questions are open (${view.waiting.join('; ')})`);
    }
    return { alreadyAccepted: false };
  }

  return { current, start, saveNotes, addItem, editItem, removeItem, submit, amend, acknowledge, ask, answer, accept };
}
export type HandoverService = ReturnType<typeof makeHandoverService>;

async function handoverOfItem(itemId: number) {
  // One round trip: this sits on the acknowledgement path every open board waits on.
  const handover = await Handover.findOne({
    where: { id: { [Op.eq]: literal(`(SELECT handover_id FROM handover_items WHERE id = ${Number(itemId)})`) } },
    // The notes and the frozen condenser state are large and not needed to check who may act.
    attributes: { exclude: ['notesHtml', 'condenserSnapshot'] },
  });
  if (!handover) throw new NotFound('That handover item');
  return handover;
}
