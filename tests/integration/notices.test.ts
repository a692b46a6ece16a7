import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { Condition } from '../../server/features/conditions/model';
import { Handover, HandoverItem } from '../../server/features/handovers/model';
import { buildApp, closeAll, makeStation, makeUser, signedInAgent, clearOutbox } from './support/test-app';
import { startCatcher, waitForMail, waitForMessage, type Catcher } from './support/mail';

let catcher: Catcher;
let built: ReturnType<typeof buildApp>;
beforeAll(async () => {
  await clearOutbox();
  catcher = await startCatcher();
  built = buildApp({ smtpUrl: catcher.smtpUrl });
});
afterAll(async () => {
  await catcher.stop();
  await closeAll();
});

afterEach(() => vi.useRealTimers());

describe('e-mail notices', () => {
  it('mails the incoming crew on submit, and the incoming lead once when acceptance is 30 minutes late', async () => {
    const { station, unit, crews } = await makeStation(2);
    const [a, b] = crews as [(typeof crews)[0], (typeof crews)[0]];
    const outgoing = await makeUser('operator', { crewId: a.id });
    const inLead = await makeUser('shift_lead', { crewId: b.id });
    const inOperator = await makeUser('operator', { crewId: b.id });
    await makeUser('operator', { crewId: null });
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    const shifts = await admin.get(`/api/units/${unit.id}/log/shifts`).expect(200);
    await admin.put(`/api/stations/${station.id}/crew-rotation`).set('X-CSRF-Token', admin.csrf).send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: [a.id, b.id] }).expect(200);

    const writer = await signedInAgent(built, outgoing.email);
    const board = (await writer.post(`/api/units/${unit.id}/handovers/current`).set('X-CSRF-Token', writer.csrf).send({}).expect(201)).body.board;
    await writer.post(`/api/handovers/${board.handover.id}/items`).set('X-CSRF-Token', writer.csrf).send({ kind: 'follow_up', title: 'Vent waterbox B', priority: 'high' }).expect(201);
    const before = catcher.messages.length;
    // Submitted within the window around the shift change: the server's clock half an hour before it.
    vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
    vi.setSystemTime(new Date(new Date(board.handover.handoverAt).getTime() - 30 * 60_000));
    await writer.post(`/api/handovers/${board.handover.id}/submit`).set('X-CSRF-Token', writer.csrf).send({}).expect(200);
    const mail = (await waitForMail(catcher, before + 1)).at(-1)!;
    expect(mail.to.sort()).toEqual([inLead.email, inOperator.email].sort());
    expect(mail.subject).toMatch(/submitted — 1 items to acknowledge/);
    expect(mail.text).toContain('[high] Vent waterbox B');
    expect(mail.text).toContain(`/handover?unit=${unit.id}`);

    // Not accepted 30 minutes into the shift: the incoming lead is told, once.
    const h = await Handover.findByPk(board.handover.id);
    const dueAt = new Date(h!.handoverAt.getTime() + 31 * 60_000);
    expect(await built.notices.queueDue(dueAt)).toBeGreaterThanOrEqual(1);
    // Other files' handovers in the shared database may be late too: this unit's is the one with its link.
    const reminder = await waitForMessage(catcher, (m) => m.subject === `Handover for ${unit.name} not yet accepted` && m.text.includes(`/handover?unit=${unit.id}`));
    expect(reminder?.to).toEqual([inLead.email]);
    expect(await built.notices.queueDue(dueAt)).toBe(0);
    expect(await HandoverItem.count({ where: { handoverId: h!.id } })).toBe(1);
    vi.useRealTimers();
  });

  it('mails the shift lead on shift and the owner when a condition’s deadline passes', async () => {
    const { unit, crews } = await makeStation(1);
    const lead = await makeUser('shift_lead', { crewId: crews[0]!.id });
    const owner = await makeUser('operator');
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    const shifts = await admin.get(`/api/units/${unit.id}/log/shifts`).expect(200);
    await admin.put(`/api/stations/${unit.stationId}/crew-rotation`).set('X-CSRF-Token', admin.csrf).send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: [crews[0]!.id] }).expect(200);
    const condition = await Condition.create({
      unitId: unit.id,
      title: 'Chlorine dosing pump out of service',
      requiredAction: 'Restore within 24 h',
      startedAt: new Date(Date.now() - 25 * 3_600_000),
      limitAt: new Date(Date.now() - 3_600_000),
      ownerId: owner.id,
      openedBy: owner.id,
      openedAt: new Date(Date.now() - 25 * 3_600_000),
      closedBy: null,
      closedAt: null,
      closingEntryId: null,
    });
    await built.notices.queueDue(new Date());
    const notice = await waitForMessage(catcher, (m) => m.subject === 'Deadline passed: Chlorine dosing pump out of service' && m.to.includes(owner.email));
    expect(notice?.to.sort()).toEqual([lead.email, owner.email].sort());
    await condition.reload();
    expect(condition.expiryNoticeSentAt).not.toBeNull();
  });
  it('reminds every late handover in one check, however many are late (not only the first page)', async () => {
    const { unit, crews } = await makeStation(2);
    const lead = await makeUser('shift_lead', { crewId: crews[1]!.id });
    // Sixty shifts of this unit, each left as a draft; every one is more than 30 minutes past its change.
    const first = Date.UTC(2020, 0, 1, 6);
    await Handover.bulkCreate(
      Array.from({ length: 60 }, (_, i) => ({
        unitId: unit.id,
        shiftStart: new Date(first + i * 12 * 3_600_000),
        handoverAt: new Date(first + (i + 1) * 12 * 3_600_000),
        outgoingCrewId: crews[0]!.id,
        incomingCrewId: crews[1]!.id,
        notesHtml: '',
        status: 'draft' as const,
        createdBy: lead.id,
        createdAt: new Date(first),
      })),
    );
    await built.notices.queueDue(new Date());
    const left = await Handover.count({ where: { unitId: unit.id, reminderSentAt: null } });
    expect(left).toBe(0);
    await waitForMail(catcher, 0);
    const mine = () => catcher.messages.filter((m) => m.subject === `Handover for ${unit.name} not yet accepted`);
    for (let waited = 0; mine().length < 60 && waited < 10_000; waited += 100) await new Promise((r) => setTimeout(r, 100));
    expect(mine()).toHaveLength(60);
  });
});
