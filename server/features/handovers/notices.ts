// E-mail about handovers and deadlines: the incoming crew on submit; the shift lead when a handover
// is still not accepted 30 minutes into the shift, or when a condition's deadline passes. Each is
// written to the outbox in the transaction of its change (the submit; the mark that the reminder
// is due) and sent from there, once.
import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { stationLocalLabel } from '../../../shared/shift-time';
import { enqueueNotice, type OutboxSender } from '../../lib/outbox';
import { unitOfWork } from '../../lib/unit-of-work';
import { Condition } from '../conditions/index';
import { findUnit } from '../plant/index';
import { shiftChangeAt } from '../shifts/index';
import { settingsForStation } from '../stations/index';
import { findPeople, findPerson } from '../users/index';
import type { Role } from '../../../shared/roles';
import { shiftRoles } from '../../../shared/policies/handover';
import { Handover, HandoverItem } from './model';

/** Late records read at a time by the reminder check. */
const PAGE = 50;

async function crewAddresses(crewId: number | null, roles: readonly Role[], transaction?: Transaction) {
  if (!crewId) return [];
  return (await findPeople({ crewIds: [crewId], activeOnly: true, roles }, transaction)).map((u) => u.email);
}

export type Notices = ReturnType<typeof makeNotices>;

export function makeNotices(sequelize: Sequelize, outbox: Pick<OutboxSender, 'wake'>, publicUrl: string) {
  const wakeAfterCommit = (transaction: Transaction) => transaction.afterCommit(() => void outbox.wake());

  /** The incoming crew's notice of a submit, written in the submit's own transaction (after its items are synced). */
  async function handoverSubmitted(handoverId: number, transaction: Transaction) {
    const h = await Handover.findByPk(handoverId, { transaction });
    if (!h) return;
    const [unit, items, submitter] = await Promise.all([
      findUnit(h.unitId, transaction),
      HandoverItem.findAll({ where: { handoverId, removedAt: null }, transaction }),
      h.submittedBy ? findPerson(h.submittedBy, transaction) : null,
    ]);
    const settings = await settingsForStation(unit!.stationId, transaction);
    const high = items.filter((i) => i.priority === 'high');
    const queued = await enqueueNotice(
      {
        kind: 'handover_submitted',
        refId: handoverId,
        to: await crewAddresses(h.incomingCrewId, shiftRoles, transaction),
        subject: `Handover for ${unit!.name} submitted — ${items.length} items to acknowledge`,
        text: [
          `${submitter?.name ?? 'The outgoing crew'} submitted the handover for ${unit!.name}, shift change ${stationLocalLabel(h.handoverAt, settings.timeZone)} (${settings.timeZone}).`,
          `${items.length} items, ${high.length} of high priority:`,
          ...items.map((i) => `- [${i.priority}] ${i.title}`),
          '',
          `Acknowledge each item on the board: ${publicUrl}/handover?unit=${h.unitId}`,
        ].join('\n'),
      },
      transaction,
    );
    if (queued) wakeAfterCommit(transaction);
  }

  /**
   * Writes the reminders due at `now` to the outbox, each once: the record's "sent" mark is set by a
   * guarded UPDATE in the same transaction as the notice, so two servers checking at once write one.
   * Called every minute by the server; returns how many were written.
   */
  async function queueDue(now = new Date()): Promise<number> {
    let queued = 0;
    // In pages, oldest first, until none is left: each one looked at is marked (told or not), so the
    // next page starts after it. One page only left the 51st late handover for the next minute.
    for (let after = 0; ; ) {
      const late = await Handover.findAll({
        where: { id: { [Op.gt]: after }, status: { [Op.ne]: 'accepted' }, reminderSentAt: null, handoverAt: { [Op.lte]: new Date(now.getTime() - 30 * 60_000) } },
        attributes: ['id', 'unitId', 'status', 'incomingCrewId'],
        order: [['id', 'ASC']],
        limit: PAGE,
      });
      for (const h of late) {
        after = Number(h.id);
        const unit = await findUnit(h.unitId);
        const to = await crewAddresses(h.incomingCrewId, ['shift_lead']);
        const wrote = await unitOfWork(sequelize, async (transaction) => {
          const [, marked] = await sequelize.query('UPDATE handovers SET reminder_sent_at = ? WHERE id = ? AND reminder_sent_at IS NULL', {
            replacements: [now, h.id],
            type: QueryTypes.UPDATE,
            transaction,
          });
          if (!Number(marked)) return false;
          return enqueueNotice(
            {
              kind: 'handover_late',
              refId: h.id,
              to,
              subject: `Handover for ${unit!.name} not yet accepted`,
              text: `The handover for ${unit!.name} is ${h.status === 'draft' ? 'still a draft' : 'submitted but not accepted'} 30 minutes into the shift.\n${publicUrl}/handover?unit=${h.unitId}`,
            },
            transaction,
          );
        }, 'queue late-acceptance reminder');
        if (wrote) queued += 1;
      }
      if (late.length < PAGE) break;
    }
    for (let after = 0; ; ) {
      const expired = await Condition.findAll({
        where: { id: { [Op.gt]: after }, closedAt: null, expiryNoticeSentAt: null, limitAt: { [Op.lte]: now } },
        order: [['id', 'ASC']],
        limit: PAGE,
      });
      for (const c of expired) {
        after = Number(c.id);
        const unit = await findUnit(c.unitId);
        const change = await shiftChangeAt(unit!.stationId, now);
        const leads = await crewAddresses(change.outgoingCrewId, ['shift_lead']);
        const owner = await findPerson(c.ownerId);
        const wrote = await unitOfWork(sequelize, async (transaction) => {
          const [, marked] = await sequelize.query('UPDATE conditions SET expiry_notice_sent_at = ? WHERE id = ? AND expiry_notice_sent_at IS NULL AND closed_at IS NULL', {
            replacements: [now, c.id],
            type: QueryTypes.UPDATE,
            transaction,
          });
          if (!Number(marked)) return false;
          return enqueueNotice(
            {
              kind: 'condition_deadline',
              refId: c.id,
              to: [...new Set([...leads, ...(owner ? [owner.email] : [])])],
              subject: `Deadline passed: ${c.title}`,
              text: `The time limit of “${c.title}” on ${unit!.name} passed at ${stationLocalLabel(c.limitAt, change.settings.timeZone)}.\nRequired action: ${c.requiredAction}\n${publicUrl}/log?unit=${c.unitId}`,
            },
            transaction,
          );
        }, 'queue deadline notice');
        if (wrote) queued += 1;
      }
      if (expired.length < PAGE) break;
    }
    if (queued) void outbox.wake();
    return queued;
  }

  return { handoverSubmitted, queueDue };
}
