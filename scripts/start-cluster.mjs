// `npm run start:cluster`: Hotwell as several nodes on one machine, to try what a multi-node
// installation does — the demo scenario on a private MariaDB, a private Redis, two app nodes (the
// compiled server) and haproxy in front of them on one address. Redis and haproxy come from
// Debian's packages, installed when missing (as root), like MariaDB. Kill a node
// (`kill <pid>` as printed) and the browsers carry on through the other.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { startBalancer, startNode } from './lib/cluster.mjs';
import { ensureNodeDependencies } from './lib/node-deps.mjs';
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';
import { startPrivateRedis } from './lib/private-redis.mjs';
import { clientBuildIsStale, runLocalOrExit, runNodeOrExit, serverBuildIsStale } from './lib/run.mjs';

const port = Number(process.env.HOTWELL_CLUSTER_PORT ?? 5280);
const nodePorts = (process.env.HOTWELL_CLUSTER_NODE_PORTS ?? '5281,5282').split(',').map(Number);
const dbPort = Number(process.env.HOTWELL_CLUSTER_DB_PORT ?? 3425);
const redisPort = Number(process.env.HOTWELL_CLUSTER_REDIS_PORT ?? 6383);
const smtpPort = Number(process.env.HOTWELL_CLUSTER_SMTP_PORT ?? 2528);
const viewerPort = Number(process.env.HOTWELL_CLUSTER_VIEWER_PORT ?? 5283);

let database = null;
let redis = null;
let mail = null;
let balancer = null;
const nodes = [];
let stopping = false;

async function shutdown(code, reason) {
  if (stopping) return;
  stopping = true;
  if (reason) console.error(`\n${reason}`);
  console.log('\n[cluster] stopping…');
  setTimeout(() => process.exit(code || 1), 30_000).unref();
  await balancer?.stop();
  await Promise.all(nodes.map((node) => node.stop()));
  await mail?.stop();
  await redis?.stop();
  await database?.stop();
  console.log('[cluster] stopped; data is kept in .data/cluster-db for the next start.');
  process.exit(code);
}
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(signal, () => shutdown(0));
process.on('uncaughtException', (error) => shutdown(1, `[cluster] unexpected error: ${error.stack ?? error}`));
process.on('unhandledRejection', (reason) => shutdown(1, `[cluster] unexpected error: ${reason?.stack ?? reason}`));

/** What the whole cluster cannot do without: its death stops everything, loudly. */
function essential(what, child) {
  child.once('exit', (code, signal) => {
    if (!stopping) shutdown(1, `[cluster] ${what} stopped unexpectedly (${signal ?? `exit code ${code}`})`);
  });
}

function sessionSecret() {
  mkdirSync('.data/cluster-db', { recursive: true });
  const file = '.data/cluster-db/session-secret';
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

try {
  ensureNodeDependencies();
  database = await startPrivateMariaDb({ dataDir: '.data/cluster-db', port: dbPort, databases: ['hotwell'], label: 'cluster' });
  essential('MariaDB', database.process);
  redis = await startPrivateRedis({ dataDir: '.data/cluster-redis', port: redisPort, label: 'cluster' });
  essential('Redis', redis.process);
  const databaseUrl = database.urlFor('hotwell');
  if (serverBuildIsStale()) {
    console.log('[build] compiling the server…');
    await runNodeOrExit(['scripts/build-server.mjs']);
  }
  if (clientBuildIsStale()) {
    console.log('[build] building the client…');
    await runLocalOrExit('vite', ['build', '--logLevel', 'warn']);
  }
  await runNodeOrExit(['dist-server/migrate.js'], { DATABASE_URL: databaseUrl });
  await runLocalOrExit('tsx', ['server/db/seed/seed-cli.ts', '--demo'], { DATABASE_URL: databaseUrl });
  const { startMailCatcher } = await import('./lib/mail-catcher.mjs');
  mail = await startMailCatcher({ smtpPort, viewerPort });
  const url = `http://127.0.0.1:${port}`;
  const env = {
    NODE_ENV: 'production',
    DATABASE_URL: databaseUrl,
    REDIS_URL: redis.url,
    SESSION_SECRET: sessionSecret(),
    PUBLIC_URL: url,
    SMTP_URL: mail.smtpUrl,
    HOTWELL_SUPERVISOR_PID: String(process.pid),
  };
  for (const [i, nodePort] of nodePorts.entries()) {
    const node = await startNode({ name: `node${i + 1}`, port: nodePort, env });
    // A node that stops is what the cluster is for: the others carry on; it is said, not fatal.
    node.process.once('exit', (code, signal) => {
      if (!stopping) console.error(`[cluster] node${i + 1} stopped (${signal ?? `exit code ${code}`}); the balancer sends everything to the others`);
    });
    nodes.push(node);
  }
  balancer = await startBalancer({ dir: '.data/cluster-lb', frontends: [{ port, nodes: nodes.map(({ name, port: p }) => ({ name, port: p })) }] });
  essential('haproxy', balancer.process);
  console.log(`\nHotwell (DEMO, ${nodes.length} nodes) is serving at ${url}`);
  for (const node of nodes) console.log(`  ${node.name}: ${node.url} (pid ${node.process.pid})`);
  console.log(`Redis ${redis.url}; e-mail caught at ${mail.viewerUrl}`);
  console.log('The demo people and password are in README.md. Ctrl-C stops everything.');
  if (process.env.HOTWELL_STOP_WHEN_SERVING === '1') await shutdown(0);
} catch (error) {
  await shutdown(1, `[cluster] could not start: ${error.message}`);
}
