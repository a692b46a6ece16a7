import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Role } from '../../shared/roles';
import type { Overview } from '../../shared/schemas/overview';
import { shiftStartFor } from '../../shared/shift-time';
import { defaultStationSettings } from '../../server/features/stations/settings';
import { buildApp, closeAll, makeStation, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);
afterEach(() => vi.useRealTimers());
const built = buildApp();
const post = (agent: Agent, path: string, body: unknown = {}) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);
const waiting = async (agent: Agent) => ((await agent.get('/api/overview').expect(200)).body as Overview).waiting;
const panelOf = async (agent: Agent, unitId: number) => ((await agent.get('/api/overview').expect(200)).body as Overview).units.find((u) => u.unit.id === unitId)!;

const round = {
  pressure: { value: 6, unit: 'kPa_a' },
  hotwellTemperature: { value: 35.5, unit: 'degC' },
  cwInletTemperature: { value: 22, unit: 'degC' },
  cwOutletTemperature: { value: 31, unit: 'degC' },
  cwFlow: { value: 54_000, unit: 'm3_h' },
};

let stationId = 0;
let unitId = 0;
const a = {} as Record<'lead' | 'operator' | 'trainee', Agent>;
const b = {} as Record<'lead' | 'operator', Agent>;
let trainer: Agent;
let traineeName = '';

beforeAll(async () => {
  const { station, unit, crews } = await makeStation(2);
  stationId = station.id;
  unitId = unit.id;
  const [crewA, crewB] = [crews[0]!.id, crews[1]!.id];
  const person = async (role: Role, crewId: number | null) => {
    const user = await makeUser(role, { crewId });
    return { user, agent: await signedInAgent(built, user.email) };
  };
  a.lead = (await person('shift_lead', crewA)).agent;
  a.operator = (await person('operator', crewA)).agent;
  const trainee = await person('trainee', crewA);
  a.trainee = trainee.agent;
  traineeName = trainee.user.name;
  b.lead = (await person('shift_lead', crewB)).agent;
  b.operator = (await person('operator', crewB)).agent;
  trainer = (await person('trainer', null)).agent;
  const admin = (await person('admin', null)).agent;
  // Crew A works the shift in progress, crew B the next one.
  const shifts = await admin.get(`/api/units/${unitId}/log/shifts`).expect(200);
  await admin.put(`/api/stations/${stationId}/crew-rotation`).set('X-CSRF-Token', admin.csrf).send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: [crewA, crewB] }).expect(200);
});

describe('GET /api/overview — waiting on you', () => {
  it('lists a submitted handover’s items for each incoming crew member until they acknowledge, and counts what is outstanding', async () => {
    const opened = await post(a.operator, `/api/units/${unitId}/handovers/current`).expect(201);
    const handoverId = opened.body.board.handover.id;
    await post(a.operator, `/api/handovers/${handoverId}/items`, { kind: 'follow_up', title: 'Waterbox A backwash due at 02:00', priority: 'high' }).expect(201);
    expect((await panelOf(a.operator, unitId)).handover).toMatchObject({ state: 'draft', id: handoverId });
    expect((await waiting(b.operator)).handoverItems).toEqual([]);
    // Submitted within the window around the shift change: the server's clock half an hour before it.
    vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
    vi.setSystemTime(new Date(Date.parse(opened.body.board.handover.handoverAt) - 30 * 60_000));
    await post(a.operator, `/api/handovers/${handoverId}/submit`).expect(200);

    const board = (await a.operator.get(`/api/handovers/${handoverId}`).expect(200)).body.board;
    const itemIds: number[] = board.items.map((i: { id: number }) => i.id);
    expect(itemIds.length).toBeGreaterThan(0);
    const forOperatorB = await waiting(b.operator);
    expect(forOperatorB.handoverItems.map((i) => i.itemId).sort()).toEqual([...itemIds].sort());
    expect(forOperatorB.handoverItems.find((i) => i.title === 'Waterbox A backwash due at 02:00')).toMatchObject({ handoverId, unitId, priority: 'high' });
    // Two incoming crew members (lead and operator), each to acknowledge every item.
    expect((await panelOf(b.lead, unitId)).handover).toMatchObject({ state: 'submitted', id: handoverId, acknowledgementsOutstanding: 2 * itemIds.length, openQuestions: 0 });
    // The outgoing crew and people outside both crews have nothing to acknowledge.
    expect((await waiting(a.operator)).handoverItems).toEqual([]);
    expect((await waiting(trainer)).handoverItems).toEqual([]);

    // A question waits on the outgoing crew's writers until answered.
    const asked = await post(b.operator, `/api/handover-items/${itemIds[0]}/queries`, { question: 'Which strainer is blocked?' }).expect(201);
    expect((await waiting(a.operator)).handoverQuestions).toEqual([expect.objectContaining({ queryId: asked.body.id, unitId, question: 'Which strainer is blocked?' })]);
    expect((await waiting(b.operator)).handoverQuestions).toEqual([]);
    await post(a.operator, `/api/handover-queries/${asked.body.id}/answer`, { answer: 'Strainer B' }).expect(200);
    expect((await waiting(a.operator)).handoverQuestions).toEqual([]);

    for (const id of itemIds) await post(b.operator, `/api/handover-items/${id}/acknowledge`).expect(201);
    expect((await waiting(b.operator)).handoverItems).toEqual([]);
    expect((await waiting(b.lead)).handoverItems).toHaveLength(itemIds.length);
    expect((await panelOf(b.lead, unitId)).handover).toMatchObject({ state: 'submitted', acknowledgementsOutstanding: itemIds.length });

    // Accepted, nothing waits any more (and no submitted handover is left behind for other tests' reminders).
    expect((await waiting(b.lead)).handoversToAccept).toEqual([]);
    for (const id of itemIds) await post(b.lead, `/api/handover-items/${id}/acknowledge`).expect(201);
    // Everything acknowledged and answered: the incoming lead is told the handover is ready to accept.
    expect((await waiting(b.lead)).handoversToAccept).toEqual([{ handoverId, unitId, unitName: expect.any(String) }]);
    expect((await waiting(b.operator)).handoversToAccept).toEqual([]);
    await post(b.lead, `/api/handovers/${handoverId}/accept`).expect(200);
    expect((await waiting(b.lead)).handoverItems).toEqual([]);
    expect((await waiting(b.lead)).handoversToAccept).toEqual([]);
    expect((await panelOf(b.lead, unitId)).handover).toMatchObject({ state: 'accepted', id: handoverId, acknowledgementsOutstanding: 0 });

    // Amended after the turnover: the incoming crew is asked to acknowledge the item again.
    await post(a.operator, `/api/handovers/${handoverId}/amendments`, { itemId: itemIds[0], reason: 'Time was wrong', text: 'Backwash due at 03:00' }).expect(201);
    expect((await waiting(b.operator)).handoverItems.map((i) => i.itemId)).toEqual([itemIds[0]]);
    expect((await panelOf(b.lead, unitId)).handover).toMatchObject({ state: 'accepted', acknowledgementsOutstanding: 2 });
    await post(b.operator, `/api/handover-items/${itemIds[0]}/acknowledge`).expect(201);
    expect((await waiting(b.operator)).handoverItems).toEqual([]);
  });

  it('lists a trainee’s round for the operators of the trainee’s crew to countersign, until one does', async () => {
    const recorded = await post(a.trainee, `/api/units/${unitId}/readings`, round);
    expect(recorded.status, JSON.stringify(recorded.body)).toBe(201);
    const listed = (await waiting(a.operator)).traineeRounds.find((r) => r.id === recorded.body.id);
    expect(listed).toMatchObject({ unitId, recordedBy: traineeName, timeZone: 'Europe/Berlin' });
    expect((await waiting(a.lead)).traineeRounds.map((r) => r.id)).toContain(recorded.body.id);
    // Another crew's operator did not walk it; a trainer and the trainee do not countersign rounds.
    expect((await waiting(b.operator)).traineeRounds.map((r) => r.id)).not.toContain(recorded.body.id);
    expect((await waiting(trainer)).traineeRounds).toEqual([]);
    expect((await waiting(a.trainee)).traineeRounds).toEqual([]);
    expect((await panelOf(a.operator, unitId)).round).toMatchObject({ id: recorded.body.id, recordedAsTrainee: true, needsCountersign: true });

    await post(a.operator, `/api/readings/${recorded.body.id}/countersign`).expect(200);
    expect((await waiting(a.lead)).traineeRounds.map((r) => r.id)).not.toContain(recorded.body.id);
    expect((await panelOf(a.operator, unitId)).round).toMatchObject({ needsCountersign: false });
  });

  it('lists a training entry awaiting countersign for operators and shift leads, not for trainers', async () => {
    const taskKey = `OV-${String(Date.now() % 10_000).padStart(4, '0')}`;
    await post(trainer, '/api/training/tasks', {
      taskKey,
      position: 'field_operator',
      system: 'circulating_water',
      title: 'Backwash a condenser waterbox',
      standard: 'Backwashes per procedure and records ΔP before and after',
      procedureRef: 'TST-OP-CW-07',
      requiredPerformances: 2,
    }).expect(201);
    const entry = await post(a.trainee, '/api/training/entries', { taskKey, performedOn: new Date().toISOString().slice(0, 10), level: 'supervised', note: 'Backwashed waterbox A with the operator' });
    expect(entry.status, JSON.stringify(entry.body)).toBe(201);
    expect((await waiting(a.operator)).trainingEntries.find((e) => e.id === entry.body.id)).toMatchObject({ trainee: traineeName, taskTitle: 'Backwash a condenser waterbox', level: 'supervised' });
    expect((await waiting(trainer)).trainingEntries).toEqual([]);
    await post(a.operator, `/api/training/entries/${entry.body.id}/countersign`).expect(200);
    expect((await waiting(a.lead)).trainingEntries.map((e) => e.id)).not.toContain(entry.body.id);
  });

  it('lists a standing order the person on shift has not read yet, until they acknowledge it', async () => {
    const crewIds = [(await a.operator.get('/api/me').expect(200)).body.user.crewId];
    const order = await post(a.lead, `/api/standing-orders?stationId=${stationId}`, {
      title: 'Log the air-ejector steam pressure every round',
      bodyHtml: '<p>Until the second-stage nozzle is replaced.</p>',
      effectiveFrom: new Date(Date.now() - 60_000).toISOString(),
      crewIds,
    });
    expect(order.status, JSON.stringify(order.body)).toBe(201);
    const orderId = order.body.order.id;
    expect((await waiting(a.operator)).standingOrders.find((o) => o.id === orderId)).toMatchObject({ title: 'Log the air-ejector steam pressure every round' });
    // Crew B is not addressed (and not on shift).
    expect((await waiting(b.operator)).standingOrders.map((o) => o.id)).not.toContain(orderId);
    await post(a.operator, `/api/standing-orders/${orderId}/acknowledge`).expect(201);
    expect((await waiting(a.operator)).standingOrders.map((o) => o.id)).not.toContain(orderId);
    expect((await waiting(a.trainee)).standingOrders.map((o) => o.id)).toContain(orderId);
  });

  it('lists a trainer’s recent review comment on the person’s log entry', async () => {
    const text = `Vacuum dipped 0.3 kPa during the waterbox backwash ${Date.now()}`;
    const written = await post(a.operator, `/api/units/${unitId}/log`, { position: 'control_room', category: 'operation', text });
    expect(written.status, JSON.stringify(written.body)).toBe(201);
    const shiftStart = shiftStartFor(new Date(), defaultStationSettings.timeZone, defaultStationSettings.shiftChangeTimes).toISOString();
    const view = (await trainer.get(`/api/logbook/units/${unitId}/shifts/${shiftStart}`).expect(200)).body;
    const doc = view.documents.find((d: { kind: string; refId: number }) => d.kind === 'log_entry' && d.refId === written.body.id);
    const comment = await post(trainer, '/api/logbook/review-comments', { documentId: doc.id, body: 'Say which waterbox and the ΔP before and after.' });
    expect(comment.status).toBe(201);
    expect((await waiting(a.operator)).reviewComments.find((c) => c.id === comment.body.comment.id)).toMatchObject({ documentId: doc.id, body: 'Say which waterbox and the ΔP before and after.', shiftStart });
    expect((await waiting(b.operator)).reviewComments.map((c) => c.id)).not.toContain(comment.body.comment.id);
  });
});
