// Automatic flags: a check outside its limits opens a flag for its parameter, or refreshes the
// one already open (escalating watch → alarm, never down). Clearing is a person's decision.
import type { Transaction } from 'sequelize';
import { checkKeys } from '../../../shared/calc/check-catalog';
import type { Evaluation } from '../../../shared/calc/evaluate';
import { publish } from '../../lib/live';
import { Flag, notYetFollowedUp } from './model';

export async function refreshAutomaticFlags(
  unitId: number,
  readingSetId: number,
  takenAt: Date,
  evaluation: Evaluation,
  transaction: Transaction,
): Promise<number> {
  const broken = checkKeys.map((k) => evaluation.checks[k]).filter((c) => c.status === 'watch' || c.status === 'alarm');
  if (!broken.length) return 0;
  const open = await Flag.findAll({
    where: { unitId, origin: 'automatic', status: 'open', parameter: broken.map((c) => c.key) },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  const byParameter = new Map(open.map((f) => [f.parameter, f]));
  let raised = 0;
  for (const check of broken) {
    const severity = check.status as 'watch' | 'alarm';
    const existing = byParameter.get(check.key);
    if (existing) {
      if (takenAt >= existing.lastSeenAt) {
        existing.lastReadingSetId = readingSetId;
        existing.lastSeenAt = takenAt;
        existing.lastValue = check.value;
      }
      const escalates = severity === 'alarm' && existing.severity !== 'alarm';
      if (escalates) existing.severity = 'alarm';
      existing.version += 1;
      await existing.save({ transaction });
      // A refreshed last value reaches the browsers with the round's own event; an escalation is news of its own.
      if (escalates) publish(transaction, { entity: 'flag', id: existing.id, unitId });
    } else {
      const created = await Flag.create(
        {
          unitId,
          parameter: check.key,
          origin: 'automatic',
          severity,
          status: 'open',
          firstReadingSetId: readingSetId,
          lastReadingSetId: readingSetId,
          lastValue: check.value,
          raisedAt: takenAt,
          lastSeenAt: takenAt,
          raisedBy: null,
          comment: `${check.label} outside its ${severity} limit`,
          ...notYetFollowedUp,
        },
        { transaction },
      );
      publish(transaction, { entity: 'flag', id: created.id, unitId });
      raised += 1;
    }
  }
  return raised;
}
