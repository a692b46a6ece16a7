// `npm start`: the one-command demo. Sets everything up on a fresh clone — a private MariaDB, the
// fictional demo scenario, a local mail catcher — then serves Hotwell on 127.0.0.1 with the same
// compiled server production runs (`npm run build`, `npm run serve`; see README, Production).
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { ensureNodeDependencies } from './lib/node-deps.mjs';
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';
import { clientBuildIsStale, runLocalOrExit, runNodeOrExit, serverBuildIsStale, spawnNode } from './lib/run.mjs';

const appPort = Number(process.env.PORT ?? 5180);
const dbPort = Number(process.env.HOTWELL_DB_PORT ?? 3417);
const dataDir = process.env.HOTWELL_DATA_DIR ?? '.data/local';

let database = null;
let server = null;
let mail = null;
let stopping = false;
// Longest a stop may take, whatever hangs (a server waiting on a dead database, say).
const STOP_LIMIT_MS = 25_000;
const SERVER_STOP_MS = 10_000;

/** Stops the app (SIGTERM, then SIGKILL after SERVER_STOP_MS); resolves once it is gone. */
function stopServer() {
  if (!server || server.exitCode !== null || server.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => {
      console.error('[hotwell] the server did not stop in time; killing it');
      server.kill('SIGKILL');
    }, SERVER_STOP_MS);
    server.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    server.kill('SIGTERM');
  });
}

/**
 * The one way out: app first, then the mail catcher, then the database, always the database,
 * within STOP_LIMIT_MS. Signals, a dead child and this script's own failures all end here.
 */
async function shutdown(code, reason) {
  if (stopping) return;
  stopping = true;
  if (reason) console.error(`\n${reason}`);
  console.log('\n[hotwell] stopping…');
  const limit = setTimeout(() => {
    console.error('[hotwell] stopping took too long; leaving now (the database was asked to stop)');
    server?.kill('SIGKILL');
    database?.process.kill('SIGTERM');
    process.exit(code || 1);
  }, STOP_LIMIT_MS);
  for (const [what, step] of [
    ['the server', stopServer],
    ['the mail catcher', () => mail?.stop()],
    ['the database', () => database?.stop()],
  ]) {
    try {
      await step();
    } catch (error) {
      console.error(`[hotwell] stopping ${what} failed: ${error.message}`);
    }
  }
  clearTimeout(limit);
  console.log('[hotwell] stopped; data is kept for the next start.');
  process.exit(code);
}
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(signal, () => shutdown(0));
// This script's own failure stops what it started rather than leaving MariaDB running without it.
process.on('uncaughtException', (error) => shutdown(1, `[hotwell] unexpected error: ${error.stack ?? error}`));
process.on('unhandledRejection', (reason) => shutdown(1, `[hotwell] unexpected error: ${reason?.stack ?? reason}`));

function sessionSecret() {
  if (process.env.SESSION_SECRET) return process.env.SESSION_SECRET;
  mkdirSync(dataDir, { recursive: true });
  const file = `${dataDir}/session-secret`;
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

async function waitUntilServing(url) {
  for (let i = 0; i < 300; i++) {
    if (server.exitCode !== null) throw new Error('the server exited during start-up');
    try {
      const response = await fetch(`${url}/api/health`);
      if (response.ok) return;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('the server did not answer within 60 s');
}

try {
  ensureNodeDependencies();
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    database = await startPrivateMariaDb({ dataDir, port: dbPort, databases: ['hotwell'], label: 'local' });
    // Nothing works without it: a database that stops by itself takes the app down with it, loudly.
    database.process.once('exit', (exitCode, signal) => {
      if (!stopping) shutdown(1, `[db] MariaDB stopped unexpectedly (${signal ?? `exit code ${exitCode}`}); stopping Hotwell. See ${dataDir}/mariadbd.log`);
    });
    databaseUrl = database.urlFor('hotwell');
    console.log(`[db] private MariaDB on 127.0.0.1:${dbPort} (data in ${dataDir})`);
  }
  const env = { DATABASE_URL: databaseUrl };
  if (serverBuildIsStale()) {
    console.log('[build] compiling the server…');
    await runNodeOrExit(['scripts/build-server.mjs']);
  }
  await runNodeOrExit(['dist-server/migrate.js'], env);
  // The demo scenario, asked for by name: the seed refuses to run without it.
  await runLocalOrExit('tsx', ['server/db/seed/seed-cli.ts', '--demo'], env);
  if (clientBuildIsStale()) {
    console.log('[build] building the client…');
    await runLocalOrExit('vite', ['build', '--logLevel', 'warn']);
  }
  const { startMailCatcher } = await import('./lib/mail-catcher.mjs');
  mail = await startMailCatcher({
    smtpPort: Number(process.env.HOTWELL_SMTP_PORT ?? 2525),
    viewerPort: Number(process.env.HOTWELL_MAIL_VIEWER_PORT ?? 5182),
  });
  server = spawnNode(['dist-server/index.js'], {
    ...env,
    SMTP_URL: process.env.SMTP_URL ?? mail.smtpUrl,
    PUBLIC_URL: process.env.PUBLIC_URL ?? `http://127.0.0.1:${appPort}`,
    PORT: String(appPort),
    SESSION_SECRET: sessionSecret(),
    NODE_ENV: 'production',
    // Within SERVER_STOP_MS, so the server's own drain ends before this script would kill it.
    SHUTDOWN_GRACE_MS: String(SERVER_STOP_MS - 2_000),
    // The server stops itself should this process vanish without stopping it (kill -9).
    HOTWELL_SUPERVISOR_PID: String(process.pid),
  });
  server.on('exit', (code, signal) => {
    if (!stopping) shutdown(code || 1, `[hotwell] the server stopped unexpectedly (${signal ?? `exit code ${code}`})`);
  });
  const url = `http://127.0.0.1:${appPort}`;
  await waitUntilServing(url);
  const people = JSON.parse(readFileSync('server/db/seed/demo-people.json', 'utf8'));
  console.log(`\nHotwell is serving at ${url}`);
  console.log('This is the DEMO: the fictional Fernhollow Station, with demo people whose password is published.');
  console.log('For a real installation see README.md, "Production" (npm run build, npm run serve, npm run admin:create).');
  console.log(`E-mail it sends is caught locally: ${mail.viewerUrl}\n`);
  console.log('Demo sign-ins (password for all: see README) —');
  for (const person of people.users) console.log(`  ${person.role.padEnd(11)} ${person.email}`);
  console.log(`  password: ${people.password}`);
  console.log('\nCtrl-C stops the app and its database.');
  // For measuring start-up (`HOTWELL_STOP_WHEN_SERVING=1 /usr/bin/time npm start`): stop cleanly once serving.
  if (process.env.HOTWELL_STOP_WHEN_SERVING === '1') await shutdown(0);
  // For the supervision test (scripts/test-start.mjs): fail the way a bug here would, once serving.
  if (process.env.HOTWELL_FAIL_WHEN_SERVING === '1') setTimeout(() => Promise.reject(new Error('deliberate failure (HOTWELL_FAIL_WHEN_SERVING)')), 100);
} catch (error) {
  console.error(`\n[hotwell] could not start: ${error.message}`);
  await shutdown(1);
}
