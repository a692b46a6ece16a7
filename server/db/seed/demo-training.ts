// Demo training record at the invented Fernhollow Station: a qualification catalogue with the
// station's own (invented) procedure numbers; every shift lead and operator signed off on the tasks
// of their position long ago, with the countersigned practice the sign-off rule asks for; and Dilys
// Marchetti's practice — one task signed off, one under way with an entry waiting for a countersign.
// Her practice and the operators' were done on their own crew's shifts and countersigned by someone
// of that crew on shift with them.
import type { CreationAttributes, Sequelize, Transaction } from 'sequelize';
import { stationLocalLabel } from '../../../shared/shift-time';
import { defaultStationSettings } from '../../features/stations/settings';
import type { User } from '../../features/users/model';
import { QualificationTask, TrainingDecision, TrainingEntry } from '../../features/training/model';
import type { DemoRoster } from './demo-roster';

const catalogue = [
  { taskKey: 'CW-01', position: 'field_operator', system: 'circulating_water', title: 'Start a circulating-water pump', standard: 'Starts the pump against a closed discharge valve, opens it on the timed sequence, checks motor current, bearing temperatures and seal leak-off, and logs the start.', procedureRef: 'FH-OP-CW-01', requiredPerformances: 3 },
  { taskKey: 'CW-02', position: 'field_operator', system: 'circulating_water', title: 'Backwash a condenser waterbox', standard: 'Reverses flow through one half of the condenser with the unit on load, watches backpressure and CW ΔP before and after, and restores normal flow.', procedureRef: 'FH-OP-CW-04', requiredPerformances: 2 },
  { taskKey: 'VAC-01', position: 'control_room_operator', system: 'condenser_vacuum', title: 'Vacuum-decay (air in-leakage) test', standard: 'Isolates air removal at steady load, records backpressure each minute for eight minutes, computes the decay rate and compares it with the station limit.', procedureRef: 'FH-OP-VAC-02', requiredPerformances: 2 },
  { taskKey: 'VAC-02', position: 'field_operator', system: 'condenser_vacuum', title: 'Change over liquid-ring vacuum pumps', standard: 'Starts the standby pump, confirms seal-water flow and suction pressure, then stops and isolates the running pump without a backpressure excursion.', procedureRef: 'FH-OP-VAC-05', requiredPerformances: 3 },
  { taskKey: 'CT-01', position: 'field_operator', system: 'cooling_tower', title: 'Start a cooling-tower fan and check vibration', standard: 'Checks the fan deck and gearbox oil level, starts the fan, reads vibration at the gearbox and motor and compares with the station limits.', procedureRef: 'FH-OP-CT-01', requiredPerformances: 2 },
  { taskKey: 'CT-02', position: 'field_operator', system: 'cooling_tower', title: 'Control basin level and makeup', standard: 'Reads basin level and makeup flow, adjusts the makeup valve to hold level within the band, and logs the change.', procedureRef: 'FH-OP-CT-03', requiredPerformances: 2 },
  { taskKey: 'CH-01', position: 'field_operator', system: 'water_chemistry', title: 'Sample cooling water and check the scaling index', standard: 'Takes the circulating-water sample per the sampling procedure, measures pH, calcium, alkalinity and conductivity, and enters them for the LSI/RSI check.', procedureRef: 'FH-CH-02', requiredPerformances: 3 },
  { taskKey: 'CH-02', position: 'control_room_operator', system: 'water_chemistry', title: 'Adjust blowdown for cycles of concentration', standard: 'Computes cycles from makeup and basin conductivity, sets blowdown to bring cycles back inside the band, and records the adjustment.', procedureRef: 'FH-CH-05', requiredPerformances: 2 },
];

/** Task positions each person's position qualifies for: control-room staff came up through the field. */
const qualifiedPositions: Record<string, string[]> = {
  field_cw_tower: ['field_operator'],
  control_room: ['field_operator', 'control_room_operator'],
};
const CATALOGUE_DAYS_AGO = 8 * 365;
const DAY_MS = 86_400_000;

type Options = { unitId: number; roster: DemoRoster; people: User[]; now: Date };
type EntryRow = CreationAttributes<TrainingEntry>;

export async function seedDemoTraining(sequelize: Sequelize, { unitId, roster, people, now }: Options): Promise<number> {
  const byEmail = new Map(people.map((p) => [p.email, p]));
  const byId = new Map(people.map((p) => [p.id, p]));
  const trainer = byEmail.get('trainer@fernhollow.example');
  if (!trainer) return 0;
  const daysAgo = (days: number) => new Date(now.getTime() - days * DAY_MS);
  const localDate = (at: Date) => stationLocalLabel(at, defaultStationSettings.timeZone).slice(0, 10);
  const hours = (at: Date, h: number) => new Date(at.getTime() + h * 3_600_000);
  /** Practice on a shift: done three hours in, written up an hour later, countersigned two hours in. */
  const practice = (trainee: User, task: QualificationTask, shiftStart: Date | null, performed: Date, level: 'observed' | 'supervised' | 'alone', note: string, signer: User | null, supervisor: User): EntryRow => ({
    traineeId: trainee.id,
    taskId: task.id,
    performedOn: localDate(performed),
    level,
    unitId: shiftStart ? unitId : null,
    shiftStart,
    readingSetId: null,
    handoverItemId: null,
    note,
    supervisorId: supervisor.id,
    status: signer ? 'countersigned' : 'awaiting_countersign',
    countersignedBy: signer?.id ?? null,
    countersignedAt: signer ? hours(performed, 2) : null,
    rejectReason: null,
    recordedAt: hours(performed, 1),
  });

  return sequelize.transaction(async (transaction) => {
    let created = 0;
    const tasks = new Map<string, QualificationTask>();
    const existing = await QualificationTask.findAll({ where: { taskKey: catalogue.map((t) => t.taskKey) }, order: [['version', 'ASC']], transaction });
    for (const task of existing) tasks.set(task.taskKey, task);
    if (!tasks.size) {
      for (const task of catalogue) {
        tasks.set(task.taskKey, await QualificationTask.create({ ...task, version: 1, retired: false, changeNote: 'First version', createdBy: trainer.id, createdAt: daysAgo(CATALOGUE_DAYS_AGO) }, { transaction }));
        created += 1;
      }
      created += await traineePractice(transaction);
    }
    created += await qualifiedStaff(transaction);
    return created;

    async function traineePractice(transaction: Transaction) {
      const trainee = byEmail.get('trainee.a@fernhollow.example');
      const operator = byEmail.get('operator.a@fernhollow.example');
      const lead = byEmail.get('lead.a@fernhollow.example');
      if (!trainee || !operator || !lead) return 0;
      // Shifts of her crew: the rotation gives crew A every fourth shift, counted back from the one in progress.
      const onShift = (back: number, level: 'observed' | 'supervised' | 'alone', taskKey: string, note: string, signer: User | null) => {
        const shiftStart = roster.shiftsBack(now, back);
        return practice(trainee, tasks.get(taskKey)!, shiftStart, hours(shiftStart, 3), level, note, signer, operator);
      };
      await TrainingEntry.bulkCreate(
        [
          onShift(40, 'supervised', 'CT-01', 'Started fan 2 on the Unit 1 tower; gearbox vibration 2.1 mm/s.', operator),
          onShift(24, 'supervised', 'CT-01', 'Started fan 4 after the lube-oil top-up; readings inside limits.', lead),
          onShift(16, 'observed', 'CW-01', 'Watched the start of 1-CWP-B after its outage.', operator),
          onShift(8, 'supervised', 'CW-01', 'Started 1-CWP-A with the discharge valve sequence; current settled at 212 A.', operator),
          onShift(4, 'supervised', 'CW-01', 'Started 2-CWP-A for the load increase.', null),
        ],
        { transaction },
      );
      await TrainingDecision.create(
        { traineeId: trainee.id, taskId: tasks.get('CT-01')!.id, taskKey: 'CT-01', decision: 'signed_off', comments: 'Careful pre-start checks on both runs; knows the vibration limits.', trainerId: trainer!.id, decidedAt: daysAgo(10) },
        { transaction },
      );
      return 6;
    }

    /** Each lead and operator without a decision yet gets their signed-off history, leads first and longest ago. */
    async function qualifiedStaff(transaction: Transaction) {
      const staff = people
        .filter((p) => (p.role === 'shift_lead' || p.role === 'operator') && p.crewId !== null)
        .sort((a, b) => Number(b.role === 'shift_lead') - Number(a.role === 'shift_lead') || a.id - b.id);
      const decided = new Set((await TrainingDecision.findAll({ where: { traineeId: staff.map((p) => p.id) }, attributes: ['traineeId'], transaction })).map((d) => d.traineeId));
      const leads = staff.filter((p) => p.role === 'shift_lead');
      const entries: EntryRow[] = [];
      const decisions: CreationAttributes<TrainingDecision>[] = [];
      staff.forEach((person, i) => {
        if (decided.has(person.id)) return;
        const isLead = person.role === 'shift_lead';
        const wanted = isLead ? ['field_operator', 'control_room_operator'] : (qualifiedPositions[person.position ?? ''] ?? []);
        // A lead's practice predates the present crews: another lead countersigned it, on no shift of today's rotation.
        // An operator's was on their crew's shifts, countersigned by their crew's lead (or a crew-mate without one).
        const crew = roster.members(person.crewId!);
        const signer = isLead ? leads[(leads.indexOf(person) + 1) % leads.length] : (crew.lead[0] ?? [...crew.control, ...crew.field].find((p) => p.id !== person.id));
        const signedBy = signer ? byId.get(signer.id) : undefined;
        if (!signedBy || signedBy.id === person.id) return;
        let cursor = daysAgo((isLead ? 2_300 : 720) - i * 45);
        for (const task of catalogue.filter((t) => wanted.includes(t.position))) {
          const version = tasks.get(task.taskKey)!;
          for (let k = 0; k < task.requiredPerformances; k++) {
            const shiftStart = isLead ? null : roster.shiftOfCrew(person.crewId!, cursor);
            const performed = shiftStart ? hours(shiftStart, 3) : hours(cursor, 0);
            const level = k === task.requiredPerformances - 1 ? 'alone' : 'supervised';
            entries.push(practice(person, version, shiftStart, performed, level, `${task.title} per ${task.procedureRef}: ${level === 'alone' ? 'performed alone, walked through with the countersigner afterwards' : 'performed under supervision'}.`, signedBy, signedBy));
            cursor = new Date(performed.getTime() + (2 + (k % 2) * 2) * DAY_MS);
          }
          decisions.push({ traineeId: person.id, taskId: version.id, taskKey: task.taskKey, decision: 'signed_off', comments: `Performed to the standard of ${task.procedureRef} on every counted run; signed off.`, trainerId: trainer!.id, decidedAt: cursor });
          cursor = new Date(cursor.getTime() + 3 * DAY_MS);
        }
      });
      await TrainingEntry.bulkCreate(entries, { transaction });
      await TrainingDecision.bulkCreate(decisions, { transaction });
      return entries.length + decisions.length;
    }
  });
}
