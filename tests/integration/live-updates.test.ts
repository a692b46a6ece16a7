// Live by construction: every route that changes a record names the kind of live event it sends
// (a new write route without an entry here fails the first test); each kind is seen leaving after
// its commit and only then; sockets join and leave unit rooms; presence counts the board only;
// a deactivated or signed-out person's socket is closed at once.
import type { Express } from 'express';
import { io as connect, type Socket } from 'socket.io-client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { LiveEntity, LiveEvent } from '../../shared/live-events';
import { onPublished, publish } from '../../server/lib/live';
import { unitOfWork } from '../../server/lib/unit-of-work';
import { vacuumRound } from './support/rounds';
import { buildApp, closeAll, db, makeStation, makeUser, signedInAgent, PASSWORD, type Agent, listenWithSockets } from './support/test-app';

const built = buildApp();
const post = (agent: Agent, path: string, body: unknown = {}) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);

/** What each write route publishes (null: it changes no record others watch). */
const publishes: Record<string, LiveEntity | null> = {
  'POST /session': null,
  'DELETE /session': null,
  'POST /me/password': 'people',
  'POST /': 'people', // admin: create a person
  'PATCH /:id': 'people',
  'POST /:id/deactivate': 'people',
  'POST /:id/reactivate': 'people',
  'POST /units/:unitId/design-versions': 'plant',
  'POST /units/:unitId/limit-versions': 'plant',
  'POST /units/:unitId/plausible-range-versions': 'plant',
  'POST /units/:unitId/equipment': 'plant',
  'POST /condenser': null, // the scratch-pad calculation saves nothing
  'POST /units/:unitId/readings': 'reading',
  'POST /readings/:id/amendments': 'reading',
  'POST /readings/:id/countersign': 'reading',
  'POST /units/:unitId/flags': 'flag',
  'POST /flags/:id/assign': 'flag',
  'POST /flags/:id/clear': 'flag',
  'POST /units/:unitId/imports/inspect': null,
  'POST /units/:unitId/imports/preview': null,
  'POST /units/:unitId/imports': 'import',
  'PUT /stations/:stationId/settings': 'station_settings',
  'POST /units/:unitId/log': 'log_entry',
  'POST /log/:id/amendments': 'log_entry',
  'POST /units/:unitId/log/reviews': 'log_review',
  'POST /standing-orders': 'standing_order',
  'POST /standing-orders/:id/acknowledge': 'standing_order',
  'POST /units/:unitId/conditions': 'condition',
  'POST /conditions/:id/close': 'condition',
  'POST /units/:unitId/handovers/current': 'handover',
  'PUT /handovers/:id/notes': 'handover',
  'POST /handovers/:id/items': 'handover',
  'PATCH /handover-items/:id': 'handover',
  'DELETE /handover-items/:id': 'handover',
  'POST /handovers/:id/submit': 'handover',
  'POST /handovers/:id/amendments': 'handover',
  'POST /handover-items/:id/acknowledge': 'handover',
  'POST /handover-items/:id/queries': 'handover',
  'POST /handover-queries/:id/answer': 'handover',
  'POST /handovers/:id/accept': 'handover',
  'POST /handover-items/:id/attachments': 'handover',
  'PUT /stations/:stationId/crew-rotation': 'station_settings',
  'POST /stations/:stationId/crew-swaps': 'station_settings',
  'POST /logbook/review-comments': 'review_comment',
  'POST /training/tasks': 'training',
  'PUT /training/tasks/:taskKey': 'training',
  'POST /training/tasks/:taskKey/retire': 'training',
  'POST /training/entries': 'training',
  'POST /training/entries/:id/countersign': 'training',
  'POST /training/entries/:id/reject': 'training',
  'POST /training/decisions': 'training',
  'POST /training/amendments': 'training',
};

type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } };
function writeRoutes(app: Express): string[] {
  const found: string[] = [];
  const walk = (stack: Layer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) if (method !== 'get' && method !== '_all') found.push(`${method.toUpperCase()} ${layer.route.path}`);
      } else if (layer.handle?.stack) walk(layer.handle.stack);
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack);
  return found;
}

let events: LiveEvent[] = [];
let stopListening = () => {};
beforeAll(() => {
  stopListening = onPublished(db(), (event) => events.push(event));
});
afterAll(async () => {
  stopListening();
  await closeAll();
});

/** Runs a write and returns the events it published (all of them leave on commit, before the response). */
async function eventsOf(write: () => Promise<{ status: number }>, expectedStatus: number) {
  events = [];
  const res = await write();
  expect(res.status, JSON.stringify((res as { body?: unknown }).body)).toBe(expectedStatus);
  return events;
}

describe('the publish point', () => {
  it('knows what every write route publishes', () => {
    const routes = writeRoutes(built.app);
    expect(routes.filter((r) => !(r in publishes)), 'write routes with no declared live event').toEqual([]);
    expect(Object.keys(publishes).filter((r) => !routes.includes(r)), 'declared routes that no longer exist').toEqual([]);
  });

  it('sends nothing for a rolled-back transaction, and the event after the commit for one that commits', async () => {
    events = [];
    await expect(
      unitOfWork(db(), async (transaction) => {
        publish(transaction, { entity: 'flag', id: 1, unitId: 1 });
        throw new Error('the write failed');
      }),
    ).rejects.toThrow('the write failed');
    expect(events).toEqual([]);
    const seenInside: number[] = [];
    await unitOfWork(db(), async (transaction) => {
      publish(transaction, { entity: 'flag', id: 2, unitId: 1 });
      seenInside.push(events.length);
    });
    expect(seenInside).toEqual([0]);
    expect(events).toEqual([{ entity: 'flag', id: 2, unitId: 1 }]);
  });
});

describe('each kind of record goes live from its service', () => {
  let unitId = 0;
  let stationId = 0;
  const a = {} as Record<'operator' | 'lead' | 'trainee' | 'trainer' | 'admin', Agent>;
  const ids = { lead: 0 };
  beforeAll(async () => {
    const { station, unit, crews } = await makeStation(2);
    unitId = unit.id;
    stationId = station.id;
    a.operator = await signedInAgent(built, (await makeUser('operator', { crewId: crews[0]!.id })).email);
    const lead = await makeUser('shift_lead', { crewId: crews[0]!.id });
    ids.lead = lead.id;
    a.lead = await signedInAgent(built, lead.email);
    a.trainee = await signedInAgent(built, (await makeUser('trainee', { crewId: crews[0]!.id })).email);
    a.trainer = await signedInAgent(built, (await makeUser('trainer')).email);
    a.admin = await signedInAgent(built, (await makeUser('admin')).email);
  });
  const kinds = (list: LiveEvent[]) => list.map((e) => `${e.entity}${e.unitId ? `@${e.unitId}` : ''}`);
  const round = (vacuumInHg = 28.5) => vacuumRound(vacuumInHg);

  it('rounds, their flags and countersigns', async () => {
    const traineeRound = await a.trainee.post(`/api/units/${unitId}/readings`).set('X-CSRF-Token', a.trainee.csrf).send(round());
    expect(traineeRound.status).toBe(201);
    expect(kinds(await eventsOf(() => post(a.operator, `/api/readings/${traineeRound.body.id}/countersign`), 200))).toEqual([`reading@${unitId}`]);
    // A round above the alarm limit: the round and the flag it opened, both for this unit.
    const high = await eventsOf(() => post(a.operator, `/api/units/${unitId}/readings`, round(25)), 201);
    expect(kinds(high)).toContain(`reading@${unitId}`);
    expect(kinds(high)).toContain(`flag@${unitId}`);
    // Bad input is refused before anything is written: nothing is sent.
    expect(await eventsOf(() => post(a.operator, `/api/units/${unitId}/readings`, { ...round(), hotwellTemperature: undefined }), 400)).toEqual([]);
  });

  it('log entries, reviews, conditions and standing orders', async () => {
    expect(kinds(await eventsOf(() => post(a.operator, `/api/units/${unitId}/log`, { position: 'control_room', category: 'operation', text: 'Vented waterbox B', carryToHandover: false }), 201))).toEqual([`log_entry@${unitId}`]);
    const shifts = await a.lead.get(`/api/units/${unitId}/log/shifts`).expect(200);
    expect(kinds(await eventsOf(() => post(a.lead, `/api/units/${unitId}/log/reviews`, { position: 'control_room', shiftStart: shifts.body.shifts[1].start }), 201))).toEqual([`log_review@${unitId}`]);
    const opened = await eventsOf(
      () => post(a.lead, `/api/units/${unitId}/conditions`, { title: '1-CWP-B out of service', requiredAction: 'Restore within 72 h', startedAt: new Date().toISOString(), limitHours: 72, ownerId: ids.lead }),
      201,
    );
    expect(kinds(opened)).toContain(`condition@${unitId}`);
    expect(kinds(await eventsOf(() => post(a.lead, `/api/standing-orders?stationId=${stationId}`, { title: 'Hourly TTD', bodyHtml: '<p>Log TTD hourly.</p>', effectiveFrom: new Date().toISOString() }), 201))).toEqual(['standing_order']);
  });

  it('plant versions, people and station settings', async () => {
    const design = await a.admin.get(`/api/plant/units/${unitId}/setup`);
    expect(design.status).toBe(200);
    expect(kinds(await eventsOf(() => post(a.admin, `/api/plant/units/${unitId}/equipment`, { tag: `T-${Date.now() % 100000}`, name: 'Test pump', kind: 'cw_pump' }), 201))).toEqual([`plant@${unitId}`]);
    const ranges = design.body.plausible.data;
    expect(kinds(await eventsOf(() => post(a.admin, `/api/plant/units/${unitId}/plausible-range-versions`, { ranges, note: 'Same ranges, recorded' }), 201))).toEqual([`plant@${unitId}`]);
    expect(kinds(await eventsOf(() => post(a.admin, '/api/admin/users', { name: 'New Person', email: `new.${Date.now()}@test.example`, role: 'operator', crewId: null, temporaryPassword: 'a long temporary password 1' }), 201))).toEqual(['people']);
    const settings = (await a.admin.get(`/api/stations/${stationId}/settings`).expect(200)).body.settings;
    expect(kinds(await eventsOf(() => a.admin.put(`/api/stations/${stationId}/settings`).set('X-CSRF-Token', a.admin.csrf).send({ ...settings, lateEntryMinutes: 45 }), 200))).toEqual(['station_settings']);
  });

  it('training records', async () => {
    const key = `LV-${String(Date.now()).slice(-4)}`;
    const task = { taskKey: key, position: 'field_operator', system: 'circulating_water', title: 'Start a CW pump', standard: 'Starts the pump per procedure', procedureRef: 'TST-1', requiredPerformances: 1 };
    expect(kinds(await eventsOf(() => post(a.trainer, '/api/training/tasks', task), 201))).toEqual(['training']);
    expect(kinds(await eventsOf(() => post(a.trainee, '/api/training/entries', { taskKey: key, performedOn: new Date().toISOString().slice(0, 10), level: 'supervised', note: 'With the lead' }), 201))).toEqual(['training']);
  });
});

describe('sockets', () => {
  let listening: Awaited<ReturnType<typeof listenWithSockets>>;
  let base = '';
  const open: Socket[] = [];
  beforeAll(async () => {
    listening = await listenWithSockets(built);
    base = listening.base;
  });
  afterAll(async () => {
    for (const s of open) s.disconnect();
    await listening.close();
  });

  async function session(email: string, password = PASSWORD) {
    let cookie = '';
    const call = async (path: string, init: RequestInit = {}) => {
      const res = await fetch(base + path, { ...init, headers: { ...(init.headers ?? {}), cookie, 'content-type': 'application/json' } });
      const set = res.headers.get('set-cookie');
      if (set) cookie = set.split(';')[0]!;
      return res;
    };
    const { csrfToken } = (await (await call('/api/session/csrf')).json()) as { csrfToken: string };
    const signedIn = await call('/api/session', { method: 'POST', headers: { 'x-csrf-token': csrfToken }, body: JSON.stringify({ email, password }) });
    const csrf = ((await signedIn.json()) as { csrfToken: string }).csrfToken;
    return { call, csrf, cookie: () => cookie };
  }
  const socketOf = async (cookie: string) => {
    const socket = connect(base, { transports: ['websocket'], extraHeaders: { cookie }, forceNew: true, reconnection: false });
    open.push(socket);
    await new Promise<void>((resolve, reject) => {
      socket.once('connect', () => resolve());
      socket.once('connect_error', reject);
    });
    return socket;
  };
  const settle = () => new Promise((r) => setTimeout(r, 150));
  const collect = (socket: Socket) => {
    const got: LiveEvent[] = [];
    socket.on('changed', (e: LiveEvent) => got.push(e));
    return got;
  };

  it('delivers a unit’s events only while a page watches it, and counts only people on the board', async () => {
    const { unit } = await makeStation(1);
    const viewer = await makeUser('operator');
    const other = await makeUser('operator');
    const writer = await session((await makeUser('operator')).email);
    const viewerSocket = await socketOf((await session(viewer.email)).cookie());
    const otherSocket = await socketOf((await session(other.email)).cookie());
    const got = collect(viewerSocket);
    const presence: string[][] = [];
    otherSocket.on('presence', (p: { people: string[] }) => presence.push(p.people));

    viewerSocket.emit('watch-unit', unit.id);
    otherSocket.emit('open-board', unit.id);
    await settle();
    await writer.call(`/api/units/${unit.id}/log`, { method: 'POST', headers: { 'x-csrf-token': writer.csrf }, body: JSON.stringify({ position: 'control_room', category: 'operation', text: 'Seen live', carryToHandover: false }) });
    await settle();
    expect(got.map((e) => e.entity)).toEqual(['log_entry']);
    // The viewer only watches the unit (the log, say): not "on the board".
    expect(presence.at(-1)).toEqual([other.name]);

    viewerSocket.emit('unwatch-unit', unit.id);
    viewerSocket.emit('open-board', unit.id);
    await settle();
    expect(presence.at(-1)).toEqual([other.name, viewer.name].sort());
    viewerSocket.emit('close-board', unit.id);
    await settle();
    expect(presence.at(-1)).toEqual([other.name]);
    await writer.call(`/api/units/${unit.id}/log`, { method: 'POST', headers: { 'x-csrf-token': writer.csrf }, body: JSON.stringify({ position: 'control_room', category: 'operation', text: 'Not seen', carryToHandover: false }) });
    await settle();
    expect(got).toHaveLength(1);
  });

  it('closes the socket of a person deactivated or signed out, and refuses one with a temporary password', async () => {
    const admin = await session((await makeUser('admin')).email);
    const leaving = await makeUser('operator');
    const leavingSocket = await socketOf((await session(leaving.email)).cookie());
    const closed = new Promise<string>((resolve) => leavingSocket.once('disconnect', resolve));
    const res = await admin.call(`/api/admin/users/${leaving.id}/deactivate`, { method: 'POST', headers: { 'x-csrf-token': admin.csrf }, body: JSON.stringify({ version: leaving.version }) });
    expect(res.status).toBe(200);
    expect(await closed).toBe('io server disconnect');

    const signingOut = await session((await makeUser('operator')).email);
    const sock = await socketOf(signingOut.cookie());
    const gone = new Promise<string>((resolve) => sock.once('disconnect', resolve));
    await signingOut.call('/api/session', { method: 'DELETE', headers: { 'x-csrf-token': signingOut.csrf } });
    expect(await gone).toBe('io server disconnect');

    const pending = await session((await makeUser('operator', { mustChangePassword: true })).email);
    await expect(socketOf(pending.cookie())).rejects.toThrow();
  });
});
