import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ReadingSet } from '../../server/features/readings/model';
import { StationSettingsRow } from '../../server/features/stations/model';
import { defaultStationSettings } from '../../server/features/stations/settings';
import { anonymousAgent, buildApp, closeAll, makeStation, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();

const mapping = {
  source: 'Historian local-time export',
  timeColumn: 'Time',
  columns: {
    pressure: { column: 'P', unit: 'kPa_a' },
    hotwellTemperature: { column: 'HW', unit: 'degC' },
    cwInletTemperature: { column: 'In', unit: 'degC' },
    cwOutletTemperature: { column: 'Out', unit: 'degC' },
  },
};
const csv = (times: string[]) => Buffer.from('Time,P,HW,In,Out\n' + times.map((t) => `${t},6.1,35.8,20.1,28.9`).join('\n') + '\n');
const upload = (agent: Agent, path: string, file: Buffer) => agent.post(path).set('X-CSRF-Token', agent.csrf).attach('file', file, 'export.csv').field('mapping', JSON.stringify(mapping));

async function stationIn(timeZone: string) {
  const made = await makeStation(1);
  await StationSettingsRow.create({ stationId: made.station.id, ...defaultStationSettings, timeZone, shiftChangeTimes: ['06:00', '18:00'], updatedAt: new Date() });
  return made;
}

let berlinUnit = 0;
let chicago: Awaited<ReturnType<typeof stationIn>>;
let chicagoUnit = 0;
let operator: Agent;
beforeAll(async () => {
  berlinUnit = (await stationIn('Europe/Berlin')).unit.id;
  chicago = await stationIn('America/Chicago');
  chicagoUnit = chicago.unit.id;
  operator = await signedInAgent(built, (await makeUser('operator')).email);
});

// Expected instants from the zone rules: Germany CET = UTC+1 in winter, CEST = UTC+2 from 01:00 UTC on
// the last Sunday of March to 01:00 UTC on the last Sunday of October (Directive 2000/84/EC); US Central
// CST = UTC−6, CDT = UTC−5 from the second Sunday of March to the first Sunday of November (Energy
// Policy Act of 2005).
describe('historian CSV times without an offset', () => {
  it('are read in the unit’s station zone, winter and summer; an offset or Z is kept; the preview names the zone', async () => {
    const file = csv(['2026-01-15 08:00', '2026-07-15T08:00', '2026-07-15T08:30:00+05:30', '2026-07-15T09:00:00Z']);
    const preview = await upload(operator, `/api/units/${berlinUnit}/imports/preview`, file).expect(200);
    expect(preview.body.timeZone).toBe('Europe/Berlin');
    expect(preview.body.rows.map((r: { takenAt: string }) => r.takenAt)).toEqual([
      '2026-01-15T07:00:00.000Z', // 08:00 CET
      '2026-07-15T06:00:00.000Z', // 08:00 CEST
      '2026-07-15T03:00:00.000Z', // 08:30 at UTC+05:30
      '2026-07-15T09:00:00.000Z',
    ]);
    const committed = await upload(operator, `/api/units/${berlinUnit}/imports`, file).expect(201);
    expect(committed.body).toMatchObject({ imported: 4, timeZone: 'Europe/Berlin' });
    const stored = await ReadingSet.findAll({ where: { unitId: berlinUnit }, order: [['takenAt', 'ASC']] });
    expect(stored.map((r) => r.takenAt.toISOString())).toEqual(['2026-01-15T07:00:00.000Z', '2026-07-15T03:00:00.000Z', '2026-07-15T06:00:00.000Z', '2026-07-15T09:00:00.000Z']);
  });

  it('use each station’s own zone: the same text is a different instant at a Chicago station', async () => {
    const preview = await upload(operator, `/api/units/${chicagoUnit}/imports/preview`, csv(['2026-01-15 08:00', '2026-07-15 08:00'])).expect(200);
    expect(preview.body.timeZone).toBe('America/Chicago');
    expect(preview.body.rows.map((r: { takenAt: string }) => r.takenAt)).toEqual(['2026-01-15T14:00:00.000Z', '2026-07-15T13:00:00.000Z']);
  });

  it('refuse a time the clocks skip, and read the repeated hour’s two rows as first and second occurrence', async () => {
    const preview = await upload(operator, `/api/units/${berlinUnit}/imports/preview`, csv(['2026-03-29 02:30', '2026-10-25 02:30', '2026-10-25 02:30'])).expect(200);
    const [skipped, first, second] = preview.body.rows;
    expect(skipped).toMatchObject({ status: 'invalid', takenAt: null });
    expect(skipped.errors.time).toContain('does not exist in Europe/Berlin');
    expect(first).toMatchObject({ status: 'valid', takenAt: '2026-10-25T00:30:00.000Z' }); // 02:30 CEST
    expect(second).toMatchObject({ status: 'valid', takenAt: '2026-10-25T01:30:00.000Z' }); // 02:30 CET
  });
});

describe('GET /api/plant/units', () => {
  it('gives each unit its station’s time zone', async () => {
    const res = await operator.get('/api/plant/units').expect(200);
    const zoneOf = (id: number) => res.body.units.find((u: { id: number }) => u.id === id)?.timeZone;
    expect(zoneOf(berlinUnit)).toBe('Europe/Berlin');
    expect(zoneOf(chicagoUnit)).toBe('America/Chicago');
  });

  it('answers 401 signed out', async () => {
    await (await anonymousAgent(built)).get('/api/plant/units').expect(401);
  });
});

describe('POST /api/stations/:stationId/crew-swaps', () => {
  it('takes a swap at a shift start on the station’s clock and refuses one at any other instant with 400 on the field', async () => {
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    const post = (shiftStart: string) =>
      admin.post(`/api/stations/${chicago.station.id}/crew-swaps`).set('X-CSRF-Token', admin.csrf).send({ shiftStart, crewId: chicago.crews[0]!.id, reason: 'Crew on a course' });
    // 06:00 CST on 2026-01-10 is 12:00 UTC; 06:00 UTC would be midnight in Chicago, no shift change there.
    await post('2026-01-10T12:00:00Z').expect(201);
    const refused = await post('2026-01-10T06:00:00Z').expect(400);
    expect(refused.body.error.fields.shiftStart).toContain('Not the start of a shift at this station');
    expect(refused.body.error.fields.shiftStart).toContain('America/Chicago');
  });
});
