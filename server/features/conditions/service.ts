// Time-limited conditions: opened with a deadline, shown with the time left (computed here, from
// UTC), closed only by a closing log entry.
import { Op, type Sequelize } from 'sequelize';
import { remainingTime } from '../../../shared/conditions';
import { stationLocalLabel } from '../../../shared/shift-time';
import { recordAudit } from '../../lib/audit';
import { Conflict, NotFound, ValidationError } from '../../lib/errors';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import type { LogService } from '../log/index';
import { settingsForUnit } from '../stations/index';
import { findPerson, namesOf } from '../users/index';
import type { LogActor } from '../../../shared/policies/log';
import { Condition } from './model';

export async function presentConditions(conditions: Condition[], timeZone: string, now = new Date()) {
  const people = await namesOf(conditions.flatMap((c) => [c.ownerId, c.openedBy, c.closedBy]));
  return conditions.map((c) => {
    const remaining = remainingTime(c.startedAt, c.limitAt, now, c.closedAt);
    return {
      id: c.id,
      unitId: c.unitId,
      title: c.title,
      requiredAction: c.requiredAction,
      startedAt: c.startedAt.toISOString(),
      limitAt: c.limitAt.toISOString(),
      limitLocal: stationLocalLabel(c.limitAt, timeZone),
      timeZone,
      owner: people.get(c.ownerId) ?? `#${c.ownerId}`,
      openedBy: people.get(c.openedBy) ?? `#${c.openedBy}`,
      closedBy: c.closedBy ? (people.get(c.closedBy) ?? `#${c.closedBy}`) : null,
      closedAt: c.closedAt?.toISOString() ?? null,
      closingEntryId: c.closingEntryId,
      serverNow: now.toISOString(),
      remainingMs: remaining.remainingMs,
      state: remaining.state,
      version: c.version,
    };
  });
}

/** A unit's conditions (open, closed or all), soonest deadline first, as shown on its station's clock. */
export async function listConditions(unitId: number, state: 'open' | 'closed' | 'all') {
  const { settings } = await settingsForUnit(unitId);
  const where: Record<string, unknown> = { unitId };
  if (state === 'open') where.closedAt = null;
  const rows = await Condition.findAll({ where, order: [['limitAt', 'ASC']], limit: 200 });
  return presentConditions(state === 'closed' ? rows.filter((r) => r.closedAt) : rows, settings.timeZone);
}

/** One condition as shown, on its unit's station clock. */
export async function presentCondition(condition: Condition) {
  const { settings } = await settingsForUnit(condition.unitId);
  return (await presentConditions([condition], settings.timeZone))[0]!;
}

/** Conditions of a unit open at some time in [start, end) (a past shift's view). */
export function conditionsOpenDuring(unitId: number, start: Date, end: Date) {
  return Condition.findAll({
    where: { unitId, startedAt: { [Op.lt]: end }, [Op.or]: [{ closedAt: null }, { closedAt: { [Op.gte]: start } }] },
    order: [['startedAt', 'ASC']],
  });
}

export function makeConditionService(sequelize: Sequelize, log: LogService) {
  async function open(actorId: number, unitId: number, input: { title: string; requiredAction: string; startedAt: string; limitHours?: number; limitAt?: string; ownerId: number }) {
    await settingsForUnit(unitId);
    const owner = await findPerson(input.ownerId);
    if (!owner || !owner.active) throw new ValidationError({ ownerId: 'No such active person' });
    const startedAt = new Date(input.startedAt);
    // Hours allowed are absolute hours: a clock change neither adds nor removes one.
    const limitAt = input.limitAt ? new Date(input.limitAt) : new Date(startedAt.getTime() + input.limitHours! * 3_600_000);
    if (limitAt <= startedAt) throw new ValidationError({ limitAt: 'The deadline must be after the start' });
    if (startedAt.getTime() > Date.now() + 60_000) throw new ValidationError({ startedAt: 'Cannot start in the future' });
    return unitOfWork(sequelize, async (transaction) => {
      const created = await Condition.create(
        { unitId, title: input.title, requiredAction: input.requiredAction, startedAt, limitAt, ownerId: input.ownerId, openedBy: actorId, openedAt: new Date(), closedBy: null, closedAt: null, closingEntryId: null },
        { transaction },
      );
      await recordAudit({ actorId, action: 'condition.open', entity: 'condition', entityId: created.id, after: { title: input.title, limitAt } }, transaction);
      publish(transaction, { entity: 'condition', id: created.id, unitId });
      return created;
    });
  }

  async function close(actor: LogActor, id: number, input: { text: string; position: string; version: number }) {
    const found = await Condition.findByPk(id);
    if (!found) throw new NotFound('That condition');
    const { settings } = await settingsForUnit(found.unitId);
    const category = settings.categories.some((c) => c.key === 'equipment_status') ? 'equipment_status' : settings.categories[0]!.key;
    // The check, the closing entry and the update are one unit of work under the condition's row
    // lock: of two people closing at once, one closes and writes the entry, the other writes nothing.
    await unitOfWork(sequelize, async (transaction) => {
      const condition = await Condition.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!condition) throw new NotFound('That condition');
      if (condition.closedAt) throw new Conflict('This condition is already closed');
      if (condition.version !== input.version) throw new Conflict('Someone else changed this condition; reload and try again');
      const { entry } = await log.addEntry(
        actor,
        condition.unitId,
        { position: input.position, category, text: `Closed condition “${condition.title}”: ${input.text}`, carryToHandover: true },
        { conditionId: id, transaction },
      );
      await condition.update({ closedAt: new Date(), closedBy: actor.id, closingEntryId: entry.id, version: condition.version + 1 }, { transaction });
      await recordAudit({ actorId: actor.id, action: 'condition.close', entity: 'condition', entityId: id, after: { closingEntryId: entry.id } }, transaction);
      publish(transaction, { entity: 'condition', id, unitId: condition.unitId });
    }, 'close condition');
    return Condition.findByPk(id);
  }

  return { open, close };
}
export type ConditionService = ReturnType<typeof makeConditionService>;
