import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { anonymousAgent, buildApp, closeAll, makeUnit, makeUser, signedInAgent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();
let unitId = 0;

beforeAll(async () => {
  unitId = (await makeUnit()).id;
});

const reading = () => ({
  unitId,
  pressure: { value: 8, unit: 'kPa_a' },
  hotwellTemperature: { value: 41.3, unit: 'degC' },
  cwInletTemperature: { value: 22, unit: 'degC' },
  cwOutletTemperature: { value: 22 + 560e6 / (15_000 * 4180), unit: 'degC' },
  cwFlow: { value: 15_000, unit: 'kg_s' },
});

describe('POST /api/calc/condenser', () => {
  it('answers 401 when nobody is signed in', async () => {
    const agent = await anonymousAgent(built);
    await agent.post('/api/calc/condenser').set('X-CSRF-Token', agent.csrf).send(reading()).expect(401);
  });

  it('returns every check with SI units, statuses and hints to any signed-in role', async () => {
    for (const role of ['trainee', 'operator', 'shift_lead', 'trainer', 'admin'] as const) {
      const user = await makeUser(role);
      const agent = await signedInAgent(built, user.email);
      const res = await agent.post('/api/calc/condenser').set('X-CSRF-Token', agent.csrf).send(reading());
      expect(res.status, role).toBe(200);
      expect(res.body.checks.saturationTemperature).toMatchObject({ unit: 'K', status: 'normal' });
      // IF97: Ts(8 kPa) = 314.66 K (41.51 °C, steam tables)
      expect(res.body.checks.saturationTemperature.value).toBeCloseTo(314.66, 2);
      expect(Math.abs(res.body.checks.expectedBackpressure.value - 8000) / 8000).toBeLessThan(0.01);
      // The design round itself: every check inside its limits, so no possible cause is offered.
      expect(res.body.hints).toEqual([]);
    }
  });

  it('offers the possible cause that fits a broken check, with its severity', async () => {
    const agent = await signedInAgent(built, (await makeUser('operator')).email);
    // CW 22 → 37.5 °C: a 15.5 K rise, over the 15 K alarm limit; TTD = 41.51 − 37.5 = 4.0 K stays normal.
    const res = await agent
      .post('/api/calc/condenser')
      .set('X-CSRF-Token', agent.csrf)
      .send({ ...reading(), cwOutletTemperature: { value: 37.5, unit: 'degC' } });
    expect(res.status).toBe(200);
    expect(res.body.checks.cwRise).toMatchObject({ status: 'alarm' });
    expect(res.body.checks.ttd).toMatchObject({ status: 'normal' });
    expect(res.body.hints.map((h: { id: string; severity: string }) => [h.id, h.severity])).toEqual([['low-cw-flow', 'alarm']]);
    expect(res.body.hints[0].title).toBe('Low circulating-water flow');
  });

  it('turns a vacuum reading into absolute pressure and notes an assumed barometer', async () => {
    const user = await makeUser('operator');
    const agent = await signedInAgent(built, user.email);
    const res = await agent
      .post('/api/calc/condenser')
      .set('X-CSRF-Token', agent.csrf)
      .send({ ...reading(), pressure: { value: 27.55, unit: 'inHg_vac' } });
    expect(res.status).toBe(200);
    // 29.921 − 27.55 = 2.371 inHgA = 8.03 kPa a (standard barometer)
    expect(res.body.checks.backpressure.value / 1000).toBeCloseTo(8.03, 1);
    expect(res.body.notes.join(' ')).toMatch(/standard atmosphere/);
  });

  it.each([
    ['a missing pressure', { pressure: undefined }, 'pressure'],
    ['a text temperature', { hotwellTemperature: { value: 'warm', unit: 'degC' } }, 'hotwellTemperature.value'],
    ['an unknown unit', { cwFlow: { value: 10, unit: 'buckets' } }, 'cwFlow.unit'],
    ['vacuum above the barometer', { pressure: { value: 31, unit: 'inHg_vac' }, barometer: { value: 29.9, unit: 'inHgA' } }, 'pressure.value'],
    ['a negative absolute pressure', { pressure: { value: -3, unit: 'kPa_a' } }, 'pressure.value'],
    ['RH above 100 %', { tower: { relativeHumidityPercent: 130 } }, 'tower.relativeHumidityPercent'],
  ])('answers 400 naming the field for %s', async (_label, patch, field) => {
    const user = await makeUser('operator');
    const agent = await signedInAgent(built, user.email);
    const res = await agent.post('/api/calc/condenser').set('X-CSRF-Token', agent.csrf).send({ ...reading(), ...patch });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it('answers 404 for a unit that does not exist', async () => {
    const user = await makeUser('operator');
    const agent = await signedInAgent(built, user.email);
    await agent.post('/api/calc/condenser').set('X-CSRF-Token', agent.csrf).send({ ...reading(), unitId: 999_999 }).expect(404);
  });
});

describe('GET /api/calc/units/:unitId/condenser-design', () => {
  it('answers 401 signed out, and the design with the limits in force when signed in', async () => {
    const anonymous = await anonymousAgent(built);
    await anonymous.get(`/api/calc/units/${unitId}/condenser-design`).expect(401);
    const user = await makeUser('trainee');
    const agent = await signedInAgent(built, user.email);
    const res = await agent.get(`/api/calc/units/${unitId}/condenser-design`).expect(200);
    expect(res.body.design).toMatchObject({ surfaceAreaM2: 17_500, tubeMaterial: 'titanium' });
    expect(res.body.design.backpressureCorrection).toHaveLength(4);
    expect(res.body.limits.backpressure).toBeDefined();
  });
});
