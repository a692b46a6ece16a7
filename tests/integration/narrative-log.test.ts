import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { LogEntry } from '../../server/features/log/model';
import { buildApp, closeAll, makeCrew, makeStation, makeUnit, makeUser, signedInAgent, anonymousAgent, type Agent } from './support/test-app';
import type { Role } from '../../shared/roles';

afterAll(closeAll);
afterEach(() => vi.useRealTimers());
const built = buildApp();
let unitId = 0;
let operator: Agent;
let lead: Agent;

beforeAll(async () => {
  unitId = (await makeUnit()).id;
  operator = await signedInAgent(built, (await makeUser('operator')).email);
  lead = await signedInAgent(built, (await makeUser('shift_lead')).email);
});

const entry = (overrides: Record<string, unknown> = {}) => ({ position: 'control_room', category: 'operation', text: 'Started 1-CWP-A; discharge pressure normal.', ...overrides });
const post = (agent: Agent, path: string, body: unknown) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);

describe('POST /api/units/:unitId/log', () => {
  it('answers 401 signed out and 403 to a trainer', async () => {
    await post(await anonymousAgent(built), `/api/units/${unitId}/log`, entry()).expect(401);
    await post(await signedInAgent(built, (await makeUser('trainer')).email), `/api/units/${unitId}/log`, entry()).expect(403);
  });

  it('sets the entry time from the server clock, and refuses a device time from long ago rather than taking it', async () => {
    const before = Date.now();
    const res = await post(operator, `/api/units/${unitId}/log`, entry());
    expect(res.status).toBe(201);
    expect(Date.parse(res.body.enteredAt)).toBeGreaterThanOrEqual(before - 5);
    expect(Date.parse(res.body.enteredAt)).toBeLessThanOrEqual(Date.now() + 5);
    expect(res.body.late).toBe(false);
    // A time of entry is taken only from a device that kept the entry offline, within 7 days (offline-records.test.ts).
    const old = await post(operator, `/api/units/${unitId}/log`, { ...entry(), enteredAt: '2001-01-01T00:00:00Z' });
    expect(old.status).toBe(400);
    expect(old.body.error.fields.enteredAt).toMatch(/more than 7 days ago/);
  });

  it('marks an entry made more than the station’s 30 minutes after its event as late', async () => {
    const late = await post(operator, `/api/units/${unitId}/log`, entry({ eventAt: new Date(Date.now() - 45 * 60_000).toISOString() }));
    expect(late.body.late).toBe(true);
    const prompt = await post(operator, `/api/units/${unitId}/log`, entry({ eventAt: new Date(Date.now() - 10 * 60_000).toISOString() }));
    expect(prompt.body.late).toBe(false);
  });

  it.each([
    ['an event far in the future', entry({ eventAt: '2099-01-01T00:00:00Z' }), 'eventAt'],
    ['an unknown category', entry({ category: 'gossip' }), 'category'],
    ['an unknown position', entry({ position: 'roof' }), 'position'],
    ['a 100 kB text', entry({ text: 'x'.repeat(100_000) }), 'text'],
    ['no text', entry({ text: '   ' }), 'text'],
    ['equipment of another unit', entry({ equipmentId: 999_999 }), 'equipmentId'],
  ])('answers 400 naming the field for %s', async (_label, body, field) => {
    const res = await post(operator, `/api/units/${unitId}/log`, body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it('stores script tags as plain text, never as markup', async () => {
    const text = '<script>alert("x")</script> pump tripped';
    const res = await post(operator, `/api/units/${unitId}/log`, entry({ text }));
    expect(res.status).toBe(201);
    const list = await operator.get(`/api/units/${unitId}/log?limit=5`).expect(200);
    expect(list.body.entries.find((e: { id: number }) => e.id === res.body.id).text).toBe(text);
  });
});

describe('append-only log', () => {
  it('offers no route, to any role, that changes or removes an entry', async () => {
    const created = await post(operator, `/api/units/${unitId}/log`, entry({ text: 'Entry that must stay as written' }));
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    for (const agent of [operator, lead, admin]) {
      for (const method of ['put', 'patch', 'delete'] as const) {
        const res = await agent[method](`/api/log/${created.body.id}`).set('X-CSRF-Token', agent.csrf).send({ text: 'rewritten' });
        expect(res.status).toBe(404);
      }
    }
    expect((await LogEntry.findByPk(created.body.id))?.text).toBe('Entry that must stay as written');
  });

  it('keeps the original beside an amendment with who and why', async () => {
    const created = await post(operator, `/api/units/${unitId}/log`, entry({ text: 'Started 1-CWP-C' }));
    // Its author corrects it (who else may is in role-rules.test.ts).
    const res = await post(operator, `/api/log/${created.body.id}/amendments`, { reason: 'Wrong pump tag', text: 'Started 1-CWP-A' });
    expect(res.status).toBe(201);
    const list = await operator.get(`/api/units/${unitId}/log?limit=20`).expect(200);
    const shown = list.body.entries.find((e: { id: number }) => e.id === created.body.id);
    expect(shown.text).toBe('Started 1-CWP-C');
    expect(shown.amendments[0]).toMatchObject({ reason: 'Wrong pump tag', text: 'Started 1-CWP-A' });
    const noReason = await post(operator, `/api/log/${created.body.id}/amendments`, { reason: '', text: 'x' });
    expect(noReason.status).toBe(400);
    const trainee = await signedInAgent(built, (await makeUser('trainee')).email);
    await post(trainee, `/api/log/${created.body.id}/amendments`, { reason: 'not mine to fix', text: 'x' }).expect(403);
  });
});

describe('end-of-shift review', () => {
  it('only a shift lead signs; amendments after it are shown as after the review', async () => {
    const created = await post(operator, `/api/units/${unitId}/log`, entry({ text: 'Reviewed entry' }));
    const shifts = await operator.get(`/api/units/${unitId}/log/shifts`).expect(200);
    const shiftStart = shifts.body.shifts[0].start;
    await post(operator, `/api/units/${unitId}/log/reviews`, { position: 'control_room', shiftStart }).expect(403);
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    await post(admin, `/api/units/${unitId}/log/reviews`, { position: 'control_room', shiftStart }).expect(403);
    const signed = await post(lead, `/api/units/${unitId}/log/reviews`, { position: 'control_room', shiftStart });
    expect(signed.status).toBe(201);
    await post(lead, `/api/units/${unitId}/log/reviews`, { position: 'control_room', shiftStart }).expect(409);
    await post(lead, `/api/units/${unitId}/log/reviews`, { position: 'control_room', shiftStart: '2026-01-01T03:17:00Z' }).expect(400);
    await post(operator, `/api/log/${created.body.id}/amendments`, { reason: 'Added the pressure', text: 'Reviewed entry, 0.4 MPa' }).expect(201);
    const list = await operator.get(`/api/units/${unitId}/log?shiftStart=${encodeURIComponent(shiftStart)}&position=control_room`).expect(200);
    const shown = list.body.entries.find((e: { id: number }) => e.id === created.body.id);
    expect(shown.amendments[0].afterReview).toBe(true);
    const after = await operator.get(`/api/units/${unitId}/log/shifts`).expect(200);
    expect(after.body.reviews).toEqual(expect.arrayContaining([expect.objectContaining({ position: 'control_room', shiftStart })]));
  });
});

describe('standing orders', () => {
  it('asks only the crews and positions in scope to acknowledge, and lists who has', async () => {
    const crewA = await makeCrew();
    const crewB = await makeCrew();
    const inScopeUser = await makeUser('operator', { crewId: crewA.id });
    await inScopeUser.update({ position: 'control_room' });
    const otherCrew = await makeUser('operator', { crewId: crewB.id });
    await otherCrew.update({ position: 'control_room' });
    const wrongPosition = await makeUser('operator', { crewId: crewA.id });
    await wrongPosition.update({ position: 'chemistry' });

    const issued = await post(lead, '/api/standing-orders?stationId=' + crewA.stationId, {
      title: 'Vent waterboxes each round',
      bodyHtml: '<p>Vent <strong>both</strong> waterboxes.</p><script>alert(1)</script><img src=x onerror=alert(1)>',
      effectiveFrom: new Date(Date.now() - 60_000).toISOString(),
      crewIds: [crewA.id],
      positions: ['control_room'],
    });
    expect(issued.status).toBe(201);
    expect(issued.body.order.bodyHtml).toBe('<p>Vent <strong>both</strong> waterboxes.</p>');
    expect(issued.body.order.people.map((p: { id: number }) => p.id)).toEqual([inScopeUser.id]);
    const id = issued.body.order.id;

    const a = await signedInAgent(built, inScopeUser.email);
    const pending = await a.get('/api/me/pending-orders').expect(200);
    expect(pending.body.orders.map((o: { id: number }) => o.id)).toContain(id);
    await post(a, `/api/standing-orders/${id}/acknowledge`, {}).expect(201);
    await post(a, `/api/standing-orders/${id}/acknowledge`, {}).expect(409);
    expect((await a.get('/api/me/pending-orders')).body.orders.map((o: { id: number }) => o.id)).not.toContain(id);
    await post(await signedInAgent(built, otherCrew.email), `/api/standing-orders/${id}/acknowledge`, {}).expect(403);
    await post(await signedInAgent(built, wrongPosition.email), `/api/standing-orders/${id}/acknowledge`, {}).expect(403);
    const detail = await lead.get(`/api/standing-orders/${id}`).expect(200);
    expect(detail.body.order).toMatchObject({ inScope: 1, acknowledged: 1 });
  });

  it('archives expired orders and still finds them by text', async () => {
    const issued = await post(lead, '/api/standing-orders', {
      title: 'Old order about the hotwell level transmitter',
      bodyHtml: '<p>Use the local gauge glass.</p>',
      effectiveFrom: '2026-01-01T00:00:00Z',
      effectiveTo: '2026-01-02T00:00:00Z',
    });
    expect(issued.status).toBe(201);
    const inForce = await operator.get('/api/standing-orders?state=in_force').expect(200);
    expect(inForce.body.orders.map((o: { id: number }) => o.id)).not.toContain(issued.body.order.id);
    const found = await operator.get('/api/standing-orders?state=archived&q=gauge%20glass').expect(200);
    expect(found.body.orders.map((o: { id: number }) => o.id)).toContain(issued.body.order.id);
  });

  it.each<Role>(['trainee', 'operator', 'trainer'])('answers 403 when a %s issues an order, 400 for a bad one', async (role) => {
    const agent = await signedInAgent(built, (await makeUser(role)).email);
    await post(agent, '/api/standing-orders', { title: 'x', bodyHtml: '<p>x</p>', effectiveFrom: new Date().toISOString() }).expect(403);
    const bad = await post(lead, '/api/standing-orders', { title: '', bodyHtml: '<script>only</script>', effectiveFrom: 'soon' });
    expect(bad.status).toBe(400);
  });
});

describe('time-limited conditions', () => {
  it('computes the time left on the server, across a daylight-saving change', async () => {
    const ownerId = (await makeUser('shift_lead')).id;
    // A session per clock setting: a rolling session's expiry moves with the clock.
    const watcher = await makeUser('operator');
    // Europe/Berlin (the default station zone) moves to summer time on 2026-03-29 at 02:00.
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2026-03-28T12:00:00Z'));
    let clockAgent = await signedInAgent(built, watcher.email);
    const opened = await post(clockAgent, `/api/units/${unitId}/conditions`, {
      title: '1-CWP-B out of service',
      requiredAction: 'Restore within 72 h',
      startedAt: '2026-03-28T11:00:00Z', // 12:00 local, winter time
      limitHours: 72,
      ownerId,
    });
    expect(opened.status).toBe(201);
    // 72 real hours later is 13:00 local summer time, not 12:00.
    expect(opened.body.condition).toMatchObject({ limitAt: '2026-03-31T11:00:00.000Z', limitLocal: '2026-03-31 13:00', state: 'running' });
    expect(opened.body.condition.remainingMs).toBe(71 * 3_600_000);

    vi.setSystemTime(new Date('2026-03-31T08:00:00Z'));
    clockAgent = await signedInAgent(built, watcher.email);
    const soon = await clockAgent.get(`/api/units/${unitId}/conditions`).expect(200);
    const shown = soon.body.conditions.find((c: { id: number }) => c.id === opened.body.condition.id);
    expect(shown).toMatchObject({ remainingMs: 3 * 3_600_000, state: 'due_soon' });

    vi.setSystemTime(new Date('2026-03-31T12:30:00Z'));
    clockAgent = await signedInAgent(built, watcher.email);
    const overdue = await clockAgent.get(`/api/units/${unitId}/conditions`).expect(200);
    expect(overdue.body.conditions.find((c: { id: number }) => c.id === opened.body.condition.id)).toMatchObject({ state: 'overdue', remainingMs: -1.5 * 3_600_000 });
    vi.useRealTimers();

    const closed = await post(lead, `/api/conditions/${opened.body.condition.id}/close`, { text: 'Pump restored, run for 1 h', position: 'control_room', version: 0 });
    expect(closed.status).toBe(200);
    expect(closed.body.condition.state).toBe('closed');
    const closingEntry = await LogEntry.findByPk(closed.body.condition.closingEntryId);
    expect(closingEntry?.text).toMatch(/Closed condition/);
    await post(lead, `/api/conditions/${opened.body.condition.id}/close`, { text: 'again', position: 'control_room', version: 1 }).expect(409);
  });

  it('answers 403 to a trainee and 400 for a condition without a limit', async () => {
    const trainee = await signedInAgent(built, (await makeUser('trainee')).email);
    await post(trainee, `/api/units/${unitId}/conditions`, {}).expect(403);
    const res = await post(operator, `/api/units/${unitId}/conditions`, { title: 'x', requiredAction: '', startedAt: 'now', ownerId: 0 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['title', 'requiredAction', 'startedAt', 'ownerId']));
  });
});

describe('station settings', () => {
  it('lets only an administrator change them, validating the time zone', async () => {
    const unit = await makeUnit();
    const { stationId } = (await operator.get('/api/plant/units').expect(200)).body.units.find((u: { id: number }) => u.id === unit.id);
    const settings = (await operator.get(`/api/stations/${stationId}/settings`).expect(200)).body.settings;
    await operator.put(`/api/stations/${stationId}/settings`).set('X-CSRF-Token', operator.csrf).send(settings).expect(403);
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    const bad = await admin.put(`/api/stations/${stationId}/settings`).set('X-CSRF-Token', admin.csrf).send({ ...settings, timeZone: 'Mars/Olympus' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.timeZone).toMatch(/IANA/);
    await admin.put(`/api/stations/${stationId}/settings`).set('X-CSRF-Token', admin.csrf).send({ ...settings, lateEntryMinutes: 20 }).expect(200);
  });
});

describe('standing-order prompt during the person’s shift', () => {
  it('prompts a crew member only while their crew is on shift under the station’s rotation', async () => {
    const { station, crews } = await makeStation(2);
    const [onShift, offShift] = crews as [(typeof crews)[0], (typeof crews)[0]];
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    const unitId = (await admin.get('/api/plant/units').expect(200)).body.units.find((u: { stationId: number }) => u.stationId === station.id).id;
    const shifts = await admin.get(`/api/units/${unitId}/log/shifts`).expect(200);
    await admin.put(`/api/stations/${station.id}/crew-rotation`).set('X-CSRF-Token', admin.csrf).send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: [onShift.id, offShift.id] }).expect(200);
    const issuer = await signedInAgent(built, (await makeUser('shift_lead')).email);
    const order = await post(issuer, `/api/standing-orders?stationId=${station.id}`, {
      title: 'Check the hotwell level glass each round',
      bodyHtml: '<p>Compare with the transmitter.</p>',
      effectiveFrom: new Date(Date.now() - 60_000).toISOString(),
      crewIds: [onShift.id, offShift.id],
    });
    expect(order.status).toBe(201);
    const working = await signedInAgent(built, (await makeUser('operator', { crewId: onShift.id })).email);
    const resting = await signedInAgent(built, (await makeUser('operator', { crewId: offShift.id })).email);
    expect((await working.get('/api/me/pending-orders')).body.orders.map((o: { id: number }) => o.id)).toContain(order.body.order.id);
    expect((await resting.get('/api/me/pending-orders')).body.orders.map((o: { id: number }) => o.id)).not.toContain(order.body.order.id);
    // Off shift they can still read and acknowledge it on the orders page.
    await post(resting, `/api/standing-orders/${order.body.order.id}/acknowledge`, {}).expect(201);
  });
});
