// Logbook history: the search index kept by the model hooks, ranked FULLTEXT search with filters,
// hostile input, CSV export, a past shift as it was, and trainers' review comments.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { buildApp, closeAll, db, makeStation, makeUser, signedInAgent, anonymousAgent, type Agent } from './support/test-app';
import { LogAmendment, LogEntry } from '../../server/features/log/model';
import { Handover, HandoverItem, HandoverQuery } from '../../server/features/handovers/model';
import { Flag } from '../../server/features/flags/model';
import { Condition } from '../../server/features/conditions/model';
import { StandingOrder } from '../../server/features/standing-orders/model';
import { shiftStartFor } from '../../shared/shift-time';
import { defaultStationSettings } from '../../server/features/stations/settings';
import { rebuildLogbookIndex } from '../../server/features/logbook/documents';

afterAll(closeAll);

const built = buildApp();
// Words no other test writes, so the shared test database cannot disturb the counts.
const tag = `zq${Date.now().toString(36)}`;
const word = (name: string) => `${name}${tag}`;
let unitId: number;
let otherUnitId: number;
let stationId: number;
let crewA: number;
const agents = {} as Record<'operator' | 'trainee' | 'trainer' | 'admin' | 'outsider', Agent>;
const ids = {} as Record<'operator' | 'trainee', number>;

const post = (agent: Agent, path: string, body: object = {}) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body);
const search = (agent: Agent, query: Record<string, string | number>) => agent.get('/api/logbook/search').query(query);

beforeAll(async () => {
  const { station, unit, crews } = await makeStation(2);
  const other = await makeStation(1);
  unitId = unit.id;
  otherUnitId = other.unit.id;
  stationId = station.id;
  crewA = crews[0]!.id;
  const operator = await makeUser('operator', { crewId: crewA });
  const trainee = await makeUser('trainee', { crewId: crewA });
  ids.operator = operator.id;
  ids.trainee = trainee.id;
  agents.operator = await signedInAgent(built, operator.email);
  agents.trainee = await signedInAgent(built, trainee.email);
  agents.trainer = await signedInAgent(built, (await makeUser('trainer')).email);
  agents.admin = await signedInAgent(built, (await makeUser('admin')).email);
  agents.outsider = await signedInAgent(built, (await makeUser('operator', { crewId: crews[1]!.id })).email);
  // Crew A works every shift of this station (a rotation of one), so documents carry it.
  await agents.admin
    .put(`/api/stations/${station.id}/crew-rotation`)
    .set('X-CSRF-Token', agents.admin.csrf)
    .send({ anchorShiftStart: new Date('2026-01-01T05:00:00Z').toISOString(), crewIds: [crewA] })
    .expect(200);
});

describe('logbook search', () => {
  it('answers 401 signed out on every logbook route', async () => {
    const anon = await anonymousAgent(built);
    await anon.get('/api/logbook/search?q=pump').expect(401);
    await anon.get('/api/logbook/search.csv?q=pump').expect(401);
    await anon.get(`/api/logbook/units/${unitId}/shifts/${new Date().toISOString()}`).expect(401);
    await anon.get('/api/logbook/review-comments/mine').expect(401);
    await post(anon, '/api/logbook/review-comments', { documentId: 1, body: 'hello there' }).expect(401);
  });

  it('finds log entries by their words, exact phrase first, and respects unit, person, kind and date filters', async () => {
    const write = (agent: Agent, text: string, unit = unitId) => post(agent, `/api/units/${unit}/log`, { position: 'control_room', category: 'operation', text });
    const scattered = await write(agents.operator, `Vacuum held steady; a small ${word('loss')} found on the gland steam header, vacuum pump normal.`);
    expect(scattered.status, JSON.stringify(scattered.body)).toBe(201);
    const exact = await write(agents.trainee, `Alarm on backpressure: vacuum ${word('loss')} traced to a stuck air ejector valve.`);
    expect(exact.status).toBe(201);
    await write(agents.operator, `Other unit: vacuum ${word('loss')} during the test.`, otherUnitId).expect(201);

    const phrase = `vacuum ${word('loss')}`;
    const all = await search(agents.trainee, { q: phrase });
    expect(all.status, JSON.stringify(all.body)).toBe(200);
    expect(all.body.total).toBe(3);
    // The exact phrase ranks above the entry that only has both words apart (a check on our own ranking rule).
    const ofUnit = await search(agents.trainee, { q: phrase, unitId });
    expect(ofUnit.body.hits.map((h: { refId: number }) => h.refId)).toEqual([exact.body.id, scattered.body.id]);
    expect(ofUnit.body.hits[0]).toMatchObject({ kind: 'log_entry', exactPhrase: true, crewName: 'A' });
    expect(ofUnit.body.hits[1].exactPhrase).toBe(false);

    const byPerson = await search(agents.trainer, { q: word('loss'), personId: ids.trainee });
    expect(byPerson.body.total).toBe(1);
    expect((await search(agents.trainer, { q: word('loss'), kind: 'flag' })).body.total).toBe(0);
    expect((await search(agents.trainer, { q: word('loss'), crewId: crewA })).body.total).toBe(2);
    // Date filters are the station's local days (Europe/Berlin by default), not UTC ones.
    const today = new Intl.DateTimeFormat('en-CA', { timeZone: defaultStationSettings.timeZone }).format(new Date());
    expect((await search(agents.trainer, { q: word('loss'), from: '2020-01-01', to: '2020-12-31' })).body.total).toBe(0);
    expect((await search(agents.trainer, { q: word('loss'), from: '2020-01-01', to: '2099-12-31' })).body.total).toBe(3);
    expect((await search(agents.trainer, { q: word('loss'), from: today, to: today })).body.total).toBeGreaterThanOrEqual(2);

    // Paging: one per page, the second page holds the second-ranked hit.
    const page2 = await search(agents.trainer, { q: phrase, unitId, pageSize: 1, page: 2 });
    expect(page2.body.hits).toHaveLength(1);
    expect(page2.body.total).toBe(2);
  });

  it('indexes every kind of logbook record as it is written, and nothing from a rolled-back write', async () => {
    const author = ids.operator;
    const now = new Date();
    const entry = await LogEntry.create({ unitId, position: 'control_room', category: 'operation', eventAt: now, enteredAt: now, receivedAt: now, clientId: null, shiftStart: now, late: false, authorId: author, text: 'plain entry', equipmentId: null, readingSetId: null, flagId: null, conditionId: null, carryToHandover: false });
    await LogAmendment.create({ entryId: entry.id, authorId: author, amendedAt: now, reason: 'wrong pump named', text: `It was ${word('amended')}` });
    const handover = await Handover.create({ unitId, shiftStart: new Date('2025-03-01T05:00:00Z'), handoverAt: new Date('2025-03-01T17:00:00Z'), outgoingCrewId: crewA, incomingCrewId: null, notesHtml: `<p>Watch the <strong>${word('notes')}</strong> trend</p>`, status: 'draft', createdBy: author, createdAt: now, submittedBy: null, submittedAt: null, acceptedBy: null, acceptedAt: null });
    const item = await HandoverItem.create({ handoverId: handover.id, kind: 'work_in_progress', title: `Screen cleaning ${word('item')}`, detail: null, reference: 'WP-77', priority: 'high', sourceId: null, createdBy: author, createdAt: now });
    const query = await HandoverQuery.create({ itemId: item.id, askedBy: author, askedAt: now, question: 'Which screen?', answeredBy: null, answeredAt: null, answer: null });
    await query.update({ answer: `The ${word('answer')} screen`, answeredBy: author, answeredAt: now });
    const flag = await Flag.create({ unitId, parameter: 'ttd', origin: 'manual', severity: 'alarm', status: 'open', firstReadingSetId: null, lastReadingSetId: null, lastValue: null, raisedAt: now, lastSeenAt: now, raisedBy: author, comment: 'TTD high', assignedTo: null, followUp: null, clearedBy: null, clearedAt: null, clearComment: null });
    await Flag.update({ clearComment: `Cleared after ${word('flag')} backwash`, status: 'cleared' }, { where: { id: flag.id } });
    await Condition.create({ unitId, title: `CW pump ${word('condition')}`, requiredAction: 'Restore or reduce load', startedAt: now, limitAt: new Date(now.getTime() + 3_600_000), ownerId: author, openedBy: author, openedAt: now, closedBy: null, closedAt: null, closingEntryId: null });
    await StandingOrder.create({ stationId, title: 'Tower fans', bodyHtml: '<p>x</p>', bodyText: `Run fans in ${word('order')} sequence`, effectiveFrom: now, effectiveTo: null, crewIds: [], positions: [], issuedBy: author, issuedAt: now });
    // Notes saved the way the service saves them (a bulk update by id); a draft is not indexed yet.
    await Handover.update({ notesHtml: `<p>${word('renotes')}</p>` }, { where: { id: handover.id } });
    expect((await search(agents.trainer, { q: word('renotes') })).body.total).toBe(0);
    await Handover.update({ status: 'submitted', submittedBy: author, submittedAt: now }, { where: { id: handover.id } });

    const kindOf = async (w: string) => (await search(agents.trainer, { q: word(w) })).body.hits.map((h: { kind: string }) => h.kind);
    expect(await kindOf('amended')).toEqual(['log_amendment']);
    expect(await kindOf('renotes')).toEqual(['handover_notes']);
    expect(await kindOf('notes')).toEqual([]); // replaced by the later save
    expect(await kindOf('item')).toEqual(['handover_item']);
    expect(await kindOf('answer')).toEqual(['handover_query']);
    expect(await kindOf('flag')).toEqual(['flag']);
    expect(await kindOf('condition')).toEqual(['condition']);
    expect(await kindOf('order')).toEqual(['standing_order']);
    const high = await search(agents.trainer, { q: word('item'), severity: 'high' });
    expect(high.body.hits[0]).toMatchObject({ severity: 'high', shiftStart: '2025-03-01T05:00:00.000Z', crewName: 'A' });

    const before = await db().query<{ n: number }>('SELECT COUNT(*) AS n FROM logbook_documents', { type: QueryTypes.SELECT });
    await expect(
      db().transaction(async (transaction) => {
        await LogEntry.create({ unitId, position: 'control_room', category: 'operation', eventAt: now, enteredAt: now, receivedAt: now, clientId: null, shiftStart: now, late: false, authorId: author, text: word('rolledback'), equipmentId: null, readingSetId: null, flagId: null, conditionId: null, carryToHandover: false }, { transaction });
        throw new Error('simulated failure after the insert');
      }),
    ).rejects.toThrow('simulated failure');
    const after = await db().query<{ n: number }>('SELECT COUNT(*) AS n FROM logbook_documents', { type: QueryTypes.SELECT });
    expect(Number(after[0]!.n)).toBe(Number(before[0]!.n));
    expect(await kindOf('rolledback')).toEqual([]);
  });

  it('indexes a round outside its limits under the checks\' names, and not a normal one', async () => {
    // 28.5 inHg vacuum on a 29.92 inHg barometer: Ts ≈ 32.0 °C (steam tables); a 25 °C hotwell is
    // ~7 K subcooled, over the starting alarm limit of 3 K (common practice, no source).
    const base = { pressure: { value: 28.5, unit: 'inHg_vac' }, barometer: { value: 29.92, unit: 'inHgA' }, cwInletTemperature: { value: 18, unit: 'degC' }, cwOutletTemperature: { value: 26.5, unit: 'degC' }, cwFlow: { value: 54_000, unit: 'm3_h' } };
    const cold = await post(agents.operator, `/api/units/${unitId}/readings`, { ...base, hotwellTemperature: { value: 25, unit: 'degC' } });
    expect(cold.status, JSON.stringify(cold.body)).toBe(201);
    const normal = await post(agents.operator, `/api/units/${unitId}/readings`, { ...base, hotwellTemperature: { value: 31.8, unit: 'degC' } });
    expect(normal.status).toBe(201);
    const found = await search(agents.trainer, { q: 'condensate subcooling alarm', kind: 'round', unitId });
    const refs = found.body.hits.map((h: { refId: number }) => h.refId);
    expect(refs).toContain(cold.body.id);
    expect(refs).not.toContain(normal.body.id);
  });

  it('moves documents to the crew of a changed rotation when the index is rebuilt', async () => {
    const { station, unit, crews } = await makeStation(2);
    const [first, second] = crews as [(typeof crews)[0], (typeof crews)[0]];
    const rotate = (crewId: number) =>
      agents.admin
        .put(`/api/stations/${station.id}/crew-rotation`)
        .set('X-CSRF-Token', agents.admin.csrf)
        .send({ anchorShiftStart: new Date('2026-01-01T05:00:00Z').toISOString(), crewIds: [crewId] })
        .expect(200);
    await rotate(first.id);
    await post(agents.operator, `/api/units/${unit.id}/log`, { position: 'control_room', category: 'operation', text: `Rotation check ${word('rotation')}` }).expect(201);
    const crewOf = async () => (await search(agents.trainer, { q: word('rotation') })).body.hits[0].crewName;
    expect(await crewOf()).toBe(first.name);
    await rotate(second.id);
    expect(await crewOf()).toBe(first.name); // fixed when indexed …
    await rebuildLogbookIndex(db());
    expect(await crewOf()).toBe(second.name); // … until the index is rebuilt
  });

  it('finds an equipment tag whole, not every record that shares a fragment of it', async () => {
    const write = (text: string) => post(agents.operator, `/api/units/${unitId}/log`, { position: 'control_room', category: 'operation', text });
    await write(`Started 1-CWP-B; ${word('tagcheck')} discharge pressure normal.`).expect(201);
    await write(`Stopped 1-CWP-A; ${word('tagcheck')} for the outage.`).expect(201);
    await write(`Pump 1 CWP B fragments only, ${word('tagcheck')}.`).expect(201);
    const tag = await search(agents.trainer, { q: `1-CWP-B ${word('tagcheck')}` });
    expect(tag.body.total).toBe(1);
    expect(tag.body.hits[0].snippet).toContain('Started 1-CWP-B');
    expect((await search(agents.trainer, { q: word('tagcheck') })).body.total).toBe(3);
  });

  it('handles hostile input with a clear 400 or a safe search, never a 500', async () => {
    // Each is searched as its plain words (three letters or more; "AND" is a word like any other,
    // "OR" too short), every word required: of the three entries with the word, one also says
    // "pump", none "and" or "distance".
    const hostile: [string, number][] = [
      [`"vacuum ${word('loss')}"`, 3],
      [`+vacuum -pump ${word('loss')}*`, 1],
      [`vacuum) AND (${word('loss')}`, 0],
      [`@distance ~${word('loss')} <>`, 0],
      [`' OR 1=1 -- ${word('loss')}`, 3],
      [`%_\\ ${word('loss')}`, 3],
    ];
    for (const [q, total] of hostile) {
      const res = await search(agents.trainee, { q });
      expect(res.status, q).toBe(200);
      expect(res.body.total, q).toBe(total);
      expect(res.body.hits, q).toHaveLength(total);
    }
    // Quotes and operators are searched as words: the quoted phrase finds the same entries as the bare words.
    expect((await search(agents.trainee, { q: `"vacuum ${word('loss')}"` })).body.total).toBe(3);
    const long = await search(agents.trainee, { q: 'x'.repeat(10_240) });
    expect(long.status).toBe(400);
    expect(long.body.error.fields.q).toMatch(/200 characters/);
    const tooShort = await search(agents.trainee, { q: 'a OR b' });
    expect(tooShort.status).toBe(400);
    expect(tooShort.body.error.fields.q).toMatch(/three letters/);
    for (const query of [{ page: 0 }, { unitId: 'abc' }, { from: '2026-13-40' }, { from: '2026-02-01', to: '2026-01-01' }, { severity: 'catastrophic' }, { kind: 'everything' }]) {
      const res = await search(agents.trainee, query as unknown as Record<string, string | number>);
      expect(res.status, JSON.stringify(query)).toBe(400);
      expect(res.body.error.fields).toBeTruthy();
    }
    const twice = await agents.trainee.get(`/api/logbook/search?q=pump&q=fan`);
    expect(twice.status).toBe(400);
  });

  it('exports the results as CSV', async () => {
    const res = await agents.trainer.get('/api/logbook/search.csv').query({ q: `vacuum ${word('loss')}`, unitId });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment/);
    const lines = res.text.replace(/^\uFEFF/, '').trim().split(/\r?\n/);
    expect(lines[0]).toBe('occurred_at_utc,shift_start_utc,unit,crew,person,record,severity,title,text');
    expect(lines).toHaveLength(3);
    expect(lines[1]).toContain('stuck air ejector');
  });

  it('keeps a cell that looks like a spreadsheet formula from running as one', async () => {
    await post(agents.operator, `/api/units/${unitId}/log`, { position: 'control_room', category: 'operation', text: `=HYPERLINK("http://example.invalid") ${word('formula')}` }).expect(201);
    const res = await agents.trainer.get('/api/logbook/search.csv').query({ q: word('formula') });
    const row = res.text.replace(/^\uFEFF/, '').trim().split(/\r?\n/)[1]!;
    expect(row).toContain(`"'=HYPERLINK`);
  });
});

describe('a past shift as it was, and review comments', () => {
  it('shows the shift read-only with its log, and lets a trainer comment that the people involved then see', async () => {
    const settings = defaultStationSettings;
    const shiftStart = shiftStartFor(new Date(), settings.timeZone, settings.shiftChangeTimes).toISOString();
    const text = `Trainee noted ${word('review')} drift on the hotwell level`;
    const written = await post(agents.trainee, `/api/units/${unitId}/log`, { position: 'control_room', category: 'operation', text });
    expect(written.status).toBe(201);

    const view = await agents.trainer.get(`/api/logbook/units/${unitId}/shifts/${shiftStart}`);
    expect(view.status, JSON.stringify(view.body)).toBe(200);
    expect(view.body.shift).toMatchObject({ start: shiftStart, crew: { id: crewA }, inProgress: true });
    const shown = view.body.logEntries.find((e: { text: string }) => e.text === text);
    expect(shown).toBeTruthy();
    const doc = view.body.documents.find((d: { kind: string; refId: number }) => d.kind === 'log_entry' && d.refId === shown.id);
    expect(doc).toBeTruthy();

    // Only trainers and administrators comment; the text is checked.
    await post(agents.operator, '/api/logbook/review-comments', { documentId: doc.id, body: 'Looks fine' }).expect(403);
    await post(agents.trainee, '/api/logbook/review-comments', { documentId: doc.id, body: 'Looks fine' }).expect(403);
    const empty = await post(agents.trainer, '/api/logbook/review-comments', { documentId: doc.id, body: ' ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.body).toBeTruthy();
    await post(agents.trainer, '/api/logbook/review-comments', { documentId: 987654321, body: 'Nothing there' }).expect(404);
    const comment = await post(agents.trainer, '/api/logbook/review-comments', { documentId: doc.id, body: 'Good catch; this should also have gone to the shift lead at once.' });
    expect(comment.status).toBe(201);

    // The trainee who wrote it sees it on their own list and on the shift; an operator of another crew does not.
    const mine = await agents.trainee.get('/api/logbook/review-comments/mine').expect(200);
    expect(mine.body.comments[0]).toMatchObject({ documentId: doc.id, body: expect.stringContaining('shift lead'), shiftStart });
    const traineeView = await agents.trainee.get(`/api/logbook/units/${unitId}/shifts/${shiftStart}`).expect(200);
    expect(traineeView.body.comments.map((c: { id: number }) => c.id)).toContain(comment.body.comment.id);
    const outsiderView = await agents.outsider.get(`/api/logbook/units/${unitId}/shifts/${shiftStart}`).expect(200);
    expect(outsiderView.body.comments).toEqual([]);
    expect((await agents.outsider.get('/api/logbook/review-comments/mine')).body.comments).toEqual([]);
  });

  it('refuses shift times that are not a shift start, are in the future, or are not dates', async () => {
    for (const bad of ['yesterday', '2026-03-01T07:13:00Z', '2099-01-01T05:00:00Z']) {
      const res = await agents.trainer.get(`/api/logbook/units/${unitId}/shifts/${encodeURIComponent(bad)}`);
      expect(res.status, bad).toBe(400);
      expect(res.body.error.fields.shiftStart).toBeTruthy();
    }
    await agents.trainer.get(`/api/logbook/units/999999/shifts/2026-01-01T05:00:00Z`).expect(404);
  });
});
