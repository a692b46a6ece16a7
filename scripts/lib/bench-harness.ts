// Shared by the benchmark scripts: a private throwaway MariaDB with the demo scenario, the app
// served on a random loopback port, and a signed-in HTTP client.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Sequelize } from 'sequelize';
import { createApp } from '../../server/app';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { createMigrator } from '../../server/db/migrator';
import { seedDemo } from '../../server/db/seed/seed-demo';
import people from '../../server/db/seed/demo-people.json';
// @ts-expect-error plain JS helper shared with the bootstrap scripts
import { startPrivateMariaDb } from './private-mariadb.mjs';

export const percentile = (values: number[], p: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]!;
};

export type Client = { call: (path: string, init?: RequestInit) => Promise<Response>; csrf: string; cookie: () => string };

export type Bench = {
  sequelize: Sequelize;
  /** Serves the app and signs in as the demo person with this role; returns a fetch wrapper. */
  serve(role: string): Promise<Client>;
  /** Another signed-in session of the demo person with this e-mail, on the same server. */
  signIn(email: string): Promise<Client>;
  /** The Socket.IO server, once `serve` attached it. */
  io(): import('socket.io').Server;
  baseUrl(): string;
  stop(): Promise<void>;
};

export async function startBench(name: string): Promise<Bench> {
  const db = await startPrivateMariaDb({ dataDir: `.data/bench-${name}`, port: Number(process.env.HOTWELL_BENCH_DB_PORT ?? 3419), databases: ['hotwell_bench'], fresh: true, label: 'benchmark' });
  const sequelize = createSequelize(db.urlFor('hotwell_bench'));
  initModels(sequelize);
  await createMigrator(sequelize).up();
  await seedDemo(sequelize);
  let server: http.Server | null = null;
  let closeApp = () => {};
  let io: import('socket.io').Server | null = null;
  let base = '';
  const signIn = async (email: string): Promise<Client> => {
    let cookie = '';
    const call = async (path: string, init: RequestInit = {}) => {
      const response = await fetch(base + path, { ...init, headers: { ...(init.headers ?? {}), cookie, 'content-type': 'application/json' } });
      const setCookie = response.headers.get('set-cookie');
      if (setCookie) cookie = setCookie.split(';')[0]!;
      return response;
    };
    const { csrfToken } = (await (await call('/api/session/csrf')).json()) as { csrfToken: string };
    const response = await call('/api/session', { method: 'POST', headers: { 'x-csrf-token': csrfToken }, body: JSON.stringify({ email, password: people.password }) });
    if (!response.ok) throw new Error(`sign-in failed: ${response.status}`);
    return { call, csrf: ((await response.json()) as { csrfToken: string }).csrfToken, cookie: () => cookie };
  };
  return {
    sequelize,
    async serve(role) {
      const built = createApp(sequelize, { sessionSecret: 'bench', behindHttpsProxy: false, anonymousTokenLimit: 100_000 });
      closeApp = built.close;
      server = http.createServer(built.app);
      io = built.realtime.attach(server, built.sessionMiddleware);
      await new Promise<void>((resolve) => server!.listen(0, '127.0.0.1', resolve));
      base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
      return signIn(people.users.find((p) => p.role === role)!.email);
    },
    signIn,
    io: () => io!,
    baseUrl: () => base,
    async stop() {
      closeApp();
      if (io) await io.close();
      server?.close();
      await sequelize.close();
      await db.stop();
    },
  };
}

/** Times `count` requests; returns p50 and p95 in ms. */
export async function timeRequests(count: number, request: (i: number) => Promise<Response>) {
  const times: number[] = [];
  for (let i = 0; i < count; i++) {
    const started = performance.now();
    const response = await request(i);
    await response.arrayBuffer();
    times.push(performance.now() - started);
    if (!response.ok) throw new Error(`request ${i} failed: ${response.status}`);
  }
  return { p50: percentile(times, 50), p95: percentile(times, 95) };
}
