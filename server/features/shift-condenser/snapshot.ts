// Freezing the condenser state into a handover at submit, inside the submit's transaction, so the
// record keeps what the outgoing crew saw even when rounds are added or amended afterwards.
import type { Sequelize, Transaction } from 'sequelize';
import type { CondenserSnapshot } from '../../../shared/shift-condenser';
import { makeShiftCondenserService } from './service';

export async function freezeCondenserState(
  sequelize: Sequelize,
  handover: { unitId: number; shiftStart: Date; handoverAt: Date },
  at: Date,
  transaction: Transaction,
): Promise<CondenserSnapshot> {
  // A late submit still describes the outgoing shift only.
  const until = at < handover.handoverAt ? at : handover.handoverAt;
  const state = await makeShiftCondenserService(sequelize).stateOver(handover.unitId, handover.shiftStart, until, transaction);
  return { version: 1, frozenAt: at.toISOString(), state };
}
