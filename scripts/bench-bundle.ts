// `npm run bench:bundle`: what a browser downloads before a page shows.
//
// 1. From the production build (built here, or `--use-dist` for the dist/ already there), with Vite's
//    manifest (dist/.vite/manifest.json): the gzip'd bytes of the entry chunk and of each page's first
//    load — the entry plus the page's chunk and everything both import statically (the chunks the
//    browser must have before the page can render) — the handover page as a reader and as a writer
//    (reader + the editor's chunk, loaded when writing starts). JavaScript only; gzip at zlib's
//    default level (what a compressing server sends); 1 kB = 1000 bytes. Targets from issue 15.
// 2. The rounds page's load on a throttled connection (Chrome DevTools Protocol: 1.6 Mbit/s down,
//    750 kbit/s up, 150 ms round trip) against a production server started here on its own port and a
//    throwaway, demo-seeded MariaDB: time to interactive and bytes transferred for a first visit and a
//    repeat visit in the same browser context, beside a floor measured in the same run.
//    `--static-only` skips this part.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { chromium, type BrowserContext, type Page } from '@playwright/test';
import { createSequelize } from '../server/db/sequelize';
import { initModels } from '../server/db/models';
import { createMigrator } from '../server/db/migrator';
import { seedDemo } from '../server/db/seed/seed-demo';
import people from '../server/db/seed/demo-people.json';
// @ts-expect-error plain JS helper shared with the bootstrap scripts
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';

const args = new Set(process.argv.slice(2));
const PORT = Number(process.env.BENCH_BUNDLE_PORT ?? 5197);
const DB_PORT = Number(process.env.HOTWELL_BENCH_DB_PORT ?? 3428);
const base = `http://127.0.0.1:${PORT}`;
const dist = path.resolve('dist');

type Chunk = { file: string; src?: string; isEntry?: boolean; isDynamicEntry?: boolean; imports?: string[]; dynamicImports?: string[] };
type Manifest = Record<string, Chunk>;

const kB = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`;
const verdict = (bytes: number, limitKb: number) => `${kB(bytes).padStart(9)}  target ≤ ${limitKb} kB  ${bytes <= limitKb * 1000 ? 'PASS' : 'FAIL'}`;

function build() {
  if (args.has('--use-dist')) {
    if (!existsSync(path.join(dist, '.vite/manifest.json'))) throw new Error('--use-dist: dist/.vite/manifest.json is missing; run `npx vite build` first');
    console.log('Using the build already in dist/.');
    return;
  }
  console.log('Building the client (vite build)…');
  const result = spawnSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'], { stdio: 'inherit' });
  if (result.status !== 0) throw new Error('vite build failed');
}

function staticReport() {
  const manifest = JSON.parse(readFileSync(path.join(dist, '.vite/manifest.json'), 'utf8')) as Manifest;
  const gzipped = new Map<string, number>();
  const size = (key: string) => {
    const file = manifest[key]!.file;
    if (!gzipped.has(file)) gzipped.set(file, file.endsWith('.js') ? gzipSync(readFileSync(path.join(dist, file))).length : 0);
    return gzipped.get(file)!;
  };
  const closure = (key: string, into = new Set<string>()) => {
    if (into.has(key)) return into;
    into.add(key);
    for (const imported of manifest[key]!.imports ?? []) closure(imported, into);
    return into;
  };
  const total = (keys: Set<string>) => [...keys].reduce((sum, key) => sum + size(key), 0);
  const entry = Object.keys(manifest).find((key) => manifest[key]!.isEntry);
  if (!entry) throw new Error('no entry chunk in the manifest');
  const firstLoad = (page: string) => closure(page, closure(entry));

  console.log('\nJavaScript, gzip (zlib default level), 1 kB = 1000 bytes');
  const entryBytes = size(entry);
  console.log(`entry chunk (${manifest[entry]!.file})`.padEnd(58) + verdict(entryBytes, 130));

  // Every page is a route's on-demand chunk: src/features/<feature>/routes/<name>.tsx.
  const pages = Object.keys(manifest)
    .filter((key) => manifest[key]!.isDynamicEntry && /^src\/features\/[^/]+\/routes\//.test(key))
    .sort();
  const targets: Record<string, number> = { 'src/features/rounds/routes/rounds-page.tsx': 160 };
  const handover = 'src/features/handover/routes/handover-page.tsx';
  const results: { label: string; bytes: number; target?: number }[] = [];
  for (const page of pages) {
    const label = page.replace(/^src\/features\//, '').replace('/routes/', ': ').replace(/\.tsx$/, '');
    if (page === handover) {
      const reader = firstLoad(page);
      results.push({ label: `${label} (reader)`, bytes: total(reader), target: 160 });
      // The editor is the page's on-demand import (a chunk shared with the orders page, which writes orders).
      const editor = manifest[page]!.dynamicImports?.find((key) => /rich-text-editor/.test(key));
      if (!editor) throw new Error('the handover page no longer loads the editor on demand');
      results.push({ label: `${label} (writer: reader + editor chunk)`, bytes: total(closure(editor, new Set(reader))) });
    } else results.push({ label, bytes: total(firstLoad(page)), target: targets[page] });
  }
  console.log('first load per page (entry + the page + their static imports):');
  for (const r of results) console.log(`  ${r.label.padEnd(56)}${r.target ? verdict(r.bytes, r.target) : kB(r.bytes).padStart(9)}`);
  return { entryFile: manifest[entry]!.file };
}

async function waitForServer(server: ReturnType<typeof spawn>) {
  for (let i = 0; ; i++) {
    const ok = await fetch(`${base}/api/health`).then((r) => r.ok, () => false);
    if (ok) return;
    if (server.exitCode !== null) throw new Error(`the server stopped while starting (exit code ${server.exitCode}); its message is above`);
    if (i > 120) throw new Error('the server did not start');
    await new Promise((r) => setTimeout(r, 500));
  }
}

/** Signs in through the API with the context's own cookie jar, as the sign-in page would. */
async function signIn(context: BrowserContext, email: string) {
  const csrf = (await (await context.request.get(`${base}/api/session/csrf`)).json()) as { csrfToken: string };
  const res = await context.request.post(`${base}/api/session`, { data: { email, password: people.password }, headers: { 'X-CSRF-Token': csrf.csrfToken } });
  if (!res.ok()) throw new Error(`sign-in ${email}: HTTP ${res.status()} ${await res.text()}`);
}

type Visit = { ms: number; bytes: number; requests: number; fromServiceWorker: number; fromCache: number; encodings: Set<string>; timeline: string[] };

/** Loads `url` on a throttled connection and waits for `ready`; counts bytes as received (encoded) per request. */
async function throttledVisit(page: Page, url: string, ready: (page: Page) => Promise<void>): Promise<Visit> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 150, downloadThroughput: 1_600_000 / 8, uploadThroughput: 750_000 / 8 });
  const visit: Visit = { ms: 0, bytes: 0, requests: 0, fromServiceWorker: 0, fromCache: 0, encodings: new Set(), timeline: [] };
  const begun = new Map<string, { url: string; at: number }>();
  const since = () => (performance.now() - started).toFixed(0).padStart(5);
  cdp.on('Network.requestWillBeSent', (e: { requestId: string; request: { url: string } }) => {
    begun.set(e.requestId, { url: e.request.url.replace(base, ''), at: performance.now() - started });
  });
  cdp.on('Network.loadingFinished', (e: { requestId: string; encodedDataLength: number }) => {
    visit.bytes += e.encodedDataLength;
    visit.requests++;
    const b = begun.get(e.requestId);
    if (b) visit.timeline.push(`${b.at.toFixed(0).padStart(5)} → ${since()} ms  ${b.url}`);
  });
  cdp.on('Network.responseReceived', (e: { response: { fromServiceWorker?: boolean; fromDiskCache?: boolean; fromPrefetchCache?: boolean; url: string; headers: Record<string, string> } }) => {
    if (e.response.fromServiceWorker) visit.fromServiceWorker++;
    if (e.response.fromDiskCache) visit.fromCache++;
    if (/\/assets\/.*\.js$/.test(e.response.url)) visit.encodings.add(e.response.headers['content-encoding'] ?? e.response.headers['Content-Encoding'] ?? 'none');
  });
  const started = performance.now();
  await page.goto(url, { waitUntil: 'commit' });
  await ready(page);
  visit.ms = performance.now() - started;
  await cdp.detach();
  return visit;
}

async function throttledReport(entryFile: string) {
  // Another server on the port would answer the health check and be measured instead of ours.
  if (await fetch(`${base}/api/health`).then(() => true, () => false)) throw new Error(`port ${PORT} is taken: set BENCH_BUNDLE_PORT`);
  const db = await startPrivateMariaDb({ dataDir: '.data/bench-bundle', port: DB_PORT, databases: ['hotwell_bench'], fresh: true, label: 'benchmark' });
  try {
    const url = db.urlFor('hotwell_bench') as string;
    const sequelize = createSequelize(url);
    initModels(sequelize);
    await createMigrator(sequelize).up();
    await seedDemo(sequelize);
    await sequelize.close();
    const server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      env: { ...process.env, DATABASE_URL: url, PORT: String(PORT), SESSION_SECRET: 'bench-bundle-session-secret-0123456789abcdef', NODE_ENV: 'production', SIGN_IN_RATE_LIMIT: '1000000', PUBLIC_URL: base, SMTP_URL: 'smtp://127.0.0.1:9', LOG_LEVEL: 'warn' },
      // Its warnings and errors go to stdout as log lines: shown with BENCH_SERVER_LOG=1.
      stdio: ['ignore', process.env.BENCH_SERVER_LOG ? 'inherit' : 'ignore', 'inherit'],
    });
    try {
      await waitForServer(server);
      await measure(entryFile);
    } finally {
      if (server.exitCode === null && server.signalCode === null) {
        const exited = new Promise((r) => server.once('exit', r));
        server.kill('SIGTERM');
        await exited;
      }
    }
  } finally {
    await db.stop();
  }
}

async function measure(entryFile: string) {
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
  try {
    // Interactive: the round form's first box can be typed in (its unit and time zone are loaded) and the
    // page's data is there (the last round of the unit is shown, the checks' design and limits are loaded).
    const roundsReady = async (page: Page) => {
      await page.locator('form[aria-label="Record a round"] input').first().waitFor({ state: 'visible', timeout: 60_000 });
      await page.waitForFunction(() => {
        const box = document.querySelector<HTMLInputElement>('form[aria-label="Record a round"] input');
        return Boolean(box && !box.disabled && document.querySelector('[data-testid="last-reading"]'));
      }, undefined, { timeout: 60_000 });
    };
    const rounds = `${base}/rounds?unit=1`;
    const operator = people.users.find((u) => u.role === 'operator')!.email;

    // Floor: a fresh browser loads the bare index.html with its entry chunk and stylesheet (the load event),
    // signed out, on the same throttled connection.
    const bare = await browser.newContext();
    const floor = await throttledVisit(await bare.newPage(), `${base}/sign-in`, async (page) => {
      await page.waitForFunction(() => document.readyState === 'complete', undefined, { timeout: 60_000 });
    });
    await bare.close();

    const context = await browser.newContext();
    await signIn(context, operator);
    const page = await context.newPage();
    const first = await throttledVisit(page, rounds, roundsReady);
    // Let the page settle (the prompt's and comments' chunks, a service worker installing), then come back.
    await page.waitForTimeout(3000);
    await page.goto('about:blank');
    const hasWorker = await context.serviceWorkers().length > 0;
    const repeat = await throttledVisit(page, rounds, roundsReady);
    await context.close();

    const line = (label: string, v: Visit, targetMs?: number) =>
      `  ${label.padEnd(44)}${`${(v.ms / 1000).toFixed(2)} s`.padStart(8)}  ${kB(v.bytes).padStart(9)} over ${String(v.requests).padStart(3)} responses` +
      (targetMs ? `  target < ${targetMs / 1000} s  ${v.ms < targetMs ? 'PASS' : 'FAIL'}` : '');
    console.log('\nRounds page on a throttled connection (1.6 Mbit/s down, 750 kbit/s up, 150 ms RTT), Chromium:');
    console.log('  interactive = from navigation until the round form\'s first box is enabled and the unit\'s last round is shown');
    console.log('  bytes = sum of CDP Network.loadingFinished encodedDataLength (as received: compressed if the server compressed)');
    console.log(line('floor: /sign-in HTML + entry + CSS (load event)', floor));
    console.log(line('first visit (signed in, empty cache)', first, 4000));
    console.log(
      line(`repeat visit (${repeat.fromServiceWorker ? `${repeat.fromServiceWorker} from the service worker` : `${repeat.fromCache} from the HTTP cache${hasWorker ? '' : ', no service worker'}`})`, repeat, 1000),
    );
    // `--timeline`: when each response of the visits began and ended, to see what a visit waits on.
    if (args.has('--timeline')) for (const [label, v] of [['first', first], ['repeat', repeat]] as const) console.log(`\n${label} visit:\n${v.timeline.join('\n')}`);
    const encodings = [...first.encodings].join(', ');
    console.log(`  the server's Content-Encoding for JavaScript (${entryFile} and others): ${encodings}${encodings === 'none' ? ' — responses are not compressed' : ''}`);
  } finally {
    await browser.close();
  }
}

const { entryFile } = (build(), staticReport());
if (!args.has('--static-only')) await throttledReport(entryFile);
