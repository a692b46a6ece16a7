// The outbox: a submit writes its notice in its own transaction (a rolled-back submit writes none);
// two senders at once send each notice once; a failing mail server is retried with a delay, the
// error kept, and then the notice goes.
import net from 'node:net';
import { QueryTypes } from 'sequelize';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { AuditEvent } from '../../server/features/audit/model';
import { Handover } from '../../server/features/handovers/model';
import { createSequelize } from '../../server/db/sequelize';
import { createMailer } from '../../server/lib/mailer';
import { enqueueNotice, makeOutboxSender } from '../../server/lib/outbox';
import { unitOfWork } from '../../server/lib/unit-of-work';
// @ts-expect-error plain JS helper shared with the bootstrap scripts
import { startMailCatcher } from '../../scripts/lib/mail-catcher.mjs';
import { startCatcher, waitForMail, type Catcher } from './support/mail';
import { buildApp, closeAll, db, makeStation, makeUser, signedInAgent, type Agent, clearOutbox } from './support/test-app';
import { logger } from '../../server/lib/logger';

type Row = { id: number; kind: string; ref_id: number; attempts: number; last_error: string | null; sent_at: Date | null; due_at: Date; claim_token: string | null };
const rowsOf = (kind: string, refIds: number[]) =>
  db().query<Row>(`SELECT id, kind, ref_id, attempts, last_error, sent_at, due_at, claim_token FROM outbox WHERE kind = ? AND ref_id IN (${refIds.map(Number).join(',')}) ORDER BY id`, {
    replacements: [kind],
    type: QueryTypes.SELECT,
  });

let catcher: Catcher;
let built: ReturnType<typeof buildApp>;
beforeAll(async () => {
  await clearOutbox();
  catcher = await startCatcher();
  built = buildApp({ smtpUrl: catcher.smtpUrl });
});
afterAll(async () => {
  await catcher.stop();
  await closeAll();
});
afterEach(() => vi.useRealTimers());

describe('a submit and its notice', () => {
  let writer: Agent;
  let handoverId = 0;
  let handoverAt = new Date();
  let incoming: string[] = [];
  beforeAll(async () => {
    const { station, unit, crews } = await makeStation(2);
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    const shifts = await admin.get(`/api/units/${unit.id}/log/shifts`).expect(200);
    await admin.put(`/api/stations/${station.id}/crew-rotation`).set('X-CSRF-Token', admin.csrf).send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: crews.map((c) => c.id) }).expect(200);
    writer = await signedInAgent(built, (await makeUser('operator', { crewId: crews[0]!.id })).email);
    incoming = [(await makeUser('shift_lead', { crewId: crews[1]!.id })).email, (await makeUser('operator', { crewId: crews[1]!.id })).email];
    const board = (await writer.post(`/api/units/${unit.id}/handovers/current`).set('X-CSRF-Token', writer.csrf).send({}).expect(201)).body.board;
    handoverId = board.handover.id;
    handoverAt = new Date(board.handover.handoverAt);
  });
  const submit = () => {
    vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
    vi.setSystemTime(new Date(handoverAt.getTime() - 20 * 60_000));
    return writer.post(`/api/handovers/${handoverId}/submit`).set('X-CSRF-Token', writer.csrf).send({});
  };

  it('writes no notice when the submit rolls back', async () => {
    // The audit row is written after the notice, in the same transaction: failing it undoes both.
    const original = AuditEvent.create.bind(AuditEvent);
    const spy = vi.spyOn(AuditEvent, 'create').mockImplementation(async (...args: Parameters<typeof AuditEvent.create>) => {
      if ((args[0] as { action?: string }).action === 'handover.submit') throw new Error('audit table full (simulated)');
      return original(...args);
    });
    const res = await submit();
    spy.mockRestore();
    expect(res.status).toBe(500);
    expect((await Handover.findByPk(handoverId))!.status).toBe('draft');
    expect(await rowsOf('handover_submitted', [handoverId])).toEqual([]);
  });

  it('writes one notice with the submit, sent once after the commit to the incoming crew', async () => {
    const before = catcher.messages.length;
    await submit().expect(200);
    const rows = await rowsOf('handover_submitted', [handoverId]);
    expect(rows).toHaveLength(1);
    const mail = (await waitForMail(catcher, before + 1)).at(-1)!;
    expect(mail.messageId).toBe(`<notice-${rows[0]!.id}@hotwell.invalid>`);
    expect(mail.to.sort()).toEqual([...incoming].sort());
    // A second submit and a further pass of the sender send nothing more.
    await submit().expect(200);
    await built.outbox.wake();
    await new Promise((r) => setTimeout(r, 300));
    expect(catcher.messages.filter((m) => m.messageId === mail.messageId)).toHaveLength(1);
    const [sent] = await rowsOf('handover_submitted', [handoverId]);
    expect(sent!.sent_at).not.toBeNull();
    expect(sent!.attempts).toBe(1);
  });
});

describe('two senders at once', () => {
  it('send each of 60 notices exactly once (10 runs of two senders racing)', { timeout: 60_000 }, async () => {
    const other = createSequelize(process.env.TEST_DATABASE_URL!);
    try {
      const mailer = createMailer(catcher.smtpUrl);
      // Separate connection pools, as two server processes would have; small batches, so they meet often.
      const senders = [makeOutboxSender(db(), mailer, { batch: 3 }), makeOutboxSender(other, mailer, { batch: 3 })];
      // A used outbox, as in a station that has run for a while (and as the shared test database is
      // by the time this file runs): thousands of sent rows beside the due ones.
      const stamp = Date.now();
      for (let chunk = 0; chunk < 5; chunk++) {
        const values = Array.from({ length: 1000 }, (_, i) => `('test_sent', ${stamp + chunk * 1000 + i}, '[]', 'Old', 'Sent', NOW(3), NOW(3), 1, NOW(3))`);
        await db().query(`INSERT INTO outbox (kind, ref_id, recipients, subject, body, created_at, due_at, attempts, sent_at) VALUES ${values.join(',')}`);
      }
      // …and notices waiting for a later try (a mail server that was down), not due yet.
      const later = Array.from({ length: 300 }, (_, i) => `('test_later', ${stamp + i}, '[]', 'Later', 'Later', NOW(3), NOW(3) + INTERVAL 1 DAY, 1)`);
      await db().query(`INSERT INTO outbox (kind, ref_id, recipients, subject, body, created_at, due_at, attempts) VALUES ${later.join(',')}`);
      const base = Date.now();
      for (let run = 0; run < 10; run++) {
        const refIds = Array.from({ length: 6 }, (_, i) => base + run * 10 + i);
        await unitOfWork(db(), async (transaction) => {
          for (const refId of refIds) await enqueueNotice({ kind: 'test_race', refId, to: ['crew@fernhollow.example'], subject: `Race ${refId}`, text: 'Two senders' }, transaction);
        });
        await Promise.all([senders[0]!.wake(), senders[1]!.wake(), senders[0]!.sendDue(), senders[1]!.sendDue()]);
        const rows = await rowsOf('test_race', refIds);
        expect(rows.every((r) => r.sent_at !== null), `run ${run}: all sent`).toBe(true);
        expect(rows.map((r) => r.attempts), `run ${run}: each claimed once`).toEqual(Array(6).fill(1));
      }
      await waitForMail(catcher, catcher.messages.filter((m) => m.subject.startsWith('Race ')).length);
      const ids = catcher.messages.filter((m) => m.subject.startsWith('Race ')).map((m) => m.messageId);
      expect(ids).toHaveLength(60);
      expect(new Set(ids).size).toBe(60);
    } finally {
      await db().query("DELETE FROM outbox WHERE kind IN ('test_sent', 'test_later')");
      await other.close();
    }
  });
});

describe('a mail server that is down', () => {
  async function freePort(): Promise<number> {
    const server = net.createServer();
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const { port } = server.address() as net.AddressInfo;
    await new Promise((resolve) => server.close(resolve));
    return port;
  }

  it('keeps the notice, records the error, tries again later with a growing delay, and then sends it once', async () => {
    const port = await freePort();
    const sender = makeOutboxSender(db(), createMailer(`smtp://127.0.0.1:${port}`), { retryBaseMs: 60_000 });
    const refId = Date.now();
    await unitOfWork(db(), (transaction) => enqueueNotice({ kind: 'test_retry', refId, to: ['lead@fernhollow.example'], subject: 'Retry me', text: 'Once' }, transaction));
    const warn = vi.spyOn(logger, 'warn').mockImplementation(() => {});
    const t0 = new Date();
    expect(await sender.sendDue(t0)).toEqual({ sent: 0, failed: 1 });
    let [row] = await rowsOf('test_retry', [refId]);
    expect(row).toMatchObject({ attempts: 1, sent_at: null, claim_token: null });
    expect(row!.last_error).toMatch(/ECONNREFUSED/);
    expect(new Date(row!.due_at).getTime() - t0.getTime()).toBe(60_000);
    // Not due again before the delay runs out.
    expect(await sender.sendDue(new Date(t0.getTime() + 59_000))).toEqual({ sent: 0, failed: 0 });
    // Still down at the second try: the delay doubles.
    const t1 = new Date(t0.getTime() + 60_000);
    expect(await sender.sendDue(t1)).toEqual({ sent: 0, failed: 1 });
    [row] = await rowsOf('test_retry', [refId]);
    expect(new Date(row!.due_at).getTime() - t1.getTime()).toBe(120_000);
    warn.mockRestore();

    const server: Catcher = await startMailCatcher({ smtpPort: port, viewerPort: 0 });
    try {
      expect(await sender.sendDue(new Date(t1.getTime() + 120_000))).toEqual({ sent: 1, failed: 0 });
      [row] = await rowsOf('test_retry', [refId]);
      expect(row).toMatchObject({ attempts: 3, last_error: null });
      expect(row!.sent_at).not.toBeNull();
      expect(await sender.sendDue(new Date(t1.getTime() + 10 * 60_000))).toEqual({ sent: 0, failed: 0 });
      expect(server.messages.map((m) => m.subject)).toEqual(['Retry me']);
    } finally {
      await server.stop();
    }
  });
});
