// `npm run bench:trends`: seeds 5 years of hourly readings for two units (~87 600 reading sets)
// into a private throwaway MariaDB, serves the app, and measures against it over HTTP:
//   - the trend query for a 90-day window of one parameter (200 requests, p50/p95)
//   - recording one round (50 requests, p50/p95).
// Figures are reported, not asserted. Needs Debian's mariadb-server (installed by npm test/start).
import { QueryTypes } from 'sequelize';
import { demoRound } from '../server/db/seed/demo-history';
import { demoCondenserDesign } from '../server/db/seed/demo-plant';
import { checkKeys } from '../shared/calc/check-catalog';
import { evaluateReadingSet } from '../shared/calc/evaluate';
import { startingLimits } from '../shared/calc/limits';
import { startingPlausibleRanges } from '../shared/calc/plausibility';
import { readingSetToSi } from '../shared/calc/reading-set-si';
import { worstOf } from '../server/features/readings/evaluate-at';
import { startBench, timeRequests } from './lib/bench-harness';

const YEARS = Number(process.env.BENCH_YEARS ?? 5);
const HOURS = YEARS * 365 * 24;
const BATCH = 400;

async function main() {
  const bench = await startBench('trends');
  const { sequelize } = bench;
  try {
    const units = await sequelize.query<{ id: number; design: number; limits: number }>(
      `SELECT u.id, (SELECT MIN(id) FROM unit_design_versions d WHERE d.unit_id = u.id) AS design,
              (SELECT MIN(id) FROM limit_set_versions l WHERE l.unit_id = u.id) AS limits FROM units u`,
      { type: QueryTypes.SELECT },
    );
    const recorder = (await sequelize.query<{ recorder: number }>(`SELECT id AS recorder FROM users WHERE role = 'operator' LIMIT 1`, { type: QueryTypes.SELECT }))[0]!.recorder;
    const maxId = (await sequelize.query<{ maxId: number | null }>('SELECT MAX(id) AS maxId FROM reading_sets', { type: QueryTypes.SELECT }))[0]!.maxId;
    let nextId = (maxId ?? 0) + 1;

    // Older than the demo's two weeks, so the two never share a timestamp.
    const end = Date.now() - 15 * 86_400_000;
    const start = end - HOURS * 3_600_000;
    const seedStarted = Date.now();
    let state = 12345;
    const next = () => ((state = (state * 1_103_515_245 + 12_345) % 2_147_483_648), state / 2_147_483_648);
    for (const unit of units) {
      for (let from = 0; from < HOURS; from += BATCH) {
        const sets: unknown[] = [];
        const values: unknown[] = [];
        for (let hour = from; hour < Math.min(HOURS, from + BATCH); hour++) {
          const { takenAtOffsetH: _offset, ...round } = demoRound(demoCondenserDesign, hour % (14 * 24), unit.id === units[0]!.id, next);
          const raw = { ...round, unitId: unit.id };
          const si = readingSetToSi(raw);
          const evaluation = evaluateReadingSet(si, demoCondenserDesign, startingLimits, startingPlausibleRanges);
          const takenAt = new Date(start + hour * 3_600_000);
          const id = nextId++;
          sets.push([id, unit.id, takenAt, takenAt, takenAt, recorder, 0, 'import', takenAt.toISOString(), unit.design, unit.limits, JSON.stringify(raw), JSON.stringify(si), JSON.stringify(evaluation), worstOf(evaluation)]);
          for (const key of checkKeys) {
            const check = evaluation.checks[key];
            if (check.value !== null) values.push([id, key, unit.id, takenAt, check.value, check.status]);
          }
        }
        await sequelize.query(
          `INSERT INTO reading_sets (id, unit_id, taken_at, recorded_at, entered_at, recorded_by, recorded_as_trainee, source, import_key, design_version_id, limit_version_id, raw, si, results, worst_status) VALUES ${sets.map(() => '(?)').join(',')}`,
          { replacements: sets },
        );
        for (let i = 0; i < values.length; i += 5000) {
          const chunk = values.slice(i, i + 5000);
          await sequelize.query(`INSERT INTO reading_values (reading_set_id, parameter, unit_id, taken_at, value, status) VALUES ${chunk.map(() => '(?)').join(',')}`, { replacements: chunk });
        }
      }
    }
    const sets = (await sequelize.query<{ sets: number }>('SELECT COUNT(*) AS sets FROM reading_sets', { type: QueryTypes.SELECT }))[0]!.sets;
    const rows = (await sequelize.query<{ rows: number }>('SELECT COUNT(*) AS `rows` FROM reading_values', { type: QueryTypes.SELECT }))[0]!.rows;
    console.log(`seeded ${Number(sets).toLocaleString('en-GB')} reading sets (${Number(rows).toLocaleString('en-GB')} trend rows) in ${((Date.now() - seedStarted) / 1000).toFixed(0)} s`);

    const { call, csrf: token } = await bench.serve('operator');

    const parameters = ['backpressure', 'ttd', 'cleanlinessFactor', 'subcooling', 'expectedBackpressure', 'towerApproach'];
    let points = 0;
    const trend = await timeRequests(200, async (i) => {
      const unit = units[i % units.length]!;
      const windowEnd = end - Math.floor(next() * (HOURS - 90 * 24)) * 3_600_000;
      const from = new Date(windowEnd - 90 * 86_400_000).toISOString();
      const to = new Date(windowEnd).toISOString();
      const response = await call(`/api/units/${unit.id}/trends?parameters=${parameters[i % parameters.length]}&from=${from}&to=${to}`);
      points += ((await response.clone().json()) as { series: { points: unknown[] }[] }).series[0]!.points.length;
      return response;
    });
    console.log(`trend, 90-day window, one parameter (${(points / 200).toFixed(0)} points each): p50 ${trend.p50.toFixed(1)} ms, p95 ${trend.p95.toFixed(1)} ms over 200 requests`);

    const record = await timeRequests(50, (i) => {
      const { takenAtOffsetH: _o, unitId: _u, ...round } = demoRound(demoCondenserDesign, i, false, next);
      return call(`/api/units/${units[0]!.id}/readings`, { method: 'POST', headers: { 'x-csrf-token': token }, body: JSON.stringify(round) });
    });
    console.log(`record one round (POST, with checks, trend rows and flags): p50 ${record.p50.toFixed(1)} ms, p95 ${record.p95.toFixed(1)} ms over 50 requests`);
  } finally {
    await bench.stop();
  }
}

await main();
