// Items the handover picks up by itself: open flags, open conditions, log entries marked for
// handover in the outgoing shift, and standing orders issued during it. Each is keyed by its source
// (unique per handover), so two syncs at once attach it once; while the handover is a draft an
// item follows its source's title and priority (a flag escalated to alarm becomes a high-priority
// "— alarm" item). An item the crew removed stays removed.
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { checkCatalog, type CheckKey } from '../../../shared/calc/check-catalog';
import { Condition } from '../conditions/index';
import { Flag } from '../flags/index';
import { LogEntry } from '../log/index';
import { findUnit } from '../plant/index';
import { StandingOrder } from '../standing-orders/index';
import { HandoverItem, type Handover, type ItemKind } from './model';

type Wanted = { kind: ItemKind; sourceId: number; title: string; detail: string | null; priority: 'normal' | 'high' };

export const flagItemTitle = (parameter: string, severity: string) => `${checkCatalog[parameter as CheckKey]?.label ?? parameter} — ${severity}`;

async function wantedItems(handover: Handover, transaction: Transaction): Promise<Wanted[]> {
  const unit = await findUnit(handover.unitId, transaction);
  const now = new Date();
  const [flags, conditions, entries, orders] = await Promise.all([
    Flag.findAll({ where: { unitId: handover.unitId, status: 'open' }, transaction }),
    Condition.findAll({ where: { unitId: handover.unitId, closedAt: null }, transaction }),
    LogEntry.findAll({ where: { unitId: handover.unitId, carryToHandover: true, shiftStart: handover.shiftStart }, transaction }),
    StandingOrder.findAll({ where: { stationId: unit!.stationId, issuedAt: { [Op.gte]: handover.shiftStart, [Op.lte]: now } }, transaction }),
  ]);
  return [
    ...flags.map((f) => ({
      kind: 'abnormal_reading' as const,
      sourceId: f.id,
      title: flagItemTitle(f.parameter, f.severity),
      detail: f.comment,
      priority: f.severity === 'alarm' ? ('high' as const) : ('normal' as const),
    })),
    ...conditions.map((c) => ({ kind: 'condition' as const, sourceId: c.id, title: c.title, detail: c.requiredAction, priority: 'high' as const })),
    ...entries.map((e) => ({ kind: 'log_entry' as const, sourceId: e.id, title: e.text.slice(0, 300), detail: null, priority: 'normal' as const })),
    ...orders.map((o) => ({ kind: 'standing_order' as const, sourceId: o.id, title: `New standing order: ${o.title}`.slice(0, 300), detail: o.bodyText.slice(0, 4000), priority: 'normal' as const })),
  ];
}

/** Brings a draft's automatic items up to date; returns how many items it attached or changed. */
export async function syncAutomaticItems(handover: Handover, transaction: Transaction): Promise<number> {
  if (handover.status !== 'draft') return 0;
  const [wanted, existing] = await Promise.all([
    wantedItems(handover, transaction),
    HandoverItem.findAll({ where: { handoverId: handover.id, sourceId: { [Op.ne]: null } }, transaction }),
  ]);
  const have = new Map(existing.map((i) => [`${i.kind}:${i.sourceId}`, i]));
  const missing = wanted.filter((w) => !have.has(`${w.kind}:${w.sourceId}`));
  let attached = 0;
  for (const w of missing) {
    try {
      await HandoverItem.create({ handoverId: handover.id, ...w, reference: null, createdBy: null, createdAt: new Date() }, { transaction });
      attached += 1;
    } catch (error) {
      // A sync running beside this one attached the same source first: the unique key kept it to one.
      if (!(error instanceof UniqueConstraintError)) throw error;
    }
  }
  for (const w of wanted) {
    const item = have.get(`${w.kind}:${w.sourceId}`);
    if (!item || item.removedAt || (item.title === w.title && item.priority === w.priority)) continue;
    await item.update({ title: w.title, priority: w.priority, version: item.version + 1 }, { transaction });
    attached += 1;
  }
  return attached;
}
