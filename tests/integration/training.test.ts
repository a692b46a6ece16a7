// Training log: the versioned catalogue, entries countersigned by an operator, trainer decisions,
// immutability with amendments, progress, queues — and the role rules of every route.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp, closeAll, makeCrew, makeUser, signedInAgent, anonymousAgent, type Agent } from './support/test-app';
import { TrainingDecision } from '../../server/features/training/model';
import { AuditEvent } from '../../server/features/audit/model';

afterAll(closeAll);

const built = buildApp();
const agents = {} as Record<'trainee' | 'otherTrainee' | 'operator' | 'lead' | 'trainer' | 'admin', Agent>;
const ids = {} as Record<'trainee' | 'otherTrainee' | 'operator' | 'lead', number>;
const key = `CW-${String(Date.now()).slice(-4)}`;
const today = new Date().toISOString().slice(0, 10);

const post = (agent: Agent, path: string, body: object = {}) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body);
const task = { position: 'field_operator', system: 'circulating_water', title: 'Start a circulating-water pump', standard: 'Starts the pump per procedure with discharge valve sequencing and checks', procedureRef: 'TST-OP-CW-01', requiredPerformances: 2 };

beforeAll(async () => {
  const crew = await makeCrew();
  const person = async (name: keyof typeof agents, role: Parameters<typeof makeUser>[0]) => {
    const user = await makeUser(role, { crewId: ['trainee', 'otherTrainee', 'operator', 'lead'].includes(name) ? crew.id : null });
    if (name in { trainee: 1, otherTrainee: 1, operator: 1, lead: 1 }) ids[name as keyof typeof ids] = user.id;
    agents[name] = await signedInAgent(built, user.email);
  };
  await person('trainee', 'trainee');
  await person('otherTrainee', 'trainee');
  await person('operator', 'operator');
  await person('lead', 'shift_lead');
  await person('trainer', 'trainer');
  await person('admin', 'admin');
});

describe('qualification catalogue', () => {
  it('lets trainers and administrators edit it, keeps every version, and checks the fields', async () => {
    for (const who of ['trainee', 'operator', 'lead'] as const) await post(agents[who], '/api/training/tasks', { ...task, taskKey: key }).expect(403);
    const bad = await post(agents.trainer, '/api/training/tasks', { ...task, taskKey: 'cw1', requiredPerformances: 0, system: 'boiler' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['requiredPerformances', 'system', 'taskKey']);
    const created = await post(agents.trainer, '/api/training/tasks', { ...task, taskKey: key });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body.task).toMatchObject({ taskKey: key, version: 1 });
    const duplicate = await post(agents.admin, '/api/training/tasks', { ...task, taskKey: key });
    expect(duplicate.status).toBe(400);
    expect(duplicate.body.error.fields.taskKey).toMatch(/exists/);
    const list = await agents.trainee.get('/api/training/tasks').expect(200);
    expect(list.body.tasks.find((t: { taskKey: string }) => t.taskKey === key)).toMatchObject({ version: 1, requiredPerformances: 2 });
    await agents.trainee.put(`/api/training/tasks/${key}`).set('X-CSRF-Token', agents.trainee.csrf).send({ ...task, changeNote: 'x' }).expect(403);
  });

  it('answers 401 signed out on every training route', async () => {
    const anon = await anonymousAgent(built);
    for (const path of ['/api/training/tasks', `/api/training/tasks/${key}/versions`, '/api/training/me', '/api/training/review-queue', '/api/training/countersign-queue', '/api/training/trainees/1', '/api/training/crews/1']) {
      await anon.get(path).expect(401);
    }
    for (const path of ['/api/training/tasks', `/api/training/tasks/${key}/retire`, '/api/training/entries', '/api/training/entries/1/countersign', '/api/training/entries/1/reject', '/api/training/decisions', '/api/training/amendments']) {
      await post(anon, path, {}).expect(401);
    }
    await anon.put(`/api/training/tasks/${key}`).set('X-CSRF-Token', anon.csrf).send({}).expect(401);
  });

  it('answers 403 to every role a route is not for, before looking at the body', async () => {
    const forbidden: [keyof typeof agents, 'get' | 'post' | 'put', string][] = [
      ['trainee', 'post', '/api/training/tasks'],
      ['operator', 'put', `/api/training/tasks/${key}`],
      ['lead', 'post', `/api/training/tasks/${key}/retire`],
      ['operator', 'post', '/api/training/entries'],
      ['trainer', 'post', '/api/training/entries'],
      ['trainee', 'post', '/api/training/entries/1/countersign'],
      ['trainer', 'post', '/api/training/entries/1/reject'],
      ['admin', 'post', '/api/training/entries/1/countersign'],
      ['admin', 'post', '/api/training/decisions'],
      ['lead', 'post', '/api/training/decisions'],
      ['operator', 'get', '/api/training/me'],
      ['trainee', 'get', '/api/training/countersign-queue'],
      ['trainer', 'get', '/api/training/countersign-queue'],
      ['trainee', 'get', '/api/training/review-queue'],
      ['lead', 'get', '/api/training/review-queue'],
      ['trainee', 'get', '/api/training/crews/1'],
    ];
    for (const [who, method, path] of forbidden) {
      const agent = agents[who];
      const res = method === 'get' ? await agent.get(path) : await agent[method](path).set('X-CSRF-Token', agent.csrf).send({});
      expect(res.status, `${who} ${method} ${path}`).toBe(403);
    }
  });
});

describe('training entries, countersign and sign-off', () => {
  it('runs practice → countersign → sign-off with the role rules, and keeps sign-offs immutable', async () => {
    const entry = (body: object = {}) => post(agents.trainee, '/api/training/entries', { taskKey: key, performedOn: today, level: 'supervised', note: 'Started 1-CWP-A with the operator watching', ...body });
    // Only trainees record practice; bad fields get field messages.
    await post(agents.operator, '/api/training/entries', { taskKey: key, performedOn: today, level: 'supervised', note: 'xyz' }).expect(403);
    const badEntry = await entry({ level: 'guessed', performedOn: '2099-01-01', note: '' });
    expect(badEntry.status).toBe(400);
    expect(Object.keys(badEntry.body.error.fields).sort()).toEqual(['level', 'note']);
    const future = await entry({ performedOn: '2099-01-01' });
    expect(future.status).toBe(400);
    expect(future.body.error.fields.performedOn).toMatch(/future/);
    const badLinks = await entry({ shiftStart: '2026-01-01T05:13:00Z', readingSetId: 999999999, handoverItemId: 999999999 });
    expect(badLinks.status).toBe(400);
    expect(Object.keys(badLinks.body.error.fields).sort()).toEqual(['handoverItemId', 'readingSetId', 'unitId']);
    const wrongSupervisor = await entry({ supervisorId: ids.otherTrainee });
    expect(wrongSupervisor.status).toBe(400);
    expect(wrongSupervisor.body.error.fields.supervisorId).toBeTruthy();

    const first = await entry({ supervisorId: ids.operator });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const second = await entry({ level: 'alone' });
    const observed = await entry({ level: 'observed' });

    // Nobody countersigns their own entry, trainees and trainers do not countersign at all.
    await post(agents.trainee, `/api/training/entries/${first.body.id}/countersign`).expect(403);
    await post(agents.otherTrainee, `/api/training/entries/${first.body.id}/countersign`).expect(403);
    await post(agents.trainer, `/api/training/entries/${first.body.id}/countersign`).expect(403);
    // The operator sees the entries in their queue and countersigns; a second countersign is refused.
    const queue = await agents.operator.get('/api/training/countersign-queue').expect(200);
    expect(queue.body.entries.map((e: { id: number }) => e.id)).toEqual(expect.arrayContaining([first.body.id, second.body.id]));
    await post(agents.operator, `/api/training/entries/${first.body.id}/countersign`).expect(200);
    await post(agents.lead, `/api/training/entries/${first.body.id}/countersign`).expect(409);
    const noReason = await post(agents.lead, `/api/training/entries/${observed.body.id}/reject`, { reason: '' });
    expect(noReason.status).toBe(400);
    await post(agents.lead, `/api/training/entries/${observed.body.id}/reject`, { reason: 'Not on this task: that was the tower fan' }).expect(200);

    // Not ready yet: one of two performances countersigned. An operator cannot sign off at all.
    await post(agents.operator, '/api/training/decisions', { traineeId: ids.trainee, taskKey: key, decision: 'signed_off', comments: 'ok' }).expect(403);
    const early = await post(agents.trainer, '/api/training/decisions', { traineeId: ids.trainee, taskKey: key, decision: 'signed_off', comments: 'Meets the standard' });
    expect(early.status).toBe(409);
    expect(early.body.error.message).toMatch(/1 of 2/);
    await post(agents.trainer, '/api/training/decisions', { traineeId: ids.trainee, taskKey: key, decision: 'returned', comments: 'Practise the valve sequence once more' }).expect(201);
    let progress = await agents.trainee.get('/api/training/me').expect(200);
    expect(progress.body.rows.find((r: { task: { taskKey: string } }) => r.task.taskKey === key)).toMatchObject({ status: 'returned', performances: 1 });

    await post(agents.lead, `/api/training/entries/${second.body.id}/countersign`).expect(200);
    const queueForTrainer = await agents.trainer.get('/api/training/review-queue').expect(200);
    expect(queueForTrainer.body.ready).toEqual(expect.arrayContaining([expect.objectContaining({ traineeId: ids.trainee, taskKey: key, performances: 2, required: 2 })]));
    await agents.operator.get('/api/training/review-queue').expect(403);

    const signed = await post(agents.trainer, '/api/training/decisions', { traineeId: ids.trainee, taskKey: key, decision: 'signed_off', comments: 'Meets the standard on both runs' });
    expect(signed.status).toBe(201);
    expect(await AuditEvent.count({ where: { action: 'training.signed_off', entityId: signed.body.id } })).toBe(1);
    // Immutable: neither a second sign-off nor a return replaces it; corrections are amendments.
    await post(agents.trainer, '/api/training/decisions', { traineeId: ids.trainee, taskKey: key, decision: 'returned', comments: 'changed my mind' }).expect(409);
    await post(agents.trainee, '/api/training/amendments', { target: 'decision', targetId: signed.body.id, reason: 'I want to change it', text: 'x' }).expect(403);
    await post(agents.operator, '/api/training/amendments', { target: 'entry', targetId: first.body.id, reason: 'Not my entry at all', text: 'x' }).expect(403);
    await post(agents.trainer, '/api/training/amendments', { target: 'decision', targetId: signed.body.id, reason: 'Wrong procedure revision cited', text: 'Signed against TST-OP-CW-01 rev 3' }).expect(201);
    await post(agents.trainee, '/api/training/amendments', { target: 'entry', targetId: second.body.id, reason: 'Date typo in the note', text: 'Pump was 1-CWP-B' }).expect(201);
    const decisionRow = await TrainingDecision.findByPk(signed.body.id);
    expect(decisionRow!.comments).toBe('Meets the standard on both runs');

    progress = await agents.trainee.get('/api/training/me').expect(200);
    const row = progress.body.rows.find((r: { task: { taskKey: string } }) => r.task.taskKey === key);
    expect(row).toMatchObject({ status: 'signed_off', signedVersion: 1, counts: { supervised: 1, alone: 1, observed: 0, rejected: 1 } });
    expect(row.lastDecision.amendments[0]).toMatchObject({ reason: 'Wrong procedure revision cited' });
    expect(progress.body.entries.find((e: { id: number }) => e.id === second.body.id).amendments).toHaveLength(1);

    // A newer version of the task leaves the sign-off on the version it was made against.
    const changed = await agents.trainer.put(`/api/training/tasks/${key}`).set('X-CSRF-Token', agents.trainer.csrf).send({ ...task, requiredPerformances: 3, changeNote: 'Three runs from now on' });
    expect(changed.status).toBe(200);
    expect(changed.body.task.version).toBe(2);
    progress = await agents.trainee.get('/api/training/me').expect(200);
    expect(progress.body.rows.find((r: { task: { taskKey: string } }) => r.task.taskKey === key)).toMatchObject({ status: 'signed_off', signedVersion: 1, newerVersionSinceSignOff: true, task: { version: 2 } });
    const versions = await agents.trainee.get(`/api/training/tasks/${key}/versions`).expect(200);
    expect(versions.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
  });

  it('shows a trainee only their own records; trainers, leads and admins see any trainee; crews show who is qualified', async () => {
    await agents.otherTrainee.get(`/api/training/trainees/${ids.trainee}`).expect(403);
    await agents.operator.get(`/api/training/trainees/${ids.trainee}`).expect(403);
    await agents.otherTrainee.get(`/api/training/trainees/${ids.otherTrainee}`).expect(200);
    for (const who of ['trainer', 'lead', 'admin'] as const) await agents[who].get(`/api/training/trainees/${ids.trainee}`).expect(200);
    await agents.operator.get('/api/training/me').expect(403);
    const me = await agents.lead.get('/api/me').expect(200);
    const crew = await agents.lead.get(`/api/training/crews/${me.body.user.crewId}`).expect(200);
    const trainee = crew.body.people.find((p: { id: number }) => p.id === ids.trainee);
    expect(trainee.signedOff.map((s: { taskKey: string }) => s.taskKey)).toContain(key);
    await agents.trainee.get(`/api/training/crews/${me.body.user.crewId}`).expect(403);
  });

  it('retires a task: no new practice is recorded against it', async () => {
    const retireKey = `RT-${String(Date.now()).slice(-4)}`;
    await post(agents.admin, '/api/training/tasks', { ...task, taskKey: retireKey }).expect(201);
    await post(agents.admin, `/api/training/tasks/${retireKey}/retire`, { changeNote: 'Pump replaced by a new design' }).expect(200);
    const res = await post(agents.trainee, '/api/training/entries', { taskKey: retireKey, performedOn: today, level: 'observed', note: 'Watched it' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.taskKey).toMatch(/retired/);
    const list = await agents.trainee.get('/api/training/tasks').expect(200);
    expect(list.body.tasks.some((t: { taskKey: string }) => t.taskKey === retireKey)).toBe(false);
  });
});
