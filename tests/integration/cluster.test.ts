// Two app nodes (separate processes) on one database and one Redis, as `npm run start:cluster` runs
// them: live updates cross nodes, reminders go out once, the sign-in limits hold whichever node
// answers, and a node killed mid-shift leaves its browsers to reconnect to the other and catch up.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io as connect, type Socket } from 'socket.io-client';
import { createClient } from 'redis';
import { QueryTypes } from 'sequelize';
import { Handover, HandoverItem } from '../../server/features/handovers/model';
import { User } from '../../server/features/users/model';
import { startCatcher, waitForMessage, type Catcher } from './support/mail';
import { redisUrl, signIn, startBalancer, startNode, type Balancer, type Client, type Node } from './support/nodes';
import { PASSWORD, closeAll, db, makeStation, makeUser } from './support/test-app';

let a: Node;
let b: Node;
let balancer: Balancer;
let catcher: Catcher;
let unitId = 0;
let unitName = '';
let stationId = 0;
const itemIds: number[] = [];
let handoverId = 0;
let incoming: Client[] = [];
let incomingLead: User;
const sockets: Socket[] = [];

/** A browser's live connection: the session's cookie, the unit's room joined on every (re)connect. */
function liveClient(base: string, client: Client): Promise<Socket> {
  const socket = connect(base, { transports: ['websocket'], extraHeaders: { cookie: client.cookie() }, forceNew: true, reconnectionDelay: 100, reconnectionDelayMax: 500 });
  sockets.push(socket);
  socket.on('connect', () => socket.emit('watch-unit', unitId));
  return new Promise((resolve, reject) => {
    socket.once('connect', () => setTimeout(() => resolve(socket), 150)); // let the join land
    socket.once('connect_error', reject);
  });
}

const nextChange = (socket: Socket, matches: (event: { entity: string; id: number }) => boolean, timeoutMs = 5_000) =>
  new Promise<{ entity: string; id: number }>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('no live event arrived')), timeoutMs);
    const handler = (event: { entity: string; id: number }) => {
      if (!matches(event)) return;
      clearTimeout(timer);
      socket.off('changed', handler);
      resolve(event);
    };
    socket.on('changed', handler);
  });

const acknowledge = (client: Client, base: string, itemId: number) =>
  client.call(base, `/api/handover-items/${itemId}/acknowledge`, { method: 'POST', headers: { 'x-csrf-token': client.csrf }, body: '{}' });

beforeAll(async () => {
  db(); // models initialised on the test database
  // The sign-in form counters of an earlier run (an outside Redis keeps them for a minute).
  const redis = createClient({ url: redisUrl() });
  await redis.connect();
  for await (const keys of redis.scanIterator({ MATCH: 'hotwell:sign-in-forms:*' })) if (keys.length) await redis.del(keys);
  await redis.close();

  catcher = await startCatcher();
  const { station, unit, crews } = await makeStation(2);
  stationId = station.id;
  unitId = unit.id;
  unitName = unit.name;
  const [outgoing, incomingCrew] = crews as [(typeof crews)[0], (typeof crews)[0]];
  const writer = await makeUser('operator', { crewId: outgoing.id });
  incomingLead = await makeUser('shift_lead', { crewId: incomingCrew.id });
  const incomingPeople = [incomingLead, await makeUser('operator', { crewId: incomingCrew.id }), await makeUser('operator', { crewId: incomingCrew.id })];
  // A handover submitted 31 minutes into the shift and not accepted: late, so a reminder is due.
  const handoverAt = new Date(Date.now() - 31 * 60_000);
  const handover = await Handover.create({
    unitId,
    shiftStart: new Date(handoverAt.getTime() - 12 * 3_600_000),
    handoverAt,
    outgoingCrewId: outgoing.id,
    incomingCrewId: incomingCrew.id,
    notesHtml: '<p>Cluster test</p>',
    status: 'submitted',
    createdBy: writer.id,
    createdAt: new Date(),
    submittedBy: writer.id,
    submittedAt: new Date(),
    acceptedBy: null,
    acceptedAt: null,
  });
  handoverId = handover.id;
  for (let i = 0; i < 4; i++) {
    const item = await HandoverItem.create({ handoverId, kind: 'follow_up', title: `Cluster item ${i + 1}`, detail: null, reference: null, priority: 'normal', sourceId: null, createdBy: writer.id, createdAt: new Date() });
    itemIds.push(item.id);
  }
  const node = { SMTP_URL: catcher.smtpUrl, REMINDER_INTERVAL_SECONDS: '1', OUTBOX_INTERVAL_SECONDS: '1', ANONYMOUS_TOKEN_LIMIT: '60' };
  [a, b] = await Promise.all([startNode(node), startNode(node)]);
  // Sessions are in MariaDB: signed in on A, the same cookie works on B.
  incoming = await Promise.all(incomingPeople.map((person) => signIn(a.url, person.email, PASSWORD)));
}, 90_000);

afterAll(async () => {
  for (const socket of sockets) socket.disconnect();
  await Promise.all([a?.stop(), b?.stop()]);
  await balancer?.close();
  await catcher?.stop();
  await closeAll();
});

describe('two app nodes on Redis', () => {
  it('a browser connected to node B gets the acknowledgement posted on node A', async () => {
    const onB = await liveClient(b.url, incoming[0]!);
    const event = nextChange(onB, (e) => e.entity === 'handover' && e.id === handoverId);
    const response = await acknowledge(incoming[1]!, a.url, itemIds[0]!);
    expect(response.status).toBe(201);
    expect(await event).toMatchObject({ entity: 'handover', id: handoverId });
  });

  it('a station setting changed on node A is what node B answers next (each node caches reference data)', async () => {
    const admin = await signIn(a.url, (await makeUser('admin')).email, PASSWORD);
    const settingsOn = async (base: string) => ((await (await admin.call(base, `/api/stations/${stationId}/settings`)).json()) as { settings: { lateEntryMinutes: number } }).settings;
    // Node B reads, and keeps, the settings as they are.
    const before = await settingsOn(b.url);
    const changed = { ...before, lateEntryMinutes: before.lateEntryMinutes + 7 };
    const saved = await admin.call(a.url, `/api/stations/${stationId}/settings`, { method: 'PUT', headers: { 'x-csrf-token': admin.csrf }, body: JSON.stringify(changed) });
    expect(saved.status).toBe(200);
    // Node A forgot at its commit; node B forgets when Redis tells it (milliseconds; its own limit is a minute).
    const deadline = Date.now() + 2_000;
    let seen = (await settingsOn(b.url)).lateEntryMinutes;
    while (seen !== changed.lateEntryMinutes && Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, 50));
      seen = (await settingsOn(b.url)).lateEntryMinutes;
    }
    expect(seen).toBe(changed.lateEntryMinutes);
    expect((await settingsOn(a.url)).lateEntryMinutes).toBe(changed.lateEntryMinutes);
  });

  it('sends the late-acceptance reminder exactly once, with both nodes checking every second', async () => {
    const isReminder = (mail: { subject: string; to: string[] }) => mail.subject === `Handover for ${unitName} not yet accepted`;
    const mail = await waitForMessage(catcher, isReminder, 15_000);
    expect(mail.to).toEqual([incomingLead.email]);
    // Both nodes keep looking (and sending what is due) for a few more rounds: nothing more for it.
    await new Promise((r) => setTimeout(r, 4_000));
    expect(catcher.messages.filter(isReminder)).toHaveLength(1);
    const rows = await db().query<{ sentAt: Date | null }>('SELECT sent_at AS sentAt FROM outbox WHERE kind = ? AND ref_id = ?', {
      replacements: ['handover_late', handoverId],
      type: QueryTypes.SELECT,
    });
    expect(rows).toHaveLength(1);
    expect(rows[0]!.sentAt).not.toBeNull();
    // Both nodes were up and checking all along, without a failed check.
    for (const node of [a, b]) {
      expect(node.process.exitCode).toBeNull();
      expect(node.output()).not.toMatch(/reminder check failed/);
    }
  });

  it('the sign-in lock counts failures on either node, and the sign-in form limit is one count in Redis', async () => {
    const person = await makeUser('operator');
    const tryPassword = async (base: string, password: string) => {
      const form = await fetch(`${base}/api/session/csrf`);
      const cookie = form.headers.get('set-cookie')!.split(';')[0]!;
      const { csrfToken } = (await form.json()) as { csrfToken: string };
      return fetch(`${base}/api/session`, { method: 'POST', headers: { cookie, 'x-csrf-token': csrfToken, 'content-type': 'application/json' }, body: JSON.stringify({ email: person.email, password }) });
    };
    // Five failures, alternating between the nodes, lock the account on both.
    for (let i = 0; i < 5; i++) expect((await tryPassword(i % 2 ? b.url : a.url, 'wrong password')).status).toBe(401);
    for (const node of [a, b]) {
      const refused = await tryPassword(node.url, PASSWORD);
      expect(refused.status).toBe(429);
      expect(((await refused.json()) as { error: { code: string } }).error.code).toBe('SIGN_IN_LOCKED');
    }
    // The form limit (60 a minute here): each node's answer counts the other's forms too.
    const remaining = async (base: string) => {
      const response = await fetch(`${base}/api/session/csrf`);
      return { status: response.status, left: Number(/r=(\d+)/.exec(response.headers.get('ratelimit') ?? '')?.[1]) };
    };
    const first = await remaining(a.url);
    const second = await remaining(b.url);
    expect(second.left).toBe(first.left - 1);
    const statuses: number[] = [];
    for (let i = 0; i < first.left + 2; i++) statuses.push((await remaining(i % 2 ? a.url : b.url)).status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(first.left - 1);
    expect(statuses.slice(-2)).toEqual([429, 429]);
  });

  it('when a node is killed, its browsers reconnect through the balancer to the other node and catch up', async () => {
    balancer = await startBalancer([a.port, b.port]);
    const viewer = incoming[2]!;
    // A tab through the balancer (on node A, the first that accepts) that refetches the board on every (re)connect.
    const seen: number[] = [];
    const board = async () => {
      const response = await viewer.call(balancer.url, `/api/handovers/${handoverId}`);
      const body = (await response.json()) as { board: { items: { id: number; acknowledgedBy: unknown[] }[] } };
      return body.board.items.find((item) => item.id === itemIds[1])!.acknowledgedBy.length;
    };
    const tab = await liveClient(balancer.url, viewer);
    tab.on('connect', () => void board().then((count) => seen.push(count)));
    expect(await board()).toBe(0);

    a.process.kill('SIGKILL');
    await a.exited;
    // While the tab is away, someone acknowledges on node B: the tab misses the event itself.
    expect((await acknowledge(incoming[0]!, b.url, itemIds[1]!)).status).toBe(201);
    // It reconnects (to B, through the balancer) and refetches, so it shows the acknowledgement.
    const until = Date.now() + 10_000;
    while (!seen.includes(1) && Date.now() < until) await new Promise((r) => setTimeout(r, 50));
    expect(seen).toContain(1);
    expect(tab.connected).toBe(true);
    // And it hears what happens next, live, on the node it is now on.
    const event = nextChange(tab, (e) => e.entity === 'handover' && e.id === handoverId);
    expect((await acknowledge(incoming[1]!, b.url, itemIds[2]!)).status).toBe(201);
    await event;
  });
});
