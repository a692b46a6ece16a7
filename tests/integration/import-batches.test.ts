// A historian import is stored in batches, each its own transaction: a round on the same unit waits
// for at most one batch, a failure part-way keeps whole batches and says so, and importing the
// same file again (or twice at once) stores every row once.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { AuditEvent } from '../../server/features/audit/model';
import { ReadingSet, ReadingValue } from '../../server/features/readings/model';
import { vacuumRound } from './support/rounds';
import { buildApp, closeAll, makeUnit, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);

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

/**
 * `count` hourly rows ending two days ago. Every 40th row has 12 kPa a in the condenser, past the
 * 11 kPa a starting watch limit (common practice), so batches raise and refresh flags as well.
 */
function hourlyCsv(count: number) {
  const end = Math.floor(Date.now() / 3_600_000) * 3_600_000 - 48 * 3_600_000;
  const lines = ['Timestamp,Cond press,Hotwell,CW in,CW out,CW flow'];
  for (let i = 0; i < count; i++) {
    const at = new Date(end - (count - 1 - i) * 3_600_000).toISOString();
    const pressure = i % 40 === 39 ? 12 : 6 + (i % 7) * 0.05;
    lines.push(`${at},${pressure.toFixed(2)},35.8,20.1,28.9,54000`);
  }
  return Buffer.from(lines.join('\n') + '\n');
}

const upload = (agent: Agent, unitId: number, file: Buffer) =>
  agent.post(`/api/units/${unitId}/imports`).set('X-CSRF-Token', agent.csrf).attach('file', file, 'export.csv').field('mapping', JSON.stringify(mapping));

describe('an import in batches', () => {
  let operator: Agent;
  let fieldOperator: Agent;
  const built = buildApp();
  const smallBatches = buildApp({ importBatchRows: 2 });
  beforeAll(async () => {
    operator = await signedInAgent(built, (await makeUser('operator')).email);
    fieldOperator = await signedInAgent(built, (await makeUser('operator')).email);
  });

  it('lets rounds on the same unit through while 5 000 rows go in: each is stored before the import ends', { timeout: 240_000 }, async () => {
    const unit = await makeUnit();
    const file = hourlyCsv(5000);
    let finished = false;
    const importing = upload(operator, unit.id, file).then((res) => {
      finished = true;
      return { res };
    });
    // Mid-way: once some batches are in and most of the file is still to come.
    let stored = 0;
    while (stored < 600 && !finished) {
      await new Promise((r) => setTimeout(r, 100));
      stored = await ReadingSet.count({ where: { unitId: unit.id } });
    }
    // Whether each round was answered before the import ended: a round held behind the whole import is
    // answered only after it. (How long a round takes under load is bench:load's to measure, not a test's.)
    const answered: { status: number; importStillRunning: boolean }[] = [];
    // One round inside its limits (waits only on the foreign key), one past the watch limit (takes the unit's turn).
    for (const round of [vacuumRound(28.5), vacuumRound(26.5, 45), vacuumRound(28.5), vacuumRound(26.5, 45)]) {
      const res = await fieldOperator.post(`/api/units/${unit.id}/readings`).set('X-CSRF-Token', fieldOperator.csrf).send(round);
      answered.push({ status: res.status, importStillRunning: !finished });
    }
    const storedWhenRoundsDone = await ReadingSet.count({ where: { unitId: unit.id, source: 'import' } });
    const { res } = await importing;
    // The rounds really were saved mid-import, not after it.
    expect(storedWhenRoundsDone, 'the rounds waited for the whole import').toBeLessThan(5000);
    expect(answered).toEqual(answered.map(() => ({ status: 201, importStillRunning: true })));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ imported: 5000, alreadyThere: 0, batches: 50, batchRows: 100 });
    expect(await ReadingSet.count({ where: { unitId: unit.id } })).toBe(5004);
    expect(await AuditEvent.count({ where: { action: 'import.batch', entity: 'unit', entityId: String(unit.id) } })).toBe(50);
  });

  it('keeps the whole batches written before a failure, says how many rows are in, and a second import adds only the rest', async () => {
    const unit = await makeUnit();
    const file = hourlyCsv(5);
    // Batches of 2: the second batch's values fail (after its reading sets were written), once the first committed.
    const original = ReadingValue.bulkCreate.bind(ReadingValue);
    let calls = 0;
    const spy = vi.spyOn(ReadingValue, 'bulkCreate').mockImplementation(async (...args: Parameters<typeof ReadingValue.bulkCreate>) => {
      calls += 1;
      if (calls === 2) throw new Error('connection lost (simulated)');
      return original(...args);
    });
    const agent = await signedInAgent(smallBatches, (await makeUser('operator')).email);
    const failed = await upload(agent, unit.id, file);
    spy.mockRestore();
    expect(failed.status).toBe(500);
    expect(failed.body.error.code).toBe('IMPORT_INCOMPLETE');
    expect(failed.body.error.message).toMatch(/stopped at file row 4: 2 rows were stored \(1 whole batches of up to 2 rows\) and nothing of the batch that failed/);
    expect(failed.body.error.message).toMatch(/Import the same file again to add the rest/);
    // Whole batches: two readings, each with its values; none of the failed batch's row 3.
    const readings = await ReadingSet.findAll({ where: { unitId: unit.id }, order: [['takenAt', 'ASC']] });
    expect(readings).toHaveLength(2);
    for (const r of readings) expect(await ReadingValue.count({ where: { readingSetId: r.id } })).toBeGreaterThan(0);

    const resumed = await upload(agent, unit.id, file).expect(201);
    expect(resumed.body).toMatchObject({ imported: 3, alreadyThere: 2, batches: 2 });
    expect(await ReadingSet.count({ where: { unitId: unit.id } })).toBe(5);
  });

  it('stores every row once when the same file is imported twice at once', { timeout: 60_000 }, async () => {
    const unit = await makeUnit();
    const file = hourlyCsv(60);
    const agents = [operator, await signedInAgent(smallBatches, (await makeUser('operator')).email)];
    // One app with batches of 100 and one with batches of 2, so the two interleave batch by batch.
    const [a, b] = await Promise.all([upload(agents[0]!, unit.id, file), upload(agents[1]!, unit.id, file)]);
    expect(a.status, JSON.stringify(a.body)).toBe(201);
    expect(b.status, JSON.stringify(b.body)).toBe(201);
    expect(a.body.imported + b.body.imported).toBe(60);
    expect(a.body.imported + a.body.alreadyThere).toBe(60);
    expect(b.body.imported + b.body.alreadyThere).toBe(60);
    expect(await ReadingSet.count({ where: { unitId: unit.id } })).toBe(60);
  });
});
