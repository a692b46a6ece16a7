// Loads the demo scenario once. Idempotent: rows that exist are left exactly as they are.
import type { Sequelize } from 'sequelize';
import { hashPassword } from '../../lib/auth';
import { Crew, Equipment, LimitSetVersion, PlantUnit, Station, UnitDesignVersion } from '../../features/plant/model';
import { startingLimits } from '../../../shared/calc/limits';
import { User } from '../../features/users/model';
import type { Role } from '../../../shared/roles';
import people from './demo-people.json';
import { demoCondenserDesign, demoCrews, demoStation, demoUnits } from './demo-plant';
import { seedDemoHistory } from './demo-history';
import { seedDemoTraining } from './demo-training';
import { seedDemoLog } from './demo-log';

export async function seedDemo(sequelize: Sequelize): Promise<{ created: number }> {
  let created = 0;
  const unitIds: number[] = [];
  const passwordHash = await hashPassword(people.password);
  await sequelize.transaction(async (transaction) => {
    const [station, stationCreated] = await Station.findOrCreate({
      where: { code: demoStation.code },
      defaults: demoStation,
      transaction,
    });
    created += Number(stationCreated);
    const crewIds = new Map<string, number>();
    for (const name of demoCrews) {
      const [crew, made] = await Crew.findOrCreate({ where: { stationId: station.id, name }, transaction });
      crewIds.set(name, crew.id);
      created += Number(made);
    }
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
      // The first versions count from long ago, so imported history is judged by them too.
      const since = new Date('2000-01-01T00:00:00Z');
      const [, madeDesign] = await UnitDesignVersion.findOrCreate({
        where: { unitId: row.id },
        defaults: { unitId: row.id, effectiveFrom: since, data: demoCondenserDesign, note: 'Demo design data', createdBy: null },
        transaction,
      });
      const [, madeLimits] = await LimitSetVersion.findOrCreate({
        where: { unitId: row.id },
        defaults: { unitId: row.id, effectiveFrom: since, limits: startingLimits, note: 'Starting limits (common practice)', createdBy: null },
        transaction,
      });
      created += Number(madeDesign) + Number(madeLimits);
    }
    for (const person of people.users) {
      const [, made] = await User.findOrCreate({
        where: { email: person.email },
        defaults: {
          name: person.name,
          email: person.email,
          role: person.role as Role,
          crewId: person.crew ? (crewIds.get(person.crew) ?? null) : null,
          position: person.position ?? null,
          passwordHash,
        },
        transaction,
      });
      created += Number(made);
    }
  });
  // Rounds history is added only where a unit has none: a second start never duplicates it.
  const recorder = await User.findOne({ where: { email: people.users.find((p) => p.role === 'operator')!.email } });
  const history = await seedDemoHistory(
    sequelize,
    unitIds.map((id, i) => ({ id, design: demoCondenserDesign, fouling: i === 0 })),
    { id: recorder!.id, role: recorder!.role },
  );
  const station = await Station.findOne({ where: { code: demoStation.code } });
  const logRows = await seedDemoLog(sequelize, station!.id, unitIds[0]!);
  const trainingRows = await seedDemoTraining(sequelize);
  return { created: created + history + logRows + trainingRows };
}
