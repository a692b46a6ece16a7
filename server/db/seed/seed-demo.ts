// Loads the demo scenario once. Idempotent: rows that exist are left exactly as they are.
import type { Sequelize } from 'sequelize';
import { hashPassword } from '../../lib/auth';
import { Crew, Equipment, LimitSetVersion, PlantUnit, Station, UnitDesignVersion } from '../../features/plant/model';
import { startingLimits } from '../../../shared/calc/limits';
import { shiftStartFor } from '../../../shared/shift-time';
import { User } from '../../features/users/model';
import { StationSettingsRow } from '../../features/stations/model';
import { defaultStationSettings, stationShiftSetup } from '../../features/stations/settings';
import type { Role } from '../../../shared/roles';
import people from './demo-people.json';
import { demoCondenserDesign, demoCrews, demoFirstLimitsNote, demoReturnToServiceDaysBeforeHistory, demoStation, demoUnits } from './demo-plant';
import { demoHistoryWindow, seedDemoHistory } from './demo-history';
import { makeRoster } from './demo-roster';
import { seedDemoTraining } from './demo-training';
import { seedDemoLog } from './demo-log';

const DAY_MS = 86_400_000;

export async function seedDemo(sequelize: Sequelize, now = new Date()): Promise<{ created: number }> {
  let created = 0;
  const unitIds: number[] = [];
  const passwordHash = await hashPassword(people.password);
  const history = demoHistoryWindow(now);
  const { timeZone, shiftChangeTimes } = defaultStationSettings;
  // Versions start at a shift change, as a plant would put them in force.
  const atShiftChange = (at: number) => shiftStartFor(new Date(at), timeZone, shiftChangeTimes);
  const stationId = await sequelize.transaction(async (transaction) => {
    const [station, stationCreated] = await Station.findOrCreate({
      where: { code: demoStation.code },
      defaults: demoStation,
      transaction,
    });
    created += Number(stationCreated);
    const crewIds: number[] = [];
    for (const name of demoCrews) {
      const [crew, made] = await Crew.findOrCreate({ where: { stationId: station.id, name }, transaction });
      crewIds.push(crew.id);
      created += Number(made);
    }
    // Crews A, B, C, D take the shifts in turn, crew A from the shift in progress at first start.
    const [, madeSettings] = await StationSettingsRow.findOrCreate({
      where: { stationId: station.id },
      defaults: { stationId: station.id, ...defaultStationSettings, crewRotation: { anchorShiftStart: atShiftChange(now.getTime()).toISOString(), crewIds }, updatedAt: now },
      transaction,
    });
    created += Number(madeSettings);
    const crewByName = new Map(demoCrews.map((name, i) => [name, crewIds[i]!]));
    for (const person of people.users) {
      const [, made] = await User.findOrCreate({
        where: { email: person.email },
        defaults: {
          name: person.name,
          email: person.email,
          role: person.role as Role,
          crewId: person.crew ? (crewByName.get(person.crew) ?? null) : null,
          position: person.position ?? null,
          passwordHash,
        },
        transaction,
      });
      created += Number(made);
    }
    const admin = await User.findOne({ where: { email: people.users.find((p) => p.role === 'admin')!.email }, transaction });
    const returnToService = atShiftChange(history.start.getTime() - demoReturnToServiceDaysBeforeHistory * DAY_MS);
    for (const unit of demoUnits) {
      const [row, made] = await PlantUnit.findOrCreate({
        where: { stationId: station.id, code: unit.code },
        defaults: { stationId: station.id, code: unit.code, name: unit.name },
        transaction,
      });
      created += Number(made);
      unitIds.push(row.id);
      for (const item of unit.equipment) {
        const [, madeEquipment] = await Equipment.findOrCreate({
          where: { unitId: row.id, tag: item.tag },
          defaults: { unitId: row.id, ...item },
          transaction,
        });
        created += Number(madeEquipment);
      }
      const createdBy = admin?.id ?? null;
      if (!(await UnitDesignVersion.count({ where: { unitId: row.id }, transaction }))) {
        await UnitDesignVersion.create({ unitId: row.id, effectiveFrom: returnToService, data: demoCondenserDesign, note: unit.designNote, createdBy }, { transaction });
        created += 1;
      }
      if (!(await LimitSetVersion.count({ where: { unitId: row.id }, transaction }))) {
        await LimitSetVersion.create({ unitId: row.id, effectiveFrom: returnToService, limits: startingLimits, note: demoFirstLimitsNote, createdBy }, { transaction });
        for (const revision of unit.limitRevisions) {
          await LimitSetVersion.create(
            { unitId: row.id, effectiveFrom: atShiftChange(now.getTime() - revision.daysAgo * DAY_MS), limits: revision.limits, note: revision.note, createdBy },
            { transaction },
          );
        }
        created += 1 + unit.limitRevisions.length;
      }
    }
    return station.id;
  });

  // Everything after this is recorded by the people the rotation puts on shift at the time.
  const { settings, rotation } = await stationShiftSetup(stationId);
  const demoPeople = await User.findAll({ where: { email: people.users.map((p) => p.email) }, attributes: ['id', 'name', 'email', 'role', 'crewId', 'position'] });
  const roster = makeRoster(
    demoPeople.map((p) => ({ id: p.id, name: p.name, role: p.role, crewId: p.crewId, position: p.position ?? null })),
    settings,
    rotation ?? { anchorShiftStart: atShiftChange(now.getTime()).toISOString(), crewIds: [] },
  );
  const byEmail = new Map(demoPeople.map((p) => [p.email, p]));
  const rounds = await seedDemoHistory(
    sequelize,
    unitIds.map((id, i) => ({ id, design: demoCondenserDesign, fouling: i === 0 })),
    roster,
    now,
  );
  const logRows = await seedDemoLog(sequelize, { stationId, unitId: unitIds[0]!, otherUnitId: unitIds[1]!, roster, byEmail, now });
  const trainingRows = await seedDemoTraining(sequelize, { unitId: unitIds[0]!, roster, people: demoPeople, now });
  return { created: created + rounds + logRows + trainingRows };
}
