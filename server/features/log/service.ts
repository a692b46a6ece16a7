// The narrative log: append-only entries, amendments beside them, late-entry marking by server
// time, and the shift lead's end-of-shift review.
import { QueryTypes, UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import { recentShiftStarts, shiftStartFor, stationLocalLabel } from '../../../shared/shift-time';
import type { NewLogEntry } from '../../../shared/schemas/log';
import { arrivedLate, enteredAtProblem } from '../../../shared/schemas/offline-record';
import { Conflict, Forbidden, NotFound, ValidationError } from '../../lib/errors';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { coalesced } from '../../lib/coalesce';
import { recordAudit } from '../../lib/audit';
import { mayAmendLogEntry, whyNotAmendLogEntry, type LogActor } from '../../../shared/policies/log';
import { findEquipment, findUnit } from '../plant/index';
import { findRound } from '../readings/index';
import { findFlag } from '../flags/index';
import { namesOf } from '../users/index';
import { crewsOnShifts } from '../shifts/index';
import { requireKnown, settingsForUnit, stationShiftSetup } from '../stations/index';
import { LogAmendment, LogEntry, LogReview } from './model';

const FUTURE_TOLERANCE_MS = 2 * 60 * 1000;
const OLDEST_LATE_ENTRY_MS = 31 * 86_400_000;

type Actor = LogActor;

/** The crew that worked each of these shifts at the station (one-off swaps first, then the rotation), by shift start. */
async function crewsOfShifts(stationId: number, shiftStarts: Date[]): Promise<Map<number, number | null>> {
  const starts = [...new Set(shiftStarts.map((s) => s.getTime()))].map((t) => new Date(t));
  if (starts.length === 0) return new Map();
  const { settings, rotation } = await stationShiftSetup(stationId);
  const crews = await crewsOnShifts(starts.map((shiftStart) => ({ stationId, shiftStart, rotation, changesPerDay: settings.shiftChangeTimes.length })));
  return new Map(starts.map((s, i) => [s.getTime(), crews[i] ?? null]));
}

async function checkLinks(unitId: number, input: NewLogEntry) {
  const fields: Record<string, string> = {};
  if (input.equipmentId) {
    const e = await findEquipment(input.equipmentId);
    if (!e || e.unitId !== unitId) fields.equipmentId = 'No such equipment on this unit';
  }
  if (input.readingSetId) {
    const r = await findRound(input.readingSetId);
    if (!r || r.unitId !== unitId) fields.readingSetId = 'No such reading set on this unit';
  }
  if (input.flagId) {
    const f = await findFlag(input.flagId);
    if (!f || f.unitId !== unitId) fields.flagId = 'No such flag on this unit';
  }
  if (Object.keys(fields).length) throw new ValidationError(fields);
}

/** The entry this person already sent with this device id; null when none. */
async function storedBefore(actor: Actor, unitId: number, clientId: string | undefined, transaction?: Transaction) {
  if (!clientId) return null;
  const found = await LogEntry.findOne({ where: { authorId: actor.id, clientId }, transaction, ...(transaction ? { lock: transaction.LOCK.SHARE } : {}) });
  if (found && found.unitId !== unitId) throw new Conflict('This device already sent a log entry with that id for another unit');
  return found;
}

export function makeLogService(sequelize: Sequelize) {
  /**
   * Writes one entry; inside `extra.transaction` when it is part of a larger unit of work (closing a
   * condition). A retry with the same `clientId` answers with the entry stored the first time (`repeated`).
   */
  async function addEntry(actor: Actor, unitId: number, input: NewLogEntry, extra: { conditionId?: number; transaction?: Transaction } = {}): Promise<{ entry: LogEntry; repeated: boolean }> {
    if (extra.transaction) return { entry: await writeEntry(actor, unitId, input, extra.conditionId ?? null, extra.transaction), repeated: false };
    // A retry of an entry already stored is answered from it, even if it would be refused today.
    const before = await storedBefore(actor, unitId, input.clientId);
    if (before) return { entry: before, repeated: true };
    return unitOfWork(
      sequelize,
      async (transaction) => {
        try {
          return { entry: await writeEntry(actor, unitId, input, null, transaction), repeated: false };
        } catch (error) {
          // Two sends of one entry at once: the unique (author, client id) lets one in; the other
          // waited on it and answers with its row (a locking read sees the committed row).
          if (error instanceof UniqueConstraintError && input.clientId) {
            const again = await storedBefore(actor, unitId, input.clientId, transaction);
            if (again) return { entry: again, repeated: true };
          }
          throw error;
        }
      },
      'log entry',
    );
  }

  async function writeEntry(actor: Actor, unitId: number, input: NewLogEntry, conditionId: number | null, transaction: Transaction) {
    const { settings } = await settingsForUnit(unitId);
    requireKnown(settings, input);
    await checkLinks(unitId, input);
    const receivedAt = new Date();
    // Entry time is the server's, whatever clock the client has, except for an entry kept on a
    // device while offline: then it is when it was written there, within the bounds
    // enteredAtProblem sets. The event time is the person's.
    const deviceEnteredAt = input.enteredAt ? new Date(input.enteredAt) : null;
    const problem = deviceEnteredAt ? enteredAtProblem(deviceEnteredAt, receivedAt) : null;
    if (problem) throw new ValidationError({ enteredAt: problem });
    const enteredAt = deviceEnteredAt && deviceEnteredAt < receivedAt ? deviceEnteredAt : receivedAt;
    const eventAt = input.eventAt ? new Date(input.eventAt) : enteredAt;
    if (eventAt.getTime() > enteredAt.getTime() + FUTURE_TOLERANCE_MS) throw new ValidationError({ eventAt: 'An event cannot be in the future' });
    if (enteredAt.getTime() - eventAt.getTime() > OLDEST_LATE_ENTRY_MS) throw new ValidationError({ eventAt: 'More than 31 days ago: ask the shift lead to record it as a communication' });
    // The entry and its search document (index hooks) commit together or not at all.
    const entry = await LogEntry.create({
      unitId,
      position: input.position,
      category: input.category,
      eventAt,
      enteredAt,
      receivedAt,
      shiftStart: shiftStartFor(eventAt, settings.timeZone, settings.shiftChangeTimes),
      late: enteredAt.getTime() - eventAt.getTime() > settings.lateEntryMinutes * 60_000,
      arrivedLate: arrivedLate(enteredAt, receivedAt, settings.lateEntryMinutes),
      clientId: input.clientId ?? null,
      authorId: actor.id,
      writtenAsTrainee: actor.role === 'trainee',
      text: input.text,
      equipmentId: input.equipmentId ?? null,
      readingSetId: input.readingSetId ?? null,
      flagId: input.flagId ?? null,
      conditionId,
      carryToHandover: input.carryToHandover,
    }, { transaction });
    publish(transaction, { entity: 'log_entry', id: entry.id, unitId });
    return entry;
  }

  async function amend(actor: Actor, entryId: number, input: { reason: string; text: string }) {
    const entry = await LogEntry.findByPk(entryId);
    if (!entry) throw new NotFound('That log entry');
    const unit = await findUnit(entry.unitId);
    const crewOnShift = unit ? ((await crewsOfShifts(unit.stationId, [entry.shiftStart])).get(entry.shiftStart.getTime()) ?? null) : null;
    if (!mayAmendLogEntry(actor, { authorId: entry.authorId, crewOnShift })) throw new Forbidden(whyNotAmendLogEntry(actor));
    return unitOfWork(sequelize, async (transaction) => {
      const created = await LogAmendment.create({ entryId, authorId: actor.id, amendedAt: new Date(), reason: input.reason, text: input.text }, { transaction });
      await recordAudit({ actorId: actor.id, action: 'log.amend', entity: 'log_entry', entityId: entryId, after: { reason: input.reason } }, transaction);
      publish(transaction, { entity: 'log_entry', id: entryId, unitId: entry.unitId });
      return created;
    });
  }

  async function signReview(actor: Actor, unitId: number, position: string, shiftStartText: string) {
    const { settings } = await settingsForUnit(unitId);
    requireKnown(settings, { position });
    const shiftStart = new Date(shiftStartText);
    if (shiftStartFor(shiftStart, settings.timeZone, settings.shiftChangeTimes).getTime() !== shiftStart.getTime()) {
      throw new ValidationError({ shiftStart: 'Not the start of a shift at this station' });
    }
    if (shiftStart.getTime() > Date.now()) throw new ValidationError({ shiftStart: 'That shift has not started' });
    const existing = await LogReview.findOne({ where: { unitId, position, shiftStart } });
    if (existing) throw new Conflict('This shift’s log for that position is already signed as reviewed');
    return unitOfWork(sequelize, async (transaction) => {
      const review = await LogReview.create({ unitId, position, shiftStart, reviewedBy: actor.id, reviewedAt: new Date() }, { transaction });
      await recordAudit({ actorId: actor.id, action: 'log.review', entity: 'log_review', entityId: review.id, after: { unitId, position, shiftStart } }, transaction);
      publish(transaction, { entity: 'log_review', id: review.id, unitId });
      return review;
    });
  }

  return { addEntry, amend, signReview };
}
export type LogService = ReturnType<typeof makeLogService>;

type LogQuery = { position?: string; category?: string; authorId?: number; shiftStart?: string; limit: number; before?: number };

type LogEntryRow = Pick<
  LogEntry,
  | 'id' | 'unitId' | 'position' | 'category' | 'eventAt' | 'enteredAt' | 'receivedAt' | 'shiftStart' | 'late' | 'arrivedLate' | 'clientId' | 'authorId'
  | 'writtenAsTrainee' | 'text' | 'equipmentId' | 'readingSetId' | 'flagId' | 'conditionId' | 'carryToHandover'
>;

/**
 * The page's entries as plain rows: the busiest read of the log page (fifty rows each time the page
 * asks again after a live event), where building a model instance per row was most of its cost.
 */
async function entryRows(unitId: number, q: LogQuery): Promise<LogEntryRow[]> {
  const filters: [string, unknown][] = [['unit_id = ?', unitId]];
  if (q.position) filters.push(['position = ?', q.position]);
  if (q.category) filters.push(['category = ?', q.category]);
  if (q.authorId) filters.push(['author_id = ?', q.authorId]);
  if (q.shiftStart) filters.push(['shift_start = ?', new Date(q.shiftStart)]);
  if (q.before) filters.push(['id < ?', q.before]);
  const where = filters.map(([condition]) => condition);
  const values = filters.map(([, value]) => value);
  type Raw = Omit<LogEntryRow, 'late' | 'arrivedLate' | 'writtenAsTrainee' | 'carryToHandover'> & { late: number; arrivedLate: number; writtenAsTrainee: number; carryToHandover: number };
  const rows = await LogEntry.sequelize!.query<Raw>(
    `SELECT id, unit_id AS unitId, position, category, event_at AS eventAt, entered_at AS enteredAt, received_at AS receivedAt, shift_start AS shiftStart,
       late, arrived_late AS arrivedLate, client_id AS clientId, author_id AS authorId, written_as_trainee AS writtenAsTrainee, text,
       equipment_id AS equipmentId, reading_set_id AS readingSetId, flag_id AS flagId, condition_id AS conditionId, carry_to_handover AS carryToHandover
     FROM log_entries WHERE ${where.join(' AND ')} ORDER BY event_at DESC, id DESC LIMIT ?`,
    { replacements: [...values, q.limit], type: QueryTypes.SELECT },
  );
  const id = (v: unknown) => (v === null ? null : Number(v));
  return rows.map((r) => ({
    ...r,
    id: Number(r.id),
    readingSetId: id(r.readingSetId),
    late: Boolean(r.late),
    arrivedLate: Boolean(r.arrivedLate),
    writtenAsTrainee: Boolean(r.writtenAsTrainee),
    carryToHandover: Boolean(r.carryToHandover),
  }));
}

/** One page of a unit's entries with everything beside them; the same for every viewer, so shared by requests asked at once. */
const entriesPage = coalesced(
  async ({ unitId, q }: { unitId: number; q: LogQuery }) => {
    // 404 for an unknown unit before anything is read.
    await settingsForUnit(unitId);
    const entries = await entryRows(unitId, q);
    const ids = entries.map((e) => e.id);
    const amendments = ids.length ? await LogAmendment.findAll({ where: { entryId: ids }, order: [['id', 'ASC']] }) : [];
    const shifts = [...new Set(entries.map((e) => e.shiftStart.getTime()))].map((t) => new Date(t));
    const reviews = shifts.length ? await LogReview.findAll({ where: { unitId, shiftStart: shifts } }) : [];
    const people = new Map(
      await namesOf([...entries.map((e) => e.authorId), ...amendments.map((a) => a.authorId), ...reviews.map((r) => r.reviewedBy)]),
    );
    const unit = await findUnit(unitId);
    const crews = unit ? await crewsOfShifts(unit.stationId, shifts) : new Map<number, number | null>();
    return { entries, amendments, reviews, people, crews };
  },
  ({ unitId, q }) => `${unitId}:${JSON.stringify([q.position, q.category, q.authorId, q.shiftStart, q.limit, q.before])}`,
);

/** Entries newest event first, each with its amendments, whether it came after the review and whether the viewer may amend it. */
export async function listEntries(unitId: number, q: LogQuery, viewer: LogActor) {
  const { entries, amendments, reviews, people, crews } = await entriesPage({ unitId, q });
  const reviewOf = (e: LogEntryRow) => reviews.find((r) => r.position === e.position && r.shiftStart.getTime() === e.shiftStart.getTime());
  return entries.map((e) => {
    const review = reviewOf(e);
    return {
      id: e.id,
      position: e.position,
      category: e.category,
      eventAt: e.eventAt.toISOString(),
      enteredAt: e.enteredAt.toISOString(),
      receivedAt: e.receivedAt.toISOString(),
      shiftStart: e.shiftStart.toISOString(),
      late: e.late,
      arrivedLate: e.arrivedLate,
      clientId: e.clientId,
      author: people.get(e.authorId) ?? `#${e.authorId}`,
      authorId: e.authorId,
      writtenAsTrainee: e.writtenAsTrainee,
      mayAmend: mayAmendLogEntry(viewer, { authorId: e.authorId, crewOnShift: crews.get(e.shiftStart.getTime()) ?? null }),
      text: e.text,
      equipmentId: e.equipmentId,
      readingSetId: e.readingSetId,
      flagId: e.flagId,
      conditionId: e.conditionId,
      carryToHandover: e.carryToHandover,
      // By arrival: an entry written offline before the review but received after it was not seen by the reviewer.
      enteredAfterReview: review ? e.receivedAt > review.reviewedAt : false,
      amendments: amendments
        .filter((a) => a.entryId === e.id)
        .map((a) => ({
          id: a.id,
          author: people.get(a.authorId) ?? `#${a.authorId}`,
          amendedAt: a.amendedAt.toISOString(),
          reason: a.reason,
          text: a.text,
          afterReview: review ? a.amendedAt > review.reviewedAt : false,
        })),
    };
  });
}

/** The station's settings and the unit's last 14 shifts with who signed each position's review. */
export async function recentShiftsWithReviews(unitId: number) {
  const { settings } = await settingsForUnit(unitId);
  const starts = recentShiftStarts(new Date(), settings.timeZone, settings.shiftChangeTimes, 14);
  return {
    settings,
    shifts: starts.map((s) => ({ start: s.toISOString(), label: stationLocalLabel(s, settings.timeZone) })),
    reviews: await reviewsFor(unitId, starts),
  };
}

export async function reviewsFor(unitId: number, shiftStarts: Date[]) {
  const reviews = await LogReview.findAll({ where: { unitId, shiftStart: shiftStarts } });
  const people = await namesOf(reviews.map((r) => r.reviewedBy));
  return reviews.map((r) => ({ position: r.position, shiftStart: r.shiftStart.toISOString(), by: people.get(r.reviewedBy) ?? `#${r.reviewedBy}`, at: r.reviewedAt.toISOString() }));
}
