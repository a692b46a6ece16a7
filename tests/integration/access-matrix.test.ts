// Every API route × every role, a person still on a temporary password, and nobody signed in —
// generated from the app's own route table and checked against the policy declared for the route in
// support/access-policies.ts, whose roles come from the shared permission table. A route with no
// declared policy fails. Outside its policy a caller gets 403 (401 when nobody is signed in); inside
// it, a valid request is answered 2xx — never 401 or 403 — unless the record itself turns that role
// away, which the policy declares.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Express } from 'express';
import { can, rolesFor, type Action } from '../../shared/policies/permissions';
import { roles, type Role } from '../../shared/roles';
import { nextShiftStart, shiftStartFor } from '../../shared/shift-time';
import { accessPolicies, type Access, type Call, type Fixtures, type Policy, type Who } from './support/access-policies';
import { PASSWORD, anonymousAgent, buildApp, closeAll, makeStation, makeUser, signedInAgent, type Agent } from './support/test-app';

const built = buildApp();

type Layer = { rawPath?: unknown; route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } };
/** "METHOD /api/path" of every API route, as the app registered them, mount paths included. */
function apiRoutes(app: Express): string[] {
  const found: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const path = prefix + (layer.route.path === '/' && prefix ? '' : layer.route.path);
        for (const method of Object.keys(layer.route.methods)) if (method !== '_all') found.push(`${method.toUpperCase()} ${path}`);
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, prefix + (typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : ''));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return found.filter((r) => r.split(' ')[1]!.startsWith('/api/'));
}
const routes = apiRoutes(built.app);

/** What an administrator must never be able to do: write a record of the plant's operation. */
const operationalWrites: Action[] = [
  'reading.record', 'reading.amend', 'reading.countersign', 'import.run', 'flag.manage', 'log.write', 'log.amend', 'log.review',
  'condition.manage', 'order.issue', 'order.acknowledge', 'handover.take-part', 'handover.attach', 'review.comment',
  'training.practice', 'training.countersign', 'training.decide', 'training.amend',
];

const callers: Who[] = ['anonymous', 'pending', ...roles];
const crewRoles: readonly Role[] = ['trainee', 'operator', 'shift_lead'];

function passesTable(access: Access, who: Who): boolean {
  if (access === 'public') return true;
  if (who === 'anonymous') return false;
  if (access === 'signed-in, temporary password too') return true;
  if (who === 'pending') return false;
  return access === 'signed-in' || can(who, access);
}
function expected(policy: Policy, who: Who): 'answered' | 401 | 403 {
  if (!passesTable(policy.access, who)) return who === 'anonymous' ? 401 : 403;
  return who !== 'anonymous' && who !== 'pending' && policy.refused?.[who] ? 403 : 'answered';
}

const agents = new Map<string, Agent>();
let policies: Record<string, Policy> = {};

beforeAll(async () => {
  // The middle of a day shift or a night shift, so no shift change falls inside the run.
  const zone = 'Europe/Berlin';
  const changes = ['06:00', '18:00'];
  const shiftStart = shiftStartFor(new Date(), zone, changes);
  vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
  vi.setSystemTime(new Date(shiftStart.getTime() + 6 * 3_600_000));
  let later = shiftStart;
  for (let i = 0; i < 4; i++) later = nextShiftStart(later, zone, changes);

  const { station, unit, crews } = await makeStation(2);
  const [crewA, crewB] = [crews[0]!.id, crews[1]!.id];
  const admin = await signedInAgent(built, (await makeUser('admin')).email);
  const post = async (agent: Agent, path: string, body: unknown) => {
    const res = await agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);
    return { status: res.status, body: res.body as Record<string, unknown> };
  };
  // Crew A works this shift and hands over to crew B; the window is the whole shift, so submit and accept work at any time in it.
  const settings = (await admin.get(`/api/stations/${station.id}/settings`).expect(200)).body.settings;
  await admin.put(`/api/stations/${station.id}/settings`).set('X-CSRF-Token', admin.csrf).send({ ...settings, timeZone: zone, shiftChangeTimes: changes, handoverWindowBeforeMinutes: 720, handoverWindowAfterMinutes: 0 }).expect(200);
  await admin.put(`/api/stations/${station.id}/crew-rotation`).set('X-CSRF-Token', admin.csrf).send({ anchorShiftStart: shiftStart.toISOString(), crewIds: [crewA, crewB] }).expect(200);

  const people: Partial<Record<string, number>> = {};
  for (const [crew, crewId] of [['A', crewA], ['B', crewB]] as const) {
    for (const role of crewRoles) {
      const person = await makeUser(role, { crewId });
      people[`${role}${crew}`] = person.id;
      agents.set(`${role}${crew}`, await signedInAgent(built, person.email));
    }
  }
  agents.set('trainer', await signedInAgent(built, (await makeUser('trainer')).email));
  agents.set('admin', admin);
  agents.set('pending', await signedInAgent(built, (await makeUser('operator', { mustChangePassword: true })).email));
  agents.set('anonymous', await anonymousAgent(built));

  let serial = Math.floor(Math.random() * 4000);
  const remembered = new Map<string, Promise<unknown>>();
  const fixtures: Fixtures = {
    unitId: unit.id,
    stationId: station.id,
    crewA,
    crewB,
    leadA: people.shift_leadA!,
    traineeA: people.traineeA!,
    shiftStart: shiftStart.toISOString(),
    laterShiftStart: later.toISOString(),
    agentOf: (who, side) => agents.get((crewRoles as readonly string[]).includes(who) ? `${who}${side === 'incoming' ? 'B' : 'A'}` : who)!,
    post,
    get: async (agent, path) => (await agent.get(path).expect(200)).body,
    throwawayAgent: async (who) => {
      const person = await makeUser(who === 'anonymous' || who === 'pending' ? 'operator' : who, { mustChangePassword: who === 'pending' });
      const agent = who === 'anonymous' ? await anonymousAgent(built) : await signedInAgent(built, person.email);
      return { agent, email: person.email, password: PASSWORD };
    },
    newUser: async () => {
      const person = await makeUser('operator');
      return { id: person.id, version: person.version };
    },
    ids: {},
    remember: <T,>(name: string, make: () => Promise<T>) => {
      if (!remembered.has(name)) remembered.set(name, make());
      return remembered.get(name) as Promise<T>;
    },
    unique: () => ++serial,
  };
  policies = accessPolicies(fixtures);
});

afterAll(async () => {
  vi.useRealTimers();
  await closeAll();
});

function send(agent: Agent, method: string, call: Call) {
  let req = agent[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](call.path).set('X-CSRF-Token', agent.csrf);
  if (call.file) {
    req = req.attach('file', call.file.buffer, call.file.name);
    for (const [name, value] of Object.entries(call.fields ?? {})) req = req.field(name, value);
    return req;
  }
  return call.body === undefined ? req : req.send(call.body as object);
}

describe('the access matrix', () => {
  it('has a declared policy for every API route, and none for a route that is gone', () => {
    expect(routes.length).toBeGreaterThan(80);
    expect(routes.filter((r) => !(r in policies)), 'routes with no declared access policy').toEqual([]);
    expect(Object.keys(policies).filter((r) => !routes.includes(r)), 'policies for routes that no longer exist').toEqual([]);
  });

  it('gives administrators no operational write', () => {
    expect(operationalWrites.filter((action) => rolesFor(action).includes('admin'))).toEqual([]);
  });

  for (const route of routes) {
    it(route, async () => {
      const policy = policies[route];
      expect(policy, `${route} has no declared access policy`).toBeDefined();
      const [method] = route.split(' ') as [string];
      const want: Record<string, unknown> = {};
      const got: Record<string, unknown> = {};
      const said: Record<string, unknown> = {};
      for (const who of callers) {
        const call = await policy!.call(who, passesTable(policy!.access, who));
        const res = await send(call.agent ?? agents.get(who === 'anonymous' || who === 'pending' || !crewRoles.includes(who) ? who : `${who}${policy!.side === 'incoming' ? 'B' : 'A'}`)!, method, call);
        call.after?.({ status: res.status, body: res.body });
        want[who] = expected(policy!, who);
        got[who] = res.status >= 200 && res.status < 300 ? 'answered' : res.status;
        if (got[who] !== want[who]) said[who] = res.body?.error?.message ?? res.text?.slice(0, 200);
      }
      expect(got, JSON.stringify(said)).toEqual(want);
    });
  }
});
