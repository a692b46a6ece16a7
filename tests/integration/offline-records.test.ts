// Rounds and log entries kept on a device while offline: the device's id makes a retry answer with the
// record stored the first time (also when two sends race), the time of entry is checked, kept beside
// the time of arrival, and a record that arrives more than the station's late-entry minutes (30 for a
// new station) after it was entered is marked as arrived late.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/features/audit/model';
import { LogEntry } from '../../server/features/log/model';
import { ReadingSet } from '../../server/features/readings/model';
import { buildApp, closeAll, makeUnit, makeUser, signedInAgent, type Agent } from './support/test-app';
import { roundInsideLimits } from '../fixtures/round-inside-limits';

afterAll(closeAll);
const built = buildApp();
let unitId = 0;
let operator: Agent;

beforeAll(async () => {
  unitId = (await makeUnit()).id;
  operator = await signedInAgent(built, (await makeUser('operator')).email);
});

// Inside every limit: 4.81 kPa a (see the fixture).
const round = roundInsideLimits;
const entry = (overrides: Record<string, unknown> = {}) => ({ position: 'control_room', category: 'operation', text: 'Basin level checked at the pump house.', ...overrides });
const post = (agent: Agent, path: string, body: unknown) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);
const minutesAgo = (m: number) => new Date(Date.now() - m * 60_000).toISOString();

describe('a round sent with a client id', () => {
  it('is stored once when sent again: the retry answers 200 with the same id', async () => {
    const clientId = randomUUID();
    const enteredAt = minutesAgo(10);
    const first = await post(operator, `/api/units/${unitId}/readings`, round({ clientId, enteredAt }));
    expect(first.status).toBe(201);
    const again = await post(operator, `/api/units/${unitId}/readings`, round({ clientId, enteredAt }));
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(first.body.id);
    expect(await ReadingSet.count({ where: { clientId } })).toBe(1);
    expect(await AuditEvent.count({ where: { action: 'reading.record', entityId: String(first.body.id) } })).toBe(1);
  });

  it('is stored once when two sends arrive at the same moment', async () => {
    const clientId = randomUUID();
    const body = round({ clientId, enteredAt: minutesAgo(5) });
    const answers = await Promise.all([1, 2, 3].map(() => post(operator, `/api/units/${unitId}/readings`, body)));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 201]);
    expect(new Set(answers.map((a) => a.body.id)).size).toBe(1);
    expect(await ReadingSet.count({ where: { clientId } })).toBe(1);
  });

  it('takes the reading’s time from the time entered and keeps the arrival beside it', async () => {
    const enteredAt = minutesAgo(12);
    const res = await post(operator, `/api/units/${unitId}/readings`, round({ clientId: randomUUID(), enteredAt }));
    expect(res.status).toBe(201);
    expect(res.body.reading.takenAt).toBe(enteredAt);
    expect(res.body.reading.enteredAt).toBe(enteredAt);
    expect(Date.parse(res.body.reading.recordedAt)).toBeGreaterThan(Date.parse(enteredAt));
    // 12 min after entry is inside the station's 30 late-entry minutes.
    expect(res.body.reading.arrivedLate).toBe(false);
  });

  it('is marked as arrived late when it arrives more than the station’s 30 late-entry minutes after it was entered', async () => {
    const late = await post(operator, `/api/units/${unitId}/readings`, round({ clientId: randomUUID(), enteredAt: minutesAgo(45) }));
    expect(late.status).toBe(201);
    expect(late.body.reading.arrivedLate).toBe(true);
    const list = await operator.get(`/api/units/${unitId}/readings?limit=50`).expect(200);
    expect(list.body.readings.find((r: { id: number }) => r.id === late.body.id)).toMatchObject({ arrivedLate: true, clientId: expect.any(String) });
    const online = await post(operator, `/api/units/${unitId}/readings`, round());
    expect(online.body.reading.arrivedLate).toBe(false);
    expect(online.body.reading.enteredAt).toBe(online.body.reading.recordedAt);
  });

  it('is not another person’s: the same client id from someone else is their own round', async () => {
    const clientId = randomUUID();
    const other = await signedInAgent(built, (await makeUser('operator')).email);
    const mine = await post(operator, `/api/units/${unitId}/readings`, round({ clientId }));
    const theirs = await post(other, `/api/units/${unitId}/readings`, round({ clientId }));
    expect([mine.status, theirs.status]).toEqual([201, 201]);
    expect(theirs.body.id).not.toBe(mine.body.id);
  });

  it('answers 400 with a message beside the time of entry for a future, too old or malformed time, and stores nothing', async () => {
    const before = await ReadingSet.count({ where: { unitId } });
    const future = await post(operator, `/api/units/${unitId}/readings`, round({ clientId: randomUUID(), enteredAt: new Date(Date.now() + 10 * 60_000).toISOString() }));
    expect(future.status).toBe(400);
    expect(future.body.error.fields.enteredAt).toMatch(/in the future by this device’s clock/);
    const old = await post(operator, `/api/units/${unitId}/readings`, round({ clientId: randomUUID(), enteredAt: minutesAgo(8 * 24 * 60) }));
    expect(old.status).toBe(400);
    expect(old.body.error.fields.enteredAt).toMatch(/more than 7 days ago/);
    const malformed = await post(operator, `/api/units/${unitId}/readings`, round({ clientId: randomUUID(), enteredAt: 'yesterday' }));
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields.enteredAt).toMatch(/Not a valid time of entry/);
    const badId = await post(operator, `/api/units/${unitId}/readings`, round({ clientId: 'not-a-uuid' }));
    expect(badId.status).toBe(400);
    expect(badId.body.error.fields.clientId).toMatch(/record id is not valid/);
    expect(await ReadingSet.count({ where: { unitId } })).toBe(before);
  });
});

describe('a log entry sent with a client id', () => {
  it('is stored once when sent again, and once when sent twice at the same moment', async () => {
    const clientId = randomUUID();
    const body = entry({ clientId, enteredAt: minutesAgo(3) });
    const first = await post(operator, `/api/units/${unitId}/log`, body);
    expect(first.status).toBe(201);
    const again = await post(operator, `/api/units/${unitId}/log`, body);
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(first.body.id);

    const raced = randomUUID();
    const answers = await Promise.all([1, 2, 3].map(() => post(operator, `/api/units/${unitId}/log`, entry({ clientId: raced, enteredAt: minutesAgo(2) }))));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 201]);
    expect(new Set(answers.map((a) => a.body.id)).size).toBe(1);
    expect(await LogEntry.count({ where: { clientId: raced } })).toBe(1);
  });

  it('keeps the time entered on the device and the time it arrived, the event defaulting to the time entered', async () => {
    const enteredAt = minutesAgo(50);
    const res = await post(operator, `/api/units/${unitId}/log`, entry({ clientId: randomUUID(), enteredAt }));
    expect(res.status).toBe(201);
    expect(res.body.enteredAt).toBe(enteredAt);
    expect(res.body.eventAt).toBe(enteredAt);
    expect(Date.parse(res.body.receivedAt) - Date.parse(enteredAt)).toBeGreaterThanOrEqual(50 * 60_000);
    // Written at the event (not a late entry) but arrived 50 min later, past the station's 30 minutes.
    expect(res.body.late).toBe(false);
    expect(res.body.arrivedLate).toBe(true);
    const log = await operator.get(`/api/units/${unitId}/log`).expect(200);
    expect(log.body.entries.find((e: { id: number }) => e.id === res.body.id)).toMatchObject({ arrivedLate: true, enteredAt, receivedAt: res.body.receivedAt });
  });

  it('answers 400 beside the time of entry for a future, too old or malformed time', async () => {
    const before = await LogEntry.count({ where: { unitId } });
    const future = await post(operator, `/api/units/${unitId}/log`, entry({ enteredAt: new Date(Date.now() + 10 * 60_000).toISOString() }));
    expect(future.body.error.fields.enteredAt).toMatch(/in the future/);
    const old = await post(operator, `/api/units/${unitId}/log`, entry({ enteredAt: minutesAgo(8 * 24 * 60) }));
    expect(old.body.error.fields.enteredAt).toMatch(/more than 7 days ago/);
    const malformed = await post(operator, `/api/units/${unitId}/log`, entry({ enteredAt: '2026-13-40' }));
    expect(malformed.body.error.fields.enteredAt).toMatch(/Not a valid time of entry/);
    expect([future.status, old.status, malformed.status]).toEqual([400, 400, 400]);
    expect(await LogEntry.count({ where: { unitId } })).toBe(before);
  });

  it('counts as entered after the review by when it arrived, not when it was written on the device', async () => {
    const unit = await makeUnit();
    const lead = await signedInAgent(built, (await makeUser('shift_lead')).email);
    const shifts = await lead.get(`/api/units/${unit.id}/log/shifts`).expect(200);
    const current = shifts.body.shifts[0].start as string;
    // Written on the device a minute into the shift in progress, or now if the shift began less than a minute ago.
    const writtenAt = new Date(Math.min(Date.parse(current) + 60_000, Date.now() - 1000)).toISOString();
    await post(lead, `/api/units/${unit.id}/log/reviews`, { position: 'control_room', shiftStart: current }).expect(201);
    const res = await post(operator, `/api/units/${unit.id}/log`, entry({ clientId: randomUUID(), enteredAt: writtenAt, eventAt: writtenAt }));
    expect(res.status).toBe(201);
    const log = await operator.get(`/api/units/${unit.id}/log`).expect(200);
    expect(log.body.entries.find((e: { id: number }) => e.id === res.body.id)).toMatchObject({ enteredAfterReview: true });
  });
});
