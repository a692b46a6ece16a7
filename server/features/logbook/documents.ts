// The logbook search index: one row in logbook_documents per searchable record (log entries and
// their amendments, standing orders, handover notes, items, questions and amendments, flags,
// abnormal, implausible or amended rounds, time-limited conditions). Each kind is one INSERT … SELECT from its
// own table, used both to rebuild everything and to refresh single rows, so there is one
// definition of what a document holds. The crew and shift come from the station's rotation.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { shiftStartFor } from '../../../shared/shift-time';
import { stationShiftSetup } from '../stations/index';
import { swapsOfStation } from '../shifts/index';
import { crewFromRotation } from '../shifts/index';
import { checkCatalog } from '../../../shared/calc/check-catalog';
import { plausibleCatalog } from '../../../shared/calc/plausibility';

export const documentKinds = [
  'log_entry',
  'log_amendment',
  'standing_order',
  'handover_notes',
  'handover_item',
  'handover_query',
  'handover_amendment',
  'flag',
  'round',
  'condition',
] as const;
export type DocumentKind = (typeof documentKinds)[number];

const sqlText = (text: string) => `'${text.replace(/'/g, "''")}'`;
/** A check's key (cleanlinessFactor) as the words people read and search (Cleanliness factor). */
const checkLabel = (column: string) =>
  `CASE ${column} ${Object.entries(checkCatalog).map(([key, check]) => `WHEN ${sqlText(key)} THEN ${sqlText(check.label)}`).join(' ')} ELSE ${column} END`;

/** A plausible-range key (cwFlow) as the words people read (CW flow). */
const plausibleLabel = (column: string) =>
  `CASE ${column} ${Object.entries(plausibleCatalog).map(([key, p]) => `WHEN ${sqlText(key)} THEN ${sqlText(p.label)}`).join(' ')} ELSE ${column} END`;
/** The round's current mark: its latest amendment's, else its own. */
const CURRENT_MARK = `COALESCE((SELECT a.outside_plausible FROM reading_amendments a WHERE a.reading_set_id = r.id ORDER BY a.id DESC LIMIT 1), r.outside_plausible)`;

const COLUMNS = ['kind', 'ref_id', 'unit_id', 'station_id', 'occurred_at', 'shift_start', 'crew_id', 'person_id', 'severity', 'title', 'body'] as const;
type Column = (typeof COLUMNS)[number];

/** One kind's SELECT: an expression per column, then its FROM … WHERE, where `{ids:x.id}` is the refresh filter. */
const source = (kind: DocumentKind, columns: Omit<Record<Column, string>, 'kind'>, from: string) =>
  `SELECT ${COLUMNS.map((c) => `${c === 'kind' ? sqlText(kind) : columns[c]} AS ${c}`).join(', ')} ${from}`;

const sources: Record<DocumentKind, string> = {
  log_entry: source(
    'log_entry',
    { ref_id: 'e.id', unit_id: 'e.unit_id', station_id: 'u.station_id', occurred_at: 'e.event_at', shift_start: 'e.shift_start', crew_id: 'NULL', person_id: 'e.author_id', severity: 'NULL',
      title: "LEFT(CONCAT(REPLACE(e.category, '_', ' '), ' · ', REPLACE(e.position, '_', ' ')), 300)", body: 'e.text' },
    'FROM log_entries e JOIN units u ON u.id = e.unit_id WHERE {ids:e.id}',
  ),
  log_amendment: source(
    'log_amendment',
    { ref_id: 'a.id', unit_id: 'e.unit_id', station_id: 'u.station_id', occurred_at: 'a.amended_at', shift_start: 'NULL', crew_id: 'NULL', person_id: 'a.author_id', severity: 'NULL',
      title: "LEFT(CONCAT('Amendment: ', a.reason), 300)", body: 'a.text' },
    'FROM log_amendments a JOIN log_entries e ON e.id = a.entry_id JOIN units u ON u.id = e.unit_id WHERE {ids:a.id}',
  ),
  standing_order: source(
    'standing_order',
    { ref_id: 'o.id', unit_id: 'NULL', station_id: 'o.station_id', occurred_at: 'o.issued_at', shift_start: 'NULL', crew_id: 'NULL', person_id: 'o.issued_by', severity: 'NULL', title: 'o.title', body: 'o.body_text' },
    'FROM standing_orders o WHERE {ids:o.id}',
  ),
  handover_notes: source(
    'handover_notes',
    { ref_id: 'h.id', unit_id: 'h.unit_id', station_id: 'u.station_id', occurred_at: 'h.handover_at', shift_start: 'h.shift_start', crew_id: 'h.outgoing_crew_id',
      person_id: 'COALESCE(h.submitted_by, h.created_by)', severity: 'NULL', title: "'Handover notes'", body: "REGEXP_REPLACE(h.notes_html, '<[^>]*>', ' ')" },
    // From submit on: a draft's autosaves would churn the index and are not yet history.
    "FROM handovers h JOIN units u ON u.id = h.unit_id WHERE h.status <> 'draft' AND h.notes_html <> '' AND {ids:h.id}",
  ),
  handover_item: source(
    'handover_item',
    { ref_id: 'i.id', unit_id: 'h.unit_id', station_id: 'u.station_id', occurred_at: 'i.created_at', shift_start: 'h.shift_start', crew_id: 'h.outgoing_crew_id', person_id: 'i.created_by',
      severity: 'i.priority', title: 'i.title', body: "CONCAT_WS(' · ', i.detail, i.reference, REPLACE(i.kind, '_', ' '))" },
    'FROM handover_items i JOIN handovers h ON h.id = i.handover_id JOIN units u ON u.id = h.unit_id WHERE i.removed_at IS NULL AND {ids:i.id}',
  ),
  handover_query: source(
    'handover_query',
    { ref_id: 'q.id', unit_id: 'h.unit_id', station_id: 'u.station_id', occurred_at: 'q.asked_at', shift_start: 'h.shift_start', crew_id: 'h.incoming_crew_id', person_id: 'q.asked_by',
      severity: 'NULL', title: "LEFT(CONCAT('Question: ', q.question), 300)", body: "CONCAT_WS(' ', q.question, q.answer)" },
    'FROM handover_queries q JOIN handover_items i ON i.id = q.item_id JOIN handovers h ON h.id = i.handover_id JOIN units u ON u.id = h.unit_id WHERE {ids:q.id}',
  ),
  handover_amendment: source(
    'handover_amendment',
    { ref_id: 'a.id', unit_id: 'h.unit_id', station_id: 'u.station_id', occurred_at: 'a.amended_at', shift_start: 'NULL', crew_id: 'NULL', person_id: 'a.author_id', severity: 'NULL',
      title: "LEFT(CONCAT('Amendment: ', a.reason), 300)", body: 'a.text' },
    'FROM handover_amendments a JOIN handovers h ON h.id = a.handover_id JOIN units u ON u.id = h.unit_id WHERE {ids:a.id}',
  ),
  flag: source(
    'flag',
    { ref_id: 'f.id', unit_id: 'f.unit_id', station_id: 'u.station_id', occurred_at: 'f.raised_at', shift_start: 'NULL', crew_id: 'NULL', person_id: 'f.raised_by', severity: 'f.severity',
      title: `CONCAT(IF(f.origin = 'manual', 'Flag: ', 'Automatic flag: '), ${checkLabel('f.parameter')})`,
      body: "CONCAT_WS(' · ', f.comment, f.follow_up, f.clear_comment, CONCAT(f.severity, ', ', f.status))" },
    'FROM flags f JOIN units u ON u.id = f.unit_id WHERE {ids:f.id}',
  ),
  // Only rounds with something to find: outside limits, outside the plausible range, or amended.
  round: source(
    'round',
    { ref_id: 'r.id', unit_id: 'r.unit_id', station_id: 'u.station_id', occurred_at: 'r.taken_at', shift_start: 'NULL', crew_id: 'NULL', person_id: 'r.recorded_by', severity: 'r.worst_status',
      title: `CONCAT('Round: ', r.worst_status, IF(JSON_LENGTH(${CURRENT_MARK}) > 0, ' · outside plausible range', ''))`,
      body: `CONCAT_WS(' ',
        (SELECT GROUP_CONCAT(CONCAT(${checkLabel('v.parameter')}, ': ', v.status) SEPARATOR ', ') FROM reading_values v WHERE v.reading_set_id = r.id AND v.status IN ('watch', 'alarm')),
        (SELECT CONCAT('Outside plausible range: ', GROUP_CONCAT(${plausibleLabel('m.k')} SEPARATOR ', '))
           FROM JSON_TABLE(${CURRENT_MARK}, '$[*]' COLUMNS (k VARCHAR(40) PATH '$')) m),
        (SELECT GROUP_CONCAT(CONCAT('Amendment: ', a.reason) SEPARATOR ' ') FROM reading_amendments a WHERE a.reading_set_id = r.id))` },
    `FROM reading_sets r JOIN units u ON u.id = r.unit_id
     WHERE (r.worst_status IN ('watch', 'alarm') OR JSON_LENGTH(r.outside_plausible) > 0 OR EXISTS (SELECT 1 FROM reading_amendments a WHERE a.reading_set_id = r.id)) AND {ids:r.id}`,
  ),
  condition: source(
    'condition',
    { ref_id: 'c.id', unit_id: 'c.unit_id', station_id: 'u.station_id', occurred_at: 'c.started_at', shift_start: 'NULL', crew_id: 'NULL', person_id: 'c.opened_by', severity: 'NULL',
      title: "LEFT(CONCAT('Condition: ', c.title), 300)", body: "CONCAT_WS(' ', c.required_action, IF(c.closed_at IS NULL, 'open', 'closed'))" },
    'FROM conditions c JOIN units u ON u.id = c.unit_id WHERE {ids:c.id}',
  ),
};

// Keeps only the hyphen- or slash-joined terms of title and body (everything else becomes a
// space), then joins their parts with "_", which the FULLTEXT parser keeps inside a word.
// Computed in the same INSERT as the row: a later UPDATE of an indexed column would make the
// FULLTEXT index hold every document twice (the old version only marked deleted).
const JOINED_TERMS = `REPLACE(REPLACE(REGEXP_REPLACE(CONCAT(src.title, ' ', src.body), '([[:alnum:]]+(?:[-/][[:alnum:]]+)+)|.', '\\\\1 '), '-', '_'), '/', '_')`;

const upsert = `ON DUPLICATE KEY UPDATE unit_id = VALUES(unit_id), occurred_at = VALUES(occurred_at), person_id = VALUES(person_id),
  severity = VALUES(severity), title = VALUES(title), body = VALUES(body), terms = VALUES(terms),
  shift_start = COALESCE(VALUES(shift_start), logbook_documents.shift_start), crew_id = COALESCE(VALUES(crew_id), logbook_documents.crew_id)`;

function sourceSql(kind: DocumentKind, ids: readonly number[] | null) {
  return sources[kind].replace(/\{ids:([a-z]\.id)\}/, (_m, column: string) => (ids ? `${column} IN (${ids.map((id) => Number(id)).join(',')})` : 'TRUE'));
}

type DocumentRow = Record<Column | 'terms', unknown>;

/**
 * Writes (or refreshes) the documents of `kind` for these source ids; all of them when `ids` is null.
 *
 * A refresh runs inside the writer's transaction, beside other writers on the same unit, so it
 * reads its source with a plain (non-locking) SELECT and then writes the rows it got with one
 * INSERT … VALUES. As a single INSERT … SELECT it took shared next-key locks on every source row
 * and index range it read (the gap after a round's values blocked the next round's) and InnoDB's
 * table-wide auto-increment lock for an insert of unknown size: concurrent rounds deadlocked in
 * it, some reported as "Failed to read auto-increment value". The whole rebuild keeps the single
 * statement: it runs alone.
 */
export async function indexDocuments(sequelize: Sequelize, kind: DocumentKind, ids: readonly number[] | null, transaction?: Transaction | null) {
  if (ids && ids.length === 0) return;
  const t = transaction ?? undefined;
  if (!ids) {
    await sequelize.query(`INSERT INTO logbook_documents (${COLUMNS.join(', ')}, terms) SELECT src.*, ${JOINED_TERMS} FROM (${sourceSql(kind, null)}) src ${upsert}`, { transaction: t });
    await assignShiftsAndCrews(sequelize, transaction);
    return;
  }
  const rows = await sequelize.query<DocumentRow>(`SELECT src.*, ${JOINED_TERMS} AS terms FROM (${sourceSql(kind, ids)}) src`, { type: QueryTypes.SELECT, transaction: t });
  if (rows.length) {
    // Shift and crew worked out here and written with the document, rather than stored empty and
    // filled by a second read and update: two statements fewer in every write that is indexed.
    await fillShiftsAndCrews(rows, transaction);
    const columns = [...COLUMNS, 'terms'] as const;
    await sequelize.query(
      `INSERT INTO logbook_documents (${columns.join(', ')}) VALUES ${rows.map(() => `(${columns.map(() => '?').join(', ')})`).join(', ')} ${upsert}`,
      { replacements: rows.flatMap((row) => columns.map((c) => row[c] ?? null)), transaction: t },
    );
  }
  // A round back inside limits and never amended, or a draft item taken off the handover, is no longer a document.
  const gone = new Set(ids.map(Number));
  for (const row of rows) gone.delete(Number(row.ref_id));
  if ((kind === 'round' || kind === 'handover_item') && gone.size) {
    // Deleted by primary key, and only rows that exist: a DELETE by (kind, ref_id) that finds
    // nothing locks the gap where the next round's document goes.
    const stale = await sequelize.query<{ id: number }>(`SELECT id FROM logbook_documents WHERE kind = ? AND ref_id IN (${[...gone].join(',')})`, {
      replacements: [kind],
      type: QueryTypes.SELECT,
      transaction: t,
    });
    if (stale.length) await sequelize.query(`DELETE FROM logbook_documents WHERE id IN (${stale.map((r) => Number(r.id)).join(',')})`, { transaction: t });
  }
}

/**
 * The shift and crew of a document at one station: the shift that contains its time (unless the
 * source already carries its shift), and the crew a swap or else the rotation put on that shift,
 * as the station's setup says now. Reference data, so read from the cache once per station.
 */
async function shiftAndCrewAt(stationId: number, transaction: Transaction | null | undefined) {
  const { settings, rotation } = await stationShiftSetup(stationId, transaction);
  const swaps = new Map((await swapsOfStation(stationId, transaction ?? undefined)).map((s) => [s.shiftStart.getTime(), s.crewId]));
  return (occurredAt: Date, knownShiftStart: Date | null) => {
    const shiftStart = knownShiftStart ?? shiftStartFor(occurredAt, settings.timeZone, settings.shiftChangeTimes);
    return { shiftStart, crewId: swaps.get(shiftStart.getTime()) ?? crewFromRotation(rotation, shiftStart, settings.shiftChangeTimes.length) };
  };
}

/** A refresh's rows, before they are written: shift and crew where the source does not carry them. */
async function fillShiftsAndCrews(rows: DocumentRow[], transaction: Transaction | null | undefined) {
  const resolvers = new Map<number, Awaited<ReturnType<typeof shiftAndCrewAt>>>();
  for (const row of rows) {
    if (row.shift_start != null && row.crew_id != null) continue;
    const stationId = Number(row.station_id);
    if (!resolvers.has(stationId)) resolvers.set(stationId, await shiftAndCrewAt(stationId, transaction));
    const { shiftStart, crewId } = resolvers.get(stationId)!(new Date(row.occurred_at as string | Date), row.shift_start != null ? new Date(row.shift_start as string | Date) : null);
    row.shift_start = shiftStart;
    row.crew_id ??= crewId;
  }
}

/**
 * Rebuilds the whole index from the logbook tables (after the migration that adds it, the
 * benchmark, `npm run db:reindex`). Shift and crew are worked out afresh, so a changed rotation or a
 * swap added later reaches old documents too. (Neither column is FULLTEXT-indexed, so clearing
 * them does not touch the text index.)
 */
export async function rebuildLogbookIndex(sequelize: Sequelize) {
  await sequelize.query('UPDATE logbook_documents SET crew_id = NULL, shift_start = NULL');
  for (const kind of documentKinds) await indexDocuments(sequelize, kind, null);
}

/**
 * After a rebuild: fills shift start and crew where the source row does not carry them, as
 * fillShiftsAndCrews does for a refresh.
 */
async function assignShiftsAndCrews(sequelize: Sequelize, transaction: Transaction | null | undefined) {
  const rows = await sequelize.query<{ id: number; stationId: number; occurredAt: Date; shiftStart: Date | null }>(
    `SELECT id, station_id AS stationId, occurred_at AS occurredAt, shift_start AS shiftStart FROM logbook_documents
     WHERE crew_id IS NULL OR shift_start IS NULL`,
    { type: QueryTypes.SELECT, transaction: transaction ?? undefined },
  );
  if (rows.length === 0) return;
  const byStation = new Map<number, typeof rows>();
  for (const row of rows) (byStation.get(row.stationId) ?? byStation.set(row.stationId, []).get(row.stationId)!).push(row);
  const updates = new Map<string, number[]>(); // "shiftStartMs|crewId" → document ids
  for (const [stationId, docs] of byStation) {
    const resolve = await shiftAndCrewAt(stationId, transaction);
    for (const doc of docs) {
      const { shiftStart, crewId } = resolve(new Date(doc.occurredAt), doc.shiftStart ? new Date(doc.shiftStart) : null);
      const key = `${shiftStart.getTime()}|${crewId ?? ''}`;
      (updates.get(key) ?? updates.set(key, []).get(key)!).push(doc.id);
    }
  }
  for (const [key, ids] of updates) {
    const [shiftMs, crew] = key.split('|');
    await sequelize.query(`UPDATE logbook_documents SET shift_start = ?, crew_id = COALESCE(crew_id, ?) WHERE id IN (${ids.join(',')})`, {
      replacements: [new Date(Number(shiftMs)), crew ? Number(crew) : null],
      transaction: transaction ?? undefined,
    });
  }
}
