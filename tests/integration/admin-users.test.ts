import { afterAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/features/audit/model';
import { SessionRow } from '../../server/features/session/model';
import { User } from '../../server/features/users/model';
import type { Role } from '../../shared/roles';
import { PASSWORD, anonymousAgent, buildApp, closeAll, makeCrew, makeUser, signedInAgent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();

type Call = { method: 'get' | 'post' | 'patch'; path: (id: number) => string; body?: object };
const adminCalls: Call[] = [
  { method: 'get', path: () => '/api/admin/users' },
  { method: 'post', path: () => '/api/admin/users', body: {} },
  { method: 'patch', path: (id) => `/api/admin/users/${id}`, body: { role: 'admin', version: 0 } },
  { method: 'post', path: (id) => `/api/admin/users/${id}/deactivate`, body: { version: 0 } },
  { method: 'post', path: (id) => `/api/admin/users/${id}/reactivate`, body: { version: 0 } },
  { method: 'get', path: () => '/api/admin/audit-events' },
];

describe('admin routes: who may call them', () => {
  const nonAdmins: Role[] = ['trainee', 'operator', 'shift_lead', 'trainer'];

  it.each(nonAdmins)('answers 403 to a %s on every admin route', async (role) => {
    const me = await makeUser(role);
    const target = await makeUser('operator');
    const agent = await signedInAgent(built, me.email);
    for (const call of adminCalls) {
      const res = await agent[call.method](call.path(target.id)).set('X-CSRF-Token', agent.csrf).send(call.body);
      expect(res.status, `${call.method} ${call.path(target.id)}`).toBe(403);
    }
    const after = await User.findByPk(target.id);
    expect(after?.role).toBe('operator');
    expect(after?.active).toBe(true);
  });

  it('answers 401 on every admin route when nobody is signed in', async () => {
    const target = await makeUser('operator');
    const agent = await anonymousAgent(built);
    for (const call of adminCalls) {
      const res = await agent[call.method](call.path(target.id)).set('X-CSRF-Token', agent.csrf).send(call.body);
      expect(res.status, `${call.method} ${call.path(target.id)}`).toBe(401);
    }
  });
});

describe('POST /api/admin/users', () => {
  it('creates a person who must change the temporary password, and audits it', async () => {
    const admin = await makeUser('admin');
    const crew = await makeCrew();
    const agent = await signedInAgent(built, admin.email);
    const email = `new.${Date.now()}@test.example`;
    const res = await agent
      .post('/api/admin/users')
      .set('X-CSRF-Token', agent.csrf)
      .send({ name: 'New Starter', email, role: 'trainee', crewId: crew.id, temporaryPassword: 'temporary-pass-1' });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email, role: 'trainee', crewId: crew.id, mustChangePassword: true });
    const audit = await AuditEvent.findOne({ where: { action: 'user.create', entityId: String(res.body.user.id) } });
    expect(audit?.actorId).toBe(admin.id);
    expect(JSON.stringify(audit?.after)).not.toContain('passwordHash');

    const newcomer = await signedInAgent(built, email, 'temporary-pass-1');
    const me = await newcomer.get('/api/me').expect(200);
    expect(me.body.user.mustChangePassword).toBe(true);
  });

  it('rejects bad input with a message per field and saves nothing', async () => {
    const admin = await makeUser('admin');
    const agent = await signedInAgent(built, admin.email);
    const before = await User.count();
    const res = await agent
      .post('/api/admin/users')
      .set('X-CSRF-Token', agent.csrf)
      .send({ name: '', email: 'not-an-email', role: 'janitor', crewId: 'A', temporaryPassword: 'short' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['crewId', 'email', 'name', 'role', 'temporaryPassword']);
    expect(await User.count()).toBe(before);
  });

  it('rejects a duplicate e-mail with a field message', async () => {
    const admin = await makeUser('admin');
    const existing = await makeUser('operator');
    const agent = await signedInAgent(built, admin.email);
    const res = await agent
      .post('/api/admin/users')
      .set('X-CSRF-Token', agent.csrf)
      .send({ name: 'Copy Cat', email: existing.email, role: 'operator', crewId: null, temporaryPassword: 'temporary-pass-1' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.email).toMatch(/already/);
  });
});

describe('PATCH /api/admin/users/:id', () => {
  it('changes the role under a version check and audits before and after', async () => {
    const admin = await makeUser('admin');
    const target = await makeUser('operator');
    const agent = await signedInAgent(built, admin.email);
    const res = await agent.patch(`/api/admin/users/${target.id}`).set('X-CSRF-Token', agent.csrf).send({ role: 'shift_lead', version: 0 });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ role: 'shift_lead', version: 1 });
    const audit = await AuditEvent.findOne({ where: { action: 'user.update', entityId: String(target.id) } });
    expect(audit?.before).toMatchObject({ role: 'operator' });
    expect(audit?.after).toMatchObject({ role: 'shift_lead' });

    const stale = await agent.patch(`/api/admin/users/${target.id}`).set('X-CSRF-Token', agent.csrf).send({ role: 'trainee', version: 0 });
    expect(stale.status).toBe(409);
    expect((await User.findByPk(target.id))?.role).toBe('shift_lead');
  });

  it('applies a role change to the person’s next request', async () => {
    const admin = await makeUser('admin');
    const target = await makeUser('admin');
    const adminAgent = await signedInAgent(built, admin.email);
    const targetAgent = await signedInAgent(built, target.email);
    await targetAgent.get('/api/admin/users').expect(200);
    await adminAgent.patch(`/api/admin/users/${target.id}`).set('X-CSRF-Token', adminAgent.csrf).send({ role: 'operator', version: 0 }).expect(200);
    await targetAgent.get('/api/admin/users').expect(403);
  });

  it('answers 404 for an unknown person and 400 for a bad id', async () => {
    const admin = await makeUser('admin');
    const agent = await signedInAgent(built, admin.email);
    await agent.patch('/api/admin/users/999999').set('X-CSRF-Token', agent.csrf).send({ role: 'operator', version: 0 }).expect(404);
    await agent.patch('/api/admin/users/abc').set('X-CSRF-Token', agent.csrf).send({ role: 'operator', version: 0 }).expect(400);
  });
});

describe('POST /api/admin/users/:id/deactivate', () => {
  it('ends the person’s open sessions, refuses their sign-in, and audits it', async () => {
    const admin = await makeUser('admin');
    const target = await makeUser('operator');
    const adminAgent = await signedInAgent(built, admin.email);
    const targetAgent = await signedInAgent(built, target.email);
    await targetAgent.get('/api/me').expect(200);

    const res = await adminAgent.post(`/api/admin/users/${target.id}/deactivate`).set('X-CSRF-Token', adminAgent.csrf).send({ version: 0 });
    expect(res.status).toBe(200);
    expect(res.body.user.active).toBe(false);
    expect(await SessionRow.count({ where: { userId: target.id } })).toBe(0);
    await targetAgent.get('/api/me').expect(401);

    const again = await anonymousAgent(built);
    await again.post('/api/session').set('X-CSRF-Token', again.csrf).send({ email: target.email, password: PASSWORD }).expect(401);
    expect(await AuditEvent.count({ where: { action: 'user.deactivate', entityId: String(target.id) } })).toBe(1);

    const back = await adminAgent.post(`/api/admin/users/${target.id}/reactivate`).set('X-CSRF-Token', adminAgent.csrf).send({ version: 1 });
    expect(back.status).toBe(200);
    expect(await AuditEvent.count({ where: { action: 'user.reactivate', entityId: String(target.id) } })).toBe(1);
  });

  it('will not let an administrator deactivate themselves', async () => {
    const admin = await makeUser('admin');
    const agent = await signedInAgent(built, admin.email);
    await agent.post(`/api/admin/users/${admin.id}/deactivate`).set('X-CSRF-Token', agent.csrf).send({ version: 0 }).expect(403);
  });
});

describe('GET /api/admin/audit-events', () => {
  it('lists audit rows newest first with the actor’s name', async () => {
    const admin = await makeUser('admin');
    const target = await makeUser('trainee');
    const agent = await signedInAgent(built, admin.email);
    await agent.patch(`/api/admin/users/${target.id}`).set('X-CSRF-Token', agent.csrf).send({ role: 'operator', version: 0 }).expect(200);
    const res = await agent.get('/api/admin/audit-events?limit=5').expect(200);
    expect(res.body.events[0]).toMatchObject({ action: 'user.update', actor: admin.name, entityId: String(target.id) });
  });
});
