// E-mail about handovers and deadlines: the incoming crew on submit; the shift lead when a handover
// is still not accepted 30 minutes into the shift, or when a condition's deadline passes.
import { Op } from 'sequelize';
import { stationLocalLabel } from '../../../shared/shift-time';
import type { Mailer } from '../../lib/mailer';
import { Condition } from '../conditions/model';
import { PlantUnit } from '../plant/model';
import { shiftChangeAt } from '../shifts/crews';
import { settingsForStation } from '../stations/settings';
import { User } from '../users/model';
import { Handover, HandoverItem } from './model';

const crewRoles = ['trainee', 'operator', 'shift_lead'];

async function crewAddresses(crewId: number | null, roles: string[]) {
  if (!crewId) return [];
  return (await User.findAll({ where: { crewId, active: true, role: roles }, attributes: ['email'] })).map((u) => u.email);
}

export type Notices = ReturnType<typeof makeNotices>;

export function makeNotices(mailer: Mailer, publicUrl: string) {
  async function handoverSubmitted(handoverId: number) {
    const h = await Handover.findByPk(handoverId);
    if (!h) return;
    const [unit, items, submitter] = await Promise.all([PlantUnit.findByPk(h.unitId), HandoverItem.findAll({ where: { handoverId, removedAt: null } }), h.submittedBy ? User.findByPk(h.submittedBy) : null]);
    const settings = await settingsForStation(unit!.stationId);
    const high = items.filter((i) => i.priority === 'high');
    await mailer.send({
      to: await crewAddresses(h.incomingCrewId, crewRoles),
      subject: `Handover for ${unit!.name} submitted — ${items.length} items to acknowledge`,
      text: [
        `${submitter?.name ?? 'The outgoing crew'} submitted the handover for ${unit!.name}, shift change ${stationLocalLabel(h.handoverAt, settings.timeZone)} (${settings.timeZone}).`,
        `${items.length} items, ${high.length} of high priority:`,
        ...items.map((i) => `- [${i.priority}] ${i.title}`),
        '',
        `Acknowledge each item on the board: ${publicUrl}/handover?unit=${h.unitId}`,
      ].join('\n'),
    });
  }

  /** Sends what is due at `now`; each notice once. Called every minute by the server. */
  async function sendDue(now = new Date()): Promise<number> {
    let sent = 0;
    const late = await Handover.findAll({
      where: { status: { [Op.ne]: 'accepted' }, reminderSentAt: null, handoverAt: { [Op.lte]: new Date(now.getTime() - 30 * 60_000) } },
      limit: 50,
    });
    for (const h of late) {
      const unit = await PlantUnit.findByPk(h.unitId);
      await mailer.send({
        to: await crewAddresses(h.incomingCrewId, ['shift_lead']),
        subject: `Handover for ${unit!.name} not yet accepted`,
        text: `The handover for ${unit!.name} is ${h.status === 'draft' ? 'still a draft' : 'submitted but not accepted'} 30 minutes into the shift.\n${publicUrl}/handover?unit=${h.unitId}`,
      });
      await h.update({ reminderSentAt: now });
      sent += 1;
    }
    const expired = await Condition.findAll({ where: { closedAt: null, expiryNoticeSentAt: null, limitAt: { [Op.lte]: now } }, limit: 50 });
    for (const c of expired) {
      const unit = await PlantUnit.findByPk(c.unitId);
      const change = await shiftChangeAt(unit!.stationId, now);
      const leads = await crewAddresses(change.outgoingCrewId, ['shift_lead']);
      const owner = await User.findByPk(c.ownerId);
      await mailer.send({
        to: [...new Set([...leads, ...(owner ? [owner.email] : [])])],
        subject: `Deadline passed: ${c.title}`,
        text: `The time limit of “${c.title}” on ${unit!.name} passed at ${stationLocalLabel(c.limitAt, change.settings.timeZone)}.\nRequired action: ${c.requiredAction}\n${publicUrl}/log?unit=${c.unitId}`,
      });
      await c.update({ expiryNoticeSentAt: now });
      sent += 1;
    }
    return sent;
  }

  return { handoverSubmitted, sendDue };
}
