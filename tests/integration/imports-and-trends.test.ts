import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { ReadingSet, ReadingValue } from '../../server/features/readings/model';
import { anonymousAgent, buildApp, closeAll, makeUnit, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();

const mapping = {
  source: 'Historian hourly export',
  timeColumn: 'Timestamp',
  columns: {
    pressure: { column: 'Cond press', unit: 'kPa_a' },
    hotwellTemperature: { column: 'Hotwell', unit: 'degC' },
    cwInletTemperature: { column: 'CW in', unit: 'degC' },
    cwOutletTemperature: { column: 'CW out', unit: 'degC' },
    cwFlow: { column: 'CW flow', unit: 'm3_h' },
  },
};

const header = 'Timestamp,Cond press,Hotwell,CW in,CW out,CW flow\n';
const goodRows = [
  '2026-03-01T00:00:00Z,6.1,35.8,20.1,28.9,54000',
  '2026-03-01T01:00:00Z,6.2,35.9,20.2,29.0,54000',
  '2026-03-01T02:00:00Z,6.0,35.6,20.0,28.8,54000',
];
const csv = (lines: string[]) => Buffer.from(header + lines.join('\n') + '\n');

function upload(agent: Agent, path: string, file: Buffer, withMapping = true) {
  const req = agent.post(path).set('X-CSRF-Token', agent.csrf).attach('file', file, 'export.csv');
  return withMapping ? req.field('mapping', JSON.stringify(mapping)) : req;
}

let unitId = 0;
let operator: Agent;
beforeAll(async () => {
  unitId = (await makeUnit()).id;
  operator = await signedInAgent(built, (await makeUser('operator')).email);
});

describe('historian CSV import', () => {
  it('answers 401 signed out and 403 to a trainee or trainer', async () => {
    await upload(await anonymousAgent(built), `/api/units/${unitId}/imports/preview`, csv(goodRows)).expect(401);
    for (const role of ['trainee', 'trainer'] as const) {
      const agent = await signedInAgent(built, (await makeUser(role)).email);
      await upload(agent, `/api/units/${unitId}/imports`, csv(goodRows)).expect(403);
    }
  });

  it('inspects the columns, previews every row, and reports bad rows without storing anything', async () => {
    const inspect = await upload(operator, `/api/units/${unitId}/imports/inspect`, csv(goodRows), false);
    expect(inspect.status).toBe(200);
    expect(inspect.body.headers).toEqual(['Timestamp', 'Cond press', 'Hotwell', 'CW in', 'CW out', 'CW flow']);
    const file = csv([...goodRows, 'yesterday,6.1,35,20,29,54000', '2026-03-01T04:00:00Z,-3,35,20,29,54000', '2026-03-01T05:00:00Z,6.1,,20,29,54000']);
    const preview = await upload(operator, `/api/units/${unitId}/imports/preview`, file);
    expect(preview.status).toBe(200);
    expect(preview.body.counts).toEqual({ rows: 6, valid: 3, invalid: 3, duplicate: 0 });
    const invalid = preview.body.rows.filter((r: { status: string }) => r.status === 'invalid');
    expect(invalid.map((r: { row: number }) => r.row)).toEqual([5, 6, 7]);
    expect(invalid[0].errors.time).toMatch(/date-time/);
    // Below the triple point of water (611.657 Pa, IAPWS), in the column's unit.
    expect(invalid[1].errors.pressure).toBe('Condenser absolute pressure must be between 0.612 kPa a and 200 kPa a');
    expect(invalid[2].errors.hotwellTemperature).toBeTruthy();
    expect(await ReadingSet.count({ where: { unitId } })).toBe(0);
  });

  it('imports the valid rows, and a second import of overlapping rows adds only the new ones', async () => {
    const first = await upload(operator, `/api/units/${unitId}/imports`, csv([...goodRows, 'not-a-time,1,1,1,1,1']));
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ imported: 3, alreadyThere: 0, batches: 1, counts: { valid: 3, invalid: 1 } });
    const again = await upload(operator, `/api/units/${unitId}/imports`, csv([...goodRows, '2026-03-01T03:00:00Z,6.3,36.0,20.3,29.1,54000']));
    expect(again.status).toBe(201);
    expect(again.body).toMatchObject({ imported: 1, alreadyThere: 3, counts: { duplicate: 3 } });
    expect(await ReadingSet.count({ where: { unitId } })).toBe(4);
    const remembered = await operator.get(`/api/units/${unitId}/import-mappings`).expect(200);
    expect(remembered.body.mappings[0]).toMatchObject({ source: 'Historian hourly export', mapping: { timeColumn: 'Timestamp' } });
  });

  it('stores nothing when the first batch fails, and says nothing was saved', async () => {
    const unit = await makeUnit();
    // The batch's values fail after its reading sets were written inside the (only) batch's transaction.
    const original = ReadingValue.bulkCreate.bind(ReadingValue);
    let calls = 0;
    const spy = vi.spyOn(ReadingValue, 'bulkCreate').mockImplementation(async (...args: Parameters<typeof ReadingValue.bulkCreate>) => {
      calls += 1;
      if (calls === 1) throw new Error('disk full (simulated)');
      return original(...args);
    });
    const res = await upload(operator, `/api/units/${unit.id}/imports`, csv(goodRows));
    spy.mockRestore();
    expect(calls).toBe(1);
    expect(res.status).toBe(500);
    expect(res.body.error.message).toMatch(/nothing was saved/);
    expect(await ReadingSet.count({ where: { unitId: unit.id } })).toBe(0);
    expect(await ReadingValue.count({ where: { unitId: unit.id } })).toBe(0);
  });

  it.each([
    ['a binary file', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x00, 0x00, 0x01, 0x02]), /binary/],
    ['a file that is not UTF-8', Buffer.concat([Buffer.from(header), Buffer.from([0xff, 0xfe, 0x41, 0x0a])]), /UTF-8/],
    ['a file without a header row', Buffer.from(goodRows.join('\n')), /header/],
    ['an empty file', Buffer.alloc(0), /empty|Choose a CSV/],
  ])('refuses %s with a clear message and stores nothing', async (_label, file, message) => {
    const unit = await makeUnit();
    const res = await upload(operator, `/api/units/${unit.id}/imports`, file);
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(message);
    expect(await ReadingSet.count({ where: { unitId: unit.id } })).toBe(0);
  });

  it('refuses a file over 10 MB with 413', async () => {
    const big = Buffer.alloc(11 * 1024 * 1024, 'a');
    const res = await upload(operator, `/api/units/${unitId}/imports/preview`, big);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/10 MB/);
  });

  it('answers 400 for a mapping that names a missing column or lacks a required field', async () => {
    const res = await operator
      .post(`/api/units/${unitId}/imports/preview`)
      .set('X-CSRF-Token', operator.csrf)
      .attach('file', csv(goodRows), 'export.csv')
      .field('mapping', JSON.stringify({ ...mapping, columns: { ...mapping.columns, hotwellTemperature: undefined, cwFlow: { column: 'Nope', unit: 'm3_h' } } }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields['columns.hotwellTemperature']).toMatch(/Map a column/);
  });
});

describe('GET /api/units/:unitId/trends', () => {
  it('returns the series, the limit bands in force and flag markers', async () => {
    const from = '2026-02-28T00:00:00Z';
    const to = '2026-03-02T00:00:00Z';
    const res = await operator.get(`/api/units/${unitId}/trends?parameters=ttd,backpressure,expectedBackpressure&from=${from}&to=${to}`).expect(200);
    expect(res.body.series).toHaveLength(3);
    const ttd = res.body.series.find((s: { parameter: string }) => s.parameter === 'ttd');
    expect(ttd.points).toHaveLength(4);
    expect(ttd.points[0].t < ttd.points[1].t).toBe(true);
    expect(res.body.limitBands[0].bands.ttd).toMatchObject({ highWatch: 7, highAlarm: 10 });
  });

  it('marks the flags of the parameters shown, when they were raised, at their severity and status', async () => {
    const unit = await makeUnit();
    // Ts(10 kPa) = 45.81 °C (IAPWS-IF97 saturation table), so TTD = 45.81 − CW out:
    // 5.81 K (normal), then 8.81 K (over the 7 K watch limit), then 11.81 K (over the 10 K alarm limit).
    // The rise stays 10, 7 and 4 K, under its 12 K watch limit.
    const rows = ['2026-03-05T00:00:00Z,10,45.5,30,40,54000', '2026-03-05T01:00:00Z,10,45.5,30,37,54000', '2026-03-05T02:00:00Z,10,45.5,30,34,54000'];
    const imported = await upload(operator, `/api/units/${unit.id}/imports`, csv(rows));
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    const trend = (parameters: string, to: string) =>
      operator.get(`/api/units/${unit.id}/trends?parameters=${parameters}&from=2026-03-04T00:00:00Z&to=${to}`).expect(200);

    // One flag for TTD: raised at watch by the 01:00 round, escalated to alarm by the 02:00 round, still open.
    const ttd = await trend('ttd', '2026-03-06T00:00:00Z');
    expect(ttd.body.flags).toEqual([
      { id: expect.any(Number), parameter: 'ttd', severity: 'alarm', status: 'open', origin: 'automatic', raisedAt: '2026-03-05T01:00:00.000Z', clearedAt: null },
    ]);
    // A parameter with no flag shows none, whatever else is flagged on the unit.
    expect((await trend('cwRise', '2026-03-06T00:00:00Z')).body.flags).toEqual([]);
    // A range that ends before the flag was raised shows none.
    expect((await trend('ttd', '2026-03-05T00:30:00Z')).body.flags).toEqual([]);
  });

  it('answers 401 signed out and 400 for a bad range or parameter', async () => {
    await (await anonymousAgent(built)).get(`/api/units/${unitId}/trends?parameters=ttd&from=2026-01-01T00:00:00Z&to=2026-02-01T00:00:00Z`).expect(401);
    const bad = await operator.get(`/api/units/${unitId}/trends?parameters=mood&from=2026-02-01T00:00:00Z&to=2026-01-01T00:00:00Z`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['parameters.0']));
  });
});
