// `npm run test:start`: how `npm start` behaves when things go wrong, each case on its own data
// folder and ports (HOTWELL_START_TEST_PORT, _DB_PORT, _SMTP_PORT, _VIEWER_PORT). Not part of
// `npm test`: it starts Hotwell six times (the first may build the client), a few minutes in all.
//   1. a mail sender that resets its SMTP connection mid-message does not take it down; SIGTERM
//      to the start script stops everything (exit 0), no MariaDB left, every port free;
//   2. MariaDB killed with SIGKILL: it says so, stops the app and exits non-zero, within the limit;
//   3. its own unexpected error: it stops the app and MariaDB first, then exits non-zero;
//   4. SIGTERM to the `npm start` process itself stops everything;
//   5. the start script killed with SIGKILL: the app stops by itself; the next start stops the
//      MariaDB left behind, serves, and stops cleanly.
import { spawn } from 'node:child_process';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { portIsFree } from './lib/private-mariadb.mjs';

const ports = {
  app: Number(process.env.HOTWELL_START_TEST_PORT ?? 5190),
  db: Number(process.env.HOTWELL_START_TEST_DB_PORT ?? 3423),
  smtp: Number(process.env.HOTWELL_START_TEST_SMTP_PORT ?? 2526),
  viewer: Number(process.env.HOTWELL_START_TEST_VIEWER_PORT ?? 5191),
};
const dataDir = '.data/start-test';
const dbDir = path.resolve(dataDir, 'db');
const env = {
  ...process.env,
  PORT: String(ports.app),
  HOTWELL_DB_PORT: String(ports.db),
  HOTWELL_SMTP_PORT: String(ports.smtp),
  HOTWELL_MAIL_VIEWER_PORT: String(ports.viewer),
  HOTWELL_DATA_DIR: dataDir,
};
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
const failures = [];
const started = [];

function check(ok, what, detail = '') {
  console.log(`${ok ? 'ok  ' : 'FAIL'}  ${what}${detail ? ` — ${detail}` : ''}`);
  if (!ok) failures.push(what);
}

/** Starts `node scripts/start.mjs` (or `npm start`) in a process group of its own, keeping its output. */
function startHotwell({ viaNpm = false, extraEnv = {} } = {}) {
  const child = viaNpm
    ? spawn('npm', ['start'], { env: { ...env, ...extraEnv }, detached: true, stdio: ['ignore', 'pipe', 'pipe'] })
    : spawn(process.execPath, ['scripts/start.mjs'], { env: { ...env, ...extraEnv }, detached: true, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout.on('data', (d) => (output += d));
  child.stderr.on('data', (d) => (output += d));
  const exited = new Promise((resolve) => child.once('exit', (code, signal) => resolve({ code, signal })));
  const run = { child, exited, output: () => output };
  started.push(run);
  return run;
}

async function serving(run, timeoutMs = 300_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (run.child.exitCode !== null || run.child.signalCode !== null) return false;
    try {
      if ((await fetch(`http://127.0.0.1:${ports.app}/api/health`)).ok && run.output().includes('Hotwell is serving')) return true;
    } catch {
      /* not yet */
    }
    await sleep(300);
  }
  return false;
}

/** Resolves with { code, signal, ms } or null when the process did not exit in time. */
async function exitWithin(run, ms) {
  const t0 = Date.now();
  const result = await Promise.race([run.exited, sleep(ms).then(() => null)]);
  return result && { ...result, ms: Date.now() - t0 };
}

/** The mariadbd processes serving this test's data folder (from /proc). */
function serversOfTestData() {
  const found = [];
  for (const pid of readdirSync('/proc').filter((p) => /^\d+$/.test(p))) {
    try {
      if (readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0').includes(`--datadir=${dbDir}`)) found.push(Number(pid));
    } catch {
      /* gone meanwhile */
    }
  }
  return found;
}

async function everythingStopped(label) {
  // A port may take a moment to be released after its process exits.
  await sleep(500);
  check(serversOfTestData().length === 0, `${label}: no MariaDB left running on its data`, `pids ${serversOfTestData().join(', ') || 'none'}`);
  for (const [name, port] of Object.entries(ports)) check(await portIsFree(port), `${label}: the ${name} port ${port} is free`);
}

/** A sender that opens a message and resets the connection halfway through it (as a killed app would). */
function abortedSmtpSession() {
  return new Promise((resolve) => {
    const socket = net.createConnection(ports.smtp, '127.0.0.1');
    socket.on('error', () => resolve());
    socket.on('close', () => resolve());
    const dialogue = ['EHLO drill.example', 'MAIL FROM:<a@drill.example>', 'RCPT TO:<b@drill.example>', 'DATA'];
    socket.on('data', (reply) => {
      // One command per reply (the EHLO reply ends with a "250 " line).
      if (dialogue.length === 4 && !/^250 /m.test(String(reply)) && !/^220 /m.test(String(reply))) return;
      const next = dialogue.shift();
      if (next) return void socket.write(`${next}\r\n`);
      socket.write('Subject: half a message\r\n\r\nand then');
      setTimeout(() => {
        socket.resetAndDestroy();
        resolve();
      }, 150);
    });
  });
}

async function scenarioSigterm() {
  const label = '1. SIGTERM to the start script';
  const run = startHotwell();
  check(await serving(run), `${label}: serves`);
  for (let i = 0; i < 5; i++) await abortedSmtpSession();
  await sleep(1_000);
  check(run.child.exitCode === null && (await fetch(`http://127.0.0.1:${ports.app}/api/health`)).ok, `${label}: still serving after 5 SMTP sessions reset mid-message`);
  run.child.kill('SIGTERM');
  const exit = await exitWithin(run, 30_000);
  check(exit?.code === 0, `${label}: exits 0`, exit ? `code ${exit.code}, ${exit.ms} ms` : 'still running after 30 s');
  await everythingStopped(label);
}

async function scenarioDatabaseKilled() {
  const label = '2. MariaDB killed';
  const run = startHotwell();
  check(await serving(run), `${label}: serves`);
  const pid = Number(readFileSync(path.join(dataDir, 'run', 'mariadbd.pid'), 'utf8').trim());
  process.kill(pid, 'SIGKILL');
  const exit = await exitWithin(run, 30_000);
  check(Boolean(exit) && exit.code !== 0, `${label}: the start script exits non-zero, within 30 s`, exit ? `code ${exit.code}, ${exit.ms} ms` : 'still running');
  check(run.output().includes('MariaDB stopped unexpectedly'), `${label}: says the database stopped`);
  await everythingStopped(label);
}

async function scenarioOwnFailure() {
  const label = '3. its own unexpected error';
  const run = startHotwell({ extraEnv: { HOTWELL_FAIL_WHEN_SERVING: '1' } });
  // It fails a moment after serving, so it is known to have served by what it printed.
  const exit = await exitWithin(run, 300_000);
  check(run.output().includes('Hotwell is serving'), `${label}: served first`);
  check(Boolean(exit) && exit.code !== 0, `${label}: exits non-zero`, exit ? `code ${exit.code}, ${exit.ms} ms` : 'still running');
  check(run.output().includes('unexpected error') && run.output().includes('data is kept for the next start'), `${label}: says so and stops what it started`);
  await everythingStopped(label);
}

async function scenarioNpmSigterm() {
  const label = '4. SIGTERM to npm start';
  const run = startHotwell({ viaNpm: true });
  check(await serving(run), `${label}: serves`);
  run.child.kill('SIGTERM');
  const exit = await exitWithin(run, 30_000);
  check(Boolean(exit), `${label}: npm exits`, exit ? `code ${exit.code} signal ${exit.signal}, ${exit.ms} ms` : 'still running after 30 s');
  // npm may answer the signal before its child has finished stopping.
  for (let i = 0; i < 60 && (serversOfTestData().length || !(await portIsFree(ports.app))); i++) await sleep(500);
  await everythingStopped(label);
}

async function scenarioStartKilled() {
  const label = '5. the start script killed with SIGKILL';
  const run = startHotwell();
  check(await serving(run), `${label}: serves`);
  run.child.kill('SIGKILL');
  await run.exited;
  let appGone = false;
  for (let i = 0; i < 40 && !appGone; i++) {
    await sleep(500);
    appGone = await portIsFree(ports.app);
  }
  check(appGone, `${label}: the app stops by itself within 20 s`);
  check(serversOfTestData().length === 1, `${label}: MariaDB is left running (nothing could stop it)`);
  const next = startHotwell();
  check(await serving(next), `${label}: the next start serves`);
  check(next.output().includes('left running by an earlier start'), `${label}: the next start stopped the MariaDB left behind`);
  next.child.kill('SIGTERM');
  const exit = await exitWithin(next, 30_000);
  check(exit?.code === 0, `${label}: the next start stops cleanly`, exit ? `code ${exit.code}` : 'still running');
  await everythingStopped(label);
}

const t0 = Date.now();
try {
  for (const [name, port] of Object.entries(ports)) {
    if (!(await portIsFree(port))) throw new Error(`port ${port} (${name}) is in use; set HOTWELL_START_TEST_${name === 'app' ? '' : `${name.toUpperCase()}_`}PORT`);
  }
  if (existsSync(path.join(dataDir, 'run', 'mariadbd.pid')) && serversOfTestData().length) throw new Error(`a MariaDB is already running on ${dataDir}`);
  const scenarios = [scenarioSigterm, scenarioDatabaseKilled, scenarioOwnFailure, scenarioNpmSigterm, scenarioStartKilled];
  // HOTWELL_START_TEST_ONLY=2,4 runs those cases alone.
  const only = (process.env.HOTWELL_START_TEST_ONLY ?? '').split(',').filter(Boolean).map(Number);
  for (const [index, scenario] of scenarios.entries()) {
    if (only.length && !only.includes(index + 1)) continue;
    // Each case starts from nothing running; what an earlier case left is a failure of that case, then cleared.
    if (serversOfTestData().length || !(await portIsFree(ports.app))) {
      failures.push(`case ${index + 1}: something was left running before it`);
      for (const run of started) {
        try {
          process.kill(-run.child.pid, 'SIGKILL');
        } catch {
          /* gone */
        }
      }
      for (const pid of serversOfTestData()) process.kill(pid, 'SIGKILL');
      await sleep(2_000);
    }
    const before = failures.length;
    await scenario();
    if (failures.length > before) console.log(`--- output of the last start ---\n${started.at(-1).output().slice(-3000)}\n---`);
  }
} catch (error) {
  failures.push(error.message);
  console.error(`[start-test] ${error.message}`);
} finally {
  // Whatever is left of the groups started here.
  for (const run of started) {
    try {
      process.kill(-run.child.pid, 'SIGKILL');
    } catch {
      /* already gone */
    }
  }
  for (const pid of serversOfTestData()) process.kill(pid, 'SIGTERM');
}
console.log(`\n[start-test] ${failures.length ? `${failures.length} check(s) failed` : 'all checks passed'} in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
process.exit(failures.length ? 1 : 0);
