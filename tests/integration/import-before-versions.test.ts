// History from before a unit's first design data or limit set: each such CSV row gets its own
// message in the preview and is left out of the import; a round dated then is refused on its field.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LimitSetVersion, PlantUnit, Station, UnitDesignVersion } from '../../server/features/plant/model';
import { ReadingSet } from '../../server/features/readings/model';
import { startingLimits } from '../../shared/calc/limits';
import { buildApp, closeAll, handBuiltDesign, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();

const mapping = {
  source: 'Historian export before go-live',
  timeColumn: 'Timestamp',
  columns: {
    pressure: { column: 'Cond press', unit: 'kPa_a' },
    hotwellTemperature: { column: 'Hotwell', unit: 'degC' },
    cwInletTemperature: { column: 'CW in', unit: 'degC' },
    cwOutletTemperature: { column: 'CW out', unit: 'degC' },
    cwFlow: { column: 'CW flow', unit: 'm3_h' },
  },
};
const csv = (lines: string[]) => Buffer.from('Timestamp,Cond press,Hotwell,CW in,CW out,CW flow\n' + lines.join('\n') + '\n');
const upload = (agent: Agent, path: string, file: Buffer) => agent.post(path).set('X-CSRF-Token', agent.csrf).attach('file', file, 'export.csv').field('mapping', JSON.stringify(mapping));

// The design data comes into force at 00:30 UTC, the first limit set at 01:30 UTC on 1 March 2026.
// The test station has no settings of its own, so it keeps the default zone, Europe/Berlin: UTC+1
// on 1 March (CET; summer time starts on the last Sunday of March, EU Directive 2000/84/EC).
const file = csv([
  '2026-03-01T00:00:00Z,6.1,35.8,20.1,28.9,54000', // before both
  '2026-03-01T01:00:00Z,6.2,35.9,20.2,29.0,54000', // design data in force, no limits yet
  '2026-03-01T02:00:00Z,6.0,35.6,20.0,28.8,54000', // both in force
]);

let unitId = 0;
let operator: Agent;
beforeAll(async () => {
  const [station] = await Station.findOrCreate({ where: { code: 'TST' }, defaults: { code: 'TST', name: 'Test station' } });
  const unit = await PlantUnit.create({ stationId: station.id, code: `GL${Date.now() % 1_000_000}`, name: 'Unit commissioned in 2026' });
  unitId = unit.id;
  await UnitDesignVersion.create({ unitId, effectiveFrom: new Date('2026-03-01T00:30:00Z'), data: handBuiltDesign, note: 'Data sheet at go-live', createdBy: null });
  await LimitSetVersion.create({ unitId, effectiveFrom: new Date('2026-03-01T01:30:00Z'), limits: startingLimits, note: 'First limits', createdBy: null });
  operator = await signedInAgent(built, (await makeUser('operator')).email);
});

describe('importing history from before the first versions', () => {
  it('previews each such row as not importable, with the station time and when the first version starts', async () => {
    const preview = await upload(operator, `/api/units/${unitId}/imports/preview`, file);
    expect(preview.status).toBe(200);
    expect(preview.body.counts).toEqual({ rows: 3, valid: 1, invalid: 2, duplicate: 0 });
    const [before, between, after] = preview.body.rows;
    expect(before).toMatchObject({ row: 2, status: 'invalid' });
    expect(before.errors.time).toBe('No design data in force at 2026-03-01 01:00 (Europe/Berlin); this unit’s first design data is in force from 2026-03-01 01:30 (Europe/Berlin)');
    expect(between).toMatchObject({ row: 3, status: 'invalid' });
    expect(between.errors.time).toBe('No limit set in force at 2026-03-01 02:00 (Europe/Berlin); this unit’s first limit set is in force from 2026-03-01 02:30 (Europe/Berlin)');
    expect(after).toMatchObject({ row: 4, status: 'valid', errors: {} });
  });

  it('imports only the rows that can be judged, answering 201 rather than failing the file', async () => {
    const res = await upload(operator, `/api/units/${unitId}/imports`, file);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ imported: 1, counts: { valid: 1, invalid: 2 } });
    expect(res.body.problems.map((p: { row: number }) => p.row)).toEqual([2, 3]);
    const stored = await ReadingSet.findAll({ where: { unitId } });
    expect(stored.map((r) => r.takenAt.toISOString())).toEqual(['2026-03-01T02:00:00.000Z']);
  });

  it('answers 400 on the time of a round dated before the first design data, and stores nothing', async () => {
    const res = await operator
      .post(`/api/units/${unitId}/readings`)
      .set('X-CSRF-Token', operator.csrf)
      .send({
        takenAt: '2026-03-01T00:10:00Z',
        pressure: { value: 6.1, unit: 'kPa_a' },
        hotwellTemperature: { value: 35.8, unit: 'degC' },
        cwInletTemperature: { value: 20.1, unit: 'degC' },
        cwOutletTemperature: { value: 28.9, unit: 'degC' },
      });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.takenAt).toMatch(/^No design data in force at 2026-03-01 01:10 \(Europe\/Berlin\)/);
    expect(await ReadingSet.count({ where: { unitId } })).toBe(1);
  });
});
