import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/features/audit/model';
import type { Role } from '../../shared/roles';
import { anonymousAgent, buildApp, closeAll, makeUnit, makeUser, signedInAgent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();
let unitId = 0;
beforeAll(async () => {
  unitId = (await makeUnit()).id;
});

const manual = { parameter: 'ttd', severity: 'watch', comment: 'TTD creeping up since the screen wash' };

describe('flags: who may do what', () => {
  it('answers 401 signed out on every flag route', async () => {
    const agent = await anonymousAgent(built);
    await agent.get(`/api/units/${unitId}/flags`).expect(401);
    await agent.post(`/api/units/${unitId}/flags`).set('X-CSRF-Token', agent.csrf).send(manual).expect(401);
    await agent.post('/api/flags/1/assign').set('X-CSRF-Token', agent.csrf).send({}).expect(401);
    await agent.post('/api/flags/1/clear').set('X-CSRF-Token', agent.csrf).send({}).expect(401);
  });

  it.each<Role>(['trainee', 'operator', 'trainer'])('answers 403 to a %s raising, assigning or clearing', async (role) => {
    const agent = await signedInAgent(built, (await makeUser(role)).email);
    await agent.get(`/api/units/${unitId}/flags`).expect(200);
    await agent.post(`/api/units/${unitId}/flags`).set('X-CSRF-Token', agent.csrf).send(manual).expect(403);
    await agent.post('/api/flags/1/assign').set('X-CSRF-Token', agent.csrf).send({}).expect(403);
    await agent.post('/api/flags/1/clear').set('X-CSRF-Token', agent.csrf).send({}).expect(403);
  });
});

describe('a shift lead follows a flag from raising to clearing', () => {
  it('raises, assigns and clears with a closing comment, audited at each step', async () => {
    const lead = await makeUser('shift_lead');
    const operator = await makeUser('operator');
    const agent = await signedInAgent(built, lead.email);
    const raised = await agent.post(`/api/units/${unitId}/flags`).set('X-CSRF-Token', agent.csrf).send(manual);
    expect(raised.status).toBe(201);
    expect(raised.body.flag).toMatchObject({ origin: 'manual', severity: 'watch', status: 'open', raisedBy: lead.name });
    const id = raised.body.flag.id;

    const assigned = await agent
      .post(`/api/flags/${id}/assign`)
      .set('X-CSRF-Token', agent.csrf)
      .send({ assignedTo: operator.id, followUp: 'Check waterbox vents at next round', version: 0 });
    expect(assigned.status).toBe(200);
    expect(assigned.body.flag.assignedTo).toBe(operator.name);

    const stale = await agent.post(`/api/flags/${id}/clear`).set('X-CSRF-Token', agent.csrf).send({ comment: 'vented', version: 0 });
    expect(stale.status).toBe(409);
    const cleared = await agent.post(`/api/flags/${id}/clear`).set('X-CSRF-Token', agent.csrf).send({ comment: 'Vents cleared, TTD back to 4 K', version: 1 });
    expect(cleared.status).toBe(200);
    expect(cleared.body.flag).toMatchObject({ status: 'cleared', clearedBy: lead.name, clearComment: 'Vents cleared, TTD back to 4 K' });
    await agent.post(`/api/flags/${id}/clear`).set('X-CSRF-Token', agent.csrf).send({ comment: 'again', version: 2 }).expect(409);

    const open = await agent.get(`/api/units/${unitId}/flags?status=open`).expect(200);
    expect(open.body.flags.map((f: { id: number }) => f.id)).not.toContain(id);
    const all = await agent.get(`/api/units/${unitId}/flags?status=all&parameter=ttd`).expect(200);
    expect(all.body.flags.map((f: { id: number }) => f.id)).toContain(id);
    const actions = (await AuditEvent.findAll({ where: { entity: 'flag', entityId: String(id) } })).map((e) => e.action).sort();
    expect(actions).toEqual(['flag.assign', 'flag.clear', 'flag.raise']);
  });

  it('answers 400 with field messages for bad input', async () => {
    const agent = await signedInAgent(built, (await makeUser('shift_lead')).email);
    const res = await agent.post(`/api/units/${unitId}/flags`).set('X-CSRF-Token', agent.csrf).send({ parameter: 'mood', severity: 'panic', comment: '' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['comment', 'parameter', 'severity']);
    const badFilter = await agent.get(`/api/units/${unitId}/flags?status=sideways`);
    expect(badFilter.status).toBe(400);
  });
});
