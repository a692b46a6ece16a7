// Logbook search: MariaDB FULLTEXT over the documents index, ranked with exact phrases first,
// then by relevance, then newest first. The text is reduced to words before it reaches SQL, so
// quotes, boolean operators and wildcards typed by a person are searched as plain words.
import { TZDate } from '@date-fns/tz';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { LogbookSearch, SearchHit } from '../../../shared/schemas/logbook';
import { ValidationError } from '../../lib/errors';

// InnoDB's default FULLTEXT stopwords and its minimum token length (3): such words are not in the
// index, so requiring them would match nothing.
const STOPWORDS = new Set(
  'a about an are as at be by com de en for from how i in is it la of on or that the this to was what when where who will with und www'.split(' '),
);
const MIN_WORD = 3;
const MAX_WORDS = 12;

export function searchWords(text: string): string[] {
  const terms: string[] = [];
  for (const group of text.normalize('NFKC').toLowerCase().match(/[\p{L}\p{N}]+(?:[-/][\p{L}\p{N}]+)*/gu) ?? []) {
    // A joined term (a tag such as 1-CWP-B) is searched whole, as the index stores it.
    if (/[-/]/.test(group)) terms.push(group.replace(/[-/]/g, '_'));
    else if (group.length >= MIN_WORD && !STOPWORDS.has(group)) terms.push(group);
  }
  return [...new Set(terms)].slice(0, MAX_WORDS);
}

/** Midnight at the start of the station-local day `date` (YYYY-MM-DD), plus `days` days. */
function localMidnight(date: string, timeZone: string, days = 0) {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return new Date(new TZDate(y, m - 1, d + days, 0, 0, 0, timeZone).getTime());
}

const likeEscape = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** `timeZone` turns the date filters into the station's local days. */
export async function searchLogbook(sequelize: Sequelize, filters: LogbookSearch, timeZone: string, limitOverride?: number) {
  const text = filters.q.trim();
  const words = searchWords(text);
  if (text && words.length === 0) {
    throw new ValidationError({ q: 'Search for words of at least three letters or digits (common words such as “the” are not indexed)' });
  }
  const where: string[] = [];
  const params: unknown[] = [];
  // Every word required; the same string ranks the matches below.
  const allWords = words.map((w) => `+${w}`).join(' ');
  if (words.length) {
    where.push('MATCH(d.title, d.body, d.terms) AGAINST(? IN BOOLEAN MODE)');
    params.push(allWords);
  }
  const filter = (sql: string, value: unknown) => {
    where.push(sql);
    params.push(value);
  };
  if (filters.unitId) filter('(d.unit_id = ? OR d.unit_id IS NULL)', filters.unitId);
  if (filters.crewId) filter('d.crew_id = ?', filters.crewId);
  if (filters.personId) filter('d.person_id = ?', filters.personId);
  if (filters.kind) filter('d.kind = ?', filters.kind);
  if (filters.severity) filter('d.severity = ?', filters.severity);
  if (filters.from) filter('d.occurred_at >= ?', localMidnight(filters.from, timeZone));
  if (filters.to) filter('d.occurred_at < ?', localMidnight(filters.to, timeZone, 1));
  const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';

  const pageSize = limitOverride ?? filters.pageSize;
  const offset = limitOverride ? 0 : (filters.page - 1) * filters.pageSize;
  // Rank: the text as typed (an exact phrase: "vacuum loss", "1-CWP-B") first, then relevance,
  // then newest. The relevance is the same MATCH as the filter, so the index is searched once;
  // the columns' case-insensitive collation makes LIKE ignore case.
  const phrase = words.length > 1 || (words.length === 1 && text.trim().toLowerCase() !== words[0]) ? `%${likeEscape(text)}%` : null;
  const rankSql = words.length
    ? `${phrase ? '(d.title LIKE ? OR d.body LIKE ?)' : 'FALSE'} AS exact, MATCH(d.title, d.body, d.terms) AGAINST(? IN BOOLEAN MODE) AS score`
    : 'FALSE AS exact, 0 AS score';
  const rankParams = words.length ? [...(phrase ? [phrase, phrase] : []), allWords] : [];

  // Rank narrow first (ids and sort keys only, with the total from the same pass), then fetch
  // the page's details: sorting wide rows with their text for every match costs far more.
  const rows = await sequelize.query<Record<string, unknown>>(
    `SELECT d.id, d.kind, d.ref_id, d.unit_id, u.name AS unit_name, d.occurred_at, d.shift_start, c.name AS crew_name, p.name AS person_name,
            d.severity, d.title, LEFT(d.body, 4000) AS body, ranked.exact, ranked.total
     FROM (SELECT d.id, ${rankSql}, d.occurred_at, COUNT(*) OVER () AS total FROM logbook_documents d ${whereSql}
           ORDER BY exact DESC, score DESC, d.occurred_at DESC, d.id DESC LIMIT ? OFFSET ?) ranked
     JOIN logbook_documents d ON d.id = ranked.id
     LEFT JOIN units u ON u.id = d.unit_id LEFT JOIN crews c ON c.id = d.crew_id LEFT JOIN users p ON p.id = d.person_id
     ORDER BY ranked.exact DESC, ranked.score DESC, ranked.occurred_at DESC, ranked.id DESC`,
    { replacements: [...rankParams, ...params, pageSize, offset], type: QueryTypes.SELECT },
  );
  // A page past the end carries no total: count separately only then.
  const total = rows.length
    ? Number(rows[0]!.total)
    : Number((await sequelize.query<{ total: number }>(`SELECT COUNT(*) AS total FROM logbook_documents d ${whereSql}`, { replacements: params, type: QueryTypes.SELECT }))[0]?.total ?? 0);

  const hits: SearchHit[] = rows.map((r) => ({
    documentId: Number(r.id),
    kind: String(r.kind),
    refId: Number(r.ref_id),
    unitId: r.unit_id === null ? null : Number(r.unit_id),
    unitName: (r.unit_name as string | null) ?? null,
    occurredAt: new Date(r.occurred_at as string).toISOString(),
    shiftStart: r.shift_start ? new Date(r.shift_start as string).toISOString() : null,
    crewName: (r.crew_name as string | null) ?? null,
    personName: (r.person_name as string | null) ?? null,
    severity: (r.severity as string | null) ?? null,
    title: String(r.title),
    snippet: snippetAround(String(r.body), words),
    exactPhrase: Number(r.exact) === 1,
  }));
  return { hits, total, page: limitOverride ? 1 : filters.page, pageSize, words };
}

/** About 240 characters of the body around the first word found, with whitespace tidied. */
export function snippetAround(body: string, words: string[]) {
  const clean = body.replace(/\s+/g, ' ').trim();
  const lower = clean.toLowerCase();
  const at = words.map((w) => lower.indexOf(w.replace(/_/g, '-'))).filter((i) => i >= 0).sort((a, b) => a - b)[0] ?? 0;
  const start = Math.max(0, at - 80);
  const cut = clean.slice(start, start + 240);
  return `${start > 0 ? '…' : ''}${cut}${start + 240 < clean.length ? '…' : ''}`;
}
