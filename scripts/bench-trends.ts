// `npm run bench:trends`: seeds 5 years of hourly readings for two units (~87 600 reading sets)
// into a private throwaway MariaDB, serves the app, and measures against it over HTTP:
//   - the trend query for a 90-day window of one parameter (200 requests, p50/p95)
//   - recording one round (50 requests, p50/p95).
// Figures are reported, not asserted. Needs Debian's mariadb-server (installed by npm test/start).
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { QueryTypes } from 'sequelize';
import { createApp } from '../server/app';
import { createSequelize } from '../server/db/sequelize';
import { initModels } from '../server/db/models';
import { createMigrator } from '../server/db/migrator';
import { seedDemo } from '../server/db/seed/seed-demo';
import { demoRound } from '../server/db/seed/demo-history';
import { demoCondenserDesign } from '../server/db/seed/demo-plant';
import people from '../server/db/seed/demo-people.json';
import { checkKeys } from '../shared/calc/check-catalog';
import { evaluateReadingSet } from '../shared/calc/evaluate';
import { startingLimits } from '../shared/calc/limits';
import { readingSetToSi } from '../shared/calc/reading-set-si';
import { worstOf } from '../server/features/readings/evaluate-at';
// @ts-expect-error plain JS helper shared with the bootstrap scripts
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';

const YEARS = Number(process.env.BENCH_YEARS ?? 5);
const HOURS = YEARS * 365 * 24;
const BATCH = 400;

const percentile = (values: number[], p: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]!;
};

async function main() {
  const db = await startPrivateMariaDb({ dataDir: '.data/bench', port: Number(process.env.HOTWELL_BENCH_DB_PORT ?? 3419), databases: ['hotwell_bench'], fresh: true, label: 'benchmark' });
  const sequelize = createSequelize(db.urlFor('hotwell_bench'));
  initModels(sequelize);
  let server: http.Server | null = null;
  try {
    await createMigrator(sequelize).up();
    await seedDemo(sequelize);
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
          const evaluation = evaluateReadingSet(si, demoCondenserDesign, startingLimits);
          const takenAt = new Date(start + hour * 3_600_000);
          const id = nextId++;
          sets.push([id, unit.id, takenAt, takenAt, recorder, 0, 'import', takenAt.toISOString(), unit.design, unit.limits, JSON.stringify(raw), JSON.stringify(si), JSON.stringify(evaluation), worstOf(evaluation)]);
          for (const key of checkKeys) {
            const check = evaluation.checks[key];
            if (check.value !== null) values.push([id, key, unit.id, takenAt, check.value, check.status]);
          }
        }
        await sequelize.query(
          `INSERT INTO reading_sets (id, unit_id, taken_at, recorded_at, recorded_by, recorded_as_trainee, source, import_key, design_version_id, limit_version_id, raw, si, results, worst_status) VALUES ${sets.map(() => '(?)').join(',')}`,
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

    const built = createApp(sequelize, { sessionSecret: 'bench', production: true, behindHttpsProxy: false, signInRateLimit: 1000 });
    server = http.createServer(built.app);
    await new Promise<void>((resolve) => server!.listen(0, '127.0.0.1', resolve));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

    // Sign in as the demo operator over HTTP, keeping the cookie and CSRF token.
    let cookie = '';
    const call = async (path: string, init: RequestInit = {}) => {
      const response = await fetch(base + path, { ...init, headers: { ...(init.headers ?? {}), cookie, 'content-type': 'application/json' } });
      const setCookie = response.headers.get('set-cookie');
      if (setCookie) cookie = setCookie.split(';')[0]!;
      return response;
    };
    const { csrfToken } = (await (await call('/api/session/csrf')).json()) as { csrfToken: string };
    const operator = people.users.find((p) => p.role === 'operator')!;
    const signIn = await call('/api/session', { method: 'POST', headers: { 'x-csrf-token': csrfToken }, body: JSON.stringify({ email: operator.email, password: people.password }) });
    const { csrfToken: token } = (await signIn.json()) as { csrfToken: string };

    const parameters = ['backpressure', 'ttd', 'cleanlinessFactor', 'subcooling', 'expectedBackpressure', 'towerApproach'];
    const trendTimes: number[] = [];
    let points = 0;
    for (let i = 0; i < 200; i++) {
      const unit = units[i % units.length]!;
      const windowEnd = end - Math.floor(next() * (HOURS - 90 * 24)) * 3_600_000;
      const from = new Date(windowEnd - 90 * 86_400_000).toISOString();
      const to = new Date(windowEnd).toISOString();
      const started = performance.now();
      const response = await call(`/api/units/${unit.id}/trends?parameters=${parameters[i % parameters.length]}&from=${from}&to=${to}`);
      const body = (await response.json()) as { series: { points: unknown[] }[] };
      trendTimes.push(performance.now() - started);
      if (!response.ok) throw new Error(`trend request failed: ${response.status}`);
      points += body.series[0]!.points.length;
    }
    console.log(`trend, 90-day window, one parameter (${(points / 200).toFixed(0)} points each): p50 ${percentile(trendTimes, 50).toFixed(1)} ms, p95 ${percentile(trendTimes, 95).toFixed(1)} ms over 200 requests`);

    const recordTimes: number[] = [];
    for (let i = 0; i < 50; i++) {
      const { takenAtOffsetH: _o, unitId: _u, ...round } = demoRound(demoCondenserDesign, i, false, next);
      const started = performance.now();
      const response = await call(`/api/units/${units[0]!.id}/readings`, { method: 'POST', headers: { 'x-csrf-token': token }, body: JSON.stringify(round) });
      recordTimes.push(performance.now() - started);
      if (response.status !== 201) throw new Error(`record failed: ${response.status} ${await response.text()}`);
    }
    console.log(`record one round (POST, with checks, trend rows and flags): p50 ${percentile(recordTimes, 50).toFixed(1)} ms, p95 ${percentile(recordTimes, 95).toFixed(1)} ms over 50 requests`);
    built.close();
  } finally {
    server?.close();
    await sequelize.close();
    await db.stop();
  }
}

await main();
