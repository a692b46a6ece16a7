// Items the handover picks up by itself: open flags, open conditions, log entries marked for
// handover in the outgoing shift, and standing orders issued during it.
import { Op, type Transaction } from 'sequelize';
import { checkCatalog, type CheckKey } from '../../../shared/calc/check-catalog';
import { Condition } from '../conditions/model';
import { Flag } from '../flags/model';
import { LogEntry } from '../log/model';
import { PlantUnit } from '../plant/model';
import { StandingOrder } from '../standing-orders/model';
import { HandoverItem, type Handover, type ItemKind } from './model';

export async function syncAutomaticItems(handover: Handover, actorId: number, transaction: Transaction): Promise<number> {
  const unit = await PlantUnit.findByPk(handover.unitId, { transaction });
  const now = new Date();
  const [flags, conditions, entries, orders, existing] = await Promise.all([
    Flag.findAll({ where: { unitId: handover.unitId, status: 'open' }, transaction }),
    Condition.findAll({ where: { unitId: handover.unitId, closedAt: null }, transaction }),
    LogEntry.findAll({ where: { unitId: handover.unitId, carryToHandover: true, shiftStart: handover.shiftStart }, transaction }),
    StandingOrder.findAll({ where: { stationId: unit!.stationId, issuedAt: { [Op.gte]: handover.shiftStart, [Op.lte]: now } }, transaction }),
    HandoverItem.findAll({ where: { handoverId: handover.id }, attributes: ['kind', 'sourceId'], transaction }),
  ]);
  const have = new Set(existing.map((i) => `${i.kind}:${i.sourceId}`));
  const wanted: { kind: ItemKind; sourceId: number; title: string; detail: string | null; priority: 'normal' | 'high' }[] = [
    ...flags.map((f) => ({
      kind: 'abnormal_reading' as const,
      sourceId: f.id,
      title: `${checkCatalog[f.parameter as CheckKey]?.label ?? f.parameter} — ${f.severity}`,
      detail: f.comment,
      priority: f.severity === 'alarm' ? ('high' as const) : ('normal' as const),
    })),
    ...conditions.map((c) => ({ kind: 'condition' as const, sourceId: c.id, title: c.title, detail: c.requiredAction, priority: 'high' as const })),
    ...entries.map((e) => ({ kind: 'log_entry' as const, sourceId: e.id, title: e.text.slice(0, 300), detail: null, priority: 'normal' as const })),
    ...orders.map((o) => ({ kind: 'standing_order' as const, sourceId: o.id, title: `New standing order: ${o.title}`, detail: o.bodyText.slice(0, 4000), priority: 'normal' as const })),
  ].filter((w) => !have.has(`${w.kind}:${w.sourceId}`));
  if (wanted.length) {
    await HandoverItem.bulkCreate(
      wanted.map((w) => ({ handoverId: handover.id, ...w, reference: null, createdBy: actorId, createdAt: now })),
      { transaction },
    );
  }
  return wanted.length;
}
