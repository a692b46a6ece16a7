// Races that two people can start at the same moment, each run many times with the requests fired
// together, and the invariant asserted on every trial (not once over the whole run): closing a
// condition, opening and starting a board with no draft, and rounds opening a flag on one unit.
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { Op } from 'sequelize';
import { AuditEvent } from '../../server/features/audit/model';
import { Condition } from '../../server/features/conditions/model';
import { Flag } from '../../server/features/flags/model';
import { Handover, HandoverItem } from '../../server/features/handovers/model';
import { LogEntry } from '../../server/features/log/model';
import { User } from '../../server/features/users/model';
import { vacuumRound } from './support/rounds';
import { buildApp, closeAll, db, makeStation, makeUnit, makeUser, signedInAgent, type Agent } from './support/test-app';
import { logger } from '../../server/lib/logger';

const built = buildApp();
const post = (agent: Agent, path: string, body: unknown = {}) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);
const statuses = (responses: { status: number }[]) => responses.map((r) => r.status).sort((a, b) => a - b);

let admin: Agent;
beforeAll(async () => {
  admin = await signedInAgent(built, (await makeUser('admin')).email);
});
afterAll(closeAll);

/** Counts the deadlock and lock-wait retries the unit of work logs while `run` runs. */
async function countingRetries<T>(run: () => Promise<T>): Promise<{ result: T; retries: string[] }> {
  const retries: string[] = [];
  const spy = vi.spyOn(logger, 'warn').mockImplementation((...args: unknown[]) => {
    retries.push(args.map((a) => (typeof a === 'string' ? a : JSON.stringify(a))).join(' '));
  });
  try {
    return { result: await run(), retries };
  } finally {
    spy.mockRestore();
  }
}

describe('closing one condition from several places at once', () => {
  const TRIALS = 20;
  const CLOSERS = 5;

  it(`closes it once, with one closing entry and one audit row (${TRIALS} trials of ${CLOSERS} closes)`, { timeout: 120_000 }, async () => {
    const { unit, crews } = await makeStation(1);
    const people: Agent[] = [];
    for (let i = 0; i < CLOSERS; i++) people.push(await signedInAgent(built, (await makeUser(i % 2 ? 'shift_lead' : 'operator', { crewId: crews[0]!.id })).email));
    const owner = await makeUser('operator');
    for (let trial = 0; trial < TRIALS; trial++) {
      const opened = await post(people[0]!, `/api/units/${unit.id}/conditions`, {
        title: `Screen wash pump B out of service (${trial})`,
        requiredAction: 'Return to service or stop the CW pump on that bay',
        startedAt: new Date(Date.now() - 60_000).toISOString(),
        limitHours: 8,
        ownerId: owner.id,
      }).expect(201);
      const id = opened.body.condition.id as number;
      const closes = await Promise.all(people.map((p, i) => post(p, `/api/conditions/${id}/close`, { text: `Pump back in service (closer ${i})`, position: 'control_room', version: 0 })));
      expect(statuses(closes), `trial ${trial}: ${JSON.stringify(closes.map((c) => c.body))}`).toEqual([200, ...Array(CLOSERS - 1).fill(409)]);
      const entries = await LogEntry.findAll({ where: { conditionId: id } });
      expect(entries, `trial ${trial}: closing entries`).toHaveLength(1);
      const condition = await Condition.findByPk(id);
      expect(condition!.closingEntryId).toBe(entries[0]!.id);
      expect(condition!.version).toBe(1);
      expect(await AuditEvent.count({ where: { action: 'condition.close', entity: 'condition', entityId: String(id) } })).toBe(1);
      // The log entry that says it closed is the one the winner wrote, not a loser's.
      const winner = closes.findIndex((c) => c.status === 200);
      expect(entries[0]!.text).toContain(`(closer ${winner})`);
    }
  });
});

describe('opening a board that has no draft yet, from both outgoing writers at once', () => {
  const TRIALS = 20;

  afterEach(() => vi.useRealTimers());

  it(`never fails, opening writes nothing, and starting makes one draft (${TRIALS} trials)`, { timeout: 180_000 }, async () => {
    const operatorRow = await makeUser('operator');
    const leadRow = await makeUser('shift_lead');
    const operator = await signedInAgent(built, operatorRow.email);
    const lead = await signedInAgent(built, leadRow.email);
    for (let trial = 0; trial < TRIALS; trial++) {
      // A station of its own per trial: each has a shift change in progress with no draft.
      const { station, unit, crews } = await makeStation(2);
      const shifts = await admin.get(`/api/units/${unit.id}/log/shifts`).expect(200);
      await admin
        .put(`/api/stations/${station.id}/crew-rotation`)
        .set('X-CSRF-Token', admin.csrf)
        .send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: crews.map((c) => c.id) })
        .expect(200);
      // The same two people, on this station's outgoing crew (each request reads the person afresh).
      await User.update({ crewId: crews[0]!.id }, { where: { id: [operatorRow.id, leadRow.id] } });
      // An open flag, so starting the draft also attaches an automatic item (one, whoever wins).
      await post(lead, `/api/units/${unit.id}/flags`, { parameter: 'ttd', severity: 'watch', comment: 'TTD creeping up' }).expect(201);
      const board = `/api/units/${unit.id}/handovers/current`;

      const handoversBefore = await Handover.count({ where: { unitId: unit.id } });
      const opens = await Promise.all(Array.from({ length: 8 }, (_, i) => (i % 2 ? lead : operator).get(board)));
      expect(statuses(opens), `trial ${trial}: opening`).toEqual(Array(8).fill(200));
      for (const res of opens) expect(res.body.board).toBeNull();
      expect(await Handover.count({ where: { unitId: unit.id } }), `trial ${trial}: opening wrote`).toBe(handoversBefore);

      const both = await Promise.all([...Array.from({ length: 3 }, () => post(operator, board)), ...Array.from({ length: 3 }, () => post(lead, board)), operator.get(board), lead.get(board)]);
      const starts = both.slice(0, 6);
      expect(statuses(starts), `trial ${trial}: ${JSON.stringify(starts.map((s) => s.body))}`).toEqual(Array(6).fill(201));
      for (const res of both.slice(6)) expect(res.status, `trial ${trial}: an open beside the starts`).toBe(200);
      const ids = new Set(starts.map((s) => s.body.board.handover.id as number));
      expect(ids.size, `trial ${trial}: drafts`).toBe(1);
      expect(await Handover.count({ where: { unitId: unit.id } })).toBe(handoversBefore + 1);
      const [handoverId] = [...ids];
      expect(await HandoverItem.count({ where: { handoverId, kind: 'abnormal_reading' } }), `trial ${trial}: automatic items`).toBe(1);
    }
  });
});

describe('rounds that open the same new automatic flag on one unit at once', () => {
  const TRIALS = 25;
  const ROUNDS = 6;
  // 26.5 inHg vacuum against 29.92 inHg barometer → 3.42 inHgA = 11.6 kPa a (1 inHg = 3.386389 kPa,
  // NIST SP 811): past the 11 kPa a starting watch limit, so each round breaks the same limit.
  const badRound = () => vacuumRound(26.5, 45);

  async function trial(unitId: number, people: Agent[], label: string) {
    const rounds = await Promise.all(people.map((p) => post(p, `/api/units/${unitId}/readings`, badRound())));
    for (const r of rounds) expect(r.status, `${label}: ${JSON.stringify(r.body)}`).toBe(201);
    const open = await Flag.findAll({ where: { unitId, origin: 'automatic', status: 'open' } });
    const perParameter = new Map<string, number>();
    for (const f of open) perParameter.set(f.parameter, (perParameter.get(f.parameter) ?? 0) + 1);
    expect(open.length, `${label}: no flag opened`).toBeGreaterThan(0);
    expect([...perParameter.values()].every((n) => n === 1), `${label}: open flags per parameter ${JSON.stringify([...perParameter])}`).toBe(true);
    // Every flag raised is in the search index, once.
    const row = (await db().query(`SELECT COUNT(*) AS n FROM logbook_documents WHERE kind = 'flag' AND ref_id IN (${open.map((f) => f.id).join(',')})`, { plain: true })) as { n: number };
    expect(Number(row.n)).toBe(open.length);
    // Exactly one round raised each flag.
    expect(rounds.reduce((sum, r) => sum + Number(r.body.flagsRaised), 0), `${label}: flags raised`).toBe(open.length);
  }

  const people: Agent[] = [];
  beforeAll(async () => {
    for (let i = 0; i < ROUNDS; i++) people.push(await signedInAgent(built, (await makeUser('operator')).email));
  });

  it(`answers 201 to every round and opens one flag per parameter (${TRIALS} trials of ${ROUNDS} rounds)`, { timeout: 180_000 }, async () => {
    const { retries } = await countingRetries(async () => {
      for (let t = 0; t < TRIALS; t++) await trial((await makeUnit()).id, people, `trial ${t}`);
    });
    // Retries are allowed (InnoDB may pick a victim); a lock wait running out is not.
    // Rounds that may open a flag take turns on the unit: no deadlock victim, no lock wait run out.
    expect(retries).toEqual([]);
  });

  it(`does the same while the unit has a handover draft being written, which each new flag joins (${TRIALS} trials)`, { timeout: 180_000 }, async () => {
    const writerRow = await makeUser('operator');
    const writer = await signedInAgent(built, writerRow.email);
    const { retries } = await countingRetries(async () => {
      for (let t = 0; t < TRIALS; t++) {
        const { station, unit, crews } = await makeStation(2);
        const shifts = await admin.get(`/api/units/${unit.id}/log/shifts`).expect(200);
        await admin
          .put(`/api/stations/${station.id}/crew-rotation`)
          .set('X-CSRF-Token', admin.csrf)
          .send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: crews.map((c) => c.id) })
          .expect(200);
        await User.update({ crewId: crews[0]!.id }, { where: { id: writerRow.id } });
        const started = await post(writer, `/api/units/${unit.id}/handovers/current`).expect(201);
        await trial(unit.id, people, `trial ${t} with a draft`);
        const open = await Flag.findAll({ where: { unitId: unit.id, status: 'open' }, attributes: ['id'] });
        const items = await HandoverItem.findAll({ where: { handoverId: started.body.board.handover.id, kind: 'abnormal_reading', sourceId: { [Op.in]: open.map((f) => f.id) } } });
        expect(items.length, `trial ${t}: one draft item per flag`).toBe(open.length);
      }
    });
    // Rounds that may open a flag take turns on the unit: no deadlock victim, no lock wait run out.
    expect(retries).toEqual([]);
  });
});
