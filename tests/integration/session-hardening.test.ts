// Before sign-in nothing is stored: the sign-in form's CSRF token travels in a signed cookie of its
// own instead of a session row, so asking for tokens costs the database nothing (it used to write a
// 13-hour row each time), and the route is rate-limited per address all the same. Every API answer
// tells browsers and proxies not to keep it.
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { SessionRow } from '../../server/features/session/model';
import { PASSWORD, anonymousAgent, buildApp, closeAll, makeUser, signedInAgent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();

describe('GET /api/session/csrf before sign-in', () => {
  it('stores no session, however often it is asked', async () => {
    const before = await SessionRow.count();
    for (let i = 0; i < 50; i++) {
      const res = await request(built.app).get('/api/session/csrf');
      expect(res.status).toBe(200);
      expect(res.body.csrfToken).toMatch(/^[\w.-]{20,}$/);
    }
    expect(await SessionRow.count()).toBe(before);
  });

  it('gives a token that signs in, and only with the cookie it came with', async () => {
    const user = await makeUser('operator');
    const visitor = await anonymousAgent(built);
    const other = await anonymousAgent(built);
    // Another visitor's token, or a token without its cookie, is refused before the password is read.
    const crossed = await other.post('/api/session').set('X-CSRF-Token', visitor.csrf).send({ email: user.email, password: PASSWORD });
    expect(crossed.status).toBe(403);
    expect(crossed.body.error.code).toBe('CSRF');
    const cookieless = await request(built.app).post('/api/session').set('X-CSRF-Token', visitor.csrf).send({ email: user.email, password: PASSWORD });
    expect(cookieless.status).toBe(403);
    const signedIn = await visitor.post('/api/session').set('X-CSRF-Token', visitor.csrf).send({ email: user.email, password: PASSWORD });
    expect(signedIn.status).toBe(200);
    // After sign-in the session's own token is the one that counts.
    await visitor.get('/api/me').expect(200);
    const withOld = await visitor.delete('/api/session').set('X-CSRF-Token', visitor.csrf);
    expect(withOld.status).toBe(403);
    await visitor.delete('/api/session').set('X-CSRF-Token', signedIn.body.csrfToken).expect(204);
  });

  it('refuses a forged token with a cookie made to match it', async () => {
    const forged = 'a'.repeat(64);
    const madeUpSignature = 'b'.repeat(43);
    const res = await request(built.app).post('/api/session').set('Cookie', `hotwell.csrf=${forged}.${madeUpSignature}`).set('X-CSRF-Token', forged).send({ email: 'x@test.example', password: 'x' });
    expect(res.status).toBe(403);
  });

  it('is rate-limited per address before sign-in, with the wait in words; a signed-in person is not limited', async () => {
    const limited = buildApp({ anonymousTokenLimit: 5 });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await request(limited.app).get('/api/session/csrf')).status);
    expect(statuses).toEqual([200, 200, 200, 200, 200, 429]);
    const refused = await request(limited.app).get('/api/session/csrf');
    expect(refused.body.error.message).toMatch(/wait a minute/);
    const signedIn = await signedInAgent(built, (await makeUser('operator')).email);
    for (let i = 0; i < 8; i++) await signedIn.get('/api/session/csrf').expect(200);
  });
});

describe('Cache-Control on API answers', () => {
  it('is no-store on every kind of answer: data, errors, not found, refused', async () => {
    const agent = await signedInAgent(built, (await makeUser('operator')).email);
    const answers = {
      health: await request(built.app).get('/api/health'),
      token: await request(built.app).get('/api/session/csrf'),
      signedOut: await request(built.app).get('/api/me'),
      data: await agent.get('/api/plant/units'),
      badInput: await agent.get('/api/units/abc/log'),
      notFound: await agent.get('/api/no-such-thing'),
      csrfRefused: await request(built.app).post('/api/session').send({}),
    };
    const seen = Object.fromEntries(Object.entries(answers).map(([k, res]) => [k, `${res.status} ${res.headers['cache-control']}`]));
    expect(seen).toEqual({
      health: '200 no-store',
      token: '200 no-store',
      signedOut: '401 no-store',
      data: '200 no-store',
      badInput: '400 no-store',
      notFound: '404 no-store',
      csrfRefused: '403 no-store',
    });
  });
});

describe('built files', () => {
  it('answers 404 for a built file that is not there (a chunk of an earlier build), never the single page', async () => {
    const res = await request(built.app).get('/assets/page-OldBuild1.js');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).not.toMatch(/text\/html/);
  });
});
