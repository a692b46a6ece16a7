import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { HandoverAmendment, HandoverItem } from '../../server/features/handovers/model';
import { HandoverAttachment } from '../../server/features/attachments/model';
import { createApp } from '../../server/app';
import { s3Storage } from '../../server/lib/storage';
import { SECRET, anonymousAgent, closeAll, db, makeStation, makeUser, signedInAgent, type Agent } from './support/test-app';
import { startFakeS3 } from './support/fake-s3';

const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAQAAAC1HAwCAAAAC0lEQVR42mNkYAAAAAYAAjCB0C8AAAAASUVORK5CYII=', 'base64');
const PDF = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n');
// A Windows executable's header ("MZ" … "PE") under a photo's name.
const EXE = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(58), Buffer.from([0x40, 0, 0, 0]), Buffer.from('PE\0\0'), Buffer.alloc(200)]);

let s3: Awaited<ReturnType<typeof startFakeS3>>;
let built: ReturnType<typeof createApp>;
let itemId = 0;
let handoverId = 0;
let handoverAt = '';
let writer: Agent;

beforeAll(async () => {
  s3 = await startFakeS3();
  built = createApp(
    db(),
    { sessionSecret: SECRET, behindHttpsProxy: false },
    { storage: s3Storage({ endpoint: s3.endpoint, bucket: 'hotwell-test', accessKeyId: 'local', secretAccessKey: 'local' }) },
  );
  const { unit, crews } = await makeStation(2);
  writer = await signedInAgent(built, (await makeUser('operator', { crewId: crews[0]!.id })).email);
  const admin = await signedInAgent(built, (await makeUser('admin')).email);
  const shifts = await admin.get(`/api/units/${unit.id}/log/shifts`).expect(200);
  await admin.put(`/api/stations/${unit.stationId}/crew-rotation`).set('X-CSRF-Token', admin.csrf).send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: crews.map((c) => c.id) }).expect(200);
  const board = (await writer.post(`/api/units/${unit.id}/handovers/current`).set('X-CSRF-Token', writer.csrf).send({}).expect(201)).body.board;
  handoverId = board.handover.id;
  handoverAt = board.handover.handoverAt;
  const created = await writer.post(`/api/handovers/${board.handover.id}/items`).set('X-CSRF-Token', writer.csrf).send({ kind: 'equipment', title: '1-CWP-B coupling guard cracked' });
  itemId = created.body.id;
});
afterAll(async () => {
  built.close();
  await s3.stop();
  await closeAll();
});

const upload = (agent: Agent, file: Buffer, name: string) =>
  agent.post(`/api/handover-items/${itemId}/attachments`).set('X-CSRF-Token', agent.csrf).attach('file', file, name);

describe('handover attachments (S3-compatible storage against a local fake)', () => {
  it('stores a photo and a PDF by their real type and serves them back', async () => {
    const photo = await upload(writer, PNG, 'guard.png');
    expect(photo.status).toBe(201);
    expect(photo.body.mime).toBe('image/png');
    const pdf = await upload(writer, PDF, 'permit.pdf');
    expect(pdf.body.mime).toBe('application/pdf');
    expect([...s3.objects.keys()].some((k) => k.startsWith('/hotwell-test/handovers/'))).toBe(true);
    const back = await writer.get(`/api/attachments/${photo.body.id}`).buffer(true).expect(200);
    expect(back.headers['content-type']).toBe('image/png');
    // Served as a download that can run nothing, never as a page of the app's origin.
    expect(back.headers['content-disposition']).toMatch(/^attachment;/);
    expect(back.headers['content-security-policy']).toMatch(/sandbox/);
    expect(Buffer.compare(back.body as Buffer, PNG)).toBe(0);
  });

  it('refuses a renamed executable and a script named as a PDF', async () => {
    const exe = await upload(writer, EXE, 'photo.png');
    expect(exe.status).toBe(400);
    expect(exe.body.error.fields.file).toMatch(/Only photos/);
    const script = await upload(writer, Buffer.from('#!/bin/sh\nrm -rf /\n'), 'notes.pdf');
    expect(script.status).toBe(400);
  });

  it('answers 401 signed out, 403 to someone outside the outgoing crew, 413 over 10 MB', async () => {
    await upload(await anonymousAgent(built), PNG, 'a.png').expect(401);
    await upload(await signedInAgent(built, (await makeUser('operator')).email), PNG, 'a.png').expect(403);
    const big = await upload(writer, Buffer.concat([PNG, Buffer.alloc(11 * 1024 * 1024)]), 'big.png');
    expect(big.status).toBe(413);
  });

  it('after submit, takes a file only as an amendment with a reason, and the item must be acknowledged again', async () => {
    vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
    vi.setSystemTime(new Date(new Date(handoverAt).getTime() - 30 * 60_000));
    try {
      await writer.post(`/api/handovers/${handoverId}/submit`).set('X-CSRF-Token', writer.csrf).send({}).expect(200);
      const versionBefore = (await HandoverItem.findByPk(itemId))!.version;
      const noReason = await upload(writer, PNG, 'late.png');
      expect(noReason.status).toBe(400);
      expect(noReason.body.error.fields.reason).toMatch(/amendment/);
      const late = await writer
        .post(`/api/handover-items/${itemId}/attachments`)
        .set('X-CSRF-Token', writer.csrf)
        .field('reason', 'Photo of the crack taken after submit')
        .attach('file', PNG, 'late.png');
      expect(late.status).toBe(201);
      const amendment = await HandoverAmendment.findByPk(late.body.amendmentId);
      expect(amendment).toMatchObject({ itemId, reason: 'Photo of the crack taken after submit' });
      expect(amendment!.text).toContain('late.png');
      expect((await HandoverAttachment.findByPk(late.body.id))!.amendmentId).toBe(amendment!.id);
      expect((await HandoverItem.findByPk(itemId))!.version).toBe(versionBefore + 1);
    } finally {
      vi.useRealTimers();
    }
  });
});
