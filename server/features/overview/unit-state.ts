// What each unit's panel shows besides the shift: its latest round, open flags, open conditions and
// the handover of the coming change. Each reader takes every unit at once (one or two statements),
// so the page costs the same number of queries for two units as for twenty.
import { Op, QueryTypes, type Sequelize } from 'sequelize';
import { jsonColumn } from '../../lib/json-column';
import { checkCatalog, type CheckKey } from '../../../shared/calc/check-catalog';
import type { Evaluation } from '../../../shared/calc/evaluate';
import type { Status } from '../../../shared/calc/limits';
import { overviewCheckKeys, type OverviewCheck, type OverviewFlag } from '../../../shared/schemas/overview';
import { Condition } from '../conditions/index';
import { Handover, HandoverAck, HandoverItem, HandoverQuery } from '../handovers/index';

/** The newest round (walked and recorded, not imported history) of each unit, in its current version. */
export async function latestRounds(sequelize: Sequelize, unitIds: number[]) {
  if (!unitIds.length) return new Map<number, LatestRound>();
  // One statement: an index range per unit, newest first, then that round with its latest
  // amendment's results and whether it is countersigned (this page is asked by everyone on shift).
  const pick = unitIds.map(() => `(SELECT id FROM reading_sets WHERE unit_id = ? AND source = 'round' ORDER BY taken_at DESC, id DESC LIMIT 1)`).join(' UNION ALL ');
  type Row = {
    id: number; unitId: number; takenAt: Date; recordedBy: number; recordedAsTrainee: number; results: Evaluation | string; worstStatus: Status;
    amendedResults: Evaluation | string | null; amendedWorstStatus: Status | null; countersigned: number;
  };
  const rows = await sequelize.query<Row>(
    `SELECT r.id, r.unit_id AS unitId, r.taken_at AS takenAt, r.recorded_by AS recordedBy, r.recorded_as_trainee AS recordedAsTrainee, r.results, r.worst_status AS worstStatus,
       a.results AS amendedResults, a.worst_status AS amendedWorstStatus,
       EXISTS (SELECT 1 FROM reading_countersigns c WHERE c.reading_set_id = r.id) AS countersigned
     FROM (${pick}) latest
     JOIN reading_sets r ON r.id = latest.id
     LEFT JOIN reading_amendments a ON a.id = (SELECT MAX(x.id) FROM reading_amendments x WHERE x.reading_set_id = r.id)`,
    { replacements: unitIds, type: QueryTypes.SELECT },
  );
  return new Map(
    rows.map((r) => {
      const amended = r.amendedResults !== null;
      const round: LatestRound = {
        id: Number(r.id),
        unitId: Number(r.unitId),
        takenAt: new Date(r.takenAt),
        recordedBy: Number(r.recordedBy),
        recordedAsTrainee: Boolean(r.recordedAsTrainee),
        needsCountersign: Boolean(r.recordedAsTrainee) && !Number(r.countersigned),
        amended,
        worstStatus: (amended ? r.amendedWorstStatus : r.worstStatus)!,
        checks: keyChecks(jsonColumn<Evaluation>(amended ? r.amendedResults! : r.results)),
      };
      return [round.unitId, round];
    }),
  );
}

export type LatestRound = {
  id: number;
  unitId: number;
  takenAt: Date;
  recordedBy: number;
  recordedAsTrainee: boolean;
  needsCountersign: boolean;
  amended: boolean;
  worstStatus: Status;
  checks: OverviewCheck[];
};

function keyChecks(evaluation: Evaluation): OverviewCheck[] {
  return overviewCheckKeys.map((key: CheckKey) => {
    const check = evaluation.checks[key];
    const { label, quantity } = checkCatalog[key];
    if (!check) return { key, label, quantity, value: null, status: 'unknown', reason: 'Not computed for this round' };
    return { key, label, quantity, value: check.value, status: check.status, reason: check.reason ?? null };
  });
}

const TOP_FLAGS = 3;

/** Open flags per unit counted by severity, and the few most severe (alarm first), newest first within a severity. */
export async function openFlags(sequelize: Sequelize, unitIds: number[]) {
  const counts = new Map<number, { alarm: number; watch: number }>(unitIds.map((id) => [id, { alarm: 0, watch: 0 }]));
  const top = new Map<number, OverviewFlag[]>(unitIds.map((id) => [id, []]));
  if (!unitIds.length) return { counts, top };
  // One statement: the few leading flags of each unit, each row carrying its unit's counts.
  const leading = await sequelize.query<{
    id: number; unitId: number; parameter: string; origin: 'automatic' | 'manual'; severity: 'watch' | 'alarm'; lastValue: number | null; raisedAt: Date; alarms: number; watches: number;
  }>(
    `SELECT id, unit_id AS unitId, parameter, origin, severity, last_value AS lastValue, raised_at AS raisedAt, alarms, watches FROM (
       SELECT f.*, ROW_NUMBER() OVER (PARTITION BY unit_id ORDER BY severity = 'alarm' DESC, raised_at DESC, id DESC) AS place,
         SUM(severity = 'alarm') OVER (PARTITION BY unit_id) AS alarms, SUM(severity = 'watch') OVER (PARTITION BY unit_id) AS watches
       FROM flags f WHERE status = 'open' AND unit_id IN (?)) ranked
     WHERE place <= ${TOP_FLAGS} ORDER BY unitId, place`,
    { replacements: [unitIds], type: QueryTypes.SELECT },
  );
  for (const f of leading) counts.set(Number(f.unitId), { alarm: Number(f.alarms), watch: Number(f.watches) });
  for (const f of leading) {
    const catalogued = checkCatalog[f.parameter as CheckKey];
    top.get(Number(f.unitId))!.push({
      id: Number(f.id),
      parameter: f.parameter,
      parameterLabel: catalogued?.label ?? f.parameter,
      quantity: catalogued?.quantity ?? null,
      origin: f.origin,
      severity: f.severity,
      lastValue: f.lastValue === null ? null : Number(f.lastValue),
      raisedAt: new Date(f.raisedAt).toISOString(),
    });
  }
  return { counts, top };
}

/** Open time-limited conditions, soonest deadline first. */
export const openConditions = (unitIds: number[]) =>
  unitIds.length ? Condition.findAll({ where: { unitId: unitIds, closedAt: null }, order: [['limitAt', 'ASC']], limit: 200 }) : Promise.resolve([]);

/** The handover of each unit's coming change (the board's "current" one), with its items, acknowledgements and open questions. */
export async function currentHandovers(shifts: { unitId: number; shiftStart: Date }[]) {
  const handovers = shifts.length
    ? await Handover.findAll({ where: { [Op.or]: shifts.map((s) => ({ unitId: s.unitId, shiftStart: s.shiftStart })) }, attributes: { exclude: ['notesHtml', 'condenserSnapshot'] } })
    : [];
  // Items still to acknowledge: every item of a submitted handover, and of an accepted one those
  // amended after the turnover (the incoming crew must read the correction too).
  const handedOver = handovers.filter((h) => h.status !== 'draft');
  const acceptedAt = new Map(handedOver.filter((h) => h.acceptedAt).map((h) => [h.id, h.acceptedAt!.getTime()]));
  const items = (
    handedOver.length
      ? await HandoverItem.findAll({
          where: { handoverId: handedOver.map((h) => h.id), removedAt: null },
          attributes: ['id', 'handoverId', 'title', 'priority', 'version', 'amendedAt'],
          order: [['id', 'ASC']],
        })
      : []
  ).filter((i) => !acceptedAt.has(i.handoverId) || (i.amendedAt !== null && i.amendedAt.getTime() > acceptedAt.get(i.handoverId)!));
  const itemIds = items.map((i) => i.id);
  const [allAcks, openQuestions] = await Promise.all([
    itemIds.length ? HandoverAck.findAll({ where: { itemId: itemIds }, attributes: ['itemId', 'userId', 'itemVersion'] }) : [],
    itemIds.length ? HandoverQuery.findAll({ where: { itemId: itemIds, answeredAt: null }, attributes: ['id', 'itemId', 'question'] }) : [],
  ]);
  // Only an acknowledgement of the item as it stands counts: an amended item waits again.
  const versionOf = new Map(items.map((i) => [i.id, i.version]));
  const acks = allAcks.filter((a) => a.itemVersion === versionOf.get(a.itemId));
  return { handovers, items, acks, openQuestions };
}
export type CurrentHandovers = Awaited<ReturnType<typeof currentHandovers>>;
