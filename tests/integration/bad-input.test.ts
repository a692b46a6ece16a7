// Bad input never breaks the server: every write route of the app (read from its own route table)
// gets generated hostile bodies, malformed paths and malformed multipart, signed in as a role the
// route allows, and never answers 5xx; the server still answers afterwards.
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '../../shared/roles';
import { vacuumRound } from './support/rounds';
import { hostileBody } from './support/hostile-input';
import { fillPath, writeRoutesOf, type RouteEntry } from './support/route-table';
import { anonymousAgent, buildApp, closeAll, makeStation, makeUser, signedInAgent, type Agent } from './support/test-app';

const built = buildApp();
afterAll(closeAll);

const roles: Role[] = ['admin', 'shift_lead', 'operator', 'trainer', 'trainee'];
const agents = {} as Record<Role, Agent>;
const ids: Record<string, string | number> = {};
const samples: Record<string, unknown> = {};
// Deletions and retirements last, so the records the other routes point at are still there.
const ending = (r: RouteEntry) => Number(r.method === 'DELETE' || r.path.endsWith('/retire'));
const routes = writeRoutesOf(built.app).sort((a, b) => ending(a) - ending(b));
const label = (r: RouteEntry) => `${r.method} ${r.path}`;
const send = (agent: Agent, method: string, path: string) => agent[method.toLowerCase() as 'post'](path).set('X-CSRF-Token', agent.csrf);
const json = (agent: Agent, route: RouteEntry, path: string, text: string) => send(agent, route.method, path).set('Content-Type', 'application/json').send(text);
const ok = async (res: Promise<{ status: number; body: Record<string, unknown> }>) => {
  const answer = await res;
  if (answer.status >= 300) throw new Error(`setup: ${answer.status} ${JSON.stringify(answer.body)}`);
  return answer.body;
};

beforeAll(async () => {
  const { station, unit, crews } = await makeStation(2);
  const crewA = crews[0]!.id;
  for (const role of roles) agents[role] = await signedInAgent(built, (await makeUser(role, { crewId: role === 'admin' || role === 'trainer' ? null : crewA })).email);
  const post = (role: Role, path: string, body: unknown) => ok(send(agents[role], 'POST', path).send(body as object));
  const shifts = await agents.admin.get(`/api/units/${unit.id}/log/shifts`).expect(200);
  const shiftStart = shifts.body.shifts[0].start as string;
  await ok(send(agents.admin, 'PUT', `/api/stations/${station.id}/crew-rotation`).send({ anchorShiftStart: shiftStart, crewIds: [crewA, crews[1]!.id] }));
  const spare = await makeUser('operator', { crewId: crewA });
  const reading = await post('operator', `/api/units/${unit.id}/readings`, vacuumRound());
  const flag = await post('shift_lead', `/api/units/${unit.id}/flags`, { parameter: 'ttd', severity: 'watch', comment: 'TTD creeping up' });
  const entry = await post('operator', `/api/units/${unit.id}/log`, { position: 'control_room', category: 'operation', text: 'Vented waterbox B', carryToHandover: false });
  const condition = await post('shift_lead', `/api/units/${unit.id}/conditions`, { title: '1-CWP-B out of service', requiredAction: 'Restore within 72 h', startedAt: new Date().toISOString(), limitHours: 72, ownerId: spare.id });
  const order = await post('shift_lead', `/api/standing-orders?stationId=${station.id}`, { title: 'Hourly TTD', bodyHtml: '<p>Log TTD hourly.</p>', effectiveFrom: new Date().toISOString() });
  const { board } = (await post('operator', `/api/units/${unit.id}/handovers/current`, {})) as { board: { handover: { id: number } } };
  const item = await post('operator', `/api/handovers/${board.handover.id}/items`, { kind: 'equipment', title: 'CWP B on standby', priority: 'normal' });
  const taskKey = `BI-${String(Date.now()).slice(-4)}`;
  await post('trainer', '/api/training/tasks', { taskKey, position: 'field_operator', system: 'circulating_water', title: 'Start a CW pump', standard: 'Starts the pump per procedure', procedureRef: 'TST-1', requiredPerformances: 1 });
  const training = await post('trainee', '/api/training/entries', { taskKey, performedOn: new Date().toISOString().slice(0, 10), level: 'supervised', note: 'With the lead' });
  Object.assign(ids, {
    unitId: unit.id,
    stationId: station.id,
    taskKey,
    'readings/:id': reading.id as number,
    'flags/:id': (flag.flag as { id: number }).id,
    'log/:id': entry.id as number,
    'conditions/:id': (condition.condition as { id: number }).id,
    'standing-orders/:id': (order.order as { id: number }).id,
    'handovers/:id': board.handover.id,
    'handover-items/:id': item.id as number,
    'entries/:id': training.id as number,
    'users/:id': spare.id,
  });
  const settings = (await agents.admin.get(`/api/stations/${station.id}/settings`).expect(200)).body.settings;
  const setup = (await agents.admin.get(`/api/plant/units/${unit.id}/setup`).expect(200)).body;
  const now = new Date().toISOString();
  Object.assign(samples, {
    'POST /api/session': { email: 'nobody@test.example', password: 'wrong password' },
    'POST /api/me/password': { currentPassword: 'not the password', newPassword: 'a brand new password' },
    'POST /api/admin/users': { name: 'New Person', email: 'new@test.example', role: 'operator', crewId: null, temporaryPassword: 'a long temporary password 1' },
    'PATCH /api/admin/users/:id': { role: 'operator', version: 0 },
    'POST /api/plant/units/:unitId/design-versions': { design: setup.design.data, note: 'Retubed' },
    'POST /api/plant/units/:unitId/limit-versions': { limits: setup.limits.data, note: 'New limits' },
    'POST /api/admin/users/:id/deactivate': { version: 0 },
    'POST /api/admin/users/:id/reactivate': { version: 0 },
    'POST /api/training/tasks/:taskKey/retire': { changeNote: 'No longer done' },
    'POST /api/plant/units/:unitId/equipment': { tag: 'P-1', name: 'Test pump', kind: 'cw_pump' },
    'POST /api/calc/condenser': { unitId: unit.id, ...vacuumRound() },
    'POST /api/units/:unitId/readings': vacuumRound(),
    'POST /api/readings/:id/amendments': { reason: 'Misread the gauge', reading: vacuumRound() },
    'POST /api/units/:unitId/flags': { parameter: 'ttd', severity: 'watch', comment: 'TTD creeping up' },
    'POST /api/flags/:id/assign': { assignedTo: spare.id, followUp: 'Check the air ejectors', version: 0 },
    'POST /api/flags/:id/clear': { comment: 'Back to normal', version: 0 },
    'PUT /api/stations/:stationId/settings': settings,
    'POST /api/units/:unitId/log': { position: 'control_room', category: 'operation', text: 'Vented waterbox B', eventAt: now, carryToHandover: false },
    'POST /api/log/:id/amendments': { reason: 'Wrong pump named', text: 'Vented waterbox A' },
    'POST /api/units/:unitId/log/reviews': { position: 'control_room', shiftStart },
    'POST /api/standing-orders': { title: 'Hourly TTD', bodyHtml: '<p>Log TTD hourly.</p>', effectiveFrom: now, crewIds: [crewA], positions: ['control_room'] },
    'POST /api/units/:unitId/conditions': { title: 'CWP out', requiredAction: 'Restore it', startedAt: now, limitHours: 72, ownerId: spare.id },
    'POST /api/conditions/:id/close': { text: 'Restored', position: 'control_room', version: 0 },
    'PUT /api/handovers/:id/notes': { html: '<p>Quiet shift</p>', version: 0 },
    'POST /api/handovers/:id/items': { kind: 'equipment', title: 'CWP B on standby', detail: 'Ready', reference: 'WO-1', priority: 'high', clientKey: 'abcdefgh12' },
    'PATCH /api/handover-items/:id': { title: 'CWP B on standby', detail: 'Ready', priority: 'low', version: 1 },
    'POST /api/handovers/:id/amendments': { itemId: null, reason: 'Forgot this', text: 'Also: CT fan 3 off' },
    'POST /api/handover-items/:id/queries': { question: 'Which pump?' },
    'POST /api/handover-queries/:id/answer': { answer: 'Pump B' },
    'PUT /api/stations/:stationId/crew-rotation': { anchorShiftStart: shiftStart, crewIds: [crewA, crews[1]!.id] },
    'POST /api/stations/:stationId/crew-swaps': { shiftStart, crewId: crews[1]!.id, reason: 'Training day' },
    'POST /api/logbook/review-comments': { documentId: 1, body: 'Say which pump' },
    'POST /api/training/tasks': { taskKey: 'BI-9999', position: 'field_operator', system: 'circulating_water', title: 'Start a CW pump', standard: 'Starts the pump', requiredPerformances: 1 },
    'PUT /api/training/tasks/:taskKey': { position: 'field_operator', system: 'circulating_water', title: 'Start a CW pump', standard: 'Starts the pump', requiredPerformances: 2, changeNote: 'Two now' },
    'POST /api/training/entries': { taskKey, performedOn: now.slice(0, 10), level: 'supervised', note: 'With the lead' },
    'POST /api/training/entries/:id/reject': { reason: 'Not what happened' },
    'POST /api/training/decisions': { traineeId: spare.id, taskKey, decision: 'returned', comments: 'More practice' },
    'POST /api/training/amendments': { target: 'entry', targetId: training.id, reason: 'Wrong date', text: 'It was Monday' },
  });
});

/** The first role (admin first) the route does not refuse outright; the sign-in routes go anonymous. */
const chosen = new Map<string, Role>();
async function agentFor(route: RouteEntry): Promise<() => Promise<Agent>> {
  if (route.path === '/api/session') return () => anonymousAgent(built);
  if (!chosen.has(label(route))) {
    const path = fillPath(route.path, ids);
    let found: Role = 'shift_lead';
    for (const role of roles) {
      const res = await json(agents[role], route, path, '{}');
      if (res.status !== 403 && res.status !== 401) {
        found = role;
        break;
      }
    }
    chosen.set(label(route), found);
  }
  const role = chosen.get(label(route))!;
  return async () => agents[role];
}

function keysOf(v: unknown): string[] {
  if (!v || typeof v !== 'object') return [];
  return Array.isArray(v) ? v.flatMap((x) => keysOf(x)) : Object.entries(v).flatMap(([k, inner]) => [k, ...keysOf(inner)]);
}
const knownKeys = () => [...new Set(Object.values(samples).flatMap((v) => keysOf(v)))];

describe('every write route, generated hostile bodies', () => {
  it('has write routes to test', () => {
    expect(routes.length).toBeGreaterThan(40);
  });

  for (const route of routes) {
    it(`${label(route)} never answers 5xx`, async () => {
      const agentOf = await agentFor(route);
      const keys = knownKeys();
      await fc.assert(
        fc.asyncProperty(hostileBody(keys, samples[label(route)]), fc.boolean(), async (body, realIds) => {
          const path = realIds ? fillPath(route.path, ids) : fillPath(route.path, {});
          const res = await json(await agentOf(), route, path, body);
          expect(res.status, `${label(route)} ${body.slice(0, 300)} → ${JSON.stringify(res.body).slice(0, 300)}`).toBeLessThan(500);
        }),
        { numRuns: 20 },
      );
    }, 60_000);
  }
});

const badSegments = ['%E0%A4%A', '%', '%ZZ', '%00', '%F0%9F', '-1', '1.5', 'NaN', '99999999999999999999', '0x10', '__proto__'];

describe('every write route, malformed paths and multipart', () => {
  it('answers 400 for a path whose percent-encoding is broken', async () => {
    const res = await agents.operator.get('/api/readings/%E0%A4%A');
    expect(res.status).toBe(400);
    expect(res.body.error.message).not.toMatch(/param|decode/i);
  });

  it('never answers 5xx to a malformed id in any write route', async () => {
    for (const route of routes.filter((r) => r.path.includes('/:'))) {
      const agent = await (await agentFor(route))();
      for (const bad of badSegments) {
        const path = route.path.replace(/:[A-Za-z]+/g, bad);
        const res = await json(agent, route, path, '{}');
        expect(res.status, `${label(route)} as ${path}`).toBeLessThan(500);
      }
    }
  }, 60_000);

  const boundary = 'hotwellBoundary';
  const part = (name: string, fileName: string) => `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${fileName}"\r\nContent-Type: text/csv\r\n\r\n${name}\r\n`;
  const multiparts: [string, string, string][] = [
    ['NUL in the file name', `multipart/form-data; boundary=${boundary}`, `${part('time,p\n2026-01-01T00:00Z,5', 'a\u0000b.csv')}--${boundary}--\r\n`],
    ['truncated body', `multipart/form-data; boundary=${boundary}`, part('time,p\n2026-01-01T00:00Z,5', 'a.csv').slice(0, 60)],
    ['missing boundary', 'multipart/form-data', `${part('x', 'a.csv')}--${boundary}--\r\n`],
    ['garbage', `multipart/form-data; boundary=${boundary}`, 'not multipart at all'],
  ];

  it('never answers 5xx to malformed multipart on any write route', async () => {
    for (const route of routes) {
      const agent = await (await agentFor(route))();
      for (const [what, type, body] of multiparts) {
        const res = await send(agent, route.method, fillPath(route.path, ids)).set('Content-Type', type).send(Buffer.from(body, 'latin1'));
        expect(res.status, `${label(route)}: ${what}`).toBeLessThan(500);
      }
    }
  }, 60_000);

  it('answers 400 with a message on the file for malformed multipart on the import and attachment routes', async () => {
    const uploads = routes.filter((r) => /imports|attachments/.test(r.path));
    expect(uploads.length).toBe(4);
    for (const route of uploads) {
      const agent = await (await agentFor(route))();
      for (const [what, type, body] of multiparts) {
        const res = await send(agent, route.method, fillPath(route.path, ids)).set('Content-Type', type).send(Buffer.from(body, 'latin1'));
        expect(res.status, `${label(route)}: ${what} → ${JSON.stringify(res.body)}`).toBe(400);
        expect(res.body.error.fields?.file, `${label(route)}: ${what}`).toMatch(/\w/);
      }
    }
  }, 60_000);

  it('never answers 5xx to a body in an odd character set or encoding', async () => {
    const odd: [string, Record<string, string>, string][] = [
      ['UTF-16 JSON', { 'Content-Type': 'application/json; charset=utf-16' }, '{"a":1}'],
      ['unknown charset', { 'Content-Type': 'application/json; charset=klingon' }, '{"a":1}'],
      ['unknown content encoding', { 'Content-Type': 'application/json', 'Content-Encoding': 'bogus' }, '{"a":1}'],
      ['gzip that is not gzip', { 'Content-Type': 'application/json', 'Content-Encoding': 'gzip' }, '{"a":1}'],
      ['form-encoded', { 'Content-Type': 'application/x-www-form-urlencoded' }, 'a=%E0%A4%A&b[c][d][e][f][g][h]=1'],
    ];
    const route = routes.find((r) => r.path === '/api/units/:unitId/log')!;
    const agent = await (await agentFor(route))();
    for (const [what, headers, body] of odd) {
      const res = await send(agent, route.method, fillPath(route.path, ids)).set(headers).send(body);
      expect(res.status, `${what} → ${JSON.stringify(res.body)}`).toBeLessThan(500);
    }
  });

  it('still answers afterwards', async () => {
    await agents.operator.get('/api/health').expect(200);
    await agents.operator.get('/api/me').expect(200);
  });
});
