// What other features ask about handovers without reading its tables themselves.
import type { Transaction } from 'sequelize';
import { NotFound } from '../../lib/errors';
import { Handover, HandoverItem, type HandoverStatus } from './model';

export async function handoverItemExists(itemId: number) {
  return (await HandoverItem.findByPk(itemId, { attributes: ['id'] })) !== null;
}

/** The handovers around a shift starting at `shiftStart`: the one it received and the one it gave. */
export async function handoversAroundShift(unitId: number, shiftStart: Date) {
  const [received, given] = await Promise.all([
    Handover.findOne({ where: { unitId, handoverAt: shiftStart }, attributes: ['id'] }),
    Handover.findOne({ where: { unitId, shiftStart }, attributes: ['id'] }),
  ]);
  return { receivedId: received?.id ?? null, givenId: given?.id ?? null };
}

/** A current (not removed) item and its handover; 404 when there is none. */
export async function itemWithHandover(itemId: number) {
  const item = await HandoverItem.findByPk(itemId);
  if (!item || item.removedAt) throw new NotFound('That handover item');
  const handover = (await Handover.findByPk(item.handoverId))!;
  return { item, handover };
}

/** The handover's status under its row lock, held for the rest of the transaction. */
export async function lockedHandoverStatus(handoverId: number, transaction: Transaction): Promise<HandoverStatus> {
  return (await Handover.findByPk(handoverId, { transaction, lock: transaction.LOCK.UPDATE, attributes: ['id', 'status'] }))!.status;
}
