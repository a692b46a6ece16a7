// `npm run test:faults` (also a step of `npm test`): a private MariaDB of its own, the app in this
// process, writers in parallel (rounds, log entries, handover items, submits that write notices);
// MariaDB is killed with SIGKILL mid-run and started again on the same data folder. Then:
//   - every write that was answered 2xx is in the database;
//   - nothing is half-written (each reading set has its values and audit row, each log entry and
//     handover item its search document, each submitted handover its one notice);
//   - the same app, not restarted, answers writes again once the database is back;
//   - the outbox has sent every notice, each once.
// Exits 1 on the first broken promise, after printing what it saw.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { rmSync } from 'node:fs';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createApp } from '../server/app';
import { createSequelize } from '../server/db/sequelize';
import { initModels } from '../server/db/models';
import { createMigrator } from '../server/db/migrator';
import { createLogger, logger } from '../server/lib/logger';
import { arrangeShifts, buildWorld, signIn, type Client } from './lib/fault-fixture';
// @ts-expect-error plain JS helper shared with the bootstrap scripts
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';
// @ts-expect-error plain JS helper shared with the bootstrap scripts
import { startMailCatcher } from './lib/mail-catcher.mjs';

type Db = { urlFor: (name: string) => string; stop: () => Promise<void>; process: import('node:child_process').ChildProcess };
type Write = { kind: 'round' | 'log' | 'item' | 'submit'; status: number; id: number | null; at: number };

const DB_PORT = Number(process.env.HOTWELL_FAULT_DB_PORT ?? 3421);
const DATA_DIR = '.data/faults';
const KILL_AFTER_MS = 3_000;
const DOWN_FOR_MS = 2_000;
const WRITE_AFTER_RESTART_MS = 4_000;
const SUBMIT_UNITS = 30;

const failures: string[] = [];
function check(ok: boolean, what: string, detail = '') {
  console.log(`${ok ? 'ok  ' : 'FAIL'}  ${what}${detail ? ` — ${detail}` : ''}`);
  if (!ok) failures.push(what);
}
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const startDb = (): Promise<Db> => startPrivateMariaDb({ dataDir: DATA_DIR, port: DB_PORT, databases: ['hotwell_faults'], label: 'fault test' });
// 28.5 inHg vacuum is inside the starting limits; 26.5 inHg (11.6 kPa a) is past the 11 kPa a watch limit.
const round = (vacuumInHg: number) => ({
  pressure: { value: vacuumInHg, unit: 'inHg_vac' },
  barometer: { value: 29.92, unit: 'inHgA' },
  hotwellTemperature: { value: 31.5, unit: 'degC' },
  cwInletTemperature: { value: 18, unit: 'degC' },
  cwOutletTemperature: { value: 26.5, unit: 'degC' },
  cwFlow: { value: 54_000, unit: 'm3_h' },
});

async function count(sequelize: Sequelize, sql: string, replacements: unknown[] = []): Promise<number> {
  const [row] = await sequelize.query<{ n: number }>(sql, { replacements, type: QueryTypes.SELECT });
  return Number(row?.n ?? 0);
}

async function main() {
  const unhandled: string[] = [];
  process.on('unhandledRejection', (reason) => unhandled.push(`unhandled rejection: ${(reason as Error)?.message ?? reason}`));
  process.on('uncaughtException', (error) => unhandled.push(`uncaught exception: ${error.message}`));

  // Durable settings (not the throwaway ones): a commit must survive the server being killed.
  rmSync(DATA_DIR, { recursive: true, force: true });
  let db = await startDb();
  const sequelize = createSequelize(db.urlFor('hotwell_faults'));
  initModels(sequelize);
  await createMigrator(sequelize).up();
  const mail = await startMailCatcher({ smtpPort: 0, viewerPort: 0 });
  // Each failed request is logged by the app; while the database is away that is hundreds of
  // lines. Warnings and errors are counted and the first few shown; requests that went well are not kept.
  const logged: string[] = [];
  const keep = (line: string) => {
    const entry = JSON.parse(line) as { msg?: string; err?: { message?: string } };
    logged.push(`${entry.msg ?? ''}${entry.err?.message ? `: ${entry.err.message}` : ''}`.slice(0, 200));
  };
  const appLogger = createLogger({ level: 'warn', destination: { write: keep } });
  const built = createApp(
    sequelize,
    { sessionSecret: 'fault-test', behindHttpsProxy: false, smtpUrl: mail.smtpUrl, publicUrl: 'http://127.0.0.1:5180' },
    // Short claims and retries, so what the kill interrupted is sent again within the run.
    { outbox: { leaseMs: 3_000, retryBaseMs: 500, retryMaxMs: 2_000 }, logger: appLogger },
  );
  built.outbox.start(300);
  const server = http.createServer(built.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  try {
    const world = await buildWorld(SUBMIT_UNITS);
    const admin = await signIn(base, world.people.admin);
    const settings = await arrangeShifts(admin, world);
    const [op1, op2, lead] = (await Promise.all(world.people.operators.map((email) => signIn(base, email)))) as [Client, Client, Client];
    const draft = await op1.call('POST', `/api/units/${world.unitId}/handovers/current`, {});
    if (draft.status !== 201) throw new Error(`starting the draft: ${draft.status} ${JSON.stringify(draft.body)}`);
    const draftId = Number((draft.body.board as { handover: { id: number } }).handover.id);

    // The process's own logger (retries, the outbox) goes to the same count meanwhile.
    const levelBefore = logger.level;
    const quiet = (...args: unknown[]) => logged.push(args.map((a) => (typeof a === 'string' ? a : a instanceof Error ? a.message : JSON.stringify(a))).join(' ').slice(0, 200));
    logger.warn = quiet as typeof logger.warn;
    logger.error = quiet as typeof logger.error;

    const writes: Write[] = [];
    let stop = false;
    let restartedAt = Infinity;
    const record = (kind: Write['kind'], status: number, id: unknown) => writes.push({ kind, status, id: typeof id === 'number' ? id : null, at: Date.now() });
    const loop = async (body: (i: number) => Promise<void>) => {
      for (let i = 0; !stop; i++) {
        await body(i);
        await sleep(20);
      }
    };
    const writers = [
      ...[op1, op2].map((who) =>
        loop(async (i) => {
          const res = await who.call('POST', `/api/units/${world.unitId}/readings`, round(i % 3 === 2 ? 26.5 : 28.5 - (i % 5) * 0.1));
          record('round', res.status, res.body.id);
        }),
      ),
      ...[op1, lead].map((who, w) =>
        loop(async (i) => {
          const res = await who.call('POST', `/api/units/${world.unitId}/log`, { position: settings.positions[0]!.key, category: settings.categories[0]!.key, text: `Drill entry ${w}-${i}: CW pump B amps steady` });
          record('log', res.status, res.body.id);
        }),
      ),
      loop(async (i) => {
        const res = await op2.call('POST', `/api/handovers/${draftId}/items`, { kind: 'follow_up', title: `Drill item ${i}: check waterbox vent`, priority: 'normal', clientKey: `drill-${i}-${Date.now()}` });
        record('item', res.status, res.body.id);
      }),
      (async () => {
        for (const unitId of world.submitUnitIds) {
          if (stop) break;
          const started = await lead.call('POST', `/api/units/${unitId}/handovers/current`, {});
          const id = (started.body.board as { handover?: { id: number } } | undefined)?.handover?.id;
          if (id) {
            const res = await lead.call('POST', `/api/handovers/${id}/submit`, {});
            record('submit', res.status, res.status === 200 && res.body.alreadySubmitted === false ? id : null);
          } else record('submit', started.status, null);
          await sleep(250);
        }
      })(),
    ];

    await sleep(KILL_AFTER_MS);
    const killedAt = Date.now();
    console.log(`[faults] kill -9 of mariadbd (pid ${db.process.pid}) after ${writes.length} writes`);
    await new Promise<void>((resolve) => {
      db.process.once('exit', () => resolve());
      db.process.kill('SIGKILL');
    });
    await sleep(DOWN_FOR_MS);
    db = await startDb();
    restartedAt = Date.now();
    console.log(`[faults] mariadbd started again on the same data after ${((restartedAt - killedAt) / 1000).toFixed(1)} s (crash recovery included)`);
    await sleep(WRITE_AFTER_RESTART_MS);
    stop = true;
    await Promise.all(writers);
    logger.level = levelBefore; // setting the level puts pino's own methods back
    console.log(`[faults] the app logged ${logged.length} errors and warnings meanwhile, e.g.:\n  ${[...new Set(logged.map((l) => l.slice(0, 120)))].slice(0, 4).join('\n  ')}`);

    const summary = (kind: Write['kind']) => {
      const of = writes.filter((w) => w.kind === kind);
      const by = (pred: (w: Write) => boolean) => of.filter(pred).length;
      return `${of.length} sent: ${by((w) => w.status >= 200 && w.status < 300)} 2xx, ${by((w) => w.status >= 500)} 5xx, ${by((w) => w.status === 0)} no answer, ${by((w) => w.status >= 300 && w.status < 500)} other`;
    };
    for (const kind of ['round', 'log', 'item', 'submit'] as const) console.log(`[faults] ${kind.padEnd(6)} ${summary(kind)}`);
    const ok = (w: Write) => w.status >= 200 && w.status < 300;
    const idsOf = (kind: Write['kind']) => writes.filter((w) => w.kind === kind && ok(w) && w.id !== null).map((w) => w.id!);

    // The same app, not restarted: writes succeed again once the database is back.
    for (const kind of ['round', 'log', 'item'] as const) {
      check(writes.some((w) => w.kind === kind && ok(w) && w.at > restartedAt), `${kind} writes answered 2xx again after the restart, without restarting the app`);
    }
    check(writes.some((w) => w.status >= 500 || w.status === 0), 'the outage was seen by writers (some writes failed while the database was down)');

    const inTable = async (table: string, ids: number[]) => (ids.length ? count(sequelize, `SELECT COUNT(*) AS n FROM ${table} WHERE id IN (${ids.join(',')})`) : 0);
    for (const [kind, table] of [['round', 'reading_sets'], ['log', 'log_entries'], ['item', 'handover_items']] as const) {
      const ids = idsOf(kind);
      check((await inTable(table, ids)) === ids.length, `every ${kind} answered 2xx is stored`, `${ids.length} answered 2xx`);
    }
    const submitted = idsOf('submit');
    check(
      submitted.length === 0 || (await count(sequelize, `SELECT COUNT(*) AS n FROM handovers WHERE status = 'submitted' AND id IN (${submitted.join(',')})`)) === submitted.length,
      'every submit answered 2xx is stored',
      `${submitted.length} answered 2xx`,
    );

    const unit = world.unitId;
    check((await count(sequelize, 'SELECT COUNT(*) AS n FROM reading_sets r WHERE r.unit_id = ? AND NOT EXISTS (SELECT 1 FROM reading_values v WHERE v.reading_set_id = r.id)', [unit])) === 0, 'every stored reading set has its values');
    check(
      (await count(sequelize, `SELECT COUNT(*) AS n FROM reading_sets r WHERE r.unit_id = ? AND NOT EXISTS (SELECT 1 FROM audit_events a WHERE a.action = 'reading.record' AND a.entity = 'reading_set' AND a.entity_id = CAST(r.id AS CHAR))`, [unit])) === 0,
      'every stored reading set has its audit row',
    );
    check(
      (await count(sequelize, `SELECT COUNT(*) AS n FROM reading_sets r WHERE r.unit_id = ? AND r.worst_status IN ('watch', 'alarm') AND NOT EXISTS (SELECT 1 FROM logbook_documents d WHERE d.kind = 'round' AND d.ref_id = r.id)`, [unit])) === 0,
      'every stored round outside its limits has its search document',
    );
    check(
      (await count(sequelize, `SELECT COUNT(*) AS n FROM (SELECT parameter FROM flags WHERE unit_id = ? AND origin = 'automatic' AND status = 'open' GROUP BY parameter HAVING COUNT(*) > 1) x`, [unit])) === 0,
      'at most one open automatic flag per parameter',
    );
    check((await count(sequelize, `SELECT COUNT(*) AS n FROM log_entries e WHERE e.unit_id = ? AND NOT EXISTS (SELECT 1 FROM logbook_documents d WHERE d.kind = 'log_entry' AND d.ref_id = e.id)`, [unit])) === 0, 'every stored log entry has its search document');
    check(
      (await count(sequelize, `SELECT COUNT(*) AS n FROM handover_items i WHERE i.handover_id = ? AND i.removed_at IS NULL AND NOT EXISTS (SELECT 1 FROM logbook_documents d WHERE d.kind = 'handover_item' AND d.ref_id = i.id)`, [draftId])) === 0,
      'every stored handover item has its search document',
    );
    check(
      (await count(sequelize, `SELECT COUNT(*) AS n FROM handovers h WHERE h.status = 'submitted' AND (SELECT COUNT(*) FROM outbox o WHERE o.kind = 'handover_submitted' AND o.ref_id = h.id) <> 1`)) === 0,
      'every submitted handover has exactly one notice in the outbox',
    );

    // Every notice sent, once: the outbox marks, and what the mail server received.
    const drainBy = Date.now() + 20_000;
    while (Date.now() < drainBy && (await count(sequelize, 'SELECT COUNT(*) AS n FROM outbox WHERE sent_at IS NULL')) > 0) {
      await built.outbox.wake();
      await sleep(200);
    }
    const notices = await sequelize.query<{ id: number }>('SELECT id FROM outbox', { type: QueryTypes.SELECT });
    check(notices.length > 0 && (await count(sequelize, 'SELECT COUNT(*) AS n FROM outbox WHERE sent_at IS NULL')) === 0, 'the outbox sent every notice', `${notices.length} notices`);
    await sleep(500);
    const received = new Map<string, number>();
    for (const m of mail.messages as { messageId: string }[]) received.set(m.messageId, (received.get(m.messageId) ?? 0) + 1);
    const wrong = notices.filter((n) => received.get(`<notice-${n.id}@hotwell.invalid>`) !== 1);
    check(wrong.length === 0 && mail.messages.length === notices.length, 'each notice reached the mail server exactly once', `${mail.messages.length} messages for ${notices.length} notices`);
    check(unhandled.length === 0, 'no unhandled error in the app while the database was away', unhandled.slice(0, 3).join('; '));
  } finally {
    await built.outbox.stop();
    built.close();
    server.closeAllConnections();
    server.close();
    await sequelize.close().catch(() => {});
    await mail.stop();
    await db.stop();
  }
}

const started = Date.now();
main()
  .then(() => {
    console.log(`\n[faults] ${failures.length ? `${failures.length} check(s) failed` : 'all checks passed'} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
    process.exit(failures.length ? 1 : 0);
  })
  .catch((error: unknown) => {
    console.error('[faults] could not run:', error);
    process.exit(1);
  });
