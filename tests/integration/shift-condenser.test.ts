import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Role } from '../../shared/roles';
import type { CondenserSnapshot, ShiftCondenserState } from '../../shared/shift-condenser';
import { anonymousAgent, buildApp, closeAll, makeStation, makeUser, signedInAgent, type Agent } from './support/test-app';

afterAll(closeAll);
afterEach(() => vi.useRealTimers());
const built = buildApp();
const post = (agent: Agent, path: string, body: unknown = {}) => agent.post(path).set('X-CSRF-Token', agent.csrf).send(body as object);

let unitId = 0;
let stationId = 0;
const agents = {} as Record<'outOperator' | 'trainer' | 'admin', Agent>;

// A round on the hand-built design (8 kPa a at 22 °C inlet, 15 000 kg/s, 560 MW); `kPa` is absolute.
const round = (takenAt: string, kPa: number, hotwellC: number, outletC: number) => ({
  takenAt,
  pressure: { value: kPa, unit: 'kPa_a' },
  hotwellTemperature: { value: hotwellC, unit: 'degC' },
  cwInletTemperature: { value: 22, unit: 'degC' },
  cwOutletTemperature: { value: outletC, unit: 'degC' },
  cwFlow: { value: 15_000, unit: 'kg_s' },
});

beforeAll(async () => {
  const { station, unit, crews } = await makeStation(2);
  unitId = unit.id;
  stationId = station.id;
  const person = async (role: Role, crewId: number | null) => signedInAgent(built, (await makeUser(role, { crewId })).email);
  agents.outOperator = await person('operator', crews[0]!.id);
  agents.trainer = await person('trainer', null);
  agents.admin = await person('admin', null);
  const shifts = await agents.admin.get(`/api/units/${unitId}/log/shifts`).expect(200);
  await agents.admin
    .put(`/api/stations/${station.id}/crew-rotation`)
    .set('X-CSRF-Token', agents.admin.csrf)
    .send({ anchorShiftStart: shifts.body.shifts[0].start, crewIds: [crews[0]!.id, crews[1]!.id] })
    .expect(200);
});

describe('GET /api/units/:unitId/shift-condenser', () => {
  it('answers 401 signed out', async () => {
    await (await anonymousAgent(built)).get(`/api/units/${unitId}/shift-condenser`).expect(401);
  });

  it('answers 400 on the field for a time that is not a shift start, not a time, or not begun; 404 for an unknown unit', async () => {
    // The test station keeps the default settings: Europe/Berlin, changes at 06:00 and 18:00.
    for (const [shiftStart, message] of [
      ['2025-11-03T05:17:00Z', /not the start of a shift/],
      ['2025-11-03T06:00:00Z', /not the start of a shift/], // 07:00 in Berlin (CET, UTC+1)
      ['yesterday', /Shift starting must be a date and time/],
      ['2099-01-01T05:00:00Z', /not started yet/],
    ] as const) {
      const res = await agents.trainer.get(`/api/units/${unitId}/shift-condenser`).query({ shiftStart });
      expect(res.status, shiftStart).toBe(400);
      expect(res.body.error.fields.shiftStart).toMatch(message);
    }
    await agents.trainer.get('/api/units/999999/shift-condenser').expect(404);
  });

  it('summarises a past shift with two rounds: start, min, max, latest and the energy lost', async () => {
    // Shift 2025-11-03 06:00–18:00 Berlin = 05:00–17:00 UTC (CET). One round from the shift before (05:30
    // Berlin), two in the shift at 08:00 and 12:00 Berlin.
    const before = await post(agents.outOperator, `/api/units/${unitId}/readings`, round('2025-11-03T04:30:00Z', 8.5, 42, 30.9)).expect(201);
    const first = await post(agents.outOperator, `/api/units/${unitId}/readings`, round('2025-11-03T07:00:00Z', 9, 43, 30.9)).expect(201);
    const second = await post(agents.outOperator, `/api/units/${unitId}/readings`, round('2025-11-03T11:00:00Z', 10, 45, 31)).expect(201);
    // Each round's own output lost and money rate, as its record holds them.
    const rate = (r: { body: { current: { results: { checks: Record<string, { value: number | null }> } } } }, key: string) => r.body.current.results.checks[key]!.value!;
    const [p1, p2] = [rate(first, 'deviationCostPower') / 1e6, rate(second, 'deviationCostPower') / 1e6];
    const [m1, m2] = [rate(first, 'deviationCostMoney'), rate(second, 'deviationCostMoney')];
    expect(p2).toBeGreaterThan(p1);

    const res = await agents.trainer.get(`/api/units/${unitId}/shift-condenser`).query({ shiftStart: '2025-11-03T05:00:00Z' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const state: ShiftCondenserState = res.body.state;
    expect(state).toMatchObject({ shiftStart: '2025-11-03T05:00:00.000Z', until: '2025-11-03T17:00:00.000Z', roundsInShift: 2, latestRound: { id: second.body.id } });
    const bp = state.checks.find((c) => c.key === 'backpressure')!;
    // kPa → Pa is × 1000 (SI prefix).
    expect(bp.start).toMatchObject({ value: 8500, basis: 'previous_shift', t: '2025-11-03T04:30:00.000Z' });
    expect(bp.min).toMatchObject({ value: 9000, t: '2025-11-03T07:00:00.000Z' });
    expect(bp.max).toMatchObject({ value: 10_000, t: '2025-11-03T11:00:00.000Z' });
    expect(bp.latest).toMatchObject({ value: 10_000, takenAt: '2025-11-03T11:00:00.000Z' });
    expect(bp.series).toHaveLength(2);
    // Hand calculation, the stated rule: trapezoid 07:00–11:00 (4 h), the 11:00 value held to 17:00 (6 h),
    // nothing 05:00–07:00; the 04:30 round belongs to the previous shift.
    expect(state.energyLost.megawattHours).toBeCloseTo(((p1 + p2) / 2) * 4 + p2 * 6, 6);
    expect(state.energyLost.money).toBeCloseTo(((m1 + m2) / 2) * 4 + m2 * 6, 4);
    expect(state.energyLost).toMatchObject({ currency: 'EUR', hoursCovered: 10, hoursElapsed: 12 });
    // The tower is not measured on these rounds: absent, with the engine's reason.
    expect(state.checks.find((c) => c.key === 'towerApproach')!.latest).toMatchObject({ value: null, status: 'unknown', reason: expect.stringMatching(/basin/) });
    expect(before.status).toBe(201);
  });

  it('freezes the state at submit: a round saved before shows, one saved or amended after does not', async () => {
    const now = Date.now();
    const current = await agents.outOperator.get(`/api/units/${unitId}/shift-condenser`).expect(200);
    const shiftStart = Date.parse(current.body.state.shiftStart);
    const beforeSubmit = await post(agents.outOperator, `/api/units/${unitId}/readings`, round(new Date(Math.max(shiftStart, now - 30_000)).toISOString(), 9.5, 44, 31)).expect(201);

    const live = await agents.outOperator.get(`/api/units/${unitId}/shift-condenser`).expect(200);
    expect(live.body.state.latestRound.id).toBe(beforeSubmit.body.id);
    expect(live.body.state.checks.find((c: { key: string }) => c.key === 'backpressure').latest.value).toBe(9500);

    const opened = await post(agents.outOperator, `/api/units/${unitId}/handovers/current`).expect(201);
    const id = opened.body.board.handover.id;
    expect(opened.body.board.handover.condenserSnapshot).toBeNull();
    // Submitted within the window around the shift change: the server's clock half an hour before it.
    vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
    vi.setSystemTime(new Date(Date.parse(opened.body.board.handover.handoverAt) - 30 * 60_000));
    const submitted = await post(agents.outOperator, `/api/handovers/${id}/submit`).expect(200);
    const frozen: CondenserSnapshot = submitted.body.board.handover.condenserSnapshot;
    expect(frozen.frozenAt).toBe(submitted.body.board.handover.submittedAt);
    expect(frozen.state).toMatchObject({ roundsInShift: 1, latestRound: { id: beforeSubmit.body.id }, until: frozen.frozenAt });

    // After submit: a new round and a correction of the earlier one.
    const afterSubmit = await post(agents.outOperator, `/api/units/${unitId}/readings`, round(new Date().toISOString(), 11, 46, 31)).expect(201);
    await post(agents.outOperator, `/api/readings/${beforeSubmit.body.id}/amendments`, { reason: 'Gauge misread', reading: { ...round('', 9.2, 43.5, 31), takenAt: undefined } }).expect(201);

    const liveAfter = await agents.outOperator.get(`/api/units/${unitId}/shift-condenser`).expect(200);
    expect(liveAfter.body.state).toMatchObject({ roundsInShift: 2, latestRound: { id: afterSubmit.body.id } });
    const board = await agents.trainer.get(`/api/handovers/${id}`).expect(200);
    expect(board.body.board.handover.condenserSnapshot).toEqual(frozen);
    expect(frozen.state.checks.find((c) => c.key === 'backpressure')!.latest.value).toBe(9500);
  });
});

describe('GET /api/handovers/:id/header', () => {
  it('names station, unit, shift change in station time and both crews; 401 signed out', async () => {
    const opened = await post(agents.outOperator, `/api/units/${unitId}/handovers/current`).expect(201);
    const id = opened.body.board.handover.id;
    await (await anonymousAgent(built)).get(`/api/handovers/${id}/header`).expect(401);
    const res = await agents.trainer.get(`/api/handovers/${id}/header`).expect(200);
    expect(res.body.header).toMatchObject({ station: { id: stationId }, unit: { id: unitId }, timeZone: 'Europe/Berlin', outgoingCrew: { name: 'A' }, incomingCrew: { name: 'B' } });
    expect(res.body.header.outgoingCrew.members.map((m: { role: string }) => m.role)).toContain('operator');
    expect(res.body.header.handoverAtLocal).toMatch(/ (06|18):00$/);
  });
});
