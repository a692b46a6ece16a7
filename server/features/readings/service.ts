// Rounds: record a reading set, correct it by amendment, countersign a trainee's round.
import { Op, UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import type { Evaluation, ReadingSetSi } from '../../../shared/calc/evaluate';
import type { PlausibleKey } from '../../../shared/calc/plausibility';
import { describeImplausible, noticesByField } from '../../../shared/plausibility-display';
import type { ReadingSetInput } from '../../../shared/schemas/reading-set';
import type { AmendReadingInput, RecordReadingInput } from '../../../shared/schemas/readings';
import { arrivedLate, enteredAtProblem } from '../../../shared/schemas/offline-record';
import { recordAudit } from '../../lib/audit';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { ConfirmationRequired, Conflict, Forbidden, NotFound, ValidationError } from '../../lib/errors';
import { convertReadingSet } from '../../lib/convert-readings';
import { refreshAutomaticFlags, takeFlagTurn } from '../flags/index';
import { requireUnit, unjudgedReason, versionStarts } from '../plant/index';
import { settingsForStation } from '../stations/index';
import { namesOf } from '../users/index';
import { judgeAt, judgeManyAt, valueRows, type Judged } from './evaluate-at';
import { ReadingAmendment, ReadingCountersign, ReadingSet, ReadingValue, type ReadingSource } from './model';

const FUTURE_TOLERANCE_MS = 5 * 60 * 1000;

export function checkTakenAt(takenAt: Date, field = 'takenAt') {
  if (Number.isNaN(takenAt.getTime())) throw new ValidationError({ [field]: 'Not a valid time' });
  if (takenAt.getTime() > Date.now() + FUTURE_TOLERANCE_MS) throw new ValidationError({ [field]: 'A reading cannot be taken in the future' });
  if (takenAt.getFullYear() < 1990) throw new ValidationError({ [field]: 'Too far in the past (before 1990)' });
}

type Actor = { id: number; role: string; name?: string };

export type StoreReading = {
  unitId: number;
  takenAt: Date;
  raw: ReadingSetInput;
  si: ReadingSetSi;
  actor: Actor;
  source: ReadingSource;
  importKey: string | null;
  /** When it was written down; now unless the record is older history (the demo scenario). */
  recordedAt?: Date;
  /** A round kept on a device: its id there and when it was entered (else entered as it arrived). */
  offline?: { clientId: string | null; enteredAt: Date; lateEntryMinutes: number };
  /** What the recorder confirmed outside the plausible range; 'all' for history taken as it comes (imports). */
  confirmed: readonly PlausibleKey[] | 'all';
};

/**
 * Refuses a round with a reading or check outside the plausible range that the person did not
 * confirm, with a message on each box in the units typed; returns the keys to mark the record with.
 */
function confirmedOutsidePlausible(judged: Judged, raw: ReadingSetInput, si: ReadingSetSi, confirmed: readonly PlausibleKey[] | 'all'): PlausibleKey[] {
  const outside = judged.evaluation.implausible;
  const unconfirmed = confirmed === 'all' ? [] : outside.filter((item) => !confirmed.includes(item.key));
  if (unconfirmed.length) {
    // The form asks the same question from `details.outside` (the ranges in force when the reading was
    // taken are the word, which for an amendment of an old round may not be today's).
    const notices = describeImplausible(unconfirmed, raw, si.cwInletK, judged.design);
    throw new ConfirmationRequired(
      'OUTSIDE_PLAUSIBLE_RANGE',
      'Outside the plausible range for this unit: check the instruments, then confirm to save anyway',
      noticesByField(notices, 'Confirm to save it anyway.'),
      { outside: notices },
    );
  }
  return outside.map((item) => item.key);
}

/** Stores one reading set with its derived values and automatic flags, inside `transaction`. */
export async function storeReading(r: StoreReading, transaction: Transaction): Promise<{ reading: ReadingSet; flagsRaised: number }> {
  const judged = await judgeAt(r.unitId, r.takenAt, r.si, transaction);
  const outsidePlausible = confirmedOutsidePlausible(judged, r.raw, r.si, r.confirmed);
  await takeFlagTurn(r.unitId, transaction, judged.evaluation);
  const recordedAt = r.recordedAt ?? new Date();
  const reading = await ReadingSet.create(
    {
      unitId: r.unitId,
      takenAt: r.takenAt,
      recordedAt,
      enteredAt: r.offline?.enteredAt ?? recordedAt,
      arrivedLate: r.offline ? arrivedLate(r.offline.enteredAt, recordedAt, r.offline.lateEntryMinutes) : false,
      clientId: r.offline?.clientId ?? null,
      recordedBy: r.actor.id,
      recordedAsTrainee: r.actor.role === 'trainee',
      source: r.source,
      importKey: r.importKey,
      designVersionId: judged.designVersionId,
      limitVersionId: judged.limitVersionId,
      plausibleVersionId: judged.plausibleVersionId,
      raw: r.raw,
      si: r.si,
      results: judged.evaluation,
      worstStatus: judged.worstStatus,
      outsidePlausible,
    },
    { transaction },
  );
  await ReadingValue.bulkCreate(valueRows(reading.id, r.unitId, r.takenAt, judged.evaluation), { transaction });
  const flagsRaised = await refreshAutomaticFlags(r.unitId, reading.id, r.takenAt, judged.evaluation, transaction);
  return { reading, flagsRaised };
}

/**
 * An import batch: the same rows as `storeReading` one by one (in the same order, so flags open
 * and refresh as they would), in a handful of statements instead of several per row, so that the
 * batch, and the unit's turn it holds, is short. Every row carries its import key.
 */
export async function storeImportBatch(unitId: number, actor: Actor, rows: { takenAt: Date; raw: ReadingSetInput; si: ReadingSetSi; importKey: string }[], transaction: Transaction) {
  if (!rows.length) return { flagsRaised: 0, outsidePlausible: 0 };
  const judge = await judgeManyAt(unitId, transaction);
  const judged = rows.map((r) => judge(r.takenAt, r.si));
  const recordedAt = new Date();
  await ReadingSet.bulkCreate(
    rows.map((r, i) => ({
      unitId,
      takenAt: r.takenAt,
      recordedAt,
      enteredAt: recordedAt,
      recordedBy: actor.id,
      recordedAsTrainee: actor.role === 'trainee',
      source: 'import' as const,
      importKey: r.importKey,
      designVersionId: judged[i]!.designVersionId,
      limitVersionId: judged[i]!.limitVersionId,
      plausibleVersionId: judged[i]!.plausibleVersionId,
      raw: r.raw,
      si: r.si,
      results: judged[i]!.evaluation,
      worstStatus: judged[i]!.worstStatus,
      // History is taken as the historian kept it: a row outside the plausible range is stored marked
      // (and its derived checks withheld) rather than refused, as nobody is there to confirm it.
      outsidePlausible: judged[i]!.evaluation.implausible.map((item) => item.key),
    })),
    { transaction },
  );
  // Read back by the unique (unit, import key) rather than trusting consecutive auto-increment ids.
  const ids = new Map(
    (await ReadingSet.findAll({ where: { unitId, importKey: rows.map((r) => r.importKey) }, attributes: ['id', 'importKey'], transaction })).map((r) => [r.importKey!, r.id]),
  );
  await ReadingValue.bulkCreate(
    rows.flatMap((r, i) => valueRows(ids.get(r.importKey)!, unitId, r.takenAt, judged[i]!.evaluation)),
    { transaction },
  );
  let flagsRaised = 0;
  for (const [i, r] of rows.entries()) flagsRaised += await refreshAutomaticFlags(unitId, ids.get(r.importKey)!, r.takenAt, judged[i]!.evaluation, transaction);
  return { flagsRaised, outsidePlausible: judged.filter((j) => j.evaluation.implausible.length > 0).length };
}

const names = (ids: (number | null | undefined)[]) => namesOf(ids);

/** A round's id and unit, or null (other records point at rounds). */
export function findRound(id: number, options: { withResults?: boolean } = {}) {
  return ReadingSet.findByPk(id, options.withResults ? {} : { attributes: ['id', 'unitId'] });
}

/** The current evaluation (its latest amendment's, else its own) of a unit's latest round in [from, until]; null without one. */
export async function latestEvaluationBetween(unitId: number, from: Date, until: Date, transaction?: Transaction): Promise<Evaluation | null> {
  const latest = await ReadingSet.findOne({
    where: { unitId, takenAt: { [Op.between]: [from, until] } },
    order: [['takenAt', 'DESC'], ['id', 'DESC']],
    attributes: ['id', 'results'],
    transaction,
  });
  if (!latest) return null;
  const amendment = await ReadingAmendment.findOne({ where: { readingSetId: latest.id }, order: [['id', 'DESC']], attributes: ['results'], transaction });
  return amendment?.results ?? latest.results;
}

/** Ids of a unit's rounds taken in [start, end), oldest first. */
export async function roundIdsBetween(unitId: number, start: Date, end: Date) {
  return (await ReadingSet.findAll({ where: { unitId, takenAt: { [Op.gte]: start, [Op.lt]: end } }, attributes: ['id'], order: [['takenAt', 'ASC']] })).map((r) => r.id);
}

export function makeReadingService(sequelize: Sequelize) {
  /** The round this person already sent with this device id, as the first answer gave it; null when none. */
  async function storedBefore(actor: Actor, unitId: number, clientId: string | undefined, transaction?: Transaction) {
    if (!clientId) return null;
    const found = await ReadingSet.findOne({ where: { recordedBy: actor.id, clientId }, attributes: ['id', 'unitId'], transaction, ...(transaction ? { lock: transaction.LOCK.SHARE } : {}) });
    if (found && found.unitId !== unitId) throw new Conflict('This device already sent a round with that id for another unit');
    return found;
  }

  /** Records a round; a retry with the same `clientId` answers with the round stored the first time (`repeated`). */
  async function record(actor: Actor, unitId: number, input: RecordReadingInput) {
    const unit = await requireUnit(unitId);
    const { takenAt: takenAtText, confirmOutsidePlausible, clientId, enteredAt: enteredAtText, ...readings } = input;
    // A retry of a round already stored is answered from it, even if it would be refused today.
    const before = await storedBefore(actor, unitId, clientId);
    if (before) return { ...(await getReading(before.id)), id: before.id, flagsRaised: 0, repeated: true };
    const enteredAt = enteredAtText ? new Date(enteredAtText) : null;
    const problem = enteredAt ? enteredAtProblem(enteredAt, new Date()) : null;
    if (problem) throw new ValidationError({ enteredAt: problem });
    // A round kept on a device was read when it was entered there, unless its author gave another time.
    const takenAt = takenAtText ? new Date(takenAtText) : (enteredAt ?? new Date());
    checkTakenAt(takenAt);
    const settings = await settingsForStation(unit.stationId);
    const unjudged = unjudgedReason(takenAt, await versionStarts(unitId), settings.timeZone);
    if (unjudged) throw new ValidationError({ takenAt: unjudged });
    const raw: ReadingSetInput = { ...readings, unitId };
    const si = convertReadingSet(raw);
    const offline = clientId || enteredAt ? { clientId: clientId ?? null, enteredAt: enteredAt ?? new Date(), lateEntryMinutes: settings.lateEntryMinutes } : undefined;
    const outcome = await unitOfWork(sequelize, async (transaction) => {
      let stored: Awaited<ReturnType<typeof storeReading>>;
      try {
        stored = await storeReading(
          { unitId, takenAt, raw, si, actor, source: 'round', importKey: null, confirmed: confirmOutsidePlausible ?? [], ...(offline ? { offline } : {}) },
          transaction,
        );
      } catch (error) {
        // Two sends of one round at once: the unique (author, client id) lets one in; the other
        // waited on it and answers with its row (a locking read sees the committed row).
        if (error instanceof UniqueConstraintError && clientId) {
          const again = await storedBefore(actor, unitId, clientId, transaction);
          if (again) return { repeatOf: again.id } as const;
        }
        throw error;
      }
      const { outsidePlausible } = stored.reading;
      await recordAudit(
        { actorId: actor.id, action: 'reading.record', entity: 'reading_set', entityId: stored.reading.id, after: { unitId, takenAt, worstStatus: stored.reading.worstStatus, outsidePlausible, ...(offline ? { enteredAt: offline.enteredAt, clientId } : {}) } },
        transaction,
      );
      publish(transaction, { entity: 'reading', id: stored.reading.id, unitId });
      return stored;
    });
    if ('repeatOf' in outcome) return { ...(await getReading(outcome.repeatOf)), id: outcome.repeatOf, flagsRaised: 0, repeated: true };
    const { reading, flagsRaised } = outcome;
    // Presented from what was just written: no read back, so the work after the commit (while every
    // open board is being told) stays small.
    return { id: reading.id, flagsRaised, repeated: false, ...presentReading(reading, [], null, new Map([[actor.id, actor.name ?? (await names([actor.id])).get(actor.id) ?? `#${actor.id}`]])) };
  }

  async function amend(actor: Actor, readingSetId: number, input: AmendReadingInput) {
    const original = await ReadingSet.findByPk(readingSetId);
    if (!original) throw new NotFound('That reading set');
    const raw: ReadingSetInput = { ...input.reading, unitId: original.unitId };
    const si = convertReadingSet(raw);
    await unitOfWork(sequelize, async (transaction) => {
      // Judged by the versions in force when the reading was taken, not today's.
      const judged = await judgeAt(original.unitId, original.takenAt, si, transaction);
      const outsidePlausible = confirmedOutsidePlausible(judged, raw, si, input.confirmOutsidePlausible ?? []);
      await takeFlagTurn(original.unitId, transaction, judged.evaluation);
      const amendment = await ReadingAmendment.create(
        { readingSetId, amendedBy: actor.id, amendedAt: new Date(), reason: input.reason, raw, si, results: judged.evaluation, worstStatus: judged.worstStatus, outsidePlausible },
        { transaction },
      );
      // The trend table follows the current version; the records themselves stay untouched.
      await ReadingValue.destroy({ where: { readingSetId }, transaction });
      await ReadingValue.bulkCreate(valueRows(readingSetId, original.unitId, original.takenAt, judged.evaluation), { transaction });
      await refreshAutomaticFlags(original.unitId, readingSetId, original.takenAt, judged.evaluation, transaction);
      await recordAudit(
        { actorId: actor.id, action: 'reading.amend', entity: 'reading_set', entityId: readingSetId, after: { amendmentId: amendment.id, reason: input.reason, outsidePlausible } },
        transaction,
      );
      publish(transaction, { entity: 'reading', id: readingSetId, unitId: original.unitId });
    });
    return getReading(readingSetId);
  }

  async function countersign(actor: Actor, readingSetId: number) {
    const reading = await ReadingSet.findByPk(readingSetId);
    if (!reading) throw new NotFound('That reading set');
    if (!reading.recordedAsTrainee) throw new ValidationError({ _: 'Only a trainee’s round needs a countersign' });
    if (reading.recordedBy === actor.id) throw new Forbidden('You cannot countersign your own round');
    await unitOfWork(sequelize, async (transaction) => {
      const existing = await ReadingCountersign.findByPk(readingSetId, { transaction, lock: transaction.LOCK.UPDATE });
      if (existing) throw new Conflict('This round is already countersigned');
      await ReadingCountersign.create({ readingSetId, signedBy: actor.id, signedAt: new Date() }, { transaction });
      await recordAudit({ actorId: actor.id, action: 'reading.countersign', entity: 'reading_set', entityId: readingSetId }, transaction);
      publish(transaction, { entity: 'reading', id: readingSetId, unitId: reading.unitId });
    });
    return getReading(readingSetId);
  }

  return { record, amend, countersign };
}
export type ReadingService = ReturnType<typeof makeReadingService>;

/** One reading set as first recorded, every amendment after it, and who did what. */
export async function getReading(id: number) {
  const reading = await ReadingSet.findByPk(id);
  if (!reading) throw new NotFound('That reading set');
  const [amendments, countersign] = await Promise.all([
    ReadingAmendment.findAll({ where: { readingSetId: id }, order: [['id', 'ASC']] }),
    ReadingCountersign.findByPk(id),
  ]);
  const who = await names([reading.recordedBy, countersign?.signedBy, ...amendments.map((a) => a.amendedBy)]);
  return presentReading(reading, amendments, countersign, who);
}

function presentReading(reading: ReadingSet, amendments: ReadingAmendment[], countersign: ReadingCountersign | null, who: Map<number, string>) {
  const current = amendments.at(-1);
  return {
    reading: {
      id: reading.id,
      unitId: reading.unitId,
      takenAt: reading.takenAt.toISOString(),
      recordedAt: reading.recordedAt.toISOString(),
      enteredAt: reading.enteredAt.toISOString(),
      arrivedLate: reading.arrivedLate,
      clientId: reading.clientId,
      recordedBy: who.get(reading.recordedBy) ?? `#${reading.recordedBy}`,
      recordedById: reading.recordedBy,
      recordedAsTrainee: reading.recordedAsTrainee,
      source: reading.source,
      designVersionId: reading.designVersionId,
      limitVersionId: reading.limitVersionId,
      raw: reading.raw,
      results: reading.results,
      worstStatus: reading.worstStatus,
      outsidePlausible: reading.outsidePlausible,
    },
    amendments: amendments.map((a) => ({
      id: a.id,
      amendedAt: a.amendedAt.toISOString(),
      amendedBy: who.get(a.amendedBy) ?? `#${a.amendedBy}`,
      reason: a.reason,
      raw: a.raw,
      results: a.results,
      worstStatus: a.worstStatus,
      outsidePlausible: a.outsidePlausible,
    })),
    current: {
      results: current?.results ?? reading.results,
      worstStatus: current?.worstStatus ?? reading.worstStatus,
      outsidePlausible: current?.outsidePlausible ?? reading.outsidePlausible,
      amended: Boolean(current),
    },
    countersign: countersign ? { by: who.get(countersign.signedBy) ?? `#${countersign.signedBy}`, at: countersign.signedAt.toISOString() } : null,
  };
}

/** Newest first; each with its current status, amendment count and countersign state. */
export async function listReadings(unitId: number, options: { before?: Date; limit: number }) {
  await requireUnit(unitId);
  const where: Record<string, unknown> = { unitId };
  if (options.before) where.takenAt = { [Op.lt]: options.before };
  const readings = await ReadingSet.findAll({
    where,
    order: [['takenAt', 'DESC'], ['id', 'DESC']],
    limit: options.limit,
    attributes: ['id', 'takenAt', 'recordedAt', 'enteredAt', 'arrivedLate', 'clientId', 'recordedBy', 'recordedAsTrainee', 'source', 'worstStatus', 'raw', 'outsidePlausible'],
  });
  const ids = readings.map((r) => r.id);
  const [amendments, countersigns] = await Promise.all([
    ids.length
      ? ReadingAmendment.findAll({ where: { readingSetId: ids }, attributes: ['readingSetId', 'worstStatus', 'outsidePlausible', 'id'], order: [['id', 'ASC']] })
      : [],
    ids.length ? ReadingCountersign.findAll({ where: { readingSetId: ids } }) : [],
  ]);
  const latestAmendment = new Map<number, { count: number; worstStatus: string; outsidePlausible: PlausibleKey[] }>();
  for (const a of amendments) {
    const seen = latestAmendment.get(a.readingSetId);
    latestAmendment.set(a.readingSetId, { count: (seen?.count ?? 0) + 1, worstStatus: a.worstStatus, outsidePlausible: a.outsidePlausible });
  }
  const signed = new Set(countersigns.map((c) => c.readingSetId));
  const who = await names(readings.map((r) => r.recordedBy));
  return readings.map((r) => ({
    id: r.id,
    takenAt: r.takenAt.toISOString(),
    enteredAt: r.enteredAt.toISOString(),
    recordedAt: r.recordedAt.toISOString(),
    arrivedLate: r.arrivedLate,
    clientId: r.clientId,
    recordedBy: who.get(r.recordedBy) ?? `#${r.recordedBy}`,
    recordedById: r.recordedBy,
    recordedAsTrainee: r.recordedAsTrainee,
    needsCountersign: r.recordedAsTrainee && !signed.has(r.id),
    source: r.source,
    worstStatus: latestAmendment.get(r.id)?.worstStatus ?? r.worstStatus,
    amendments: latestAmendment.get(r.id)?.count ?? 0,
    outsidePlausible: latestAmendment.get(r.id)?.outsidePlausible ?? r.outsidePlausible,
    raw: r.raw,
  }));
}
