// Who works which shift: the station's crew rotation and one-off swaps, set by an administrator.
import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { shiftStartFor } from '../../../shared/shift-time';
import { recordAudit } from '../../lib/audit';
import { Conflict, NotFound, ValidationError } from '../../lib/errors';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { countCrewsOfStation, findStation } from '../plant/index';
import { saveCrewRotation, settingsForStation } from '../stations/index';
import { CrewSwap } from './model';

async function requireStation(stationId: number) {
  if (!(await findStation(stationId))) throw new NotFound('That station');
}

/** A time that is not one of the station's shift changes would never match a shift: refuse it. */
async function requireShiftStart(stationId: number, at: Date, field: string) {
  const settings = await settingsForStation(stationId);
  if (shiftStartFor(at, settings.timeZone, settings.shiftChangeTimes).getTime() !== at.getTime()) {
    throw new ValidationError({ [field]: `Not the start of a shift at this station (shifts change at ${settings.shiftChangeTimes.join(' and ')}, ${settings.timeZone})` });
  }
}

export function makeShiftService(sequelize: Sequelize) {
  async function setRotation(actorId: number, stationId: number, rotation: { anchorShiftStart: string; crewIds: number[] }) {
    await requireStation(stationId);
    if ((await countCrewsOfStation(stationId, rotation.crewIds)) !== new Set(rotation.crewIds).size) throw new ValidationError({ crewIds: 'Choose crews of this station' });
    await requireShiftStart(stationId, new Date(rotation.anchorShiftStart), 'anchorShiftStart');
    await unitOfWork(sequelize, async (transaction) => {
      await saveCrewRotation(stationId, rotation, transaction);
      await recordAudit({ actorId, action: 'station.crew_rotation', entity: 'station', entityId: stationId, after: rotation }, transaction);
      publish(transaction, { entity: 'station_settings', id: stationId });
    });
    return rotation;
  }

  async function addSwap(actorId: number, stationId: number, swap: { shiftStart: string; crewId: number; reason: string }) {
    await requireStation(stationId);
    if ((await countCrewsOfStation(stationId, [swap.crewId])) !== 1) throw new ValidationError({ crewId: 'Choose a crew of this station' });
    await requireShiftStart(stationId, new Date(swap.shiftStart), 'shiftStart');
    try {
      return await unitOfWork(sequelize, async (transaction) => {
        const row = await CrewSwap.create({ stationId, shiftStart: new Date(swap.shiftStart), crewId: swap.crewId, reason: swap.reason, createdBy: actorId, createdAt: new Date() }, { transaction });
        await recordAudit({ actorId, action: 'station.crew_swap', entity: 'station', entityId: stationId, after: swap }, transaction);
        publish(transaction, { entity: 'station_settings', id: stationId });
        return row;
      });
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw new Conflict('That shift already has a swap; one swap per shift');
      throw error;
    }
  }

  return { setRotation, addSwap };
}
export type ShiftService = ReturnType<typeof makeShiftService>;
