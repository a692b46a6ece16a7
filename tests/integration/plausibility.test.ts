// Physical ranges (always refused) and plausible ranges (confirm, mark, withhold) on the real app.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ReadingSet, ReadingValue } from '../../server/features/readings/model';
import { startingPlausibleRanges } from '../../shared/calc/plausibility';
import { anonymousAgent, buildApp, closeAll, makeUnit, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();
const post = (agent: Agent, path: string, body: unknown) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);

// The hand-built design point (tests/fixtures/hand-built-design.ts): 8 kPa a, 22 °C in, 560 MW on
// 15 000 kg/s, so the rise is 560e6 / (15 000 × 4180) = 8.93 K; Tsat(8 kPa) = 41.51 °C (steam tables).
const atDesign = {
  pressure: { value: 8, unit: 'kPa_a' },
  hotwellTemperature: { value: 41.3, unit: 'degC' },
  cwInletTemperature: { value: 22, unit: 'degC' },
  cwOutletTemperature: { value: 30.93, unit: 'degC' },
  cwFlow: { value: 15_000, unit: 'kg_s' },
};
// The same duty on 150 % of design flow (rise 5.95 K): above the starting 20–130 % (common practice).
const highFlow = { ...atDesign, cwFlow: { value: 22_500, unit: 'kg_s' }, cwOutletTemperature: { value: 27.95, unit: 'degC' } };
const flowChecks = ['duty', 'overallU', 'tubeVelocity', 'cleanU', 'cleanlinessFactor', 'expectedBackpressure', 'backpressureDeviation', 'deviationCostPower'] as const;

let unitId = 0;
let operator: Agent;
let admin: Agent;
let trainer: Agent;
beforeAll(async () => {
  unitId = (await makeUnit({ plausible: 'starting' })).id;
  operator = await signedInAgent(built, (await makeUser('operator')).email);
  admin = await signedInAgent(built, (await makeUser('admin')).email);
  trainer = await signedInAgent(built, (await makeUser('trainer')).email);
});

describe('physical ranges', () => {
  it('refuses CW flow 1e9 m³/h with 400 on the field, in the unit typed, and stores nothing', async () => {
    const before = await ReadingSet.count({ where: { unitId } });
    const res = await post(operator, `/api/units/${unitId}/readings`, { ...atDesign, cwFlow: { value: 1e9, unit: 'm3_h' }, confirmOutsidePlausible: ['cwFlow'] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['cwFlow.value']).toBe('CW flow must be between 0 m³/h and 1,000,000 m³/h');
    expect(await ReadingSet.count({ where: { unitId } })).toBe(before);
  });

  it('words a temperature in the unit typed, never in kelvin', async () => {
    // Water boils at 212 °F at one atmosphere (the definition of the scale).
    const res = await post(operator, `/api/units/${unitId}/readings`, { ...atDesign, hotwellTemperature: { value: 2800, unit: 'degF' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['hotwellTemperature.value']).toBe('Hotwell temperature must be between 32 °F and 212 °F');
    expect(JSON.stringify(res.body)).not.toMatch(/\d K\b/);
  });

  it('refuses the same on the scratch-pad check', async () => {
    const res = await post(operator, '/api/calc/condenser', { ...atDesign, unitId, cwFlow: { value: 1e9, unit: 'm3_h' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['cwFlow.value']).toMatch(/^CW flow must be between/);
  });
});

describe('plausible ranges on a round', () => {
  let markedId = 0;

  it('saves a round at the design point without asking', async () => {
    const res = await post(operator, `/api/units/${unitId}/readings`, atDesign);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.reading.outsidePlausible).toEqual([]);
  });

  it('refuses an unconfirmed round outside the plausible range with a field message, and stores nothing', async () => {
    const before = await ReadingSet.count({ where: { unitId } });
    const res = await post(operator, `/api/units/${unitId}/readings`, highFlow);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('OUTSIDE_PLAUSIBLE_RANGE');
    // 20–130 % of 15 000 kg/s = 3 000–19 500 kg/s.
    expect(res.body.error.fields['cwFlow.value']).toBe(
      'CW flow 22,500 kg/s is outside the plausible range for this unit (3,000–19,500 kg/s, 20–130 % of design flow). Check the instrument and the reading. Confirm to save it anyway.',
    );
    // What to ask about, for a form whose own copy of the ranges is older than the server's.
    expect(res.body.error.details.outside).toEqual([{ key: 'cwFlow', field: 'cwFlow.value', message: expect.stringMatching(/^CW flow 22,500 kg\/s is outside/) }]);
    // A confirmation of something else does not cover it.
    const wrong = await post(operator, `/api/units/${unitId}/readings`, { ...highFlow, confirmOutsidePlausible: ['ttd'] });
    expect(wrong.status).toBe(400);
    expect(await ReadingSet.count({ where: { unitId } })).toBe(before);
  });

  it('stores a confirmed round marked, with the checks built on the flow withheld and the reason given', async () => {
    const res = await post(operator, `/api/units/${unitId}/readings`, { ...highFlow, confirmOutsidePlausible: ['cwFlow'] });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    markedId = res.body.id;
    const stored = (await ReadingSet.findByPk(markedId))!;
    expect(stored.outsidePlausible).toEqual(['cwFlow']);
    expect(stored.plausibleVersionId).toBeNull(); // the starting ranges
    for (const key of flowChecks) {
      expect(stored.results.checks[key], key).toMatchObject({ value: null, status: 'unknown', reason: 'not computed: CW flow is outside the plausible range for this unit' });
    }
    expect(stored.results.checks.ttd.value).not.toBeNull();
    // The trend table keeps the flow, marked, and has nothing for what was withheld.
    const values = await ReadingValue.findAll({ where: { readingSetId: markedId } });
    expect(values.find((v) => v.parameter === 'cwFlow')?.outsidePlausible).toBe(true);
    expect(values.find((v) => v.parameter === 'ttd')?.outsidePlausible).toBe(false);
    expect(values.some((v) => v.parameter === 'duty')).toBe(false);
  });

  it('shows the mark in the round list, on the round and in its trend points', async () => {
    const list = await operator.get(`/api/units/${unitId}/readings`).expect(200);
    const listed = list.body.readings.find((r: { id: number }) => r.id === markedId);
    expect(listed.outsidePlausible).toEqual(['cwFlow']);
    expect(list.body.readings.filter((r: { outsidePlausible: string[] }) => r.outsidePlausible.length)).toHaveLength(1);
    const detail = await operator.get(`/api/readings/${markedId}`).expect(200);
    expect(detail.body.current.outsidePlausible).toEqual(['cwFlow']);
    const from = new Date(Date.now() - 3_600_000).toISOString();
    const to = new Date(Date.now() + 60_000).toISOString();
    const trend = await operator.get(`/api/units/${unitId}/trends`).query({ parameters: 'cwFlow,duty', from, to }).expect(200);
    const flow = trend.body.series.find((s: { parameter: string }) => s.parameter === 'cwFlow').points;
    expect(flow.filter((p: { o?: boolean }) => p.o)).toHaveLength(1);
    expect(flow.filter((p: { o?: boolean }) => !p.o)).toHaveLength(1);
    expect(trend.body.series.find((s: { parameter: string }) => s.parameter === 'duty').points).toHaveLength(1);
  });

  it('puts a marked round in the logbook search even when every check it judged is normal', async () => {
    // 1.9 kPa a is below the starting 2 kPa a (common practice) and has no low limit: Tsat 16.7 °C
    // (steam tables), the rest a cold-water winter round.
    const coldWinter = {
      ...atDesign,
      pressure: { value: 1.9, unit: 'kPa_a' },
      hotwellTemperature: { value: 16.5, unit: 'degC' },
      cwInletTemperature: { value: 5, unit: 'degC' },
      cwOutletTemperature: { value: 12, unit: 'degC' },
    };
    const saved = await post(operator, `/api/units/${unitId}/readings`, { ...coldWinter, confirmOutsidePlausible: ['backpressure'] });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect(saved.body.reading).toMatchObject({ worstStatus: 'normal', outsidePlausible: ['backpressure'] });
    const found = await trainer.get('/api/logbook/search').query({ q: 'outside plausible range', kind: 'round', unitId }).expect(200);
    const hit = found.body.hits.find((h: { refId: number }) => h.refId === saved.body.id);
    expect(hit?.title).toBe('Round: normal · outside plausible range');
    expect(found.body.hits.map((h: { refId: number }) => h.refId)).toContain(markedId);
  });

  it('asks again on an amendment, and an amendment back inside the range clears the mark', async () => {
    const unconfirmed = await post(operator, `/api/readings/${markedId}/amendments`, { reason: 'Flow transmitter re-read', reading: highFlow });
    expect(unconfirmed.status).toBe(400);
    expect(unconfirmed.body.error.code).toBe('OUTSIDE_PLAUSIBLE_RANGE');
    const fixed = await post(operator, `/api/readings/${markedId}/amendments`, { reason: 'Flow read from the wrong transmitter', reading: atDesign });
    expect(fixed.status, JSON.stringify(fixed.body)).toBe(201);
    expect(fixed.body.current.outsidePlausible).toEqual([]);
    expect(fixed.body.reading.outsidePlausible).toEqual(['cwFlow']); // the record as first written stays
    expect(fixed.body.current.results.checks.duty.value).toBeGreaterThan(0);
    const values = await ReadingValue.findAll({ where: { readingSetId: markedId, parameter: 'cwFlow' } });
    expect(values[0]?.outsidePlausible).toBe(false);
  });
});

describe('POST /api/plant/units/:unitId/plausible-range-versions', () => {
  const wider = { ...startingPlausibleRanges, cwFlow: { low: 0.2, high: 1.6 } };

  it('answers 401 signed out and 403 to an operator', async () => {
    const anonymous = await anonymousAgent(built);
    await post(anonymous, `/api/plant/units/${unitId}/plausible-range-versions`, { ranges: wider, note: 'Two CW pumps plus the spare' }).expect(401);
    await post(operator, `/api/plant/units/${unitId}/plausible-range-versions`, { ranges: wider, note: 'Two CW pumps plus the spare' }).expect(403);
  });

  it('answers 400 on the field for a range upside down or beyond what can be set, in the setup page’s units', async () => {
    const upsideDown = await post(admin, `/api/plant/units/${unitId}/plausible-range-versions`, { ranges: { ...wider, ttd: { low: 15, high: 1 } }, note: 'typo' });
    expect(upsideDown.status).toBe(400);
    expect(upsideDown.body.error.fields['ranges.ttd.high']).toBe('The high end of TTD must be above its low end');
    // 150 °C = 423.15 K: water at a hotwell is 0–100 °C.
    const tooHot = await post(admin, `/api/plant/units/${unitId}/plausible-range-versions`, { ranges: { ...wider, hotwellTemperature: { low: 288.15, high: 423.15 } }, note: 'typo' });
    expect(tooHot.body.error.fields['ranges.hotwellTemperature.high']).toBe('The high end of Hotwell temperature must lie within 0 to 100 °C');
    const missing = await post(admin, `/api/plant/units/${unitId}/plausible-range-versions`, { ranges: { ...wider, cwFlow: { low: 0.2 } }, note: 'typo' });
    expect(missing.body.error.fields['ranges.cwFlow.high']).toBe('Enter a number');
  });

  it('stores a new version that judges rounds taken from then on; earlier rounds keep the ranges of their time', async () => {
    const setupBefore = await operator.get(`/api/plant/units/${unitId}/setup`).expect(200);
    expect(setupBefore.body.plausible).toEqual({ versionId: null, data: startingPlausibleRanges });
    const saved = await post(admin, `/api/plant/units/${unitId}/plausible-range-versions`, { ranges: wider, note: 'Three CW pumps in summer: up to 160 % of design flow' });
    expect(saved.status).toBe(201);
    const setup = await operator.get(`/api/plant/units/${unitId}/setup`).expect(200);
    expect(setup.body.plausible).toEqual({ versionId: saved.body.versionId, data: wider });
    expect(setup.body.plausibleHistory[0]).toMatchObject({ id: saved.body.versionId, note: 'Three CW pumps in summer: up to 160 % of design flow' });
    const design = await operator.get(`/api/calc/units/${unitId}/condenser-design`).expect(200);
    expect(design.body.plausible.cwFlow).toEqual({ low: 0.2, high: 1.6 });

    const now = await post(operator, `/api/units/${unitId}/readings`, highFlow);
    expect(now.status, JSON.stringify(now.body)).toBe(201);
    expect(now.body.reading.outsidePlausible).toEqual([]);
    const earlier = await post(operator, `/api/units/${unitId}/readings`, { ...highFlow, takenAt: new Date(Date.now() - 2 * 3_600_000).toISOString() });
    expect(earlier.status).toBe(400);
    expect(earlier.body.error.fields['cwFlow.value']).toMatch(/20–130 % of design flow/);
  });
});

describe('historian import', () => {
  const mapping = {
    source: 'Historian export',
    timeColumn: 'Time',
    columns: {
      pressure: { column: 'P', unit: 'kPa_a' },
      hotwellTemperature: { column: 'HW', unit: 'degC' },
      cwInletTemperature: { column: 'In', unit: 'degC' },
      cwOutletTemperature: { column: 'Out', unit: 'degC' },
      cwFlow: { column: 'Flow', unit: 'kg_s' },
    },
  };
  const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
  const file = () =>
    Buffer.from(
      ['Time,P,HW,In,Out,Flow', `${hoursAgo(5)},8,41.3,22,30.93,15000`, `${hoursAgo(4)},8,41.3,22,27.95,22500`, `${hoursAgo(3)},8,41.3,22,30.93,1e9`].join('\n') + '\n',
    );

  it('makes a row outside the physical range a row error and imports one outside the plausible range marked', async () => {
    const importUnit = (await makeUnit({ plausible: 'starting' })).id;
    const res = await operator.post(`/api/units/${importUnit}/imports`).set('X-CSRF-Token', operator.csrf).attach('file', file(), 'export.csv').field('mapping', JSON.stringify(mapping));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ imported: 2, outsidePlausible: 1, counts: { valid: 2, invalid: 1 } });
    // 1 000 000 m³/h at a nominal 1000 kg/m³ = 277 778 kg/s, shown to three figures.
    expect(res.body.problems[0].errors.cwFlow).toBe('CW flow must be between 0 kg/s and 278,000 kg/s');
    const stored = await ReadingSet.findAll({ where: { unitId: importUnit }, order: [['takenAt', 'ASC']] });
    expect(stored.map((r) => r.outsidePlausible)).toEqual([[], ['cwFlow']]);
    expect(stored[1]!.results.checks.duty.reason).toBe('not computed: CW flow is outside the plausible range for this unit');
  });
});
