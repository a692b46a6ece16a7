// `npm run bench:cluster`: Hotwell as two nodes (the compiled server, each its own process) on one
// MariaDB and one Redis, with haproxy in front, all on this machine.
// 1. Live updates across nodes: BENCH_CLIENTS (400) signed-in Socket.IO clients on one unit's
//    handover board, half connected to node A and half to node B; BENCH_ROUNDS (50) acknowledgements
//    posted on node A, one at a time after 2 unrecorded warm-ups; time from the POST until each
//    client has the event (p50/p95/max, and by node). The floor, in the same run: a raw Socket.IO
//    broadcast of the same event to the same number of clients on one plain Socket.IO server in this
//    process (no app, no Redis), timed from the emit.
// 2. Throughput of a mixed read load (board, log, overview, search, plant units) through haproxy:
//    BENCH_WORKERS (64) signed-in loops without think time for BENCH_SECONDS (20) each, first with
//    one node behind the balancer, then with both. Requests per second, p50/p95, errors.
// Clients, nodes, balancer and database share this machine; figures are reported only.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { Server } from 'socket.io';
import { io as connect, type Socket } from 'socket.io-client';
import { QueryTypes } from 'sequelize';
import { createSequelize } from '../server/db/sequelize';
import { initModels } from '../server/db/models';
import { seedDemo } from '../server/db/seed/seed-demo';
import people from '../server/db/seed/demo-people.json';
import { percentile } from './lib/bench-harness';
// @ts-expect-error plain JS helpers shared with the bootstrap scripts
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';
// @ts-expect-error plain JS helper
import { startPrivateRedis } from './lib/private-redis.mjs';
// @ts-expect-error plain JS helper
import { startBalancer, startNode } from './lib/cluster.mjs';
// @ts-expect-error plain JS helper
import { runNodeOrExit, serverBuildIsStale } from './lib/run.mjs';
// @ts-expect-error plain JS helper
import { startMailCatcher } from './lib/mail-catcher.mjs';
import { httpCall, type Answer, type Session } from './lib/http-call';

const CLIENTS = Number(process.env.BENCH_CLIENTS ?? 400);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 50);
const WARM_UP = 2;
const WORKERS = Number(process.env.BENCH_WORKERS ?? 64);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 20);
// Node A, node B, the balancer over A alone, the balancer over both.
const [portA, portB, portOne, portTwo] = (process.env.BENCH_CLUSTER_PORTS ?? '5290,5291,5292,5293').split(',').map(Number) as [number, number, number, number];

type Child = { process: import('node:child_process').ChildProcess; url: string; stop: () => Promise<void> };

const agent = new http.Agent({ keepAlive: true, maxSockets: 512 });
const call = (base: string, method: string, path: string, session: Session | null, body?: unknown): Promise<Answer> => httpCall(agent, base, method, path, session, body);

async function signIn(base: string, email: string): Promise<Session> {
  const session: Session = { cookie: '', csrf: '' };
  // The form's token cookie first, then the session cookie that replaces it at sign-in.
  const take = (setCookie?: string[]) => {
    if (setCookie?.[0]) session.cookie = setCookie[0].split(';')[0]!;
  };
  const form = await call(base, 'GET', '/api/session/csrf', session);
  take(form.setCookie);
  session.csrf = (JSON.parse(form.text) as { csrfToken: string }).csrfToken;
  const signedIn = await call(base, 'POST', '/api/session', session, { email, password: people.password });
  if (signedIn.status !== 200) throw new Error(`sign-in ${email}: HTTP ${signedIn.status} ${signedIn.text}`);
  take(signedIn.setCookie);
  session.csrf = (JSON.parse(signedIn.text) as { csrfToken: string }).csrfToken;
  return session;
}

const summary = (times: number[]) =>
  `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms, max ${Math.max(...times).toFixed(1)} ms`;

function socketTo(base: string, cookie: string): Promise<Socket> {
  const socket = connect(base, { transports: ['websocket'], extraHeaders: cookie ? { cookie } : {}, forceNew: true, reconnection: false });
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket));
    socket.once('connect_error', reject);
  });
}

/** How long after `trigger` starts each socket has a `changed` event that `expect` accepts. */
async function timeToAll(sockets: Socket[], trigger: () => Promise<unknown> | void, expect: (payload: { entity?: string; probe?: boolean }) => boolean) {
  const started = performance.now();
  const arrivals = sockets.map(
    (socket) =>
      new Promise<number>((resolve) => {
        const handler = (payload: { entity?: string; probe?: boolean }) => {
          if (!expect(payload)) return;
          socket.off('changed', handler);
          resolve(performance.now() - started);
        };
        socket.on('changed', handler);
      }),
  );
  await trigger();
  return Promise.all(arrivals);
}

async function readLoad(base: string, sessions: Session[], unitIds: number[]) {
  const words = ['hotwell level', 'waterbox', 'vacuum pump', 'cleanliness', 'strainer'];
  const unit = (i: number) => unitIds[i % unitIds.length]!;
  const mix = [
    (i: number) => `/api/units/${unit(i)}/handovers/current`,
    (i: number) => `/api/units/${unit(i)}/log?limit=50`,
    () => '/api/overview',
    (i: number) => `/api/logbook/search?q=${encodeURIComponent(words[i % words.length]!)}`,
    () => '/api/plant/units',
  ];
  const times: number[] = [];
  let errors = 0;
  const statuses = new Map<number, number>();
  const until = performance.now() + SECONDS * 1000;
  await Promise.all(
    Array.from({ length: WORKERS }, async (_, worker) => {
      const session = sessions[worker % sessions.length]!;
      for (let i = worker; performance.now() < until; i += WORKERS) {
        const started = performance.now();
        const response = await call(base, 'GET', mix[i % mix.length]!(i), session).catch(() => ({ status: 0 }));
        times.push(performance.now() - started);
        if (response.status !== 200) errors += 1;
        statuses.set(response.status, (statuses.get(response.status) ?? 0) + 1);
      }
    }),
  );
  const answered = [...statuses].sort(([x], [y]) => x - y).map(([status, n]) => `${n}× ${status || 'no answer'}`).join(', ');
  return { perSecond: times.length / SECONDS, times, errors, answered };
}

async function main() {
  const children: Child[] = [];
  const sockets: Socket[] = [];
  const db = await startPrivateMariaDb({ dataDir: '.data/bench-cluster', port: Number(process.env.HOTWELL_BENCH_DB_PORT ?? 3419), databases: ['hotwell_bench'], fresh: true, label: 'benchmark' });
  const redis = await startPrivateRedis({ dataDir: '.data/bench-cluster-redis', port: Number(process.env.HOTWELL_BENCH_REDIS_PORT ?? 6384), label: 'benchmark' });
  const mail = await startMailCatcher({ smtpPort: 0, viewerPort: 0 });
  const floorHttp = http.createServer();
  const floorIo = new Server(floorHttp, { serveClient: false });
  let balancer: Child | null = null;
  const sequelize = createSequelize(db.urlFor('hotwell_bench'));
  try {
    if (serverBuildIsStale()) await runNodeOrExit(['scripts/build-server.mjs']);
    await runNodeOrExit(['dist-server/migrate.js'], { DATABASE_URL: db.urlFor('hotwell_bench') });
    initModels(sequelize);
    await seedDemo(sequelize);
    // Submit and acceptance at any time of the shift here, whatever the time of day.
    await sequelize.query('UPDATE station_settings SET handover_window_before_minutes = 720, handover_window_after_minutes = 0');
    const unitIds = (await sequelize.query<{ id: number }>('SELECT id FROM units ORDER BY id', { type: QueryTypes.SELECT })).map((u) => u.id);
    const unitId = unitIds[0]!;

    const env = {
      NODE_ENV: 'production',
      DATABASE_URL: db.urlFor('hotwell_bench'),
      REDIS_URL: redis.url,
      SESSION_SECRET: 'bench-cluster-session-secret-0123456789abcdef',
      PUBLIC_URL: `http://127.0.0.1:${portTwo}`,
      SMTP_URL: mail.smtpUrl,
      ANONYMOUS_TOKEN_LIMIT: '1000000',
      SIGN_IN_ADDRESS_FAILURES: '1000000',
    };
    const a: Child = await startNode({ name: 'A', port: portA, env, logFile: '.data/bench-cluster/node-a.log' });
    children.push(a);
    const b: Child = await startNode({ name: 'B', port: portB, env, logFile: '.data/bench-cluster/node-b.log' });
    children.push(b);
    balancer = await startBalancer({
      dir: '.data/bench-cluster/lb',
      frontends: [
        { port: portOne, nodes: [{ name: 'a', port: portA }] },
        { port: portTwo, nodes: [{ name: 'a', port: portA }, { name: 'b', port: portB }] },
      ],
    });

    // The handover: started, items added and submitted by the outgoing crew (operator.a), on node A.
    const outgoing = await signIn(a.url, 'operator.a@fernhollow.example');
    const started = await call(a.url, 'POST', `/api/units/${unitId}/handovers/current`, outgoing, {});
    if (started.status !== 201) throw new Error(`start the handover: HTTP ${started.status} ${started.text}`);
    const handoverId = (JSON.parse(started.text) as { board: { handover: { id: number } } }).board.handover.id;
    for (let i = 0; i < ROUNDS + WARM_UP; i++) {
      await call(a.url, 'POST', `/api/handovers/${handoverId}/items`, outgoing, { kind: 'follow_up', title: `Benchmark item ${i + 1}` });
    }
    const submitted = await call(a.url, 'POST', `/api/handovers/${handoverId}/submit`, outgoing, {});
    if (submitted.status !== 200) throw new Error(`submit: HTTP ${submitted.status} ${submitted.text}`);
    const board = JSON.parse((await call(a.url, 'GET', `/api/handovers/${handoverId}`, outgoing)).text) as { board: { items: { id: number }[] } };
    const items = board.board.items.slice(0, ROUNDS + WARM_UP);

    // The incoming crew's sessions (a few tabs each); the acknowledging one posts on node A.
    const acknowledger = await signIn(a.url, 'operator.b@fernhollow.example');
    const sessions: Session[] = [acknowledger];
    for (let i = 1; i < 40; i++) sessions.push(await signIn(i % 2 ? b.url : a.url, i % 2 ? 'lead.b@fernhollow.example' : 'operator.b@fernhollow.example'));

    // 1a. The floor: a plain Socket.IO server in this process, the same number of clients in one room.
    await new Promise<void>((resolve) => floorHttp.listen(0, '127.0.0.1', resolve));
    floorIo.on('connection', (socket) => void socket.join('unit'));
    const floorUrl = `http://127.0.0.1:${(floorHttp.address() as AddressInfo).port}`;
    const floorSockets: Socket[] = [];
    for (let i = 0; i < CLIENTS; i++) floorSockets.push(await socketTo(floorUrl, ''));
    sockets.push(...floorSockets);
    await new Promise((r) => setTimeout(r, 500));
    const floor: number[] = [];
    const probe = { entity: 'handover', id: handoverId, unitId, probe: true };
    for (let round = 0; round < ROUNDS + WARM_UP; round++) {
      const times = await timeToAll(floorSockets, () => void floorIo.to('unit').emit('changed', probe), (p) => p.probe === true);
      if (round >= WARM_UP) floor.push(...times);
    }
    for (const socket of floorSockets) socket.disconnect();

    // 1b. The cluster: half the clients on A, half on B, on the board as the page puts them.
    const onA: Socket[] = [];
    const onB: Socket[] = [];
    for (let i = 0; i < CLIENTS; i++) {
      const socket = await socketTo(i % 2 ? b.url : a.url, sessions[i % sessions.length]!.cookie);
      socket.emit('watch-unit', unitId);
      socket.emit('open-board', unitId);
      (i % 2 ? onB : onA).push(socket);
      sockets.push(socket);
    }
    await new Promise((r) => setTimeout(r, 1_000));
    const all = [...onA, ...onB];
    const acks: number[] = [];
    const acksA: number[] = [];
    const acksB: number[] = [];
    for (const [round, item] of items.entries()) {
      const times = await timeToAll(
        all,
        async () => {
          const answer = await call(a.url, 'POST', `/api/handover-items/${item.id}/acknowledge`, acknowledger, {});
          if (answer.status !== 201) throw new Error(`acknowledge: HTTP ${answer.status} ${answer.text}`);
        },
        (p) => p.entity === 'handover' && !p.probe,
      );
      if (round < WARM_UP) continue;
      acks.push(...times);
      acksA.push(...times.slice(0, onA.length));
      acksB.push(...times.slice(onA.length));
    }
    for (const socket of all) socket.disconnect();

    // 2. Mixed reads through the balancer: one node behind it, then both.
    const loadSessions = sessions.slice(0, 20);
    const one = await readLoad(`http://127.0.0.1:${portOne}`, loadSessions, unitIds);
    const two = await readLoad(`http://127.0.0.1:${portTwo}`, loadSessions, unitIds);

    console.log(`(${WARM_UP} warm-up rounds not recorded; ${CLIENTS} clients, ${ROUNDS} rounds)`);
    console.log(`acknowledgement posted on node A → each of ${CLIENTS} clients (${onA.length} on A, ${onB.length} on B) has the event: ${summary(acks)}`);
    console.log(`  clients on node A: ${summary(acksA)}`);
    console.log(`  clients on node B (through Redis): ${summary(acksB)}`);
    console.log(`raw Socket.IO broadcast to ${CLIENTS} clients on one plain server (floor): ${summary(floor)}`);
    console.log(`p95 ratio to the floor: ${(percentile(acks, 95) / percentile(floor, 95)).toFixed(2)}×`);
    console.log('');
    console.log(`mixed reads through haproxy, ${WORKERS} loops without think time, ${SECONDS} s each:`);
    console.log(`  one node:  ${one.perSecond.toFixed(0)} requests/s, ${summary(one.times)}, ${one.errors} errors (${one.answered})`);
    console.log(`  two nodes: ${two.perSecond.toFixed(0)} requests/s, ${summary(two.times)}, ${two.errors} errors (${two.answered})`);
    console.log(`  two nodes / one node: ${(two.perSecond / one.perSecond).toFixed(2)}× (machine: ${(await import('node:os')).cpus().length} cores, shared with the database, balancer and this load)`);
  } finally {
    for (const socket of sockets) socket.disconnect();
    await floorIo.close();
    await balancer?.stop();
    for (const child of children) await child.stop();
    await sequelize.close();
    await mail.stop();
    await redis.stop();
    await db.stop();
  }
}

await main();
