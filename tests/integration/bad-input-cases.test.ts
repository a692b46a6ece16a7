// The bad input found by probing, one case each: answered 400 on the field in the words the person
// sees, nothing stored, never a 500 and never a silent change.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LogEntry } from '../../server/features/log/model';
import { AuditEvent } from '../../server/features/audit/model';
import { vacuumRound } from './support/rounds';
import { PASSWORD, anonymousAgent, buildApp, closeAll, makeStation, makeUser, signedInAgent, type Agent } from './support/test-app';

const built = buildApp();
afterAll(closeAll);
const post = (agent: Agent, path: string, body: unknown) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);
const internalNames = /anchorShiftStart|crewIds|bodyHtml|hotwellTemperature|highWatch|Invalid input|expected|ISO|>=/;

let unitId = 0;
let stationId = 0;
const a = {} as Record<'operator' | 'lead' | 'admin', Agent>;
beforeAll(async () => {
  const { station, unit, crews } = await makeStation(2);
  unitId = unit.id;
  stationId = station.id;
  a.operator = await signedInAgent(built, (await makeUser('operator', { crewId: crews[0]!.id })).email);
  a.lead = await signedInAgent(built, (await makeUser('shift_lead', { crewId: crews[0]!.id })).email);
  a.admin = await signedInAgent(built, (await makeUser('admin')).email);
});

describe('text that cannot be stored (a lone UTF-16 surrogate)', () => {
  it('answers 400 on the field, in plain words, and stores nothing', async () => {
    const [entries, audits] = [await LogEntry.count(), await AuditEvent.count()];
    const res = await post(a.operator, `/api/units/${unitId}/log`, { position: 'control_room', category: 'operation', text: 'Vented \uD800 waterbox', carryToHandover: false });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ text: expect.stringMatching(/cannot be stored.*retype/) });
    expect([await LogEntry.count(), await AuditEvent.count()]).toEqual([entries, audits]);
  });

  it('answers 400 for one in a nested field or in a key', async () => {
    const round = vacuumRound();
    const nested = await post(a.operator, `/api/units/${unitId}/readings`, { ...round, pressure: { ...round.pressure, unit: 'inHg_vac\uDC00' } });
    expect(nested.status).toBe(400);
    expect(Object.keys(nested.body.error.fields)).toEqual(['pressure.unit']);
    const key = await post(a.lead, `/api/units/${unitId}/flags`, { parameter: 'ttd', severity: 'watch', comment: 'Rising', ['x\uDBFF']: 1 });
    expect(key.status).toBe(400);
    expect(Object.values(key.body.error.fields)[0]).toMatch(/cannot be stored/);
  });
});

describe('sign-in', () => {
  it('accepts the e-mail with spaces around it (the form trims it, and so must the check)', async () => {
    const user = await makeUser('operator');
    const agent = await anonymousAgent(built);
    const res = await post(agent, '/api/session', { email: `  ${user.email.toUpperCase()} `, password: PASSWORD });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.user.id).toBe(user.id);
  });
});

describe('a limit set with a value that is not a number', () => {
  it('is refused on the field, and the limit in force is kept', async () => {
    const setup = async () => (await a.admin.get(`/api/plant/units/${unitId}/setup`).expect(200)).body.limits;
    const before = await setup();
    expect(before.data.ttd.highWatch).toEqual(expect.any(Number));
    // "1O" as typed, and null: what the old form sent for it (JSON has no NaN).
    for (const typed of ['1O', null, 'NaN', 'Infinity']) {
      const res = await post(a.admin, `/api/plant/units/${unitId}/limit-versions`, { limits: { ...before.data, ttd: { ...before.data.ttd, highWatch: typed } }, note: 'Typo' });
      expect(res.status, String(typed)).toBe(400);
      expect(res.body.error.fields['limits.ttd.highWatch']).toMatch(/^Terminal temperature difference \(TTD\), high watch must be a number/);
    }
    expect(await setup()).toEqual(before);
  });
});

describe('messages name fields by the label a person sees', () => {
  it('crew rotation: a time that is not a time and no crews', async () => {
    const res = await a.admin.put(`/api/stations/${stationId}/crew-rotation`).set('X-CSRF-Token', a.admin.csrf).send({ anchorShiftStart: 'tomorrow', crewIds: [] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ anchorShiftStart: 'First shift of the rotation must be a date and time', crewIds: 'Crews: choose at least one' });
    expect(res.body.error.message).toBe('Some fields need attention: First shift of the rotation, Crews');
  });

  it('an empty standing order, round and log entry say what is missing', async () => {
    const order = await post(a.lead, `/api/standing-orders?stationId=${stationId}`, { title: 'Hourly TTD', bodyHtml: '', effectiveFrom: new Date().toISOString() });
    expect(order.body.error).toMatchObject({ message: 'Some fields need attention: Order text', fields: { bodyHtml: 'Write the order' } });
    const round = await post(a.operator, `/api/units/${unitId}/readings`, {});
    expect(round.body.error.fields).toMatchObject({ pressure: 'Condenser pressure is missing', hotwellTemperature: 'Hotwell temperature is missing' });
    const entry = await post(a.operator, `/api/units/${unitId}/log`, { position: 'control_room', category: 'operation' });
    expect(entry.body.error.fields).toEqual({ text: 'Entry text is missing' });
    for (const res of [order, round, entry]) {
      expect(res.status).toBe(400);
      for (const text of [res.body.error.message, ...Object.values(res.body.error.fields)]) expect(text).not.toMatch(internalNames);
    }
  });

  it('a temperature outside its physical range names the reading', async () => {
    const res = await post(a.operator, `/api/units/${unitId}/readings`, { ...vacuumRound(), hotwellTemperature: { value: -300, unit: 'degC' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ 'hotwellTemperature.value': 'Hotwell temperature must be between 0 °C and 100 °C' });
  });
});
