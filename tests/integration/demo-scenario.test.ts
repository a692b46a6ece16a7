// The demo scenario (Fernhollow Station) seeded into the test database: who recorded what, on which
// crew's shift; who is qualified; which versions judged the history; and that a second run adds nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Model, ModelStatic } from 'sequelize';
import { seedDemo } from '../../server/db/seed/seed-demo';
import { demoHistoryWindow } from '../../server/db/seed/demo-history';
import { crewFromRotation } from '../../server/features/shifts/crews';
import { stationShiftSetup } from '../../server/features/stations/settings';
import { Crew, Equipment, LimitSetVersion, PlantUnit, Station, UnitDesignVersion } from '../../server/features/plant/model';
import { ReadingCountersign, ReadingSet, ReadingValue } from '../../server/features/readings/model';
import { LogEntry, LogReview } from '../../server/features/log/model';
import { Condition } from '../../server/features/conditions/model';
import { StandingOrder } from '../../server/features/standing-orders/model';
import { Flag } from '../../server/features/flags/model';
import { QualificationTask, TrainingDecision, TrainingEntry } from '../../server/features/training/model';
import { crewQualifications, progressOf } from '../../server/features/training/service';
import { StationSettingsRow } from '../../server/features/stations/model';
import { User } from '../../server/features/users/model';
import { nextShiftStart, shiftStartFor } from '../../shared/shift-time';
import { closeAll, db } from './support/test-app';

afterAll(closeAll);

const DAY = 86_400_000;
const tables: [string, ModelStatic<Model>][] = Object.entries({
  Station, Crew, PlantUnit, Equipment, UnitDesignVersion, LimitSetVersion, User, StationSettingsRow,
  ReadingSet, ReadingValue, ReadingCountersign, Flag, LogEntry, LogReview, Condition, StandingOrder,
  QualificationTask, TrainingEntry, TrainingDecision,
} as Record<string, ModelStatic<Model>>);
const countAll = async () => Object.fromEntries(await Promise.all(tables.map(async ([name, model]) => [name, await model.count()] as const)));

let seededAt: Date;
let firstRun = 0;
let countsAfterFirst: Record<string, number>;
let secondRun = -1;
let countsAfterSecond: Record<string, number>;
let unitIds: number[];
let people: Map<number, User>;
let crewName: Map<number, string>;
let crewAt: (at: Date) => number | null;
let shiftAt: (at: Date) => Date;
let nextShift: (start: Date) => Date;

beforeAll(async () => {
  seededAt = new Date();
  firstRun = (await seedDemo(db(), seededAt)).created;
  countsAfterFirst = await countAll();
  secondRun = (await seedDemo(db())).created;
  countsAfterSecond = await countAll();
  const station = (await Station.findOne({ where: { code: 'FHS' } }))!;
  unitIds = (await PlantUnit.findAll({ where: { stationId: station.id }, order: [['code', 'ASC']] })).map((u) => u.id);
  const crews = await Crew.findAll({ where: { stationId: station.id } });
  crewName = new Map(crews.map((c) => [c.id, c.name]));
  people = new Map((await User.findAll({ where: { crewId: crews.map((c) => c.id) } })).map((u) => [u.id, u]));
  for (const u of await User.findAll({ where: { email: ['trainer@fernhollow.example', 'admin@fernhollow.example'] } })) people.set(u.id, u);
  const { settings, rotation } = await stationShiftSetup(station.id);
  shiftAt = (at) => shiftStartFor(at, settings.timeZone, settings.shiftChangeTimes);
  nextShift = (start) => nextShiftStart(start, settings.timeZone, settings.shiftChangeTimes);
  crewAt = (at) => crewFromRotation(rotation, shiftAt(at), settings.shiftChangeTimes.length);
}, 120_000);

const demoRounds = () => ReadingSet.findAll({ where: { unitId: unitIds }, attributes: ['id', 'unitId', 'takenAt', 'recordedAt', 'recordedBy', 'recordedAsTrainee', 'designVersionId', 'limitVersionId'] });

describe('demo scenario: seeding', () => {
  it('loads once, and a second run creates nothing and changes no row count', () => {
    expect(firstRun).toBeGreaterThan(1000);
    expect(secondRun).toBe(0);
    expect(countsAfterSecond).toEqual(countsAfterFirst);
  });
});

describe('demo scenario: rounds follow the crew rotation', () => {
  it('puts crew A on the shift in progress and crew B on the next one (what the e2e tests rely on)', () => {
    const now = shiftAt(seededAt);
    expect(crewName.get(crewAt(now)!)).toBe('A');
    expect(crewName.get(crewAt(nextShift(now))!)).toBe('B');
    // Four crews, one 12-hour shift each: crew A's shift before this one was two days back (common practice for a 2-shift, 4-crew rota).
    expect(crewName.get(crewAt(new Date(now.getTime() - 2 * DAY + 3_600_000))!)).toBe('A');
    expect(crewName.get(crewAt(new Date(now.getTime() - 3_600_000))!)).toBe('D');
  });

  it('has every round recorded by someone of the crew on shift when it was taken, written up soon after', async () => {
    const rounds = await demoRounds();
    expect(rounds.length).toBe(2 * 14 * 24);
    for (const r of rounds) {
      const recorder = people.get(r.recordedBy);
      expect(recorder, `round ${r.id}`).toBeDefined();
      expect(crewName.get(recorder!.crewId!), `round ${r.id} at ${r.takenAt.toISOString()}`).toBe(crewName.get(crewAt(r.takenAt)!));
      expect(r.recordedAt.getTime() - r.takenAt.getTime()).toBeGreaterThan(0);
      expect(r.recordedAt.getTime() - r.takenAt.getTime()).toBeLessThan(30 * 60_000);
    }
  });

  it('has field operators walk most rounds and the control room or the lead some', async () => {
    const rounds = await demoRounds();
    const by = (test: (u: User) => boolean) => rounds.filter((r) => test(people.get(r.recordedBy)!)).length;
    const field = by((u) => u.role === 'operator' && u.position === 'field_cw_tower');
    const desk = by((u) => u.role === 'shift_lead' || (u.role === 'operator' && u.position === 'control_room'));
    const trainee = by((u) => u.role === 'trainee');
    expect(field / rounds.length).toBeGreaterThan(0.5);
    expect(desk).toBeGreaterThan(0);
    expect(trainee).toBeGreaterThan(0);
    expect(field + desk + trainee).toBe(rounds.length);
  });

  it('never has one person record in two consecutive shifts (rounds, log entries, reviews, practice)', async () => {
    const shifts = new Map<number, Set<number>>();
    const note = (who: number | null, at: Date) => {
      if (who === null) return;
      const set = shifts.get(who) ?? new Set<number>();
      set.add(shiftAt(at).getTime());
      shifts.set(who, set);
    };
    for (const r of await demoRounds()) note(r.recordedBy, r.takenAt);
    for (const e of await LogEntry.findAll({ where: { unitId: unitIds } })) note(e.authorId, e.eventAt);
    for (const v of await LogReview.findAll({ where: { unitId: unitIds } })) note(v.reviewedBy, v.reviewedAt);
    for (const f of await Flag.findAll({ where: { unitId: unitIds } })) {
      note(f.raisedBy, f.raisedAt);
      if (f.clearedAt) note(f.clearedBy, f.clearedAt);
    }
    for (const t of await TrainingEntry.findAll({ where: { unitId: unitIds } })) {
      note(t.traineeId, t.shiftStart!);
      if (t.countersignedAt) note(t.countersignedBy, t.countersignedAt);
    }
    expect(shifts.size).toBeGreaterThan(8);
    for (const [who, starts] of shifts) {
      for (const start of starts) expect(starts.has(nextShift(new Date(start)).getTime()), `${people.get(who)?.name} on ${new Date(start).toISOString()} and the next shift`).toBe(false);
    }
  });

  it('has the trainee walk rounds only on her crew’s shifts, each countersigned by an operator of that crew on the same shift', async () => {
    const traineeRounds = (await demoRounds()).filter((r) => r.recordedAsTrainee);
    expect(traineeRounds.length).toBeGreaterThan(10);
    const signs = new Map((await ReadingCountersign.findAll({ where: { readingSetId: traineeRounds.map((r) => r.id) } })).map((s) => [s.readingSetId, s]));
    for (const r of traineeRounds) {
      const trainee = people.get(r.recordedBy)!;
      expect(trainee.role).toBe('trainee');
      expect(crewAt(r.takenAt)).toBe(trainee.crewId);
      const sign = signs.get(r.id);
      expect(sign, `trainee round ${r.id}`).toBeDefined();
      const signer = people.get(sign!.signedBy)!;
      expect(signer.role).toBe('operator');
      expect(signer.crewId).toBe(trainee.crewId);
      expect(shiftAt(sign!.signedAt).getTime()).toBe(shiftAt(r.takenAt).getTime());
      expect(sign!.signedAt.getTime()).toBeGreaterThan(r.recordedAt.getTime());
    }
    // Nobody else's round carries a countersign it did not need.
    expect(await ReadingCountersign.count({ where: { readingSetId: (await demoRounds()).filter((r) => !r.recordedAsTrainee).map((r) => r.id) } })).toBe(0);
  });

  it('has log entries written, and past shifts reviewed, by the crew on shift (the lead signs the review)', async () => {
    const entries = await LogEntry.findAll({ where: { unitId: unitIds } });
    expect(entries.length).toBeGreaterThanOrEqual(5);
    for (const e of entries) {
      expect(people.get(e.authorId)!.crewId, e.text).toBe(crewAt(e.eventAt));
      expect(e.shiftStart.getTime()).toBe(shiftAt(e.eventAt).getTime());
      expect(e.eventAt.getTime()).toBeLessThanOrEqual(Date.now());
      // The trainee's report is marked as a trainee's; nobody else's entry is.
      expect(e.writtenAsTrainee, e.text).toBe(people.get(e.authorId)!.role === 'trainee');
    }
    expect(entries.some((e) => e.writtenAsTrainee)).toBe(true);
    const reviews = await LogReview.findAll({ where: { unitId: unitIds } });
    expect(reviews.length).toBeGreaterThan(0);
    for (const v of reviews) {
      const reviewer = people.get(v.reviewedBy)!;
      expect(reviewer.role).toBe('shift_lead');
      expect(reviewer.crewId).toBe(crewAt(v.shiftStart));
      expect(shiftAt(v.reviewedAt).getTime()).toBe(v.shiftStart.getTime());
    }
    // The shift in progress is left for its lead to review (the shift-log e2e signs it).
    expect(reviews.some((v) => v.shiftStart.getTime() === shiftAt(seededAt).getTime())).toBe(false);
    const condition = (await Condition.findOne({ where: { unitId: unitIds[0], title: '1-CWP-B out of service (seal replacement)' } }))!;
    expect(people.get(condition.openedBy)!.crewId).toBe(crewAt(condition.openedAt));
    expect(condition.closedAt).toBeNull();
    const order = (await StandingOrder.findOne({ where: { title: 'Unit 1: hourly TTD while cleanliness is below 0.75' } }))!;
    expect(people.get(order.issuedBy)!.crewId).toBe(crewAt(order.issuedAt));
  });
});

describe('demo scenario: flags raised and cleared by people', () => {
  it('has each person-made flag raised and cleared by the lead of the crew on shift then', async () => {
    const flags = (await Flag.findAll({ where: { unitId: unitIds } })).filter((f) => f.raisedBy !== null || f.clearedBy !== null);
    expect(flags.length).toBeGreaterThan(0);
    for (const f of flags) {
      if (f.raisedBy !== null) {
        expect(people.get(f.raisedBy)!.role).toBe('shift_lead');
        expect(people.get(f.raisedBy)!.crewId).toBe(crewAt(f.raisedAt));
      }
      if (f.assignedTo !== null) expect(people.get(f.assignedTo)!.crewId).toBe(crewAt(f.raisedAt));
      if (f.clearedBy !== null) {
        expect(people.get(f.clearedBy)!.role).toBe('shift_lead');
        expect(people.get(f.clearedBy)!.crewId).toBe(crewAt(f.clearedAt!));
        expect(f.clearedAt!.getTime()).toBeGreaterThan(f.raisedAt.getTime());
        expect(f.clearComment!.length).toBeGreaterThan(10);
      }
    }
  });
});

describe('demo scenario: qualifications', () => {
  // Task positions by person position, as the demo states them: control-room staff came up through the field.
  const tasksOf: Record<string, string[]> = { field_cw_tower: ['field_operator'], control_room: ['field_operator', 'control_room_operator'] };

  it('has every shift lead and operator signed off on each task of their position, with enough countersigned practice', async () => {
    const tasks = await QualificationTask.findAll({ where: { taskKey: ['CW-01', 'CW-02', 'VAC-01', 'VAC-02', 'CT-01', 'CT-02', 'CH-01', 'CH-02'] } });
    const staff = [...people.values()].filter((p) => p.role === 'shift_lead' || p.role === 'operator');
    expect(staff.length).toBeGreaterThanOrEqual(11);
    for (const crewId of new Set(staff.map((p) => p.crewId!))) {
      const grid = await crewQualifications(crewId);
      for (const member of staff.filter((p) => p.crewId === crewId)) {
        const row = grid.people.find((p) => p.id === member.id)!;
        const wanted = tasks.filter((t) => (member.role === 'shift_lead' ? ['field_operator', 'control_room_operator'] : tasksOf[member.position!]!).includes(t.position));
        expect(wanted.length).toBeGreaterThanOrEqual(2);
        expect(row.signedOff.map((s) => s.taskKey).sort(), member.name).toEqual(expect.arrayContaining(wanted.map((t) => t.taskKey)));
        for (const task of wanted) {
          const decision = (await TrainingDecision.findOne({ where: { traineeId: member.id, taskKey: task.taskKey } }))!;
          expect(people.get(decision.trainerId)!.role).toBe('trainer');
          expect(decision.decidedAt.getTime()).toBeLessThan(seededAt.getTime() - 30 * DAY);
          expect(decision.decidedAt.getTime()).toBeGreaterThan(task.createdAt.getTime());
          // The sign-off rule of the training service: countersigned supervised or solo runs, at least as many as the task asks.
          const counted = await TrainingEntry.findAll({ where: { traineeId: member.id, taskId: task.id, status: 'countersigned', level: ['supervised', 'alone'] } });
          expect(counted.length, `${member.name} ${task.taskKey}`).toBeGreaterThanOrEqual(task.requiredPerformances);
          for (const e of counted) {
            const signer = people.get(e.countersignedBy!)!;
            expect(signer.id).not.toBe(member.id);
            expect(['operator', 'shift_lead']).toContain(signer.role);
            expect(e.countersignedAt!.getTime()).toBeLessThanOrEqual(decision.decidedAt.getTime());
            // Practice tied to a shift was on the person's own crew's shift, countersigned by that crew.
            if (e.shiftStart) {
              expect(crewAt(e.shiftStart)).toBe(member.crewId);
              expect(signer.crewId).toBe(member.crewId);
            }
          }
        }
      }
    }
  });

  it('leaves the demo trainee with one task signed off and one under way, on her crew’s shifts', async () => {
    const trainee = (await User.findOne({ where: { email: 'trainee.a@fernhollow.example' } }))!;
    const progress = await progressOf(trainee.id);
    const status = (key: string) => progress.rows.find((r) => r.task.taskKey === key)!.status;
    expect(status('CT-01')).toBe('signed_off');
    expect(status('CW-01')).toBe('in_progress');
    expect(progress.rows.filter((r) => r.status === 'signed_off')).toHaveLength(1);
    const entries = await TrainingEntry.findAll({ where: { traineeId: trainee.id } });
    expect(entries.filter((e) => e.status === 'awaiting_countersign')).toHaveLength(1);
    for (const e of entries) {
      expect(crewAt(e.shiftStart!)).toBe(trainee.crewId);
      if (e.countersignedBy) expect(people.get(e.countersignedBy)!.crewId).toBe(trainee.crewId);
    }
  });
});

describe('demo scenario: design data and limit versions', () => {
  it('dates the first versions shortly before the history and a limit revision inside it, each with a note', async () => {
    const { start } = demoHistoryWindow(seededAt);
    for (const unitId of unitIds) {
      const designs = await UnitDesignVersion.findAll({ where: { unitId }, order: [['effectiveFrom', 'ASC']] });
      const limits = await LimitSetVersion.findAll({ where: { unitId }, order: [['effectiveFrom', 'ASC']] });
      for (const first of [designs[0]!, limits[0]!]) {
        expect(first.effectiveFrom.getTime()).toBeLessThan(start.getTime());
        expect(first.effectiveFrom.getTime()).toBeGreaterThan(start.getTime() - 30 * DAY);
        expect(first.note!.length).toBeGreaterThan(20);
        expect(first.createdBy).not.toBeNull();
      }
      for (const later of limits.slice(1)) {
        expect(later.effectiveFrom.getTime()).toBeGreaterThan(start.getTime());
        expect(later.effectiveFrom.getTime()).toBeLessThan(seededAt.getTime());
        expect(later.note).toMatch(/lowered|raised|changed/);
      }
    }
    const unit1Limits = await LimitSetVersion.findAll({ where: { unitId: unitIds[0] }, order: [['effectiveFrom', 'ASC']] });
    expect(unit1Limits.length).toBe(2);
    expect(unit1Limits[1]!.limits.dissolvedOxygen?.highWatch).toBe(15);
  });

  it('judges every round by the versions in force when it was taken (the revision judges the later ones)', async () => {
    const versions = await LimitSetVersion.findAll({ where: { unitId: unitIds[0] }, order: [['effectiveFrom', 'ASC']] });
    const rounds = (await demoRounds()).filter((r) => r.unitId === unitIds[0]);
    for (const r of rounds) {
      const inForce = versions.filter((v) => v.effectiveFrom.getTime() <= r.takenAt.getTime()).at(-1)!;
      expect(r.limitVersionId).toBe(inForce.id);
    }
    expect(new Set(rounds.map((r) => r.limitVersionId)).size).toBe(2);
  });
});
