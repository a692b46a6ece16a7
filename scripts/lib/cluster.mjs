// Pieces of a Hotwell cluster on one machine, for `npm run start:cluster` and `npm run bench:cluster`:
// app nodes (the compiled server, each its own process) and haproxy in front of them, which sends
// each connection to a node whose /api/ready answers 200. Dependency-free, like the bootstrap.
import { spawn } from 'node:child_process';
import { mkdirSync, openSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { portIsFree } from './private-mariadb.mjs';
import { ensureHaproxy } from './system-packages.mjs';

/** Prefixes each output line of `child` with its name, so two nodes' logs can be told apart. */
function prefixLines(stream, name, out) {
  let rest = '';
  stream.on('data', (chunk) => {
    const lines = (rest + chunk).split('\n');
    rest = lines.pop();
    for (const line of lines) out.write(`[${name}] ${line}\n`);
  });
}

/**
 * Starts one app node from dist-server/ on `port`; resolves once its /api/ready answers 200.
 * `quiet`: its log goes to `logFile` instead of the terminal (the benchmark).
 */
export async function startNode({ name, port, env, logFile }) {
  if (!(await portIsFree(port))) throw new Error(`Port ${port} (${name}) is in use; choose other node ports.`);
  const output = logFile ? openSync(logFile, 'a') : 'pipe';
  const child = spawn(process.execPath, ['--enable-source-maps', 'dist-server/index.js'], {
    env: { ...process.env, ...env, PORT: String(port) },
    stdio: ['ignore', output, output],
  });
  if (!logFile) {
    prefixLines(child.stdout, name, process.stdout);
    prefixLines(child.stderr, name, process.stderr);
  }
  const url = `http://127.0.0.1:${port}`;
  for (let i = 0; ; i++) {
    if (child.exitCode !== null) throw new Error(`${name} exited during start-up (code ${child.exitCode})`);
    try {
      if ((await fetch(`${url}/api/ready`)).ok) break;
    } catch {
      /* not listening yet */
    }
    if (i > 300) throw new Error(`${name} was not ready within 60 s`);
    await new Promise((r) => setTimeout(r, 200));
  }
  return { name, port, url, process: child, stop: () => stopChild(child, 15_000) };
}

/** SIGTERM, then SIGKILL after `ms`; resolves once the process is gone. */
export function stopChild(child, ms) {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => child.kill('SIGKILL'), ms);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill('SIGTERM');
  });
}

/**
 * haproxy in front of the nodes. `frontends`: { port, nodes: [{ name, port }] } — the benchmark
 * uses one frontend over a single node and one over both. A node is taken out after three failed
 * readiness checks (1 s apart, 3 s each at most) and back after two good ones; a connection refused by a node that
 * just stopped is retried on another (redispatch).
 */
export async function startBalancer({ dir, frontends }) {
  const haproxy = ensureHaproxy();
  const root = path.resolve(dir);
  mkdirSync(root, { recursive: true });
  for (const { port } of frontends) {
    if (!(await portIsFree(port))) throw new Error(`Port ${port} (the balancer) is in use; choose another (HOTWELL_CLUSTER_PORT).`);
  }
  const config = [
    'global',
    '  maxconn 4096',
    'defaults',
    '  mode http',
    '  option forwardfor',
    '  option redispatch',
    '  retries 3',
    '  timeout connect 2s',
    '  timeout client 60s',
    '  timeout server 60s',
    // A busy node answers its readiness check late; late is not down.
    '  timeout check 3s',
    // A live-update WebSocket stays open for the whole shift.
    '  timeout tunnel 12h',
    ...frontends.flatMap(({ port, nodes }, i) => [
      `frontend hotwell_${i}`,
      `  bind 127.0.0.1:${port}`,
      `  default_backend nodes_${i}`,
      `backend nodes_${i}`,
      '  balance roundrobin',
      '  option httpchk GET /api/ready',
      '  http-check expect status 200',
      '  default-server inter 1s fall 3 rise 2',
      ...nodes.map((node) => `  server ${node.name} 127.0.0.1:${node.port} check`),
    ]),
    '',
  ].join('\n');
  const configFile = path.join(root, 'haproxy.cfg');
  writeFileSync(configFile, config);
  const logFd = openSync(path.join(root, 'haproxy.log'), 'a');
  const child = spawn(haproxy, ['-db', '-f', configFile], { stdio: ['ignore', logFd, logFd] });
  const first = `http://127.0.0.1:${frontends[0].port}`;
  for (let i = 0; ; i++) {
    if (child.exitCode !== null) throw new Error(`haproxy exited (code ${child.exitCode}); see ${path.join(root, 'haproxy.log')}`);
    try {
      if ((await fetch(`${first}/api/ready`)).ok) break;
    } catch {
      /* not yet */
    }
    if (i > 100) throw new Error('haproxy did not pass requests within 20 s');
    await new Promise((r) => setTimeout(r, 200));
  }
  return { process: child, urls: frontends.map(({ port }) => `http://127.0.0.1:${port}`), stop: () => stopChild(child, 5_000) };
}
