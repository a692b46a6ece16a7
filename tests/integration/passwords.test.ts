// New passwords: long is not enough. Common and breached-looking ones (as the zxcvbn strength estimate
// judges them), the public demo password, only spaces, and ones built from the person's own name or
// e-mail are refused with a message on the field, whether the person chooses it or an administrator
// sets it as a temporary one. Changing one's password ends one's other sessions and their live
// connections; the session it was changed in carries on.
import { io as connect, type Socket } from 'socket.io-client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashPassword } from '../../server/lib/auth';
import { SessionRow } from '../../server/features/session/model';
import { User } from '../../server/features/users/model';
import { PASSWORD, buildApp, closeAll, makeUser, signedInAgent, type Agent, listenWithSockets } from './support/test-app';

const built = buildApp();
afterAll(closeAll);

const change = (agent: Agent, newPassword: string) => agent.post('/api/me/password').set('X-CSRF-Token', agent.csrf).send({ currentPassword: PASSWORD, newPassword });

// Each is 12 characters or more, so only the new rules can refuse it.
const refused: [string, (person: { name: string; email: string }) => string, RegExp][] = [
  ['a very common password', () => 'password1234', /common|guess/],
  ['a keyboard row', () => 'qwertyuiop12', /common|guess/],
  ['twelve spaces', () => ' '.repeat(12), /spaces/],
  ['the public demo password', () => 'hotwell-demo-2026', /demo/],
  ['the person’s own name', (p) => `${p.name.split(' ').at(-1)} tends the condenser`, /name/],
  ['the local part of the person’s e-mail', (p) => `${p.email.split('@')[0]} cw pumps`, /e-mail/],
];

let serial = 0;
describe('POST /api/me/password', () => {
  it.each(refused)('refuses %s with a message on the new password', async (_label, make, message) => {
    serial += 1;
    const user = await User.create({ name: 'Ilse Brandvold', email: `nightwatch${serial}${Date.now()}@test.example`, role: 'operator', crewId: null, passwordHash: await hashPassword(PASSWORD), active: true, mustChangePassword: false });
    const agent = await signedInAgent(built, user.email);
    const res = await change(agent, make(user));
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.fields.newPassword).toMatch(message);
    // Nothing changed: the old password still signs in.
    await signedInAgent(built, user.email);
  });

  it('accepts a long passphrase of unrelated words', async () => {
    const agent = await signedInAgent(built, (await makeUser('operator')).email);
    const res = await change(agent, 'slate otter cobalt lantern 47');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
  });
});

describe('POST /api/admin/users', () => {
  it('refuses a weak or personal temporary password with a message on that field', async () => {
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    const create = (temporaryPassword: string) =>
      admin.post('/api/admin/users').set('X-CSRF-Token', admin.csrf).send({ name: 'Tove Aalund', email: `tove.aalund.${Date.now()}@test.example`, role: 'operator', crewId: null, temporaryPassword });
    for (const weak of ['password1234', 'hotwell-demo-2026', 'aalund on nights', ' '.repeat(14)]) {
      const res = await create(weak);
      expect(res.status, weak).toBe(400);
      expect(res.body.error.fields.temporaryPassword, weak).toBeTruthy();
    }
    expect((await create('first shift kestrel 83')).status).toBe(201);
  });
});

describe('a password change ends the person’s other sessions', () => {
  let listening: Awaited<ReturnType<typeof listenWithSockets>>;
  let base = '';
  const sockets: Socket[] = [];
  beforeAll(async () => {
    listening = await listenWithSockets(built);
    base = listening.base;
  });
  afterAll(async () => {
    for (const s of sockets) s.disconnect();
    await listening.close();
  });

  /** A browser: its session cookie, its CSRF token and its socket. */
  async function browser(email: string) {
    let cookie = '';
    const call = async (path: string, init: RequestInit = {}) => {
      const res = await fetch(base + path, { ...init, headers: { ...(init.headers ?? {}), cookie, 'content-type': 'application/json' } });
      const set = res.headers.get('set-cookie');
      if (set) cookie = set.split(';')[0]!;
      return res;
    };
    const { csrfToken } = (await (await call('/api/session/csrf')).json()) as { csrfToken: string };
    const signedIn = await call('/api/session', { method: 'POST', headers: { 'x-csrf-token': csrfToken }, body: JSON.stringify({ email, password: PASSWORD }) });
    expect(signedIn.status).toBe(200);
    const csrf = ((await signedIn.json()) as { csrfToken: string }).csrfToken;
    const socket = connect(base, { transports: ['websocket'], extraHeaders: { cookie }, forceNew: true, reconnection: false });
    sockets.push(socket);
    await new Promise<void>((resolve, reject) => {
      socket.once('connect', () => resolve());
      socket.once('connect_error', reject);
    });
    return { call, csrf, socket };
  }

  it('signs out the other browsers and closes their sockets, and keeps this one', async () => {
    const user = await makeUser('operator');
    const here = await browser(user.email);
    const elsewhere = await browser(user.email);
    const closedElsewhere = new Promise<string>((resolve) => elsewhere.socket.once('disconnect', resolve));
    let closedHere = false;
    here.socket.once('disconnect', () => (closedHere = true));
    expect(await SessionRow.count({ where: { userId: user.id } })).toBe(2);

    const res = await here.call('/api/me/password', { method: 'POST', headers: { 'x-csrf-token': here.csrf }, body: JSON.stringify({ currentPassword: PASSWORD, newPassword: 'slate otter cobalt lantern 47' }) });
    expect(res.status).toBe(200);
    expect(await closedElsewhere).toBe('io server disconnect');
    expect((await elsewhere.call('/api/me')).status).toBe(401);
    expect((await here.call('/api/me')).status).toBe(200);
    expect(await SessionRow.count({ where: { userId: user.id } })).toBe(1);
    await new Promise((resolve) => setTimeout(resolve, 100));
    expect(closedHere).toBe(false);
  });
});
