// Automatic flags: a check outside its limits opens a flag for its parameter, or refreshes the
// one already open (escalating watch → alarm, never down). Clearing is a person's decision.
import type { Transaction } from 'sequelize';
import { checkKeys } from '../../../shared/calc/check-catalog';
import type { Evaluation } from '../../../shared/calc/evaluate';
import { publish } from '../../lib/live';
import { lockUnit } from '../plant/index';
import { Flag, notYetFollowedUp } from './model';

const brokenChecks = (evaluation: Evaluation) => checkKeys.map((k) => evaluation.checks[k]).filter((c) => c.status === 'watch' || c.status === 'alarm');

/**
 * Writers that may open automatic flags on a unit take turns on the unit's row, first thing in
 * their transaction (before any insert's foreign-key check takes a shared lock on it). Without the
 * turn, two rounds find no open flag for a parameter and both insert one: InnoDB's gap locks let
 * both look and then make one of them a deadlock victim (the unit of work would run it again).
 * A round inside its limits skips the turn and never waits.
 */
export async function takeFlagTurn(unitId: number, transaction: Transaction, evaluation?: Evaluation): Promise<void> {
  if (evaluation && brokenChecks(evaluation).length === 0) return;
  await lockUnit(unitId, transaction);
}

export async function refreshAutomaticFlags(
  unitId: number,
  readingSetId: number,
  takenAt: Date,
  evaluation: Evaluation,
  transaction: Transaction,
): Promise<number> {
  const broken = brokenChecks(evaluation);
  if (!broken.length) return 0;
  const open = await Flag.findAll({
    where: { unitId, origin: 'automatic', status: 'open', parameter: broken.map((c) => c.key) },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  const byParameter = new Map(open.map((f) => [f.parameter, f]));
  // Flags this round only brings up to date (last value, last seen): no hook watches those
  // columns (the search document and the handover's item show neither), so they are written
  // together in one statement instead of one save each.
  const seenAgain: { id: number; value: number | null }[] = [];
  let raised = 0;
  for (const check of broken) {
    const severity = check.status as 'watch' | 'alarm';
    const existing = byParameter.get(check.key);
    const escalates = existing !== undefined && severity === 'alarm' && existing.severity !== 'alarm';
    if (existing && !escalates && takenAt >= existing.lastSeenAt) {
      seenAgain.push({ id: existing.id, value: check.value });
      continue;
    }
    if (existing) {
      if (takenAt >= existing.lastSeenAt) {
        existing.lastReadingSetId = readingSetId;
        existing.lastSeenAt = takenAt;
        existing.lastValue = check.value;
      }
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
  if (seenAgain.length) {
    await Flag.sequelize!.query(
      `UPDATE flags SET last_reading_set_id = ?, last_seen_at = ?, last_value = CASE id ${seenAgain.map(() => 'WHEN ? THEN ?').join(' ')} END, version = version + 1 WHERE id IN (${seenAgain.map(() => '?').join(', ')})`,
      { replacements: [readingSetId, takenAt, ...seenAgain.flatMap((f) => [f.id, f.value]), ...seenAgain.map((f) => f.id)], transaction },
    );
  }
  return raised;
}
