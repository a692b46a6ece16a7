// One past shift of one unit, read-only and as it was: the log with its amendments and review
// signatures, every round with the checks and the limit set in force when it was taken, flags and
// time-limited conditions alive during the shift (remaining time as at the shift's end), standing
// orders in force, the handover received at the start and the one given at the end, and the
// trainers' review comments the viewer may see.
import { QueryTypes, type Sequelize } from 'sequelize';
import { nextShiftStart, shiftStartFor, stationLocalLabel } from '../../../shared/shift-time';
import { NotFound, ValidationError } from '../../lib/errors';
import { stationShiftSetup } from '../stations/index';
import { crewOnShift } from '../shifts/index';
import { findCrew, findUnit, limitSetsById } from '../plant/index';
import { listEntries, reviewsFor } from '../log/index';
import { getReading, roundIdsBetween } from '../readings/index';
import { flagsOpenDuring, presentFlags } from '../flags/index';
import { conditionsOpenDuring, presentConditions } from '../conditions/index';
import { ordersInForceDuring, presentOrder } from '../standing-orders/index';
import { handoversAroundShift, viewHandover } from '../handovers/index';
import { commentsOn } from './review-comments';

export async function pastShift(sequelize: Sequelize, viewer: Express.User, unitId: number, shiftStartText: string) {
  const unit = await findUnit(unitId);
  if (!unit) throw new NotFound('That unit');
  const { settings, rotation } = await stationShiftSetup(unit.stationId);
  const start = new Date(shiftStartText);
  if (Number.isNaN(start.getTime())) throw new ValidationError({ shiftStart: 'Give the shift start as an ISO 8601 date-time' });
  if (shiftStartFor(start, settings.timeZone, settings.shiftChangeTimes).getTime() !== start.getTime()) {
    throw new ValidationError({ shiftStart: 'That time is not the start of a shift at this station' });
  }
  const now = new Date();
  if (start > now) throw new ValidationError({ shiftStart: 'That shift has not started yet' });
  const end = nextShiftStart(start, settings.timeZone, settings.shiftChangeTimes);
  const asAt = end < now ? end : now;
  const crewId = await crewOnShift(unit.stationId, start, rotation, settings.shiftChangeTimes.length);

  const [entries, reviews, roundIds, flagRows, conditionRows, orderRows, around, crew] = await Promise.all([
    listEntries(unitId, { shiftStart: start.toISOString(), limit: 2000 }, viewer),
    reviewsFor(unitId, [start]),
    roundIdsBetween(unitId, start, end),
    flagsOpenDuring(unitId, start, end),
    conditionsOpenDuring(unitId, start, end),
    ordersInForceDuring(unit.stationId, start, end),
    handoversAroundShift(unitId, start),
    crewId ? findCrew(crewId) : null,
  ]);
  const readings = await Promise.all(roundIds.map((id) => getReading(id)));
  const limitSets = new Map(
    [...(await limitSetsById(readings.map((r) => r.reading.limitVersionId))).values()].map((l) => [
      l.id,
      { id: l.id, effectiveFrom: l.effectiveFrom.toISOString(), limits: l.limits },
    ]),
  );
  const [handoverReceived, handoverGiven, orders] = await Promise.all([
    around.receivedId ? viewHandover(around.receivedId) : null,
    around.givenId ? viewHandover(around.givenId) : null,
    Promise.all(orderRows.map((o) => presentOrder(o, false))),
  ]);

  // The search documents of everything shown: review comments hang on them.
  const shown: [string, number[]][] = [
    ['log_entry', entries.map((e) => e.id)],
    ['log_amendment', entries.flatMap((e) => e.amendments.map((a) => a.id))],
    ['round', readings.map((r) => r.reading.id)],
    ['flag', flagRows.map((f) => f.id)],
    ['condition', conditionRows.map((c) => c.id)],
    ['standing_order', orderRows.map((o) => o.id)],
    ['handover_notes', [handoverReceived, handoverGiven].flatMap((h) => (h ? [h.handover.id] : []))],
    ['handover_item', [handoverReceived, handoverGiven].flatMap((h) => h?.items.map((i) => i.id) ?? [])],
    ['handover_query', [handoverReceived, handoverGiven].flatMap((h) => h?.items.flatMap((i) => i.queries.map((q) => q.id)) ?? [])],
    ['handover_amendment', [handoverReceived, handoverGiven].flatMap((h) => h?.amendments.map((a) => a.id) ?? [])],
  ];
  const clauses = shown.filter(([, ids]) => ids.length).map(([kind, ids]) => `(kind = '${kind}' AND ref_id IN (${ids.map(Number).join(',')}))`);
  const documents = clauses.length
    ? await sequelize.query<{ id: number; kind: string; refId: number }>(`SELECT id, kind, ref_id AS refId FROM logbook_documents WHERE ${clauses.join(' OR ')}`, { type: QueryTypes.SELECT })
    : [];

  return {
    unit: { id: unit.id, name: unit.name },
    shift: {
      start: start.toISOString(),
      end: end.toISOString(),
      startLocal: stationLocalLabel(start, settings.timeZone),
      endLocal: stationLocalLabel(end, settings.timeZone),
      timeZone: settings.timeZone,
      crew: crew ? { id: crew.id, name: crew.name } : null,
      inProgress: end > now,
      asAt: asAt.toISOString(),
    },
    logEntries: [...entries].reverse(),
    reviews,
    readings: readings.map((r) => ({ ...r, limitSet: limitSets.get(r.reading.limitVersionId) ?? null })),
    flags: (await presentFlags(flagRows)).map((f) => ({
      ...f,
      // As it was: a flag cleared after the shift was still open then.
      statusThen: f.clearedAt && new Date(f.clearedAt) < end ? 'cleared' : 'open',
    })),
    conditions: await presentConditions(conditionRows, settings.timeZone, asAt),
    standingOrders: orders.map(({ id, title, bodyHtml, effectiveFrom, effectiveTo, issuedBy, issuedAt }) => ({ id, title, bodyHtml, effectiveFrom, effectiveTo, issuedBy, issuedAt })),
    handoverReceived,
    handoverGiven,
    documents: documents.map((d) => ({ id: Number(d.id), kind: d.kind, refId: Number(d.refId) })),
    comments: await commentsOn(sequelize, viewer, documents.map((d) => Number(d.id))),
  };
}
