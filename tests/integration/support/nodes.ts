// App nodes as separate processes (the real server entry, run by Node through tsx), against the
// test database and the test Redis, plus a balancer that sends each connection to the first node
// that takes it. Several nodes in one process would share one live-update hub and prove nothing
// about Redis, so each node here is its own process.
import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import type { AddressInfo } from 'node:net';
import { SECRET } from './test-app';

export const databaseUrl = () => process.env.TEST_DATABASE_URL!;
export function redisUrl(): string {
  const url = process.env.TEST_REDIS_URL;
  if (!url) throw new Error('TEST_REDIS_URL is not set: run the integration tests through `npm test` or `npm run test:integration`, which start Redis.');
  return url;
}

export type Node = {
  url: string;
  port: number;
  process: ChildProcess;
  /** Every line the node wrote (JSON log lines and plain stderr text). */
  output: () => string;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  stop(): Promise<void>;
};

/** The environment a node gets unless a test says otherwise. */
export function nodeEnvironment(extra: Record<string, string | undefined> = {}): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = {
    PATH: process.env.PATH,
    DATABASE_URL: databaseUrl(),
    SESSION_SECRET: SECRET,
    REDIS_URL: redisUrl(),
    PORT: '0',
    HOST: '127.0.0.1',
    LOG_LEVEL: 'info',
    // Every sign-in in the tests comes from one address.
    SIGN_IN_ADDRESS_FAILURES: '100000',
    ANONYMOUS_TOKEN_LIMIT: '100000',
    ...extra,
  };
  for (const key of Object.keys(env)) if (env[key] === undefined) delete env[key];
  return env;
}

/** Runs the server entry as its own process; `args`/`env` as given (nothing inherited but PATH). */
export function runServerProcess(entry: string, env: NodeJS.ProcessEnv, args: string[] = []) {
  const child = spawn(process.execPath, ['--import', 'tsx', entry, ...args], { env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout!.on('data', (chunk) => (output += chunk));
  child.stderr!.on('data', (chunk) => (output += chunk));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => child.once('exit', (code, signal) => resolve({ code, signal })));
  return { child, output: () => output, exited };
}

/** Starts a node and resolves once it listens (its port read from its "listening" log line). */
export async function startNode(extra: Record<string, string | undefined> = {}): Promise<Node> {
  const run = runServerProcess('server/index.ts', nodeEnvironment(extra));
  const started = Date.now();
  let port = 0;
  while (!port) {
    const match = /"port":(\d+)[^\n]*"msg":"listening/.exec(run.output());
    if (match) port = Number(match[1]);
    else if (run.child.exitCode !== null) throw new Error(`the node exited before listening:\n${run.output()}`);
    else if (Date.now() - started > 30_000) {
      // Not left running after the test run (it would hold its database connections and port).
      run.child.kill('SIGKILL');
      throw new Error(`the node did not listen within 30 s:\n${run.output()}`);
    }
    else await new Promise((r) => setTimeout(r, 50));
  }
  return {
    url: `http://127.0.0.1:${port}`,
    port,
    process: run.child,
    output: run.output,
    exited: run.exited,
    async stop() {
      if (run.child.exitCode === null && run.child.signalCode === null) run.child.kill('SIGTERM');
      await run.exited;
    },
  };
}

export type Balancer = { url: string; port: number; close(): Promise<void> };

/**
 * A TCP balancer in front of `ports`: each connection goes to the first of them that accepts it,
 * so a stopped or killed node's connections land on the next one.
 */
export async function startBalancer(ports: number[]): Promise<Balancer> {
  const open = new Set<net.Socket>();
  const server = net.createServer((client) => {
    open.add(client);
    client.once('close', () => open.delete(client));
    client.pause();
    const tryNode = (index: number) => {
      if (index >= ports.length) return void client.destroy();
      const upstream = net.createConnection(ports[index]!, '127.0.0.1');
      upstream.once('error', () => tryNode(index + 1));
      upstream.once('connect', () => {
        upstream.removeAllListeners('error');
        open.add(upstream);
        upstream.once('close', () => open.delete(upstream));
        upstream.on('error', () => client.destroy());
        client.on('error', () => upstream.destroy());
        client.pipe(upstream).pipe(client);
        client.resume();
      });
    };
    tryNode(0);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  return {
    url: `http://127.0.0.1:${port}`,
    port,
    close: () =>
      new Promise<void>((resolve) => {
        for (const socket of open) socket.destroy();
        server.close(() => resolve());
      }),
  };
}

export type Client = { cookie: () => string; csrf: string; call(base: string, path: string, init?: RequestInit): Promise<Response> };

/** A signed-in person talking plain HTTP (fetch) to whichever node `base` names; the session works on every node. */
export async function signIn(base: string, email: string, password: string): Promise<Client> {
  let cookie = '';
  const call = async (to: string, path: string, init: RequestInit = {}) => {
    const response = await fetch(to + path, { ...init, headers: { 'content-type': 'application/json', ...(init.headers ?? {}), cookie } });
    const setCookie = response.headers.get('set-cookie');
    if (setCookie) cookie = setCookie.split(';')[0]!;
    return response;
  };
  const { csrfToken } = (await (await call(base, '/api/session/csrf')).json()) as { csrfToken: string };
  const response = await call(base, '/api/session', { method: 'POST', headers: { 'x-csrf-token': csrfToken }, body: JSON.stringify({ email, password }) });
  if (!response.ok) throw new Error(`sign-in failed: ${response.status} ${await response.text()}`);
  const csrf = ((await response.json()) as { csrfToken: string }).csrfToken;
  return { cookie: () => cookie, csrf, call };
}
