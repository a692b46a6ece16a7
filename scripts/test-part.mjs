// `npm run test:integration` / `npm run test:e2e`: one part of `npm test` on its own throwaway
// database (port HOTWELL_PART_DB_PORT, default 3420), for quick runs while developing; the
// integration part also starts its own Redis (HOTWELL_PART_REDIS_PORT, default 6381).
// Extra arguments go to the runner, e.g. `npm run test:e2e -- e2e/rounds-flags-trends.spec.ts`.
import { ensureNodeDependencies } from './lib/node-deps.mjs';
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';
import { startPrivateRedis } from './lib/private-redis.mjs';
import { ensureChromium } from './lib/system-packages.mjs';
import { runLocal, runLocalOrExit } from './lib/run.mjs';

const [part, ...args] = process.argv.slice(2);
if (part !== 'integration' && part !== 'e2e') {
  console.error('usage: node scripts/test-part.mjs integration|e2e [runner arguments]');
  process.exit(2);
}
ensureNodeDependencies();
const db = await startPrivateMariaDb({
  dataDir: `.data/part-${part}`,
  port: Number(process.env.HOTWELL_PART_DB_PORT ?? 3420),
  databases: ['hotwell_part'],
  fresh: true,
  label: `${part} test`,
});
let code = 1;
let redis = null;
try {
  const url = db.urlFor('hotwell_part');
  await runLocalOrExit('tsx', ['server/db/migrate-cli.ts'], { DATABASE_URL: url });
  if (part === 'integration') {
    redis = await startPrivateRedis({ dataDir: '.data/part-redis', port: Number(process.env.HOTWELL_PART_REDIS_PORT ?? 6381), label: 'integration test' });
    code = await runLocal('vitest', ['run', '--project', 'integration', ...args], { TEST_DATABASE_URL: url, TEST_REDIS_URL: redis.url });
  } else {
    const chromium = ensureChromium();
    await runLocalOrExit('tsx', ['server/db/seed/seed-cli.ts', '--demo'], { DATABASE_URL: url });
    await runLocalOrExit('vite', ['build', '--logLevel', 'warn']);
    const { startMailCatcher } = await import('./lib/mail-catcher.mjs');
    const mail = await startMailCatcher({ smtpPort: 0, viewerPort: 0 });
    code = await runLocal('playwright', ['test', ...args], { E2E_DATABASE_URL: url, CHROMIUM_PATH: chromium, SMTP_URL: mail.smtpUrl, MAIL_VIEWER_URL: mail.viewerUrl });
    await mail.stop();
  }
} finally {
  await redis?.stop();
  await db.stop();
}
process.exit(code);
