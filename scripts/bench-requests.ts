// `npm run bench:requests`: each request of bench:load's mix alone, one at a time (PROBE_N times,
// 30), in-process against a private MariaDB with the demo scenario: median and least time, the CPU
// it took, the size of the answer, and how many SQL statements it made with their summed time —
// to see where a request's time goes. PROBE_ONLY=overview,round picks requests; PROBE_SQL=1 prints
// the statements of the last one. The signed-in `GET /api/me` is the floor beside them.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { QueryTypes } from 'sequelize';
import { createSequelize } from '../server/db/sequelize';
import { initModels } from '../server/db/models';
import { createMigrator } from '../server/db/migrator';
import { seedDemo } from '../server/db/seed/seed-demo';
import { createApp } from '../server/app';
import people from '../server/db/seed/demo-people.json';
// @ts-expect-error plain JS helper
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';
import { httpCall, type Session } from './lib/http-call';

const db = await startPrivateMariaDb({ dataDir: '.data/probe', port: Number(process.env.HOTWELL_BENCH_DB_PORT ?? 3422), databases: ['hotwell_probe'], fresh: true, label: 'probe' });
try {
  const url = db.urlFor('hotwell_probe');
  const sequelize = createSequelize(url);
  let statements: { sql: string; ms: number }[] = [];
  (sequelize as unknown as { options: Record<string, unknown> }).options.benchmark = true;
  (sequelize as unknown as { options: Record<string, unknown> }).options.logging = (sql: string, ms?: number) => { statements.push({ sql, ms: ms ?? 0 }); };
  initModels(sequelize);
  await createMigrator(sequelize).up();
  await seedDemo(sequelize);
  const unitIds = (await sequelize.query<{ id: number }>('SELECT id FROM units ORDER BY id', { type: QueryTypes.SELECT })).map((u) => u.id);
  const built = createApp(sequelize, { sessionSecret: 'probe-secret-probe-secret-probe-secret', behindHttpsProxy: false, publicUrl: 'http://127.0.0.1', smtpUrl: undefined } as never, {});
  const server = http.createServer(built.app);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const agent = new http.Agent({ keepAlive: true });
  const call = (m: string, p: string, s: Session | null, b?: unknown) => httpCall(agent, base, m, p, s, b);
  const s: Session = { cookie: '', csrf: '' };
  const c = await call('GET', '/api/session/csrf', s);
  s.cookie = c.setCookie![0]!.split(';')[0]!; s.csrf = JSON.parse(c.text).csrfToken;
  const email = people.users.find((u) => u.role === 'operator')!.email;
  const r = await call('POST', '/api/session', s, { email, password: people.password });
  if (r.setCookie?.[0]) s.cookie = r.setCookie[0].split(';')[0]!; s.csrf = JSON.parse(r.text).csrfToken;
  const u = unitIds[0]!;
  const actions: [string, () => Promise<{ status: number }>][] = [
    ['me', () => call('GET', '/api/me', s)],
    ['board', () => call('GET', `/api/units/${u}/handovers/current`, s)],
    ['log', () => call('GET', `/api/units/${u}/log?limit=50`, s)],
    ['overview', () => call('GET', '/api/overview', s)],
    ['search', () => call('GET', `/api/logbook/search?q=waterbox`, s)],
    ['log entry', () => call('POST', `/api/units/${u}/log`, s, { position: 'control_room', category: 'operation', text: 'Probe entry: checked waterbox vents', carryToHandover: false })],
    ['round', () => call('POST', `/api/units/${u}/readings`, s, { pressure: { value: 8.4, unit: 'kPa_a' }, hotwellTemperature: { value: 41.5, unit: 'degC' }, cwInletTemperature: { value: 21, unit: 'degC' }, cwOutletTemperature: { value: 29.8, unit: 'degC' }, cwFlow: { value: 54_000, unit: 'm3_h' } })],
  ];
  const N = Number(process.env.PROBE_N ?? 30);
  const only = process.env.PROBE_ONLY?.split(',');
  for (const [name, run] of actions.filter(([n]) => !only || only.includes(n))) {
    const times: number[] = []; let cpu = 0; let q = 0; let qms = 0; let bytes = 0; let status = 0; let sample: string[] = [];
    for (let i = 0; i < N; i++) {
      statements = [];
      const t0 = performance.now();
      const c0 = process.cpuUsage();
      const answer = (await run()) as { status: number; text?: string };
      status = answer.status; bytes = answer.text?.length ?? 0;
      const c1 = process.cpuUsage(c0);
      cpu += (c1.user + c1.system) / 1000;
      times.push(performance.now() - t0);
      q += statements.length; qms += statements.reduce((a, b) => a + b.ms, 0);
      if (i === N - 1) sample = statements.map((x) => `${x.ms}ms ${x.sql.slice(0, 160)}`);
    }
    times.sort((a, b) => a - b);
    console.log(`${name.padEnd(10)} status ${status} median ${times[Math.floor(N / 2)]!.toFixed(1)} ms, min ${times[0]!.toFixed(1)} ms, cpu ${(cpu / N).toFixed(1)} ms, ${bytes} chars; ${(q / N).toFixed(1)} statements, ${(qms / N).toFixed(1)} ms in SQL`);
    if (process.env.PROBE_SQL) for (const line of sample) console.log('    ' + line);
  }
  server.close(); built.close(); await sequelize.close();
} finally {
  await db.stop();
}
process.exit(0);
