// `npm run bench:search`: seeds five years of logbook for two units into a private throwaway
// MariaDB — 8-hour shifts, so ~11 000 handovers with notes, ~100 000 handover items, questions,
// flags and narrative log entries — builds the search index the way a fresh install does, serves
// the app and measures text search over HTTP: 200 varied queries (words, phrases, filters by
// unit, crew, kind, severity and date range, later pages), p50/p95. Figures are reported only.
import { QueryTypes } from 'sequelize';
import { nextShiftStart } from '../shared/shift-time';
import { rebuildLogbookIndex } from '../server/features/logbook/documents';
import { percentile, startBench } from './lib/bench-harness';
import { forgetReferenceData } from '../server/lib/reference-cache';

const YEARS = Number(process.env.BENCH_YEARS ?? 5);
const ITEMS_PER_HANDOVER = 9;
const LOG_ENTRIES_PER_SHIFT = 3;
const QUERIES = 200;
const SHIFT_TIMES = ['06:00', '14:00', '22:00'];
const TIME_ZONE = 'Europe/Berlin';

// Invented plant vocabulary for the generated text: per-unit equipment tags, many event phrases,
// measured values and follow-ups, so that words occur with the spread of a real logbook (a few
// common, most rare) rather than a handful of sentences repeated.
const tagKinds = ['CWP-A', 'CWP-B', 'CWP-C', 'VP-A', 'VP-B', 'VP-C', 'CEP-A', 'CEP-B', 'SJAE-1', 'SJAE-2', 'WB-A', 'WB-B', 'WB-C', 'WB-D', 'TS-1', 'TS-2', 'TS-3', 'TS-4', 'CTF-1', 'CTF-2', 'CTF-3', 'CTF-4', 'CTF-5', 'CTF-6', 'CTF-7', 'CTF-8', 'MUV-1', 'BDV-1', 'BCS-1', 'LIC-101', 'GSC-1', 'SWP-A', 'SWP-B', 'ADP-1', 'BDP-1', 'SMC-1'];
const equipment = [1, 2].flatMap((unit) => tagKinds.map((tag) => `${unit}-${tag}`));
const events = [
  'tripped on high vibration and was reset after inspection', 'started for the load increase with discharge pressure normal', 'isolated under permit for seal replacement',
  'backwashed and the differential pressure returned to normal', 'running with high bearing temperature, trend logged hourly', 'suspected of air in-leakage, decay test planned',
  'returned to service after the outage without abnormal noise', 'showed rising conductivity so blowdown was increased', 'losing cleanliness, ball cleaning system checked',
  'level controller found in manual and put back to auto', 'gave a hotwell high level alarm, recirculation opened', 'held backpressure above expected, shift lead informed',
  'had a gearbox oil leak, drip tray placed and work order raised', 'vented after the restart', 'drained and refilled with treated water', 'lubricated per the weekly schedule',
  'showed motor current hunting between two values', 'stroked full open and closed for the functional test', 'failed to open on demand, local manual operation used',
  'had its suction strainer cleaned of debris and leaves', 'reported a steam leak at the packing gland', 'found with the seal water flow low',
  'checked after the thunderstorm, no damage found', 'changed over to the standby for the monthly rotation', 'sampled for chlorine residual and dosing adjusted',
  'put on local control for calibration by instrument technicians', 'alarmed on low suction pressure briefly', 'tagged out for electrical insulation testing',
  'showed ice forming on the louvres so the fan was reversed', 'had algae growth on the distribution deck', 'noisy coupling guard refitted',
  'reading drifted so the transmitter was zero checked', 'overflowing the basin while the makeup valve hunted', 'cavitating at low flow so a second pump was started',
  'showed a cracked sight glass, isolated and replaced', 'had the anticorrosion anode inspected', 'foaming in the basin, antifoam dose added',
  'tripped on earth fault, electricians called out', 'restarted after the grid disturbance', 'found with a stuck check valve rattling',
];
const values = ['backpressure 5.1 kPa a', 'backpressure 6.4 kPa a', 'TTD 4.2 K', 'TTD 7.9 K', 'subcooling 1.8 K', 'cleanliness 0.78', 'cleanliness 0.64', 'approach 6.5 K', 'approach 9.1 K', 'pH 8.3', 'conductivity 2140 µS/cm', 'current 212 A', 'vibration 4.1 mm/s', 'bearing 71 °C', 'basin 27 °C'];
const followUps = ['Informed the shift lead.', 'Logged for the next shift.', 'Work order raised.', 'No further action.', 'Trend set up on the desk.', 'Maintenance asked to attend at day shift.', 'Chemistry lab told.', 'Recorded on the round sheet.', 'Permit handed back.', 'Standing order followed.'];
const itemKinds = ['equipment', 'abnormal_reading', 'work_in_progress', 'chemistry', 'follow_up', 'condition'];
const priorities = ['low', 'normal', 'normal', 'high'];
const parameters = ['backpressure', 'ttd', 'subcooling', 'cleanlinessFactor', 'towerApproach', 'cwRise'];

let seed = 20261202;
const random = () => ((seed = (seed * 1_103_515_245 + 12_345) % 2_147_483_648), seed / 2_147_483_648);
const pick = <T>(list: readonly T[]) => list[Math.floor(random() * list.length)]!;
const sentence = () => `${pick(equipment)} ${pick(events)}${random() < 0.5 ? `; ${pick(values)}` : ''}. ${random() < 0.6 ? pick(followUps) : ''}`.trim();

async function insertRows(sequelize: import('sequelize').Sequelize, table: string, columns: string[], rows: unknown[][]) {
  for (let i = 0; i < rows.length; i += 1000) {
    const batch = rows.slice(i, i + 1000);
    await sequelize.query(`INSERT INTO ${table} (${columns.join(', ')}) VALUES ${batch.map(() => '(?)').join(',')}`, { replacements: batch });
  }
}

async function main() {
  const bench = await startBench('search');
  const { sequelize } = bench;
  try {
    // 8-hour shifts at the benchmark station (the demo uses 12-hour ones).
    await sequelize.query(`UPDATE station_settings SET shift_change_times = ?`, { replacements: [JSON.stringify(SHIFT_TIMES)] });
    // Behind the models' back: the server in this process must not keep the settings it cached before.
    forgetReferenceData();
    const units = await sequelize.query<{ id: number }>('SELECT id FROM units ORDER BY id', { type: QueryTypes.SELECT });
    const crews = (await sequelize.query<{ id: number }>('SELECT id FROM crews ORDER BY name', { type: QueryTypes.SELECT })).map((c) => c.id);
    const people = (await sequelize.query<{ id: number }>(`SELECT id FROM users WHERE role IN ('operator','shift_lead','trainee')`, { type: QueryTypes.SELECT })).map((u) => u.id);
    const seedStarted = performance.now();

    // Every shift start over the years, from the oldest.
    const first = new Date(Date.now() - YEARS * 365.25 * 86_400_000);
    const starts: Date[] = [];
    for (let at = nextShiftStart(first, TIME_ZONE, SHIFT_TIMES); at.getTime() < Date.now() - 86_400_000; at = nextShiftStart(at, TIME_ZONE, SHIFT_TIMES)) starts.push(at);

    const handoverRows: unknown[][] = [];
    const logRows: unknown[][] = [];
    const flagRows: unknown[][] = [];
    starts.forEach((start, index) => {
      const end = starts[index + 1] ?? new Date(start.getTime() + 8 * 3_600_000);
      const outgoing = crews[index % crews.length]!;
      const incoming = crews[(index + 1) % crews.length]!;
      for (const unit of units) {
        const author = pick(people);
        handoverRows.push([unit.id, start, end, outgoing, incoming, `<p>${sentence()} ${sentence()}</p><ul><li>${sentence()}</li></ul>`, 'accepted', author, end, author, end, author, end]);
        for (let e = 0; e < LOG_ENTRIES_PER_SHIFT; e++) {
          const at = new Date(start.getTime() + (e + 0.5) * ((end.getTime() - start.getTime()) / LOG_ENTRIES_PER_SHIFT));
          logRows.push([unit.id, 'control_room', pick(['operation', 'equipment_status', 'alarm_abnormal', 'chemistry']), at, at, start, 0, pick(people), sentence(), 0]);
        }
        if (random() < 0.2) {
          const raised = new Date(start.getTime() + 3_600_000);
          flagRows.push([unit.id, pick(parameters), pick(['automatic', 'manual']), pick(['watch', 'alarm']), 'cleared', raised, raised, author, sentence(), sentence(), raised, `Cleared: ${sentence()}`]);
        }
      }
    });
    await insertRows(sequelize, 'handovers', ['unit_id', 'shift_start', 'handover_at', 'outgoing_crew_id', 'incoming_crew_id', 'notes_html', 'status', 'created_by', 'created_at', 'submitted_by', 'submitted_at', 'accepted_by', 'accepted_at'], handoverRows);
    await insertRows(sequelize, 'log_entries', ['unit_id', 'position', 'category', 'event_at', 'entered_at', 'shift_start', 'late', 'author_id', 'text', 'carry_to_handover'], logRows);
    await insertRows(sequelize, 'flags', ['unit_id', 'parameter', 'origin', 'severity', 'status', 'raised_at', 'last_seen_at', 'raised_by', 'comment', 'follow_up', 'cleared_at', 'clear_comment'], flagRows);

    const handovers = await sequelize.query<{ id: number; created_at: Date; created_by: number }>('SELECT id, created_at, created_by FROM handovers ORDER BY id', { type: QueryTypes.SELECT });
    const itemRows: unknown[][] = [];
    for (const h of handovers) {
      for (let i = 0; i < ITEMS_PER_HANDOVER; i++) {
        itemRows.push([h.id, pick(itemKinds), `${pick(equipment)}: ${pick(events)}`.slice(0, 300), sentence(), random() < 0.3 ? `WP-${1000 + Math.floor(random() * 9000)}` : null, pick(priorities), h.created_by, h.created_at]);
      }
    }
    await insertRows(sequelize, 'handover_items', ['handover_id', 'kind', 'title', 'detail', 'reference', 'priority', 'created_by', 'created_at'], itemRows);
    const queryRows: unknown[][] = [];
    const someItems = await sequelize.query<{ id: number; created_at: Date }>('SELECT id, created_at FROM handover_items WHERE id % 20 = 0', { type: QueryTypes.SELECT });
    for (const item of someItems) queryRows.push([item.id, pick(people), item.created_at, `Is ${pick(equipment)} still ${pick(['isolated', 'on trend watch', 'under permit'])}?`, pick(people), item.created_at, sentence()]);
    await insertRows(sequelize, 'handover_queries', ['item_id', 'asked_by', 'asked_at', 'question', 'answered_by', 'answered_at', 'answer'], queryRows);
    const seeded = performance.now();

    await rebuildLogbookIndex(sequelize);
    const indexed = performance.now();
    const [{ documents }] = (await sequelize.query<{ documents: number }>('SELECT COUNT(*) AS documents FROM logbook_documents', { type: QueryTypes.SELECT })) as [{ documents: number }];
    console.log(
      `Seeded ${YEARS} years: ${handovers.length} handovers (with notes), ${itemRows.length} items, ${queryRows.length} questions, ${flagRows.length} flags, ${logRows.length} log entries in ${((seeded - seedStarted) / 1000).toFixed(1)} s; search index of ${documents} documents built in ${((indexed - seeded) / 1000).toFixed(1)} s`,
    );

    const client = await bench.serve('trainer');
    const year = (offset: number) => new Date(Date.now() - offset * 365 * 86_400_000).getFullYear();
    // Searches people would type: single words (common and rare), phrases, tags and values.
    const texts = [
      'vibration', 'seal replacement', 'decay test', 'backwashed', 'bearing temperature', 'air in-leakage', 'conductivity', 'ball cleaning', 'level controller manual',
      'hotwell high level', 'backpressure above expected', '1-CWP-B', '2-CTF-6', 'strainer debris', 'packing gland', 'earth fault', 'grid disturbance', 'antifoam',
      'algae', 'louvres reversed', 'check valve rattling', 'insulation testing', 'cavitating', 'sight glass', 'chlorine residual', 'gearbox oil leak', 'permit',
      'thunderstorm', 'transmitter zero', 'makeup valve hunted',
    ];
    const queries: string[] = [];
    for (let i = 0; i < QUERIES; i++) {
      const params = new URLSearchParams({ q: texts[i % texts.length]! });
      const variant = Math.floor(i / texts.length) % 10;
      if (variant === 1) params.set('unitId', String(units[0]!.id));
      if (variant === 2) params.set('crewId', String(crews[i % crews.length]));
      if (variant === 3) params.set('kind', 'handover_item');
      if (variant === 4) params.set('severity', 'high');
      if (variant === 5) {
        params.set('from', `${year(2)}-01-01`);
        params.set('to', `${year(2)}-12-31`);
      }
      if (variant === 6) params.set('page', '3');
      if (variant === 7) {
        params.set('unitId', String(units[1]!.id));
        params.set('kind', 'log_entry');
      }
      if (variant === 8) params.set('kind', 'flag');
      if (variant === 9) {
        params.set('personId', String(people[i % people.length]));
        params.set('from', `${year(1)}-06-01`);
      }
      queries.push(params.toString());
    }
    // One unrecorded pass over a few queries warms the pool and the JIT, as a running server would be.
    for (const q of queries.slice(0, 10)) await (await client.call(`/api/logbook/search?${q}`)).arrayBuffer();
    const times: number[] = [];
    const slowest: { ms: number; q: string; total: number }[] = [];
    let hits = 0;
    for (const q of queries) {
      const started = performance.now();
      const response = await client.call(`/api/logbook/search?${q}`);
      const body = (await response.json()) as { total: number };
      times.push(performance.now() - started);
      if (!response.ok) throw new Error(`search failed (${response.status}): ${q}`);
      hits += body.total;
      slowest.push({ ms: times.at(-1)!, q: decodeURIComponent(q), total: body.total });
    }
    console.log(`${QUERIES} varied searches over HTTP: p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms, max ${Math.max(...times).toFixed(1)} ms (mean ${Math.round(hits / QUERIES)} matching records per query)`);
    console.log('Slowest five:');
    for (const s of slowest.sort((a, b) => b.ms - a.ms).slice(0, 5)) console.log(`  ${s.ms.toFixed(1)} ms  ${s.total} matches  ${s.q}`);
  } finally {
    await bench.stop();
  }
}

await main();
