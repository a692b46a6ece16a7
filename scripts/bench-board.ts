// `npm run bench:board`: 200 signed-in Socket.IO clients watch one unit's handover board; one
// acknowledgement is posted over HTTP and we time how long until each client has the event
// (p50/p95/max), over BENCH_ROUNDS rounds (100) after two unrecorded warm-up rounds. The floor: a raw Socket.IO broadcast of the same size to the same room, timed
// from the emit. Server and clients share this process and machine; figures are reported only.
import http from 'node:http';
import { io as connect, type Socket } from 'socket.io-client';
import { QueryTypes } from 'sequelize';
import { percentile, startBench, type Client } from './lib/bench-harness';

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
let baseUrl = '';

async function main() {
  const bench = await startBench('board');
  const sockets: Socket[] = [];
  try {
    const outgoing = await bench.serve('operator');
    baseUrl = bench.baseUrl(); // operator.a, crew A: on shift in the demo rotation
    const unitId = (await bench.sequelize.query<{ id: number }>('SELECT MIN(id) AS id FROM units', { type: QueryTypes.SELECT }))[0]!.id;
    const board = ((await (await outgoing.call(`/api/units/${unitId}/handovers/current`)).json()) as { board: { handover: { id: number } } }).board;
    const handoverId = board.handover.id;
    for (let i = 0; i < ROUNDS + WARM_UP; i++) {
      await outgoing.call(`/api/handovers/${handoverId}/items`, { method: 'POST', headers: { 'x-csrf-token': outgoing.csrf }, body: JSON.stringify({ kind: 'follow_up', title: `Benchmark item ${i + 1}` }) });
    }
    await outgoing.call(`/api/handovers/${handoverId}/submit`, { method: 'POST', headers: { 'x-csrf-token': outgoing.csrf }, body: '{}' });
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
      socket.emit('watch-unit', unitId);
      sockets.push(socket);
    }
    await new Promise((r) => setTimeout(r, 500)); // let every join land

    const timeToAll = async (trigger: () => Promise<unknown> | void, expect: (payload: { entity?: string; probe?: boolean }) => boolean) => {
      const started = performance.now();
      const arrivals = sockets.map(
        (socket) =>
          new Promise<number>((resolve) => {
            const handler = (payload: { entity?: string; probe?: boolean }) => {
              if (!expect(payload)) return;
              socket.off('changed', handler);
              resolve(performance.now() - started);
            };
            socket.on('changed', handler);
          }),
      );
      await trigger();
      return Promise.all(arrivals);
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
    console.log(`(${WARM_UP} warm-up rounds of each not recorded)`);
    console.log(`${CLIENTS} clients × ${ROUNDS} acknowledgements posted → each client notified: ${summary(ackTimes)}`);
    console.log(`${CLIENTS} clients × ${ROUNDS} raw Socket.IO broadcasts of the same event (floor): ${summary(floorTimes)}`);
    console.log(`p95 ratio to the floor: ${(percentile(ackTimes, 95) / percentile(floorTimes, 95)).toFixed(2)}×`);
  } finally {
    for (const socket of sockets) socket.disconnect();
    await bench.stop();
  }
}

await main();
