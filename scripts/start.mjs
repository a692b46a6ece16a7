// `npm start`: set everything up on a fresh clone, then serve Hotwell on 127.0.0.1.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { ensureNodeDependencies } from './lib/node-deps.mjs';
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';
import { clientBuildIsStale, runLocalOrExit, spawnLocal } from './lib/run.mjs';

const appPort = Number(process.env.PORT ?? 5180);
const dbPort = Number(process.env.HOTWELL_DB_PORT ?? 3417);
const dataDir = process.env.HOTWELL_DATA_DIR ?? '.data/local';

let database = null;
let server = null;
let mail = null;
let stopping = false;

async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  console.log('\n[hotwell] stopping…');
  if (server && server.exitCode === null) {
    await new Promise((resolve) => {
      server.once('exit', resolve);
      server.kill('SIGTERM');
    });
  }
  if (mail) await mail.stop();
  if (database) await database.stop();
  console.log('[hotwell] stopped; data is kept for the next start.');
  process.exit(code);
}
process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

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
    databaseUrl = database.urlFor('hotwell');
    console.log(`[db] private MariaDB on 127.0.0.1:${dbPort} (data in ${dataDir})`);
  }
  const env = { DATABASE_URL: databaseUrl };
  await runLocalOrExit('tsx', ['server/db/migrate-cli.ts'], env);
  await runLocalOrExit('tsx', ['server/db/seed/seed-cli.ts'], env);
  if (clientBuildIsStale()) {
    console.log('[build] building the client…');
    await runLocalOrExit('vite', ['build', '--logLevel', 'warn']);
  }
  const { startMailCatcher } = await import('./lib/mail-catcher.mjs');
  mail = await startMailCatcher({
    smtpPort: Number(process.env.HOTWELL_SMTP_PORT ?? 2525),
    viewerPort: Number(process.env.HOTWELL_MAIL_VIEWER_PORT ?? 5182),
  });
  server = spawnLocal('tsx', ['server/index.ts'], {
    ...env,
    SMTP_URL: process.env.SMTP_URL ?? mail.smtpUrl,
    PUBLIC_URL: process.env.PUBLIC_URL ?? `http://127.0.0.1:${appPort}`,
    PORT: String(appPort),
    SESSION_SECRET: sessionSecret(),
    NODE_ENV: 'production',
  });
  server.on('exit', (code) => {
    if (!stopping) shutdown(code ?? 1);
  });
  const url = `http://127.0.0.1:${appPort}`;
  await waitUntilServing(url);
  const people = JSON.parse(readFileSync('server/db/seed/demo-people.json', 'utf8'));
  console.log(`\nHotwell is serving at ${url}`);
  console.log(`E-mail it sends is caught locally: ${mail.viewerUrl}\n`);
  console.log('Demo sign-ins (password for all: see README) —');
  for (const person of people.users) console.log(`  ${person.role.padEnd(11)} ${person.email}`);
  console.log(`  password: ${people.password}`);
  console.log('\nCtrl-C stops the app and its database.');
  // For measuring start-up (`HOTWELL_STOP_WHEN_SERVING=1 /usr/bin/time npm start`): stop cleanly once serving.
  if (process.env.HOTWELL_STOP_WHEN_SERVING === '1') await shutdown(0);
} catch (error) {
  console.error(`\n[hotwell] could not start: ${error.message}`);
  await shutdown(1);
}
