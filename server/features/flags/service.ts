import { Op, type Sequelize } from 'sequelize';
import { checkCatalog, type CheckKey } from '../../../shared/calc/check-catalog';
import type { AssignFlagInput, ClearFlagInput, RaiseFlagInput } from '../../../shared/schemas/flags';
import { recordAudit } from '../../lib/audit';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { Conflict, NotFound, ValidationError } from '../../lib/errors';
import { requireUnit } from '../plant/index';
import { findRound } from '../readings/index';
import { findPerson, namesOf } from '../users/index';
import { Flag, notYetFollowedUp } from './model';

const auditView = (f: Flag) => ({ status: f.status, severity: f.severity, assignedTo: f.assignedTo, followUp: f.followUp, clearComment: f.clearComment });

export async function presentFlags(flags: Flag[]) {
  const ids = new Set<number>();
  for (const f of flags) for (const id of [f.raisedBy, f.assignedTo, f.clearedBy]) if (id) ids.add(id);
  const names = await namesOf([...ids]);
  const name = (id: number | null) => (id ? (names.get(id) ?? `#${id}`) : null);
  return flags.map((f) => ({
    id: f.id,
    unitId: f.unitId,
    parameter: f.parameter,
    parameterLabel: checkCatalog[f.parameter as CheckKey]?.label ?? f.parameter,
    quantity: checkCatalog[f.parameter as CheckKey]?.quantity ?? null,
    origin: f.origin,
    severity: f.severity,
    status: f.status,
    lastValue: f.lastValue,
    firstReadingSetId: f.firstReadingSetId,
    lastReadingSetId: f.lastReadingSetId,
    raisedAt: f.raisedAt.toISOString(),
    lastSeenAt: f.lastSeenAt.toISOString(),
    raisedBy: name(f.raisedBy),
    comment: f.comment,
    assignedTo: name(f.assignedTo),
    assignedToId: f.assignedTo,
    followUp: f.followUp,
    clearedBy: name(f.clearedBy),
    clearedAt: f.clearedAt?.toISOString() ?? null,
    clearComment: f.clearComment,
    version: f.version,
  }));
}

export async function listFlags(
  unitId: number,
  q: { status: 'open' | 'cleared' | 'all'; severity?: string; parameter?: string; from?: string; to?: string; limit: number },
) {
  await requireUnit(unitId);
  const where: Record<string | symbol, unknown> = { unitId };
  if (q.status !== 'all') where.status = q.status;
  if (q.severity) where.severity = q.severity;
  if (q.parameter) where.parameter = q.parameter;
  if (q.from || q.to) {
    where.raisedAt = { ...(q.from ? { [Op.gte]: new Date(q.from) } : {}), ...(q.to ? { [Op.lte]: new Date(q.to) } : {}) };
  }
  const flags = await Flag.findAll({ where, order: [['severity', 'DESC'], ['raisedAt', 'DESC']], limit: q.limit });
  return presentFlags(flags);
}

export function findFlag(id: number) {
  return Flag.findByPk(id);
}

/** Flags on these parameters that were open at some time between `from` and `to` (trend markers). */
export function flagsRaisedBetween(unitId: number, parameters: string[], from: Date, to: Date) {
  return Flag.findAll({
    where: { unitId, parameter: parameters, raisedAt: { [Op.lte]: to }, [Op.or]: [{ clearedAt: null }, { clearedAt: { [Op.gte]: from } }] },
    order: [['raisedAt', 'ASC']],
    limit: 500,
  });
}

/** Flags of a unit open at some time in [start, end) (a past shift's view). */
export function flagsOpenDuring(unitId: number, start: Date, end: Date) {
  return Flag.findAll({ where: { unitId, raisedAt: { [Op.lt]: end }, [Op.or]: [{ clearedAt: null }, { clearedAt: { [Op.gte]: start } }] }, order: [['raisedAt', 'ASC']] });
}

export function makeFlagService(sequelize: Sequelize) {
  async function raise(actorId: number, unitId: number, input: RaiseFlagInput) {
    await requireUnit(unitId);
    let value: number | null = null;
    if (input.readingSetId) {
      const reading = await findRound(input.readingSetId, { withResults: true });
      if (!reading || reading.unitId !== unitId) throw new ValidationError({ readingSetId: 'No such reading set on this unit' });
      value = reading.results.checks[input.parameter]?.value ?? null;
    }
    const flag = await unitOfWork(sequelize, async (transaction) => {
      const now = new Date();
      const created = await Flag.create(
        {
          unitId,
          parameter: input.parameter,
          origin: 'manual',
          severity: input.severity,
          status: 'open',
          firstReadingSetId: input.readingSetId ?? null,
          lastReadingSetId: input.readingSetId ?? null,
          lastValue: value,
          raisedAt: now,
          lastSeenAt: now,
          raisedBy: actorId,
          comment: input.comment,
          ...notYetFollowedUp,
        },
        { transaction },
      );
      await recordAudit({ actorId, action: 'flag.raise', entity: 'flag', entityId: created.id, after: { ...auditView(created), comment: input.comment } }, transaction);
      publish(transaction, { entity: 'flag', id: created.id, unitId });
      return created;
    });
    return (await presentFlags([flag]))[0]!;
  }

  async function change(actorId: number, id: number, version: number, action: string, mutate: (flag: Flag) => void) {
    const flag = await unitOfWork(sequelize, async (transaction) => {
      const found = await Flag.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!found) throw new NotFound('That flag');
      if (found.status === 'cleared') throw new Conflict('This flag is already cleared');
      if (found.version !== version) throw new Conflict('Someone else changed this flag since you opened it; reload and try again');
      const before = auditView(found);
      mutate(found);
      found.version += 1;
      await found.save({ transaction });
      await recordAudit({ actorId, action, entity: 'flag', entityId: id, before, after: auditView(found) }, transaction);
      publish(transaction, { entity: 'flag', id, unitId: found.unitId });
      return found;
    });
    return (await presentFlags([flag]))[0]!;
  }

  async function assign(actorId: number, id: number, input: AssignFlagInput) {
    const assignee = await findPerson(input.assignedTo);
    if (!assignee || !assignee.active) throw new ValidationError({ assignedTo: 'No such active person' });
    return change(actorId, id, input.version, 'flag.assign', (flag) => {
      flag.assignedTo = input.assignedTo;
      flag.followUp = input.followUp;
    });
  }

  async function clear(actorId: number, id: number, input: ClearFlagInput) {
    return change(actorId, id, input.version, 'flag.clear', (flag) => {
      flag.status = 'cleared';
      flag.clearedBy = actorId;
      flag.clearedAt = new Date();
      flag.clearComment = input.comment;
    });
  }

  return { raise, assign, clear };
}
export type FlagService = ReturnType<typeof makeFlagService>;
