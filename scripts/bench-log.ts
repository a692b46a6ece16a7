// `npm run bench:log`: seeds 5 years of narrative log for two units (~200 000 entries) into a
// private throwaway MariaDB, serves the app and measures over HTTP (200 requests each, p50/p95):
//   - the latest-200-entries view of a unit
//   - one shift's entries (a random past shift).
// Figures are reported, not asserted.
import { QueryTypes } from 'sequelize';
import { shiftStartFor } from '../shared/shift-time';
import { defaultStationSettings } from '../server/features/stations/settings';
import { startBench, timeRequests } from './lib/bench-harness';

const YEARS = Number(process.env.BENCH_YEARS ?? 5);
const PER_UNIT = Math.round((YEARS * 200_000) / 5 / 2);
const BATCH = 2000;
const { timeZone, shiftChangeTimes, positions, categories } = defaultStationSettings;
const phrases = [
  'Started 1-CWP-A; discharge pressure normal.',
  'Backwashed waterbox B; screen differential back to normal.',
  'Vacuum-decay test with air removal isolated: 0.8 mbar/min.',
  'Blowdown increased to hold cycles near 5.',
  'Informed the shift lead of rising TTD.',
  'Took the shift from the outgoing crew after the panel walkdown.',
  'Chemistry sample taken; pH 8.1, conductivity 2100 µS/cm.',
  'Cooling-tower fan 3 tripped on vibration; reset after inspection.',
];

async function main() {
  const bench = await startBench('log');
  const { sequelize } = bench;
  try {
    const units = await sequelize.query<{ id: number }>('SELECT id FROM units', { type: QueryTypes.SELECT });
    const authors = (await sequelize.query<{ id: number }>(`SELECT id FROM users WHERE role IN ('operator','shift_lead','trainee')`, { type: QueryTypes.SELECT })).map((u) => u.id);
    const end = Date.now() - 86_400_000;
    const span = YEARS * 365 * 86_400_000;
    const started = Date.now();
    let state = 4242;
    const next = () => ((state = (state * 1_103_515_245 + 12_345) % 2_147_483_648), state / 2_147_483_648);
    const shiftStarts: number[] = [];
    for (const unit of units) {
      for (let done = 0; done < PER_UNIT; done += BATCH) {
        const rows: unknown[] = [];
        for (let i = done; i < Math.min(PER_UNIT, done + BATCH); i++) {
          const eventAt = new Date(end - span + (i / PER_UNIT) * span + Math.floor(next() * 600_000));
          const shiftStart = shiftStartFor(eventAt, timeZone, shiftChangeTimes);
          if (i % 500 === 0) shiftStarts.push(shiftStart.getTime());
          rows.push([
            unit.id,
            positions[i % positions.length]!.key,
            categories[Math.floor(next() * categories.length)]!.key,
            eventAt,
            eventAt,
            eventAt,
            shiftStart,
            0,
            authors[i % authors.length],
            phrases[Math.floor(next() * phrases.length)],
            0,
          ]);
        }
        await sequelize.query(
          `INSERT INTO log_entries (unit_id, position, category, event_at, entered_at, received_at, shift_start, late, author_id, text, carry_to_handover) VALUES ${rows.map(() => '(?)').join(',')}`,
          { replacements: rows },
        );
      }
    }
    const count = (await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM log_entries', { type: QueryTypes.SELECT }))[0]!.n;
    console.log(`seeded ${Number(count).toLocaleString('en-GB')} log entries in ${((Date.now() - started) / 1000).toFixed(0)} s`);

    const { call } = await bench.serve('operator');
    const latest = await timeRequests(200, (i) => call(`/api/units/${units[i % units.length]!.id}/log?limit=200`));
    console.log(`latest 200 entries of a unit: p50 ${latest.p50.toFixed(1)} ms, p95 ${latest.p95.toFixed(1)} ms over 200 requests`);
    const oneShift = await timeRequests(200, (i) => {
      const shift = new Date(shiftStarts[Math.floor(next() * shiftStarts.length)]!).toISOString();
      return call(`/api/units/${units[i % units.length]!.id}/log?shiftStart=${encodeURIComponent(shift)}`);
    });
    console.log(`one shift's entries: p50 ${oneShift.p50.toFixed(1)} ms, p95 ${oneShift.p95.toFixed(1)} ms over 200 requests`);
  } finally {
    await bench.stop();
  }
}

await main();
