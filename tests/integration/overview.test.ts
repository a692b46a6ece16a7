import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { QueryTypes } from 'sequelize';
import { Handover } from '../../server/features/handovers/model';
import { overviewCheckKeys, type Overview, type OverviewUnit } from '../../shared/schemas/overview';
import { anonymousAgent, buildApp, closeAll, db, makeStation, makeUnit, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);
afterEach(() => vi.useRealTimers());
const built = buildApp();
const post = (agent: Agent, path: string, body: unknown = {}) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);

async function panel(agent: Agent, unitId: number): Promise<OverviewUnit> {
  const res = await agent.get('/api/overview');
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  const found = (res.body as Overview).units.find((u) => u.unit.id === unitId);
  expect(found).toBeTruthy();
  return found!;
}

// 10 kPa a: Ts = 45.81 °C (steam tables, e.g. Çengel & Boles table A-5; IAPWS-IF97 gives 318.956 K).
const round = (overrides: Record<string, unknown> = {}) => ({
  pressure: { value: 10, unit: 'kPa_a' },
  hotwellTemperature: { value: 45.0, unit: 'degC' },
  cwInletTemperature: { value: 30, unit: 'degC' },
  cwOutletTemperature: { value: 38, unit: 'degC' },
  cwFlow: { value: 54_000, unit: 'm3_h' },
  ...overrides,
});

let stationId = 0;
let unitId = 0;
let crewA = 0;
let crewB = 0;
let operatorA: Agent;
let leadAName = '';
let operatorAName = '';

beforeAll(async () => {
  const { station, unit, crews } = await makeStation(2);
  stationId = station.id;
  unitId = unit.id;
  crewA = crews[0]!.id;
  crewB = crews[1]!.id;
  const lead = await makeUser('shift_lead', { crewId: crewA });
  const operator = await makeUser('operator', { crewId: crewA });
  await makeUser('operator', { crewId: crewB });
  await makeUser('operator', { crewId: crewA, active: false });
  leadAName = lead.name;
  operatorAName = operator.name;
  operatorA = await signedInAgent(built, operator.email);
  const admin = await signedInAgent(built, (await makeUser('admin')).email);
  // Crew A works the shift in progress, crew B the next one.
  const shifts = await admin.get(`/api/units/${unitId}/log/shifts`).expect(200);
  await admin.put(`/api/stations/${stationId}/crew-rotation`).set('X-CSRF-Token', admin.csrf).send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: [crewA, crewB] }).expect(200);
});

describe('GET /api/overview', () => {
  it('answers 401 signed out', async () => {
    const res = await (await anonymousAgent(built)).get('/api/overview');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('UNAUTHENTICATED');
  });

  it('changes no row anywhere, even for the outgoing operator whose opening of the board would start a draft', async () => {
    const tables = await db().query<{ name: string }>(
      `SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' AND table_name <> 'sessions'`,
      { type: QueryTypes.SELECT },
    );
    // Sessions are left out: the store's own expiry sweep may remove stale sessions at any request.
    const counts = async () => {
      const [row] = await db().query<Record<string, number>>(`SELECT ${tables.map((t) => `(SELECT COUNT(*) FROM \`${t.name}\`) AS \`${t.name}\``).join(', ')}`, { type: QueryTypes.SELECT });
      return row;
    };
    const before = await counts();
    await operatorA.get('/api/overview').expect(200);
    await operatorA.get('/api/overview').expect(200);
    expect(await counts()).toEqual(before);
    expect(await Handover.count({ where: { unitId } })).toBe(0);
  });

  it('reads a fixed number of statements however many units, rounds, flags and conditions there are', async () => {
    const statements: string[] = [];
    db().addHook('beforeQuery', 'count-overview', (_options, query) => {
      const sql = String((query as unknown as { sql?: string }).sql ?? '');
      // The session store's reads and its once-a-minute touch are not the overview's.
      if (!/sessions/.test(sql)) statements.push(sql);
    });
    const count = async () => {
      statements.length = 0;
      await operatorA.get('/api/overview').expect(200);
      return statements.length;
    };
    const lead = await signedInAgent(built, (await makeUser('shift_lead')).email);
    const busyUnit = async () => {
      const unit = await makeUnit();
      await post(lead, `/api/units/${unit.id}/readings`, round()).expect(201);
      await post(lead, `/api/units/${unit.id}/flags`, { parameter: 'cwRise', severity: 'watch', comment: 'Rise creeping up' }).expect(201);
      await post(lead, `/api/units/${unit.id}/conditions`, { title: 'Screen wash out of service', requiredAction: 'Restore within 24 h', startedAt: new Date().toISOString(), limitHours: 24, ownerId: (await lead.get('/api/me')).body.user.id }).expect(201);
    };
    try {
      await busyUnit();
      const before = await count();
      for (let i = 0; i < 3; i++) await busyUnit();
      expect(await count()).toBe(before);
    } finally {
      db().removeHook('beforeQuery', 'count-overview');
    }
  });

  it('shows a unit with no round yet: the crews, the next change in the station zone and nothing open', async () => {
    const shown = await panel(operatorA, unitId);
    expect(shown.round).toBeNull();
    expect(shown.flags).toEqual({ open: { alarm: 0, watch: 0 }, top: [] });
    expect(shown.conditions).toEqual([]);
    expect(shown.handover).toMatchObject({ state: 'none', id: null });
    expect(shown.timeZone).toBe('Europe/Berlin');
    expect(shown.roundIntervalMinutes).toBe(240);
    expect(shown.shift.crewOnShift).toEqual({ id: crewA, name: 'A' });
    expect(shown.shift.incomingCrew).toEqual({ id: crewB, name: 'B' });
    // The lead first, then operators; the deactivated member is not on shift.
    expect(shown.shift.people.map((p) => p.name)).toEqual([leadAName, operatorAName]);
    // The default station changes shift at 06:00 and 18:00 Berlin time (read here through the ICU time-zone data).
    const change = new Date(shown.shift.changeAt);
    const berlin = new Intl.DateTimeFormat('en-GB', { timeZone: 'Europe/Berlin', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(change);
    expect(['06:00', '18:00']).toContain(berlin);
    expect(change.getTime()).toBeGreaterThan(Date.now());
    expect(change.getTime() - Date.now()).toBeLessThanOrEqual(13 * 3_600_000);
  });

  it('shows the latest round with its key checks and statuses, from its current (amended) version', async () => {
    const recorded = await post(operatorA, `/api/units/${unitId}/readings`, round());
    expect(recorded.status, JSON.stringify(recorded.body)).toBe(201);
    const shown = await panel(operatorA, unitId);
    expect(shown.round).toMatchObject({ id: recorded.body.id, recordedBy: operatorAName, recordedAsTrainee: false, amended: false, overdue: false, worstStatus: 'watch' });
    expect(shown.round!.ageMs).toBeGreaterThanOrEqual(0);
    expect(shown.round!.ageMs).toBeLessThan(60_000);
    expect(shown.round!.checks.map((c) => c.key)).toEqual([...overviewCheckKeys]);
    const check = (key: string) => shown.round!.checks.find((c) => c.key === key)!;
    expect(check('backpressure')).toMatchObject({ value: 10_000, status: 'normal', quantity: 'pressure' });
    expect(check('saturationTemperature').value! - 273.15).toBeCloseTo(45.81, 1);
    // Subcooling = Tsat − hotwell; TTD = Tsat − CW outlet; rise = outlet − inlet (definitions, HEI / common practice).
    expect(check('subcooling')).toMatchObject({ status: 'normal' });
    expect(check('subcooling').value).toBeCloseTo(0.81, 1);
    // TTD 7.8 K is past the 7 K watch limit of the starting limits (common practice, no source).
    expect(check('ttd')).toMatchObject({ status: 'watch' });
    expect(check('ttd').value).toBeCloseTo(7.81, 1);
    expect(check('cwRise')).toMatchObject({ status: 'normal' });
    expect(check('cwRise').value).toBeCloseTo(8, 6);
    // Every key check is the round's own stored result, value and status alike, or absent with its reason.
    const stored = (await operatorA.get(`/api/readings/${recorded.body.id}`).expect(200)).body.current.results.checks;
    for (const c of shown.round!.checks) {
      expect({ value: c.value, status: c.status }).toEqual({ value: stored[c.key].value, status: stored[c.key].status });
      if (c.value === null) expect(c.reason).toBeTruthy();
    }

    // Corrected: CW outlet 35 °C read wrongly as 38 → TTD 10.8 K, past the 10 K alarm limit. The overview follows the correction.
    const amended = await post(operatorA, `/api/readings/${recorded.body.id}/amendments`, { reason: 'Outlet thermometer misread', reading: round({ cwOutletTemperature: { value: 35.0, unit: 'degC' } }) });
    expect(amended.status, JSON.stringify(amended.body)).toBe(201);
    const after = await panel(operatorA, unitId);
    expect(after.round).toMatchObject({ id: recorded.body.id, amended: true, worstStatus: 'alarm' });
    expect(after.round!.checks.find((c) => c.key === 'ttd')).toMatchObject({ status: 'alarm' });
    expect(after.round!.checks.find((c) => c.key === 'ttd')!.value).toBeCloseTo(10.81, 1);
  });

  it('marks the round overdue once it is older than the station’s round interval, by a fixed clock', async () => {
    const { station, unit } = await makeStation(1);
    const admin = await signedInAgent(built, (await makeUser('admin')).email);
    const settings = (await admin.get(`/api/stations/${station.id}/settings`).expect(200)).body.settings;
    await admin.put(`/api/stations/${station.id}/settings`).set('X-CSRF-Token', admin.csrf).send({ ...settings, roundIntervalMinutes: 60 }).expect(200);
    const operator = await makeUser('operator');

    vi.useFakeTimers({ toFake: ['Date'] });
    const t0 = Date.parse('2026-05-12T08:00:00Z');
    vi.setSystemTime(t0);
    const agent = await signedInAgent(built, operator.email);
    await post(agent, `/api/units/${unit.id}/readings`, round({ takenAt: new Date(t0 - 30 * 60_000).toISOString() })).expect(201);
    expect((await panel(agent, unit.id)).round).toMatchObject({ ageMs: 30 * 60_000, overdue: false });

    vi.setSystemTime(t0 + 29 * 60_000);
    expect((await panel(agent, unit.id)).round).toMatchObject({ ageMs: 59 * 60_000, overdue: false });
    vi.setSystemTime(t0 + 31 * 60_000);
    expect((await panel(agent, unit.id)).round).toMatchObject({ ageMs: 61 * 60_000, overdue: true });
  });

  it('counts open flags by severity and shows the most severe, newest first, three at most', async () => {
    const unit = await makeUnit();
    const lead = await signedInAgent(built, (await makeUser('shift_lead')).email);
    const raise = async (parameter: string, severity: 'watch' | 'alarm') => (await post(lead, `/api/units/${unit.id}/flags`, { parameter, severity, comment: `Check ${parameter}` }).expect(201)).body.flag;
    await raise('towerApproach', 'watch');
    await raise('subcooling', 'alarm');
    await raise('cwRise', 'watch');
    await raise('lmtd', 'watch');
    const cleared = await raise('itd', 'watch');
    await post(lead, `/api/flags/${cleared.id}/clear`, { comment: 'Thermometer swapped, ITD normal', version: cleared.version }).expect(200);

    const shown = await panel(lead, unit.id);
    expect(shown.flags.open).toEqual({ alarm: 1, watch: 3 });
    expect(shown.flags.top.map((f) => [f.parameter, f.severity])).toEqual([
      ['subcooling', 'alarm'],
      ['lmtd', 'watch'],
      ['cwRise', 'watch'],
    ]);
    expect(shown.flags.top[0]).toMatchObject({ parameterLabel: 'Condensate subcooling', origin: 'manual' });
  });

  it('gives an open condition’s time left from the server clock, across the spring clock change', async () => {
    const unit = await makeUnit();
    const owner = await makeUser('shift_lead');
    vi.useFakeTimers({ toFake: ['Date'] });
    const t0 = Date.parse('2026-03-28T11:00:00Z');
    vi.setSystemTime(t0);
    let lead = await signedInAgent(built, owner.email);
    const opened = await post(lead, `/api/units/${unit.id}/conditions`, {
      title: '1-CWP-B out of service',
      requiredAction: 'Restore within 72 h',
      startedAt: new Date(t0 - 3_600_000).toISOString(),
      limitHours: 72,
      ownerId: owner.id,
    });
    expect(opened.status, JSON.stringify(opened.body)).toBe(201);
    const condition = () => panel(lead, unit.id).then((p) => p.conditions.find((c) => c.id === opened.body.condition.id));
    // 72 h from 10:00 UTC on 28 March is 10:00 UTC on 31 March: 12:00 in Berlin, on summer time
    // since 01:00 UTC on 29 March (EU rule, Directive 2000/84/EC: last Sunday of March).
    expect(await condition()).toMatchObject({ remainingMs: 71 * 3_600_000, state: 'running', limitAt: '2026-03-31T10:00:00.000Z', limitLocal: '2026-03-31 12:00' });

    vi.setSystemTime(t0 + 60 * 3_600_000);
    lead = await signedInAgent(built, owner.email);
    // 11 h left of 72: inside the last fifth (14.4 h), so due soon.
    expect(await condition()).toMatchObject({ remainingMs: 11 * 3_600_000, state: 'due_soon' });

    vi.setSystemTime(t0 + 73 * 3_600_000);
    lead = await signedInAgent(built, owner.email);
    expect(await condition()).toMatchObject({ remainingMs: -2 * 3_600_000, state: 'overdue' });
  });
});
