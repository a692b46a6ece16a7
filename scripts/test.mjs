// `npm test`: the same set-up as `npm start` for a throwaway database, then every check:
// typecheck, lint, Vitest (unit, client components in happy-dom, integration against real MariaDB), the fault test (kill -9 of its
// own MariaDB mid-run), Playwright in Debian's chromium.
import { ensureNodeDependencies } from './lib/node-deps.mjs';
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';
import { startPrivateRedis } from './lib/private-redis.mjs';
import { ensureChromium } from './lib/system-packages.mjs';
import { runLocal, runLocalOrExit } from './lib/run.mjs';
import { playwrightFailures, vitestFailures } from './lib/failure-digest.mjs';
import { mkdirSync, rmSync } from 'node:fs';

const dbPort = Number(process.env.HOTWELL_TEST_DB_PORT ?? 3418);
const results = [];
// Each runner also writes a JSON report here; the summary lists the failed tests from them.
const reports = '.data/test-reports';
rmSync(reports, { recursive: true, force: true });
mkdirSync(reports, { recursive: true });
const vitestReport = (project) => ['--reporter=default', '--reporter=json', `--outputFile.json=${reports}/${project}.json`];
let database = null;
let redis = null;
let mail = null;

async function step(name, action) {
  const started = Date.now();
  console.log(`\n=== ${name} ===`);
  let ok;
  try {
    ok = (await action()) === 0;
  } catch (error) {
    console.error(error.message);
    ok = false;
  }
  results.push({ name, ok, seconds: (Date.now() - started) / 1000 });
}

async function stopDatabase() {
  if (mail) await mail.stop();
  mail = null;
  if (redis) await redis.stop();
  redis = null;
  if (database) await database.stop();
  database = null;
}
process.on('SIGINT', async () => {
  await stopDatabase();
  process.exit(130);
});
process.on('SIGTERM', async () => {
  await stopDatabase();
  process.exit(143);
});

try {
  ensureNodeDependencies();
  const chromium = ensureChromium();

  let integrationUrl = process.env.TEST_DATABASE_URL;
  let e2eUrl = process.env.E2E_DATABASE_URL;
  if (!integrationUrl || !e2eUrl) {
    database = await startPrivateMariaDb({
      dataDir: '.data/test',
      port: dbPort,
      databases: ['hotwell_it', 'hotwell_e2e'],
      fresh: true,
      label: 'throwaway test',
    });
    integrationUrl = database.urlFor('hotwell_it');
    e2eUrl = database.urlFor('hotwell_e2e');
  }
  for (const url of [integrationUrl, e2eUrl]) {
    await runLocalOrExit('tsx', ['server/db/migrate-cli.ts'], { DATABASE_URL: url });
  }
  await runLocalOrExit('tsx', ['server/db/seed/seed-cli.ts', '--demo'], { DATABASE_URL: e2eUrl });
  // Real Redis for the tests of several app nodes (HOTWELL_TEST_REDIS_PORT, default 6380).
  let redisUrl = process.env.TEST_REDIS_URL;
  if (!redisUrl) {
    redis = await startPrivateRedis({ dataDir: '.data/test-redis', port: Number(process.env.HOTWELL_TEST_REDIS_PORT ?? 6380), label: 'throwaway test' });
    redisUrl = redis.url;
  }

  await step('typecheck', () => runLocal('tsc', ['-p', 'tsconfig.json', '--noEmit']));
  await step('lint', () => runLocal('eslint', ['.', '--max-warnings=0']));
  await step('vitest unit', () => runLocal('vitest', ['run', '--project', 'unit', ...vitestReport('unit')]));
  await step('vitest client', () => runLocal('vitest', ['run', '--project', 'client', ...vitestReport('client')]));
  // On its own, so nothing else competes with the shared database while its files run in turn.
  await step('vitest integration', () => runLocal('vitest', ['run', '--project', 'integration', ...vitestReport('integration')], { TEST_DATABASE_URL: integrationUrl, TEST_REDIS_URL: redisUrl }));
  // Its own MariaDB (HOTWELL_FAULT_DB_PORT, default 3421), killed and restarted mid-run.
  await step('fault test', () => runLocal('tsx', ['scripts/test-faults.ts']));
  await step('client build', () => runLocal('vite', ['build', '--logLevel', 'warn']));
  const { startMailCatcher } = await import('./lib/mail-catcher.mjs');
  mail = await startMailCatcher({ smtpPort: 0, viewerPort: 0 });
  await step('playwright e2e', () =>
    runLocal('playwright', ['test', '--reporter=list,json'], { PLAYWRIGHT_JSON_OUTPUT_NAME: `${reports}/e2e.json`, E2E_DATABASE_URL: e2eUrl, CHROMIUM_PATH: chromium, SMTP_URL: mail.smtpUrl, MAIL_VIEWER_URL: mail.viewerUrl }),
  );
} catch (error) {
  console.error(`\n[test] set-up failed: ${error.message}`);
  results.push({ name: 'set-up', ok: false, seconds: 0 });
} finally {
  await stopDatabase();
}

console.log('\n=== summary ===');
for (const r of results) console.log(`${r.ok ? 'PASS' : 'FAIL'}  ${r.name}  (${r.seconds.toFixed(1)} s)`);
const failedTests = [
  ...['unit', 'client', 'integration'].flatMap((p) => vitestFailures(`${reports}/${p}.json`)),
  ...playwrightFailures(`${reports}/e2e.json`),
];
if (failedTests.length) {
  console.log(`\n=== failed tests (${failedTests.length}) ===`);
  for (const line of failedTests) console.log(`- ${line}`);
}
const failed = results.filter((r) => !r.ok).length;
process.exit(failed === 0 ? 0 : 1);
