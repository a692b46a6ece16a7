// Demo training record at the invented Fernhollow Station: a qualification catalogue with the
// station's own (invented) procedure numbers, and Dilys Marchetti's practice — one task signed
// off, one under way with an entry waiting for a countersign. Added once, when no task exists.
import type { Sequelize } from 'sequelize';
import { User } from '../../features/users/model';
import { QualificationTask, TrainingDecision, TrainingEntry } from '../../features/training/model';

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

const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000);
const dateOnly = (d: Date) => d.toISOString().slice(0, 10);

export async function seedDemoTraining(sequelize: Sequelize): Promise<number> {
  if ((await QualificationTask.count()) > 0) return 0;
  const [trainer, trainee, operator, lead] = await Promise.all(
    ['trainer@fernhollow.example', 'trainee.a@fernhollow.example', 'operator.a@fernhollow.example', 'lead.a@fernhollow.example'].map((email) => User.findOne({ where: { email } })),
  );
  if (!trainer || !trainee || !operator || !lead) return 0;
  return sequelize.transaction(async (transaction) => {
    const created = new Map<string, QualificationTask>();
    for (const task of catalogue) {
      created.set(task.taskKey, await QualificationTask.create({ ...task, version: 1, retired: false, changeNote: 'First version', createdBy: trainer.id, createdAt: daysAgo(60) }, { transaction }));
    }
    const entry = (taskKey: string, days: number, level: 'observed' | 'supervised' | 'alone', note: string, signedBy: User | null) =>
      TrainingEntry.create(
        {
          traineeId: trainee.id,
          taskId: created.get(taskKey)!.id,
          performedOn: dateOnly(daysAgo(days)),
          level,
          unitId: null,
          shiftStart: null,
          readingSetId: null,
          handoverItemId: null,
          note,
          supervisorId: signedBy?.id ?? operator.id,
          status: signedBy ? 'countersigned' : 'awaiting_countersign',
          countersignedBy: signedBy?.id ?? null,
          countersignedAt: signedBy ? daysAgo(days - 0.2) : null,
          rejectReason: null,
          recordedAt: daysAgo(days - 0.1),
        },
        { transaction },
      );
    await entry('CT-01', 20, 'supervised', 'Started fan 2 on the Unit 1 tower; gearbox vibration 2.1 mm/s.', operator);
    await entry('CT-01', 12, 'supervised', 'Started fan 4 after the lube-oil top-up; readings inside limits.', lead);
    await TrainingDecision.create(
      { traineeId: trainee.id, taskId: created.get('CT-01')!.id, taskKey: 'CT-01', decision: 'signed_off', comments: 'Careful pre-start checks on both runs; knows the vibration limits.', trainerId: trainer.id, decidedAt: daysAgo(10) },
      { transaction },
    );
    await entry('CW-01', 8, 'observed', 'Watched the start of 1-CWP-B after its outage.', operator);
    await entry('CW-01', 4, 'supervised', 'Started 1-CWP-A with the discharge valve sequence; current settled at 212 A.', operator);
    await entry('CW-01', 1, 'supervised', 'Started 2-CWP-A for the load increase.', null);
    return catalogue.length + 6;
  });
}
