// The role rules that are more than "which roles may call this route": administrators administer but
// write no operational record; a trainee's log entry is marked as a trainee's; an operator amends only
// their own entries, a shift lead any entry of a shift their crew worked (the station's rotation says
// which crew that was). The route × role table as a whole is proved in access-matrix.test.ts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { vacuumRound } from './support/rounds';
import { buildApp, closeAll, makeStation, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();
const post = (agent: Agent, path: string, body: unknown) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);
const entry = (text: string, eventAt?: string) => ({ position: 'control_room', category: 'operation', text, ...(eventAt ? { eventAt } : {}) });

let unitId = 0;
let stationId = 0;
let crewA = 0;
let previousShiftStart = '';
const a = {} as Record<'operatorA' | 'otherOperatorA' | 'leadA' | 'leadB' | 'traineeA' | 'trainer' | 'admin', Agent>;
const ids = { leadA: 0 };

beforeAll(async () => {
  const station = await makeStation(2);
  unitId = station.unit.id;
  stationId = station.station.id;
  crewA = station.crews[0]!.id;
  const crewB = station.crews[1]!.id;
  a.admin = await signedInAgent(built, (await makeUser('admin')).email);
  // Crew A works the shift in progress, crew B the one before it.
  const shifts = await a.admin.get(`/api/units/${unitId}/log/shifts`).expect(200);
  previousShiftStart = shifts.body.shifts[1].start;
  await a.admin.put(`/api/stations/${stationId}/crew-rotation`).set('X-CSRF-Token', a.admin.csrf).send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: [crewA, crewB] }).expect(200);
  a.operatorA = await signedInAgent(built, (await makeUser('operator', { crewId: crewA })).email);
  a.otherOperatorA = await signedInAgent(built, (await makeUser('operator', { crewId: crewA })).email);
  const leadA = await makeUser('shift_lead', { crewId: crewA });
  ids.leadA = leadA.id;
  a.leadA = await signedInAgent(built, leadA.email);
  a.leadB = await signedInAgent(built, (await makeUser('shift_lead', { crewId: crewB })).email);
  a.traineeA = await signedInAgent(built, (await makeUser('trainee', { crewId: crewA })).email);
  a.trainer = await signedInAgent(built, (await makeUser('trainer')).email);
});

describe('administrators administer and write no operational record', () => {
  it('refuses an administrator every operational write with 403, before looking at the body', async () => {
    const now = new Date().toISOString();
    const writes: [string, unknown][] = [
      [`/api/units/${unitId}/readings`, vacuumRound()],
      [`/api/units/${unitId}/flags`, { parameter: 'ttd', severity: 'watch', comment: 'Watch the TTD' }],
      [`/api/units/${unitId}/log`, entry('Administrator writing in the log')],
      [`/api/units/${unitId}/conditions`, { title: '1-CWP-B out of service', requiredAction: 'Restore within 72 h', startedAt: now, limitHours: 72, ownerId: ids.leadA }],
      [`/api/standing-orders?stationId=${stationId}`, { title: 'Hourly TTD', bodyHtml: '<p>Log TTD hourly.</p>', effectiveFrom: now }],
      [`/api/units/${unitId}/imports/inspect`, {}],
      ['/api/training/decisions', { traineeId: ids.leadA, taskKey: 'CW-01', decision: 'signed_off', comments: 'Meets the standard' }],
      ['/api/training/amendments', { target: 'decision', targetId: 1, reason: 'Wrong task noted', text: 'Correction' }],
      ['/api/logbook/review-comments', { documentId: 1, body: 'Looks fine' }],
    ];
    const refused: Record<string, number> = {};
    for (const [path, body] of writes) refused[path] = (await post(a.admin, path, body)).status;
    expect(refused).toEqual(Object.fromEntries(writes.map(([path]) => [path, 403])));
  });

  it('still lets an administrator change the station’s settings', async () => {
    const settings = (await a.admin.get(`/api/stations/${stationId}/settings`).expect(200)).body.settings;
    await a.admin.put(`/api/stations/${stationId}/settings`).set('X-CSRF-Token', a.admin.csrf).send({ ...settings, lateEntryMinutes: 35 }).expect(200);
  });
});

describe('trainees in the log', () => {
  it('marks a trainee’s entry as a trainee’s, and nobody else’s', async () => {
    const byTrainee = await post(a.traineeA, `/api/units/${unitId}/log`, entry('Hotwell level creeping up; told the control room'));
    expect(byTrainee.status).toBe(201);
    const byOperator = await post(a.operatorA, `/api/units/${unitId}/log`, entry('Level controller back to auto'));
    expect(byOperator.status).toBe(201);
    const list = await a.operatorA.get(`/api/units/${unitId}/log?limit=20`).expect(200);
    const shown = (id: number) => list.body.entries.find((e: { id: number }) => e.id === id);
    expect(shown(byTrainee.body.id).writtenAsTrainee).toBe(true);
    expect(shown(byOperator.body.id).writtenAsTrainee).toBe(false);
  });
});

describe('who amends a log entry', () => {
  const amend = (agent: Agent, id: number) => post(agent, `/api/log/${id}/amendments`, { reason: 'Wrong pump tag', text: 'Started 1-CWP-A' });

  it('lets an operator amend their own entry and refuses them another operator’s', async () => {
    const own = await post(a.operatorA, `/api/units/${unitId}/log`, entry('Started 1-CWP-C'));
    expect((await amend(a.operatorA, own.body.id)).status).toBe(201);
    const refused = await amend(a.otherOperatorA, own.body.id);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/own/);
  });

  it('lets the lead of the crew whose shift it was amend anyone’s entry, and refuses another crew’s lead', async () => {
    const now = await post(a.operatorA, `/api/units/${unitId}/log`, entry('Vented waterbox B'));
    expect((await amend(a.leadB, now.body.id)).status).toBe(403);
    expect((await amend(a.leadA, now.body.id)).status).toBe(201);
    // A late entry about the shift before: crew B worked it, so its lead amends and crew A's does not.
    const eventAt = new Date(new Date(previousShiftStart).getTime() + 60 * 60_000).toISOString();
    const late = await post(a.operatorA, `/api/units/${unitId}/log`, entry('Late: 1-CWP-B tripped at the start of nights', eventAt));
    expect(late.status).toBe(201);
    expect((await amend(a.leadA, late.body.id)).status).toBe(403);
    expect((await amend(a.leadB, late.body.id)).status).toBe(201);
  });

  it('refuses a trainer and an administrator', async () => {
    const created = await post(a.operatorA, `/api/units/${unitId}/log`, entry('Backwashed the strainer'));
    expect((await amend(a.trainer, created.body.id)).status).toBe(403);
    expect((await amend(a.admin, created.body.id)).status).toBe(403);
  });
});
