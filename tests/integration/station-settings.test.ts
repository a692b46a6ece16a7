import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/features/audit/model';
import type { Role } from '../../shared/roles';
import { anonymousAgent, buildApp, closeAll, makeStation, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();
let stationId = 0;
let admin: Agent;
let settings: Record<string, unknown>;

const put = (agent: Agent, body: unknown) => agent.put(`/api/stations/${stationId}/settings`).set('X-CSRF-Token', agent.csrf).send(body as object);

beforeAll(async () => {
  stationId = (await makeStation(1)).station.id;
  admin = await signedInAgent(built, (await makeUser('admin')).email);
  settings = (await admin.get(`/api/stations/${stationId}/settings`).expect(200)).body.settings;
});

describe('GET /api/stations/:stationId/settings', () => {
  it('starts a station without its own settings at a 240-minute round interval and a 120-minute handover window each side', async () => {
    expect(settings).toMatchObject({ roundIntervalMinutes: 240, handoverWindowBeforeMinutes: 120, handoverWindowAfterMinutes: 120 });
  });

  it('answers 401 signed out', async () => {
    await (await anonymousAgent(built)).get(`/api/stations/${stationId}/settings`).expect(401);
  });
});

describe('PUT /api/stations/:stationId/settings', () => {
  it('answers 401 signed out', async () => {
    await put(await anonymousAgent(built), settings).expect(401);
  });

  it.each<Role>(['trainee', 'operator', 'shift_lead', 'trainer'])('answers 403 to a %s and changes nothing', async (role) => {
    const agent = await signedInAgent(built, (await makeUser(role)).email);
    await put(agent, { ...settings, roundIntervalMinutes: 60 }).expect(403);
    expect((await admin.get(`/api/stations/${stationId}/settings`).expect(200)).body.settings.roundIntervalMinutes).toBe(240);
  });

  it.each([
    ['a round interval under 15 minutes', { roundIntervalMinutes: 10 }, 'roundIntervalMinutes', 'Round interval: between 15 and 1440 minutes'],
    ['a round interval over a day', { roundIntervalMinutes: 1441 }, 'roundIntervalMinutes', 'Round interval: between 15 and 1440 minutes'],
    ['a round interval in words', { roundIntervalMinutes: 'hourly' }, 'roundIntervalMinutes', 'Round interval: between 15 and 1440 minutes'],
    ['a fractional round interval', { roundIntervalMinutes: 60.5 }, 'roundIntervalMinutes', 'Round interval: between 15 and 1440 minutes'],
    ['no round interval at all', { roundIntervalMinutes: undefined }, 'roundIntervalMinutes', 'Round interval: between 15 and 1440 minutes'],
    ['a window before the change of 5 minutes', { handoverWindowBeforeMinutes: 5 }, 'handoverWindowBeforeMinutes', 'Handover window before the change: between 15 and 720 minutes'],
    ['a window after the change of 13 hours', { handoverWindowAfterMinutes: 780 }, 'handoverWindowAfterMinutes', 'Handover window after the change: between 0 and 720 minutes'],
    ['a shift change time of 25:00', { shiftChangeTimes: ['06:00', '25:00'] }, 'shiftChangeTimes.1', 'Shift change times: 24-hour HH:mm, e.g. 06:00'],
  ])('answers 400 naming the field for %s, and stores nothing', async (_label, change, field, message) => {
    const res = await put(admin, { ...settings, ...change });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toBe(message);
    expect((await admin.get(`/api/stations/${stationId}/settings`).expect(200)).body.settings).toEqual(settings);
  });

  it('refuses windows that together pass the shortest shift (8 h shifts: 240 + 241 min), on both fields', async () => {
    const res = await put(admin, { ...settings, shiftChangeTimes: ['06:00', '14:00', '22:00'], handoverWindowBeforeMinutes: 240, handoverWindowAfterMinutes: 241 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.handoverWindowBeforeMinutes).toMatch(/at most the shortest shift \(480 minutes\)/);
    expect(res.body.error.fields.handoverWindowAfterMinutes).toMatch(/at most the shortest shift \(480 minutes\)/);
    // One minute less fits.
    // Meeting is allowed: 480 + 0 opens the window for the whole shift and closes it at the change.
    await put(admin, { ...settings, shiftChangeTimes: ['06:00', '14:00', '22:00'], handoverWindowBeforeMinutes: 480, handoverWindowAfterMinutes: 0 }).expect(200);
    await put(admin, { ...settings, shiftChangeTimes: ['06:00', '14:00', '22:00'], handoverWindowBeforeMinutes: 240, handoverWindowAfterMinutes: 240 }).expect(200);
    await put(admin, settings).expect(200);
  });

  it('saves the round interval and handover window and records who changed them, before and after', async () => {
    const res = await put(admin, { ...settings, roundIntervalMinutes: 60, handoverWindowBeforeMinutes: 90, handoverWindowAfterMinutes: 45 });
    expect(res.status).toBe(200);
    const stored = (await admin.get(`/api/stations/${stationId}/settings`).expect(200)).body.settings;
    expect(stored).toMatchObject({ roundIntervalMinutes: 60, handoverWindowBeforeMinutes: 90, handoverWindowAfterMinutes: 45 });
    const audit = await AuditEvent.findOne({ where: { action: 'station.settings', entityId: String(stationId) }, order: [['id', 'DESC']] });
    expect(audit?.before).toMatchObject({ roundIntervalMinutes: 240, handoverWindowAfterMinutes: 120 });
    expect(audit?.after).toMatchObject({ roundIntervalMinutes: 60, handoverWindowAfterMinutes: 45 });
  });
});
