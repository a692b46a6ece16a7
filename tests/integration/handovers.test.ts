import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '../../shared/roles';
import { Handover } from '../../server/features/handovers/model';
import { anonymousAgent, buildApp, closeAll, makeStation, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();
const post = (agent: Agent, path: string, body: unknown = {}) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);

let unitId = 0;
let joinIncomingCrew: () => Promise<Agent>;
const agents = {} as Record<'outOperator' | 'outLead' | 'inOperator' | 'inLead' | 'inTrainee' | 'admin', Agent>;

beforeAll(async () => {
  // Another station's handover exists first, so a lookup that ignores the item would find it.
  const decoy = await makeStation(2);
  const decoyOwner = await makeUser('operator', { crewId: decoy.crews[0]!.id });
  await Handover.create({
    unitId: decoy.unit.id,
    shiftStart: new Date('2026-01-01T05:00:00Z'),
    handoverAt: new Date('2026-01-01T17:00:00Z'),
    outgoingCrewId: decoy.crews[0]!.id,
    incomingCrewId: decoy.crews[1]!.id,
    notesHtml: '',
    status: 'submitted',
    createdBy: decoyOwner.id,
    createdAt: new Date(),
    submittedBy: decoyOwner.id,
    submittedAt: new Date(),
    acceptedBy: null,
    acceptedAt: null,
  });
  const { station, unit, crews } = await makeStation(2);
  unitId = unit.id;
  const [a, b] = crews as [(typeof crews)[0], (typeof crews)[0]];
  const person = async (role: Role, crewId: number | null) => signedInAgent(built, (await makeUser(role, { crewId })).email);
  agents.outOperator = await person('operator', a.id);
  agents.outLead = await person('shift_lead', a.id);
  agents.inOperator = await person('operator', b.id);
  agents.inLead = await person('shift_lead', b.id);
  agents.inTrainee = await person('trainee', b.id);
  agents.admin = await person('admin', null);
  joinIncomingCrew = async () => person('operator', b.id);
  // Crew A works the shift in progress, crew B the next one.
  const shifts = await agents.admin.get(`/api/units/${unitId}/log/shifts`).expect(200);
  await agents.admin
    .put(`/api/stations/${station.id}/crew-rotation`)
    .set('X-CSRF-Token', agents.admin.csrf)
    .send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: [a.id, b.id] })
    .expect(200);
  // An open flag, to be picked up by the handover.
  await post(agents.outLead, `/api/units/${unitId}/flags`, { parameter: 'ttd', severity: 'watch', comment: 'TTD creeping up' }).expect(201);
});

describe('shift handover', () => {
  it('answers 401 signed out and 403 to a trainer', async () => {
    await (await anonymousAgent(built)).get(`/api/units/${unitId}/handovers/current`).expect(401);
    const trainer = await signedInAgent(built, (await makeUser('trainer')).email);
    await post(trainer, '/api/handovers/1/submit').expect(403);
    await post(trainer, '/api/handover-items/1/acknowledge').expect(403);
  });

  it('runs from draft to accepted turnover with the crews’ rules enforced at each step', async () => {
    // The incoming crew finds no handover until the outgoing crew opens one.
    const before = await agents.inOperator.get(`/api/units/${unitId}/handovers/current`).expect(200);
    expect(before.body.board).toBeNull();
    const opened = await agents.outOperator.get(`/api/units/${unitId}/handovers/current`).expect(200);
    const id = opened.body.board.handover.id;
    expect(opened.body.board.handover.status).toBe('draft');
    expect(opened.body.board.items.map((i: { kind: string }) => i.kind)).toContain('abnormal_reading');

    // Notes under a version check: the second of two saves from version 0 gets 409.
    await agents.outOperator.put(`/api/handovers/${id}/notes`).set('X-CSRF-Token', agents.outOperator.csrf).send({ html: '<p>Quiet night.</p>', version: 0 }).expect(200);
    const clash = await agents.outLead.put(`/api/handovers/${id}/notes`).set('X-CSRF-Token', agents.outLead.csrf).send({ html: '<p>Busy night.</p>', version: 0 });
    expect(clash.status).toBe(409);
    expect(clash.body.error.code).toBe('NOTES_CONFLICT');
    expect((await agents.outLead.get(`/api/handovers/${id}`)).body.board.handover.notesHtml).toBe('<p>Quiet night.</p>');
    const xss = await agents.outOperator.put(`/api/handovers/${id}/notes`).set('X-CSRF-Token', agents.outOperator.csrf).send({ html: '<p>ok</p><script>alert(1)</script>', version: 1 });
    expect(xss.status).toBe(200);
    expect((await agents.outLead.get(`/api/handovers/${id}`)).body.board.handover.notesHtml).toBe('<p>ok</p>');

    // Items: the outgoing crew adds; the incoming crew cannot; bad input is a 400.
    await post(agents.outOperator, `/api/handovers/${id}/items`, { kind: 'work_in_progress', title: '1-CWP-B seal replacement', reference: 'WP-1187', priority: 'high' }).expect(201);
    await post(agents.inOperator, `/api/handovers/${id}/items`, { kind: 'follow_up', title: 'mine' }).expect(403);
    const bad = await post(agents.outOperator, `/api/handovers/${id}/items`, { kind: 'gossip', title: '' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['kind', 'title']);

    // Nothing is acknowledged before submit; the outgoing crew submits.
    const board = (await agents.inOperator.get(`/api/handovers/${id}`)).body.board;
    const itemIds: number[] = board.items.map((i: { id: number }) => i.id);
    const beforeSubmit = await post(agents.inOperator, `/api/handover-items/${itemIds[0]}/acknowledge`);
    expect(beforeSubmit.status, JSON.stringify(beforeSubmit.body)).toBe(409);
    await post(agents.inOperator, `/api/handovers/${id}/submit`).expect(403);
    await post(agents.outOperator, `/api/handovers/${id}/submit`).expect(200);

    // After submit: no edits, amendments instead.
    await agents.outOperator.put(`/api/handovers/${id}/notes`).set('X-CSRF-Token', agents.outOperator.csrf).send({ html: '<p>late edit</p>', version: 2 }).expect(409);
    await post(agents.outOperator, `/api/handovers/${id}/items`, { kind: 'follow_up', title: 'forgot this' }).expect(409);
    await post(agents.outOperator, `/api/handovers/${id}/amendments`, { itemId: itemIds[0], reason: 'Permit number was wrong', text: 'Permit WP-1188' }).expect(201);

    // Acknowledgements: the outgoing crew cannot acknowledge its own handover.
    await post(agents.outLead, `/api/handover-items/${itemIds[0]}/acknowledge`).expect(403);
    for (const itemId of itemIds) {
      await post(agents.inOperator, `/api/handover-items/${itemId}/acknowledge`).expect(201);
      await post(agents.inTrainee, `/api/handover-items/${itemId}/acknowledge`).expect(201);
    }
    const twice = await post(agents.inOperator, `/api/handover-items/${itemIds[0]}/acknowledge`);
    expect(twice.status, JSON.stringify(twice.body)).toBe(409);
    expect(twice.body.error.message).toMatch(/already/);
    const query = await post(agents.inOperator, `/api/handover-items/${itemIds[0]}/queries`, { question: 'Is the TTD trend logged hourly?' });
    expect(query.status).toBe(201);

    // Acceptance waits for every item (the incoming lead has not acknowledged) and the open question.
    const early = await post(agents.inLead, `/api/handovers/${id}/accept`);
    expect(early.status).toBe(409);
    expect(early.body.error.message).toMatch(/open question/);
    for (const itemId of itemIds) await post(agents.inLead, `/api/handover-items/${itemId}/acknowledge`).expect(201);
    await post(agents.inOperator, `/api/handover-queries/${query.body.id}/answer`, { answer: 'no' }).expect(403);
    await post(agents.outOperator, `/api/handover-queries/${query.body.id}/answer`, { answer: 'Yes, per the standing order' }).expect(200);

    // Only the incoming shift lead accepts: not a trainee, not the outgoing lead.
    await post(agents.inTrainee, `/api/handovers/${id}/accept`).expect(403);
    await post(agents.outLead, `/api/handovers/${id}/accept`).expect(403);
    const accepted = await post(agents.inLead, `/api/handovers/${id}/accept`);
    expect(accepted.status).toBe(200);
    expect(accepted.body.board.handover).toMatchObject({ status: 'accepted' });
    expect(accepted.body.board.handover.submittedBy).toBeTruthy();
    expect(accepted.body.board.handover.acceptedBy).toBeTruthy();
    expect(accepted.body.board.amendments[0]).toMatchObject({ reason: 'Permit number was wrong' });
    await post(agents.inLead, `/api/handovers/${id}/accept`).expect(409);

    // After the turnover nothing more is acknowledged, and an unknown item is a 404, not a 409.
    const latecomer = await joinIncomingCrew();
    const afterTurnover = await post(latecomer, `/api/handover-items/${itemIds[0]}/acknowledge`);
    expect(afterTurnover.status).toBe(409);
    expect(afterTurnover.body.error.message).toMatch(/already accepted/);
    await post(latecomer, '/api/handover-items/999999/acknowledge').expect(404);
  });
});

describe('crew rotation and swaps', () => {
  it('lets only an administrator set them, with field messages for bad input', async () => {
    const { station, crews } = await makeStation(2);
    await agents.outLead.put(`/api/stations/${station.id}/crew-rotation`).set('X-CSRF-Token', agents.outLead.csrf).send({}).expect(403);
    const bad = await agents.admin.put(`/api/stations/${station.id}/crew-rotation`).set('X-CSRF-Token', agents.admin.csrf).send({ anchorShiftStart: '2026-03-01T03:17:00Z', crewIds: [crews[0]!.id] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.anchorShiftStart).toMatch(/start of a shift/);
    await post(agents.admin, `/api/stations/${station.id}/crew-swaps`, { shiftStart: '2026-03-01T05:00:00Z', crewId: 999_999, reason: 'sick' }).expect(400);
    await post(agents.admin, `/api/stations/${station.id}/crew-swaps`, { shiftStart: '2026-03-01T05:00:00Z', crewId: crews[1]!.id, reason: 'Crew A training day' }).expect(201);
  });
});
