// `npm run bench:load`: BENCH_CLIENTS signed-in people (200) use Hotwell at once for BENCH_SECONDS
// (60) each: a realistic mix — the handover board, the shift log, the overview, a logbook search,
// writing a log entry, recording a round — each person waiting a think time (0.5–1.5 s) between
// requests. Beside it, in the same run and at the same offered load, the floor: the same people
// calling a signed-in `GET /api/me` with the same think time. The server runs in its own process
// (`node --import tsx server/index.ts`) against a private MariaDB with the demo scenario;
// the clients run here. Reported: throughput, p50/p95/p99, errors by status, the server's RSS before
// and after. Figures are printed, not asserted.
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import http from 'node:http';
import { QueryTypes } from 'sequelize';
import { createSequelize } from '../server/db/sequelize';
import { initModels } from '../server/db/models';
import { createMigrator } from '../server/db/migrator';
import { seedDemo } from '../server/db/seed/seed-demo';
import people from '../server/db/seed/demo-people.json';
import { percentile } from './lib/bench-harness';
// @ts-expect-error plain JS helper shared with the bootstrap scripts
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';
import { httpCall, type Answer, type Session } from './lib/http-call';

const CLIENTS = Number(process.env.BENCH_CLIENTS ?? 200);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 60);
const PORT = Number(process.env.BENCH_LOAD_PORT ?? 5199);
const base = `http://127.0.0.1:${PORT}`;
// People who write on shift (administrators and trainers do not record operational records).
const writers = people.users.filter((u) => ['operator', 'shift_lead'].includes(u.role)).map((u) => u.email);

const agent = new http.Agent({ keepAlive: true, maxSockets: CLIENTS * 2 });

const call = (method: string, path: string, session: Session | null, body?: unknown): Promise<Answer> => httpCall(agent, base, method, path, session, body);

async function signIn(email: string): Promise<Session> {
  const session: Session = { cookie: '', csrf: '' };
  const csrf = await call('GET', '/api/session/csrf', session);
  if (csrf.setCookie?.[0]) session.cookie = csrf.setCookie[0].split(';')[0]!;
  session.csrf = (JSON.parse(csrf.text) as { csrfToken: string }).csrfToken;
  const res = await call('POST', '/api/session', session, { email, password: people.password });
  if (res.status !== 200) throw new Error(`sign-in ${email}: HTTP ${res.status} ${res.text}`);
  if (res.setCookie?.[0]) session.cookie = res.setCookie[0].split(';')[0]!;
  session.csrf = (JSON.parse(res.text) as { csrfToken: string }).csrfToken;
  return session;
}

const rssOf = (child: ChildProcess) => {
  const status = readFileSync(`/proc/${child.pid}/status`, 'utf8');
  return Number(/VmRSS:\s+(\d+) kB/.exec(status)?.[1] ?? 0) / 1024;
};

// The server's CPU time so far (user + system, in ms), from /proc: how much work a phase cost it,
// which varies far less between runs than the latencies do.
const cpuMsOf = (child: ChildProcess) => {
  const fields = readFileSync(`/proc/${child.pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100; // utime, stime in clock ticks (USER_HZ = 100)
};

type Action = { name: string; weight: number; run: (s: Session, i: number) => Promise<{ status: number }> };

function mix(unitIds: number[]): Action[] {
  const unit = (i: number) => unitIds[i % unitIds.length]!;
  const words = ['hotwell level', 'waterbox', 'vacuum pump', 'cleanliness', '1-CWP-B', 'backwash', 'TTD', 'strainer'];
  return [
    { name: 'board', weight: 25, run: (s, i) => call('GET', `/api/units/${unit(i)}/handovers/current`, s) },
    { name: 'log', weight: 20, run: (s, i) => call('GET', `/api/units/${unit(i)}/log?limit=50`, s) },
    { name: 'overview', weight: 15, run: (s) => call('GET', '/api/overview', s) },
    { name: 'search', weight: 10, run: (s, i) => call('GET', `/api/logbook/search?q=${encodeURIComponent(words[i % words.length]!)}`, s) },
    {
      name: 'log entry',
      weight: 20,
      run: (s, i) => call('POST', `/api/units/${unit(i)}/log`, s, { position: 'control_room', category: 'operation', text: `Load test entry ${i}: checked waterbox vents`, carryToHandover: false }),
    },
    {
      name: 'round',
      weight: 10,
      run: (s, i) =>
        call('POST', `/api/units/${unit(i)}/readings`, s, {
          pressure: { value: 8.2 + (i % 7) / 10, unit: 'kPa_a' },
          hotwellTemperature: { value: 41.5, unit: 'degC' },
          cwInletTemperature: { value: 21, unit: 'degC' },
          cwOutletTemperature: { value: 29.5 + (i % 10) / 10, unit: 'degC' },
          cwFlow: { value: 54_000, unit: 'm3_h' },
        }),
    },
  ];
}

function pick(actions: Action[]): Action {
  const total = actions.reduce((sum, a) => sum + a.weight, 0);
  let r = Math.random() * total;
  for (const a of actions) if ((r -= a.weight) < 0) return a;
  return actions.at(-1)!;
}

async function phase(label: string, sessions: Session[], actions: Action[], server: ChildProcess) {
  const cpuBefore = cpuMsOf(server);
  const times: number[] = [];
  const perAction = new Map<string, number[]>();
  const errors = new Map<string, number>();
  const until = Date.now() + SECONDS * 1000;
  let counter = 0;
  const started = performance.now();
  await Promise.all(
    sessions.map(async (session, clientIndex) => {
      // Spread the first requests over one think time, as people do not all click at once.
      await new Promise((r) => setTimeout(r, Math.random() * 1000));
      while (Date.now() < until) {
        const action = pick(actions);
        const t0 = performance.now();
        let status = 0;
        try {
          status = (await action.run(session, counter++ + clientIndex)).status;
        } catch (error) {
          errors.set(`network: ${(error as Error).message}`, (errors.get(`network: ${(error as Error).message}`) ?? 0) + 1);
        }
        const ms = performance.now() - t0;
        times.push(ms);
        (perAction.get(action.name) ?? perAction.set(action.name, []).get(action.name)!).push(ms);
        if (status >= 400 || status === 0) errors.set(`${action.name} ${status}`, (errors.get(`${action.name} ${status}`) ?? 0) + 1);
        await new Promise((r) => setTimeout(r, 500 + Math.random() * 1000));
      }
    }),
  );
  const seconds = (performance.now() - started) / 1000;
  const line = (values: number[]) => `p50 ${percentile(values, 50).toFixed(1)} ms, p95 ${percentile(values, 95).toFixed(1)} ms, p99 ${percentile(values, 99).toFixed(1)} ms`;
  const cpuMs = cpuMsOf(server) - cpuBefore;
  console.log(`${label}: ${times.length} requests in ${seconds.toFixed(1)} s = ${(times.length / seconds).toFixed(1)} req/s; ${line(times)}; errors ${[...errors.values()].reduce((a, b) => a + b, 0)}`);
  console.log(`  server CPU ${(cpuMs / 1000).toFixed(1)} s = ${((100 * cpuMs) / 1000 / seconds).toFixed(0)} % of one core, ${(cpuMs / times.length).toFixed(2)} ms per request`);
  for (const [name, values] of perAction) if (perAction.size > 1) console.log(`  ${name.padEnd(10)} ${String(values.length).padStart(6)} × ${line(values)}`);
  for (const [what, count] of errors) console.log(`  error ${what}: ${count}`);
  return { p95: percentile(times, 95), errors: [...errors.values()].reduce((a, b) => a + b, 0) };
}

async function main() {
  const db = await startPrivateMariaDb({ dataDir: '.data/bench-load', port: Number(process.env.HOTWELL_BENCH_DB_PORT ?? 3419), databases: ['hotwell_bench'], fresh: true, label: 'benchmark' });
  try {
    await run(db.urlFor('hotwell_bench'));
  } finally {
    await db.stop();
  }
}

async function run(url: string) {
  const sequelize = createSequelize(url);
  initModels(sequelize);
  await createMigrator(sequelize).up();
  await seedDemo(sequelize);
  const unitIds = (await sequelize.query<{ id: number }>('SELECT id FROM units ORDER BY id', { type: QueryTypes.SELECT })).map((u) => u.id);
  await sequelize.close();

  // `node --import tsx` rather than the tsx command, so the process measured is the server itself.
  // BENCH_SERVER_NODE_ARGS, e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof", to see where the server's time goes.
  const extraArgs = (process.env.BENCH_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean);
  const server = spawn(process.execPath, [...extraArgs, '--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, DATABASE_URL: url, PORT: String(PORT), SESSION_SECRET: 'bench-load-session-secret-0123456789abcdef', NODE_ENV: 'production', SIGN_IN_RATE_LIMIT: '1000000', PUBLIC_URL: base, SMTP_URL: 'smtp://127.0.0.1:9' },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  try {
    for (let i = 0; ; i++) {
      const ok = await call('GET', '/api/health', null).then((r) => r.status === 200, () => false);
      if (ok) break;
      if (server.exitCode !== null) throw new Error(`the server stopped while starting (exit code ${server.exitCode}); its message is above`);
      if (i > 120) throw new Error('the server did not start');
      await new Promise((r) => setTimeout(r, 500));
    }
    const sessions: Session[] = [];
    for (let i = 0; i < CLIENTS; i++) sessions.push(await signIn(writers[i % writers.length]!));
    const rssBefore = rssOf(server);
    console.log(`${CLIENTS} signed-in clients, think time 0.5–1.5 s, ${SECONDS} s per phase; server RSS ${rssBefore.toFixed(0)} MB`);
    const floor = await phase('floor (GET /api/me)', sessions, [{ name: 'me', weight: 1, run: (s) => call('GET', '/api/me', s) }], server);
    const load = await phase('mix (board, log, overview, search, log entry, round)', sessions, mix(unitIds), server);
    const rssAfter = rssOf(server);
    console.log(`server RSS before ${rssBefore.toFixed(0)} MB, after ${rssAfter.toFixed(0)} MB`);
    console.log(`mix p95 / floor p95: ${(load.p95 / floor.p95).toFixed(2)}× (target within 3×); errors ${load.errors + floor.errors} (target 0)`);
  } finally {
    // An 'exit' already past would never come again: wait only for a server still running.
    if (server.exitCode === null && server.signalCode === null) {
      const exited = new Promise((r) => server.once('exit', r));
      server.kill('SIGTERM');
      await exited;
    }
  }
}

await main();
