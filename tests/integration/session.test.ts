import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { SIGN_IN_FAILED } from '../../server/lib/auth';
import { SessionRow } from '../../server/features/session/model';
import { PASSWORD, anonymousAgent, buildApp, closeAll, makeUser, signedInAgent } from './support/test-app';

afterAll(closeAll);

describe('POST /api/session (sign-in)', () => {
  const built = buildApp();

  it('signs in with the right password and returns the person without the password hash', async () => {
    const user = await makeUser('operator');
    const agent = await anonymousAgent(built);
    const res = await agent.post('/api/session').set('X-CSRF-Token', agent.csrf).send({ email: user.email, password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: user.email, role: 'operator' });
    expect(JSON.stringify(res.body)).not.toContain('argon2');
    const me = await agent.get('/api/me').expect(200);
    expect(me.body.user.id).toBe(user.id);
  });

  it('gives a new session id at sign-in (no session fixation)', async () => {
    // The id alone: the whole Set-Cookie line differs anyway, since its rolling Expires moves on.
    const sessionId = (setCookie: string[] | string | undefined) => {
      const line = [setCookie ?? []].flat().find((c) => c.startsWith('hotwell.sid='));
      return line ? decodeURIComponent(line.slice('hotwell.sid='.length).split(';')[0]!).replace(/^s:/, '').split('.')[0]! : null;
    };
    const first = await makeUser('operator');
    const second = await makeUser('operator');
    const agent = await anonymousAgent(built);
    const signIn = (email: string) => agent.post('/api/session').set('X-CSRF-Token', agent.csrf).send({ email, password: PASSWORD });
    const one = await signIn(first.email);
    expect(one.status).toBe(200);
    agent.csrf = one.body.csrfToken;
    const held = sessionId(one.headers['set-cookie']);
    expect(held).toMatch(/^[\w-]{20,}$/);
    // Signing in while holding a session (one an attacker could have planted) gives another id…
    const two = await signIn(second.email);
    expect(two.status).toBe(200);
    const fresh = sessionId(two.headers['set-cookie']);
    expect(fresh).toMatch(/^[\w-]{20,}$/);
    expect(fresh).not.toBe(held);
    // …and the id held before no longer opens anything.
    const oldCookie = one.headers['set-cookie']![0]!.split(';')[0]!;
    await request(built.app).get('/api/me').set('Cookie', oldCookie).expect(401);
    const me = await request(built.app).get('/api/me').set('Cookie', two.headers['set-cookie']![0]!.split(';')[0]!).expect(200);
    expect(me.body.user.id).toBe(second.id);
  });

  it('answers 401 with the same generic message for a wrong password and an unknown e-mail', async () => {
    const user = await makeUser('operator');
    const agent = await anonymousAgent(built);
    const wrong = await agent.post('/api/session').set('X-CSRF-Token', agent.csrf).send({ email: user.email, password: 'not it at all' });
    const unknown = await agent
      .post('/api/session')
      .set('X-CSRF-Token', agent.csrf)
      .send({ email: 'nobody@test.example', password: 'not it at all' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(SIGN_IN_FAILED);
    expect(unknown.body.error.message).toBe(SIGN_IN_FAILED);
  });

  it.each([
    ['missing fields', {}],
    ['a number for the e-mail', { email: 42, password: 'x' }],
    ['an array for the password', { email: 'a@test.example', password: ['x'] }],
    ['a 100 kB password', { email: 'a@test.example', password: 'x'.repeat(100_000) }],
  ])('answers 400 with field messages for %s, and keeps serving', async (_label, body) => {
    const agent = await anonymousAgent(built);
    const res = await agent.post('/api/session').set('X-CSRF-Token', agent.csrf).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('VALIDATION');
    expect(Object.keys(res.body.error.fields).length).toBeGreaterThan(0);
    await request(built.app).get('/api/health').expect(200);
  });

  it('answers 400 for a body that is not JSON', async () => {
    const agent = await anonymousAgent(built);
    const res = await agent
      .post('/api/session')
      .set('X-CSRF-Token', agent.csrf)
      .set('Content-Type', 'application/json')
      .send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('MALFORMED_JSON');
  });

  it('refuses a write without the CSRF token with 403', async () => {
    const user = await makeUser('operator');
    const res = await request(built.app).post('/api/session').send({ email: user.email, password: PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('CSRF');
  });

  it('refuses a deactivated person with the generic message', async () => {
    const user = await makeUser('operator', { active: false });
    const agent = await anonymousAgent(built);
    const res = await agent.post('/api/session').set('X-CSRF-Token', agent.csrf).send({ email: user.email, password: PASSWORD });
    expect(res.status).toBe(401);
    expect(res.body.error.message).toBe(SIGN_IN_FAILED);
  });
});

// How many failed sign-ins are allowed, per account and per address: sign-in-limits.test.ts.

describe('DELETE /api/session (sign-out)', () => {
  const built = buildApp();
  it('ends the session and removes it from the store', async () => {
    const user = await makeUser('trainee');
    const agent = await signedInAgent(built, user.email);
    expect(await SessionRow.count({ where: { userId: user.id } })).toBe(1);
    await agent.delete('/api/session').set('X-CSRF-Token', agent.csrf).expect(204);
    await agent.get('/api/me').expect(401);
    expect(await SessionRow.count({ where: { userId: user.id } })).toBe(0);
  });
});

describe('session store', () => {
  it('keeps a session across an app restart (sessions live in MariaDB)', async () => {
    const user = await makeUser('shift_lead');
    const first = buildApp();
    const agent = await anonymousAgent(first);
    const signIn = await agent.post('/api/session').set('X-CSRF-Token', agent.csrf).send({ email: user.email, password: PASSWORD });
    const cookie = String(signIn.headers['set-cookie']?.[0]).split(';')[0]!;
    first.close();
    const second = buildApp();
    const res = await request(second.app).get('/api/me').set('Cookie', cookie);
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(user.email);
  });

  it('refuses a session whose stored expiry has passed, even before the clean-up removes the row', async () => {
    const user = await makeUser('operator');
    const agent = await signedInAgent(buildApp(), user.email);
    await agent.get('/api/me').expect(200);
    await SessionRow.update({ expires: new Date(Date.now() - 1000) }, { where: { userId: user.id } });
    await agent.get('/api/me').expect(401);
  });

  it('writes the rolling expiry at most once a minute, and again once a minute has passed', async () => {
    const user = await makeUser('operator');
    const agent = await signedInAgent(buildApp(), user.email);
    const stored = async () => (await SessionRow.findOne({ where: { userId: user.id } }))!.expires!.getTime();
    // Pretend the row was last written 30 s ago: a request now moves the expiry by ~30 s, under a minute.
    const recent = new Date(Date.now() + 13 * 3600_000 - 30_000);
    await SessionRow.update({ expires: recent }, { where: { userId: user.id } });
    await agent.get('/api/me').expect(200);
    expect(await stored()).toBe(recent.getTime() - (recent.getTime() % 1000));
    // Two minutes ago: the request writes the new expiry.
    const older = new Date(Date.now() + 13 * 3600_000 - 120_000);
    await SessionRow.update({ expires: older }, { where: { userId: user.id } });
    await agent.get('/api/me').expect(200);
    expect(await stored()).toBeGreaterThan(older.getTime() + 60_000);
  });
});

describe('POST /api/me/password', () => {
  const built = buildApp();

  it('lets a person with a temporary password reach nothing else until they change it', async () => {
    const user = await makeUser('operator', { mustChangePassword: true });
    const agent = await signedInAgent(built, user.email);
    const blocked = await agent.get('/api/plant/units');
    expect(blocked.status).toBe(403);
    expect(blocked.body.error.code).toBe('PASSWORD_CHANGE_REQUIRED');
    const changed = await agent
      .post('/api/me/password')
      .set('X-CSRF-Token', agent.csrf)
      .send({ currentPassword: PASSWORD, newPassword: 'a brand new passphrase' });
    expect(changed.status).toBe(200);
    expect(changed.body.user.mustChangePassword).toBe(false);
    await agent.get('/api/plant/units').expect(200);
  });

  it('rejects a wrong current password and a short new one with field messages', async () => {
    const user = await makeUser('operator');
    const agent = await signedInAgent(built, user.email);
    const wrong = await agent
      .post('/api/me/password')
      .set('X-CSRF-Token', agent.csrf)
      .send({ currentPassword: 'not my password', newPassword: 'a brand new passphrase' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toBeTruthy();
    const short = await agent.post('/api/me/password').set('X-CSRF-Token', agent.csrf).send({ currentPassword: PASSWORD, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.newPassword).toMatch(/12/);
  });

  it('answers 401 when nobody is signed in', async () => {
    const agent = await anonymousAgent(built);
    await agent.post('/api/me/password').set('X-CSRF-Token', agent.csrf).send({}).expect(401);
  });
});
