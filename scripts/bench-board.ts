// `npm run bench:board`: 200 signed-in Socket.IO clients have one unit's handover board open.
// 1. One acknowledgement is posted over HTTP; time until each client has the event.
// 2. One round is saved over HTTP; time from the save's HTTP response until each client has the
//    round's event (the board's condenser panel refetches on it). An event that arrives before the
//    response counts as 0 ms; how many did is reported.
// Each over BENCH_ROUNDS rounds (100) after two unrecorded warm-up rounds, p50/p95/max. The floor,
// in the same run: a raw Socket.IO broadcast of the same size to the same room, timed from the
// emit. Server and clients share this process and machine; figures are reported only.
import http from 'node:http';
import { io as connect, type Socket } from 'socket.io-client';
import { QueryTypes } from 'sequelize';
import { onPublished } from '../server/lib/live';
import { percentile, startBench, type Client } from './lib/bench-harness';
import { forgetReferenceData } from '../server/lib/reference-cache';

const CLIENTS = Number(process.env.BENCH_CLIENTS ?? 200);
// With 200 clients a round is 200 samples: over 100 rounds the p95 is the 95th-percentile round,
// not (as with 20) simply the slowest one.
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 100);
// Unrecorded rounds first, so neither series pays for first-use costs (JIT, cold pool connections).
const WARM_UP = 2;

function summary(times: number[]) {
  return `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms, max ${Math.max(...times).toFixed(1)} ms`;
}

// The acknowledgement goes out on a plain keep-alive node:http request: fetch (undici) adds 1–2 ms
// of client-side work in this same process before the request even leaves, which is not the
// server's path being measured (the floor is timed from the server's emit).
const agent = new http.Agent({ keepAlive: true });
function post(path: string, client: Client) {
  return new Promise<void>((resolve, reject) => {
    const request = http.request(new URL(path, baseUrl), { method: 'POST', agent, headers: { cookie: client.cookie(), 'x-csrf-token': client.csrf, 'content-type': 'application/json' } }, (response) => {
      response.resume();
      response.on('end', () => (response.statusCode === 201 ? resolve() : reject(new Error(`acknowledge: HTTP ${response.statusCode}`))));
    });
    request.on('error', reject);
    request.end('{}');
  });
}
function postJson(path: string, client: Client, body: unknown) {
  return new Promise<void>((resolve, reject) => {
    const request = http.request(new URL(path, baseUrl), { method: 'POST', agent, headers: { cookie: client.cookie(), 'x-csrf-token': client.csrf, 'content-type': 'application/json' } }, (response) => {
      response.resume();
      response.on('end', () => (response.statusCode === 201 ? resolve() : reject(new Error(`${path}: HTTP ${response.statusCode}`))));
    });
    request.on('error', reject);
    request.end(JSON.stringify(body));
  });
}

/** A plausible round, a little different each time (8.3–8.9 kPa a, 29.5–30.4 °C outlet). */
const roundBody = (i: number) => ({
  pressure: { value: 8.3 + (i % 7) / 10, unit: 'kPa_a' },
  hotwellTemperature: { value: 41.5, unit: 'degC' },
  cwInletTemperature: { value: 21, unit: 'degC' },
  cwOutletTemperature: { value: 29.5 + (i % 10) / 10, unit: 'degC' },
  cwFlow: { value: 54_000, unit: 'm3_h' },
});

let baseUrl = '';

async function main() {
  const bench = await startBench('board');
  const sockets: Socket[] = [];
  try {
    const outgoing = await bench.serve('operator');
    baseUrl = bench.baseUrl(); // operator.a, crew A: on shift in the demo rotation
    const unitId = (await bench.sequelize.query<{ id: number }>('SELECT MIN(id) AS id FROM units', { type: QueryTypes.SELECT }))[0]!.id;
    // Submit and acceptance may happen at any time of the shift here, whatever the time of day.
    await bench.sequelize.query('UPDATE station_settings SET handover_window_before_minutes = 720, handover_window_after_minutes = 0');
    // Behind the models' back: the server in this process must not keep the settings it cached before.
    forgetReferenceData();
    const started = await outgoing.call(`/api/units/${unitId}/handovers/current`, { method: 'POST', headers: { 'x-csrf-token': outgoing.csrf }, body: '{}' });
    if (started.status !== 201) throw new Error(`start the handover: HTTP ${started.status} ${await started.text()}`);
    const board = ((await started.json()) as { board: { handover: { id: number } } }).board;
    const handoverId = board.handover.id;
    for (let i = 0; i < ROUNDS + WARM_UP; i++) {
      await outgoing.call(`/api/handovers/${handoverId}/items`, { method: 'POST', headers: { 'x-csrf-token': outgoing.csrf }, body: JSON.stringify({ kind: 'follow_up', title: `Benchmark item ${i + 1}` }) });
    }
    const submitted = await outgoing.call(`/api/handovers/${handoverId}/submit`, { method: 'POST', headers: { 'x-csrf-token': outgoing.csrf }, body: '{}' });
    if (submitted.status !== 200) throw new Error(`submit: HTTP ${submitted.status} ${await submitted.text()}`);
    const items = ((await (await outgoing.call(`/api/handovers/${handoverId}`)).json()) as { board: { items: { id: number }[] } }).board.items.slice(0, ROUNDS + WARM_UP);

    // 200 sessions of the incoming crew, each with its own socket on the unit's room.
    const incoming = await bench.signIn('operator.b@fernhollow.example');
    for (let i = 0; i < CLIENTS; i++) {
      const session = i === 0 ? incoming : await bench.signIn(i % 2 ? 'lead.b@fernhollow.example' : 'operator.b@fernhollow.example');
      const socket = connect(bench.baseUrl(), { transports: ['websocket'], extraHeaders: { cookie: session.cookie() }, forceNew: true });
      await new Promise<void>((resolve, reject) => {
        socket.once('connect', () => resolve());
        socket.once('connect_error', reject);
      });
      // What the board page does: watch the unit's records and be counted on the board.
      socket.emit('watch-unit', unitId);
      socket.emit('open-board', unitId);
      sockets.push(socket);
    }
    await new Promise((r) => setTimeout(r, 500)); // let every join land

    /** The moment (performance.now) each client has a matching event, after `trigger` runs. */
    const arrivalStamps = async (trigger: () => Promise<unknown> | void, expect: (payload: { entity?: string; probe?: boolean }) => boolean) => {
      const arrivals = sockets.map(
        (socket) =>
          new Promise<number>((resolve) => {
            const handler = (payload: { entity?: string; probe?: boolean }) => {
              if (!expect(payload)) return;
              socket.off('changed', handler);
              resolve(performance.now());
            };
            socket.on('changed', handler);
          }),
      );
      await trigger();
      return Promise.all(arrivals);
    };

    /** How long after the trigger started each client has a matching event. */
    const timeToAll = async (trigger: () => Promise<unknown> | void, expect: (payload: { entity?: string; probe?: boolean }) => boolean) => {
      const started = performance.now();
      return (await arrivalStamps(trigger, expect)).map((at) => at - started);
    };

    // One acknowledgement per item (each a separate round), alternating with the raw broadcast.
    const ackTimes: number[] = [];
    const floorTimes: number[] = [];
    const payload = { entity: 'handover', id: handoverId, unitId, probe: true };
    for (const [round, item] of items.entries()) {
      const recorded = round >= WARM_UP;
      const acks = await timeToAll(
          () => post(`/api/handover-items/${item.id}/acknowledge`, incoming),
          (p) => p.entity === 'handover' && !p.probe,
      );
      const floor = await timeToAll(() => void bench.io().to(`unit:${unitId}`).emit('changed', payload), (p) => p.probe === true);
      if (recorded) {
        ackTimes.push(...acks);
        floorTimes.push(...floor);
      }
    }
    // Rounds saved by the outgoing operator: from the save's response to each board having the event.
    const roundTimes: number[] = [];
    const fromCommit: number[] = [];
    const fromRequest: number[] = [];
    // The moment the round's transaction committed and its event left (same process: one clock).
    let publishedAt = 0;
    const stopListening = onPublished(bench.sequelize, (event) => {
      if (event.entity === 'reading') publishedAt = performance.now();
    });
    const roundFloor: number[] = [];
    const saveTimes: number[] = [];
    let beforeResponse = 0;
    const roundPayload = { entity: 'reading', id: 0, unitId, probe: true };
    for (let i = 0; i < ROUNDS + WARM_UP; i++) {
      const recorded = i >= WARM_UP;
      let requestedAt = 0;
      let respondedAt = 0;
      const stamps = await arrivalStamps(
        async () => {
          requestedAt = performance.now();
          await postJson(`/api/units/${unitId}/readings`, outgoing, roundBody(i));
          respondedAt = performance.now();
        },
        (p) => p.entity === 'reading' && !p.probe,
      );
      const floor = await timeToAll(() => void bench.io().to(`unit:${unitId}`).emit('changed', roundPayload), (p) => p.probe === true);
      if (recorded) {
        for (const at of stamps) {
          if (at < respondedAt) beforeResponse += 1;
          roundTimes.push(Math.max(0, at - respondedAt));
          fromCommit.push(at - publishedAt);
          fromRequest.push(at - requestedAt);
        }
        saveTimes.push(respondedAt - requestedAt);
        roundFloor.push(...floor);
      }
    }

    console.log(`(${WARM_UP} warm-up rounds of each not recorded)`);
    console.log(`${CLIENTS} clients × ${ROUNDS} acknowledgements posted → each client notified: ${summary(ackTimes)}`);
    console.log(`${CLIENTS} clients × ${ROUNDS} raw Socket.IO broadcasts of the same event (floor): ${summary(floorTimes)}`);
    console.log(`p95 ratio to the floor: ${(percentile(ackTimes, 95) / percentile(floorTimes, 95)).toFixed(2)}×`);
    console.log('');
    console.log(`${ROUNDS} rounds saved (HTTP, request to response): ${summary(saveTimes)}`);
    stopListening();
    console.log(`${CLIENTS} clients × ${ROUNDS} rounds → from the save's response to each board having the event: ${summary(roundTimes)} (${beforeResponse} of ${roundTimes.length} arrived before the response, counted as 0 ms)`);
    console.log(`  the same events from the request being sent: ${summary(fromRequest)}`);
    console.log(`  the same events from the commit (the event leaving the publish point): ${summary(fromCommit)}`);
    console.log(`${CLIENTS} clients × ${ROUNDS} raw Socket.IO broadcasts of the same event (floor, from the emit): ${summary(roundFloor)}`);
    console.log(`p95 ratio to the floor, from the response: ${(percentile(roundTimes, 95) / percentile(roundFloor, 95)).toFixed(2)}×; from the commit: ${(percentile(fromCommit, 95) / percentile(roundFloor, 95)).toFixed(2)}×`);
  } finally {
    for (const socket of sockets) socket.disconnect();
    await bench.stop();
  }
}

await main();
