// The device's queue of rounds and log entries made without a network, through an in-memory
// storage (happy-dom has no IndexedDB) and a stubbed server: what is kept, the order of sending,
// what a refusal or a sign-in answer does, and that another person's records wait for them.
import { act, render, screen, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { discard, replaceQueueStorage, sendOrKeep, sendQueued, loadQueue } from '../../src/features/offline/api/offline-store';
import { noteSignedInPerson } from '../../src/features/offline/api/session-person';
import { sendWaiting, type QueueStorage, type QueuedRecord } from '../../src/features/offline/api/queue';
import { WaitingRecords } from '../../src/features/offline/components/waiting-records';
import { ApiError } from '../../src/lib/api-client';
import { fakeServer } from './support/fake-server';

function memoryStorage(): QueueStorage & { rows: Map<string, QueuedRecord> } {
  const rows = new Map<string, QueuedRecord>();
  return {
    rows,
    list: async () => [...rows.values()].map((r) => structuredClone(r)),
    put: async (r) => void rows.set(r.clientId, structuredClone(r)),
    remove: async (id) => void rows.delete(id),
  };
}

let storage: ReturnType<typeof memoryStorage>;
beforeEach(() => {
  storage = memoryStorage();
  replaceQueueStorage(storage);
  // Person 7 is signed in on the page unless a test says otherwise.
  noteSignedInPerson(7);
});
afterEach(() => vi.restoreAllMocks());

const offline = () => vi.spyOn(navigator, 'onLine', 'get').mockReturnValue(false);
const entry = (text: string, userId = 7) => ({ kind: 'log_entry' as const, userId, unitId: 1, payload: { position: 'field', category: 'operation', text, carryToHandover: false }, summary: text });
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

describe('keeping a record on the device', () => {
  it('keeps it with a client id, the time entered and its author when offline, and sends nothing', async () => {
    const server = fakeServer({});
    offline();
    const before = Date.now();
    const outcome = await sendOrKeep(entry('Basin level 70 %'));
    expect(outcome.kept).toMatchObject({ kind: 'log_entry', userId: 7, unitId: 1, state: 'waiting', payload: { text: 'Basin level 70 %' } });
    expect(outcome.kept!.clientId).toMatch(UUID);
    expect(Date.parse(outcome.kept!.enteredAt)).toBeGreaterThanOrEqual(before);
    expect(server.calls).toHaveLength(0);
    expect([...storage.rows.keys()]).toEqual([outcome.kept!.clientId]);
  });

  it('keeps it when the request fails on the network, and sends it at once (with its client id only) when the server is there', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    const kept = await sendOrKeep(entry('Fan 2 tripped'));
    expect(kept.kept?.state).toBe('waiting');
    const server = fakeServer({ 'GET /api/session/csrf': { body: { csrfToken: 't' } }, 'POST /api/units/1/log': { status: 201, body: { id: 41 } } });
    const sent = await sendOrKeep(entry('Fan 2 restarted'));
    expect(sent.saved).toEqual({ id: 41 });
    const body = server.writes()[0]!.body as Record<string, unknown>;
    expect(body.clientId).toMatch(UUID);
    // Sent at once, the server's clock is the time of entry.
    expect(body).not.toHaveProperty('enteredAt');
    expect(storage.rows.size).toBe(1);
  });
});

describe('keeping a record when the app is down behind its proxy', () => {
  it('keeps it on a 502, 503 or 504 from the proxy, as when the network is gone', async () => {
    for (const status of [502, 503, 504]) {
      fakeServer({ 'GET /api/session/csrf': { body: { csrfToken: 't' } }, 'POST /api/units/1/log': { status, body: { error: { code: 'DOWN', message: 'Bad gateway' } } } });
      const outcome = await sendOrKeep(entry(`Answer ${status}`));
      expect(outcome.kept?.state).toBe('waiting');
    }
    expect(storage.rows.size).toBe(3);
  });
});

describe('sending what waits', () => {
  async function keepThree() {
    offline();
    const a = (await sendOrKeep(entry('first'))).kept!;
    const b = (await sendOrKeep(entry('second'))).kept!;
    const c = (await sendOrKeep(entry('third'))).kept!;
    vi.restoreAllMocks();
    return [a, b, c] as const;
  }

  it('sends in the order entered, with each record’s client id and time of entry, and removes each once stored', async () => {
    const [a, b, c] = await keepThree();
    const server = fakeServer({ 'GET /api/session/csrf': { body: { csrfToken: 't' } }, 'POST /api/units/1/log': ({ body }) => ({ status: 201, body: { id: (body as { text: string }).text.length } }) });
    const outcome = await sendQueued(7, () => undefined);
    expect(outcome).toEqual({ sent: 3, refused: 0, stopped: null });
    expect(server.writes().map((w) => w.body)).toEqual([a, b, c].map((r) => ({ ...r.payload, clientId: r.clientId, enteredAt: r.enteredAt })));
    expect(storage.rows.size).toBe(0);
  });

  it('stops sending when its author signs out mid-pass and the next person signs in: nothing goes out under their session', async () => {
    const [a, b, c] = await keepThree();
    const server = fakeServer({
      'GET /api/session/csrf': { body: { csrfToken: 't' } },
      'POST /api/units/1/log': () => {
        // Shift change on the same tablet while the first record is on its way.
        noteSignedInPerson(8);
        return { status: 201, body: { id: 1 } };
      },
    });
    const outcome = await sendQueued(7, () => undefined);
    expect(outcome).toEqual({ sent: 1, refused: 0, stopped: 'signed-out' });
    expect(server.writes()).toHaveLength(1);
    expect([...storage.rows.values()].map((r) => [r.clientId, r.state])).toEqual([
      [b.clientId, 'waiting'],
      [c.clientId, 'waiting'],
    ]);
    expect(storage.rows.has(a.clientId)).toBe(false);
  });

  it('keeps a refused record with the server’s reason and field messages, and goes on with the next', async () => {
    const [a, b, c] = await keepThree();
    fakeServer({
      'GET /api/session/csrf': { body: { csrfToken: 't' } },
      'POST /api/units/1/log': ({ body }) =>
        (body as { text: string }).text === 'second'
          ? { status: 400, body: { error: { code: 'VALIDATION', message: 'Check the fields marked', fields: { enteredAt: 'Entered more than 7 days ago' } } } }
          : { status: 201, body: { id: 1 } },
    });
    expect(await sendQueued(7, () => undefined)).toEqual({ sent: 2, refused: 1, stopped: null });
    expect([...storage.rows.keys()]).toEqual([b.clientId]);
    expect(storage.rows.get(b.clientId)).toMatchObject({ state: 'refused', refusal: { message: 'Check the fields marked', fields: { enteredAt: 'Entered more than 7 days ago' } } });
    expect(storage.rows.has(a.clientId) || storage.rows.has(c.clientId)).toBe(false);
    // A refused record is not sent again by itself: only its author's fix or discard moves it.
    const again = fakeServer({});
    await sendQueued(7, () => undefined);
    expect(again.writes()).toHaveLength(0);
  });

  it('keeps every record waiting, in order, when the server answers 401 or 403, and sends them after sign-in', async () => {
    await keepThree();
    for (const status of [401, 403]) {
      const server = fakeServer({ 'GET /api/session/csrf': { body: { csrfToken: 't' } }, 'POST /api/units/1/log': { status, body: { error: { code: 'SIGNED_OUT', message: 'Sign in' } } } });
      expect(await sendQueued(7, () => undefined)).toEqual({ sent: 0, refused: 0, stopped: 'signed-out' });
      // Stopped at the first: the later ones never overtake it.
      expect(server.writes()).toHaveLength(1);
      expect([...storage.rows.values()].every((r) => r.state === 'waiting')).toBe(true);
      expect(storage.rows.size).toBe(3);
    }
    fakeServer({ 'GET /api/session/csrf': { body: { csrfToken: 't' } }, 'POST /api/units/1/log': { status: 201, body: { id: 1 } } });
    expect((await sendQueued(7, () => undefined)).sent).toBe(3);
  });

  it('stops at a network failure and keeps the rest waiting', async () => {
    await keepThree();
    let calls = 0;
    const send = async () => {
      calls += 1;
      if (calls === 2) throw new ApiError(0, 'NETWORK', 'The server could not be reached');
    };
    expect(await sendWaiting(storage, 7, send)).toEqual({ sent: 1, refused: 0, stopped: 'network' });
    expect([...storage.rows.values()].map((r) => r.payload.text)).toEqual(['second', 'third']);
  });

  it('sends only the signed-in person’s records; another person’s wait for them', async () => {
    offline();
    const mine = (await sendOrKeep(entry('mine', 7))).kept!;
    const theirs = (await sendOrKeep(entry('theirs', 8))).kept!;
    vi.restoreAllMocks();
    const server = fakeServer({ 'GET /api/session/csrf': { body: { csrfToken: 't' } }, 'POST /api/units/1/log': { status: 201, body: { id: 1 } } });
    await sendQueued(7, () => undefined);
    expect(server.writes().map((w) => (w.body as { clientId: string }).clientId)).toEqual([mine.clientId]);
    expect([...storage.rows.keys()]).toEqual([theirs.clientId]);
  });
});

describe('the list of what waits', () => {
  it('shows a waiting record with its time of entry in station time, and a refused one with its reason, Fix and resend and Discard', async () => {
    const waiting: QueuedRecord = { clientId: 'a', kind: 'log_entry', userId: 7, unitId: 1, enteredAt: '2026-01-15T06:30:05.000Z', sequence: 1, payload: { text: 'Basin level 70 %' }, summary: 'Basin level 70 %', state: 'waiting' };
    const refused: QueuedRecord = { ...waiting, clientId: 'b', sequence: 2, summary: 'Fan 2 tripped', state: 'refused', refusal: { message: 'Check the fields marked', fields: { enteredAt: 'Entered more than 7 days ago' } } };
    await storage.put(waiting);
    await storage.put(refused);
    await act(async () => loadQueue());
    const onFix = vi.fn();
    render(<WaitingRecords kind="log_entry" unitId={1} userId={7} timeZone="Europe/Berlin" onFix={onFix} />);
    const items = await screen.findAllByTestId('waiting-record');
    // 06:30:05 UTC is 07:30:05 in Berlin in January (CET, UTC+1: IANA tz database).
    expect(items[0]!.textContent).toContain('waiting to send');
    expect(items[0]!.textContent).toContain('entered 2026-01-15 07:30:05 (station time)');
    expect(items[1]!.textContent).toContain('refused on arrival');
    expect(items[1]!.textContent).toContain('Time of entry: Entered more than 7 days ago');
    within(items[1]!).getByRole('button', { name: 'Fix and resend' }).click();
    expect(onFix).toHaveBeenCalledWith(expect.objectContaining({ clientId: 'b' }));
    await act(async () => discard('b'));
    expect(screen.getAllByTestId('waiting-record')).toHaveLength(1);
  });
});

describe('the shell’s online indicator', () => {
  it('says Online once the browser has its network back, even if the “online” event came before it listened', async () => {
    fakeServer({ 'GET /api/session/csrf': { body: { csrfToken: 't' } } });
    const onLine = vi.spyOn(navigator, 'onLine', 'get').mockReturnValue(false);
    const { QueryClient, QueryClientProvider } = await import('@tanstack/react-query');
    const { OfflineStatus } = await import('../../src/features/offline/components/offline-status');
    render(
      <QueryClientProvider client={new QueryClient()}>
        <OfflineStatus userId={7} />
      </QueryClientProvider>,
    );
    expect(screen.getByRole('status').textContent).toMatch(/Offline/);
    // The network comes back between the indicator's first draw and its listening (no event reaches it) ...
    onLine.mockReturnValue(true);
    // ... and the next change of the queue redraws it: it must read the network afresh, not keep “Offline”.
    await act(async () => {
      await discard('a record not on this device');
    });
    expect(screen.getByRole('status').textContent).toMatch(/^\W*Online/);
  });
});
