// Ending a person's stored sessions inside the transaction of the change that ends them
// (deactivation, a password change), so the change and the sign-outs stand or fall together.
import { Op, type Transaction } from 'sequelize';
import { SessionRow } from './model';

/** Deletes the person's sessions (all but `exceptSessionId` when given); returns how many. */
export function endSessionsOf(userId: number, transaction: Transaction, exceptSessionId?: string): Promise<number> {
  return SessionRow.destroy({ where: { userId, ...(exceptSessionId ? { sid: { [Op.ne]: exceptSessionId } } : {}) }, transaction });
}
