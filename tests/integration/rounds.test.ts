import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/features/audit/model';
import { Flag } from '../../server/features/flags/model';
import { LimitSetVersion } from '../../server/features/plant/model';
import { ReadingSet, ReadingValue } from '../../server/features/readings/model';
import { startingLimits } from '../../shared/calc/limits';
import { anonymousAgent, buildApp, closeAll, makeUnit, makeUser, signedInAgent } from './support/test-app';
import { roundInsideLimits } from '../fixtures/round-inside-limits';

afterAll(closeAll);
const built = buildApp();
let unitId = 0;
beforeAll(async () => {
  unitId = (await makeUnit()).id;
});

// Inside every limit: 4.81 kPa a (see the fixture).
const round = roundInsideLimits;

describe('POST /api/units/:unitId/readings', () => {
  it('answers 401 signed out and 403 to a trainer', async () => {
    const anonymous = await anonymousAgent(built);
    await anonymous.post(`/api/units/${unitId}/readings`).set('X-CSRF-Token', anonymous.csrf).send(round()).expect(401);
    const trainer = await signedInAgent(built, (await makeUser('trainer')).email);
    await trainer.post(`/api/units/${unitId}/readings`).set('X-CSRF-Token', trainer.csrf).send(round()).expect(403);
  });

  it('stores raw values with units, SI values and the computed results', async () => {
    const operator = await makeUser('operator');
    const agent = await signedInAgent(built, operator.email);
    const res = await agent.post(`/api/units/${unitId}/readings`).set('X-CSRF-Token', agent.csrf).send(round());
    expect(res.status).toBe(201);
    const stored = await ReadingSet.findByPk(res.body.id);
    expect(stored?.raw.pressure).toEqual({ value: 28.5, unit: 'inHg_vac' });
    expect(stored?.si.pressurePa).toBeCloseTo((29.92 - 28.5) * 3386.389, 6);
    expect(stored!.results.checks.saturationTemperature.value! - 273.15).toBeCloseTo(32.0, 0);
    expect(stored?.recordedAsTrainee).toBe(false);
    expect(await ReadingValue.count({ where: { readingSetId: res.body.id } })).toBeGreaterThan(10);
    expect(await AuditEvent.count({ where: { action: 'reading.record', entityId: String(res.body.id) } })).toBe(1);
  });

  it('answers 400 with field messages for bad readings and stores nothing', async () => {
    const agent = await signedInAgent(built, (await makeUser('operator')).email);
    const before = await ReadingSet.count({ where: { unitId } });
    const res = await agent
      .post(`/api/units/${unitId}/readings`)
      .set('X-CSRF-Token', agent.csrf)
      .send(round({ pressure: { value: 31, unit: 'inHg_vac' }, takenAt: '2099-01-01T00:00:00Z' }));
    expect(res.status).toBe(400);
    expect(await ReadingSet.count({ where: { unitId } })).toBe(before);
    const future = await agent.post(`/api/units/${unitId}/readings`).set('X-CSRF-Token', agent.csrf).send(round({ takenAt: '2099-01-01T00:00:00Z' }));
    expect(future.status).toBe(400);
    expect(future.body.error.fields.takenAt).toMatch(/future/);
    const noHotwell = await agent.post(`/api/units/${unitId}/readings`).set('X-CSRF-Token', agent.csrf).send(round({ hotwellTemperature: undefined }));
    expect(noHotwell.status).toBe(400);
    expect(Object.keys(noHotwell.body.error.fields)).toContain('hotwellTemperature');
  });

  it('raises an automatic alarm flag for an out-of-limit value, and refreshes it instead of duplicating', async () => {
    const unit = await makeUnit();
    const agent = await signedInAgent(built, (await makeUser('operator')).email);
    // 25 inHg vacuum against 29.92 inHg = 4.92 inHgA = 16.7 kPa a: above the 16 kPa a starting alarm limit.
    const bad = round({ pressure: { value: 25, unit: 'inHg_vac' }, hotwellTemperature: { value: 50, unit: 'degC' } });
    await agent.post(`/api/units/${unit.id}/readings`).set('X-CSRF-Token', agent.csrf).send(bad).expect(201);
    await agent.post(`/api/units/${unit.id}/readings`).set('X-CSRF-Token', agent.csrf).send(bad).expect(201);
    const flags = await Flag.findAll({ where: { unitId: unit.id, parameter: 'backpressure' } });
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ origin: 'automatic', severity: 'alarm', status: 'open' });
  });

  it('marks a trainee’s round for countersign, which the trainee cannot give themselves', async () => {
    const trainee = await makeUser('trainee');
    const traineeAgent = await signedInAgent(built, trainee.email);
    const res = await traineeAgent.post(`/api/units/${unitId}/readings`).set('X-CSRF-Token', traineeAgent.csrf).send(round());
    expect(res.status).toBe(201);
    expect(res.body.reading.recordedAsTrainee).toBe(true);
    await traineeAgent.post(`/api/readings/${res.body.id}/countersign`).set('X-CSRF-Token', traineeAgent.csrf).expect(403);
    const other = await signedInAgent(built, (await makeUser('trainer')).email);
    await other.post(`/api/readings/${res.body.id}/countersign`).set('X-CSRF-Token', other.csrf).expect(403);
    const operator = await signedInAgent(built, (await makeUser('operator')).email);
    const signed = await operator.post(`/api/readings/${res.body.id}/countersign`).set('X-CSRF-Token', operator.csrf);
    expect(signed.status).toBe(200);
    expect(signed.body.countersign.by).toBeTruthy();
    await operator.post(`/api/readings/${res.body.id}/countersign`).set('X-CSRF-Token', operator.csrf).expect(409);
  });
});

describe('POST /api/readings/:id/amendments', () => {
  it('keeps the original and shows both versions', async () => {
    const agent = await signedInAgent(built, (await makeUser('operator')).email);
    const created = await agent.post(`/api/units/${unitId}/readings`).set('X-CSRF-Token', agent.csrf).send(round());
    const id = created.body.id;
    const amended = await agent
      .post(`/api/readings/${id}/amendments`)
      .set('X-CSRF-Token', agent.csrf)
      .send({ reason: 'Hotwell thermometer read from the wrong scale', reading: round({ hotwellTemperature: { value: 30.2, unit: 'degC' } }) });
    expect(amended.status).toBe(201);
    expect(amended.body.reading.raw.hotwellTemperature.value).toBe(31.5);
    expect(amended.body.amendments).toHaveLength(1);
    expect(amended.body.amendments[0]).toMatchObject({ reason: 'Hotwell thermometer read from the wrong scale' });
    expect(amended.body.amendments[0].raw.hotwellTemperature.value).toBe(30.2);
    expect(amended.body.current.amended).toBe(true);
    const original = await ReadingSet.findByPk(id);
    expect(original?.raw.hotwellTemperature?.value).toBe(31.5);
    const subcooling = await ReadingValue.findOne({ where: { readingSetId: id, parameter: 'subcooling' } });
    expect(subcooling!.value).toBeCloseTo(amended.body.amendments[0].results.checks.subcooling.value, 9);
  });

  it('requires a reason, refuses a trainee, and answers 404 for an unknown reading', async () => {
    const agent = await signedInAgent(built, (await makeUser('operator')).email);
    const created = await agent.post(`/api/units/${unitId}/readings`).set('X-CSRF-Token', agent.csrf).send(round());
    const noReason = await agent.post(`/api/readings/${created.body.id}/amendments`).set('X-CSRF-Token', agent.csrf).send({ reason: '', reading: round() });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.reason).toBeTruthy();
    const trainee = await signedInAgent(built, (await makeUser('trainee')).email);
    await trainee.post(`/api/readings/${created.body.id}/amendments`).set('X-CSRF-Token', trainee.csrf).send({ reason: 'a good reason', reading: round() }).expect(403);
    await agent.post('/api/readings/99999999/amendments').set('X-CSRF-Token', agent.csrf).send({ reason: 'a good reason', reading: round() }).expect(404);
  });
});

describe('limits versioning', () => {
  it('judges a reading by the limits in force when it was taken, not by later ones', async () => {
    const unit = await makeUnit();
    const agent = await signedInAgent(built, (await makeUser('operator')).email);
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    const earlier = new Date(Date.now() - 3_600_000).toISOString();
    // Tighten the TTD limits now; a reading taken an hour ago keeps the old judgement.
    const tight = { ...startingLimits, ttd: { highWatch: 1, highAlarm: 2 } };
    await admin.post(`/api/plant/units/${unit.id}/limit-versions`).set('X-CSRF-Token', admin.csrf).send({ limits: tight, note: 'Tighter TTD after retubing' }).expect(201);
    const old = await agent.post(`/api/units/${unit.id}/readings`).set('X-CSRF-Token', agent.csrf).send(round({ takenAt: earlier }));
    const now = await agent.post(`/api/units/${unit.id}/readings`).set('X-CSRF-Token', agent.csrf).send(round());
    expect(old.body.reading.results.checks.ttd.status).toBe('normal');
    expect(now.body.reading.results.checks.ttd.status).toBe('alarm');
    expect(old.body.reading.limitVersionId).not.toBe(now.body.reading.limitVersionId);
    expect(await LimitSetVersion.count({ where: { unitId: unit.id } })).toBe(2);
  });
});

describe('GET /api/units/:unitId/readings and /api/readings/:id', () => {
  it('lists newest first for any signed-in role and answers 401 signed out', async () => {
    const anonymous = await anonymousAgent(built);
    await anonymous.get(`/api/units/${unitId}/readings`).expect(401);
    const trainer = await signedInAgent(built, (await makeUser('trainer')).email);
    const res = await trainer.get(`/api/units/${unitId}/readings?limit=5`).expect(200);
    expect(res.body.readings.length).toBeGreaterThan(0);
    const times = res.body.readings.map((r: { takenAt: string }) => r.takenAt);
    expect([...times].sort().reverse()).toEqual(times);
    await trainer.get(`/api/readings/${res.body.readings[0].id}`).expect(200);
    await trainer.get(`/api/units/${unitId}/readings?limit=5000`).expect(400);
  });
});
