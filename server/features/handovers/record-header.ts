// What a printed or archived handover names at its head: station, unit, the shift change in the
// station's own time, and both crews with their people. Its own read, so the board's
// acknowledgement path does not pay for it.
import { Router } from 'express';
import { Op } from 'sequelize';
import { stationLocalLabel } from '../../../shared/shift-time';
import { signedIn } from '../../lib/auth';
import { NotFound } from '../../lib/errors';
import { parseId } from '../../lib/validate';
import { Crew, PlantUnit, Station } from '../plant/index';
import { stationShiftSetup } from '../stations/index';
import { User } from '../users/index';
import { Handover } from './model';

const crewRoles = ['trainee', 'operator', 'shift_lead'];

export async function handoverRecordHeader(id: number) {
  const h = await Handover.findByPk(id, { attributes: ['id', 'unitId', 'shiftStart', 'handoverAt', 'outgoingCrewId', 'incomingCrewId'] });
  if (!h) throw new NotFound('That handover');
  const unit = (await PlantUnit.findByPk(h.unitId))!;
  const crewIds = [h.outgoingCrewId, h.incomingCrewId].filter((x): x is number => x !== null);
  const [station, { settings }, crews, people] = await Promise.all([
    Station.findByPk(unit.stationId),
    stationShiftSetup(unit.stationId),
    crewIds.length ? Crew.findAll({ where: { id: crewIds } }) : [],
    crewIds.length ? User.findAll({ where: { crewId: { [Op.in]: crewIds }, active: true, role: crewRoles }, attributes: ['id', 'name', 'role', 'crewId'], order: [['name', 'ASC']] }) : [],
  ]);
  const crew = (crewId: number | null) => {
    const row = crews.find((c) => c.id === crewId);
    if (!row) return null;
    return { id: row.id, name: row.name, members: people.filter((p) => p.crewId === row.id).map((p) => ({ name: p.name, role: p.role })) };
  };
  return {
    station: { id: unit.stationId, name: station?.name ?? `#${unit.stationId}` },
    unit: { id: unit.id, name: unit.name },
    timeZone: settings.timeZone,
    shiftStartLocal: stationLocalLabel(h.shiftStart, settings.timeZone),
    handoverAtLocal: stationLocalLabel(h.handoverAt, settings.timeZone),
    outgoingCrew: crew(h.outgoingCrewId),
    incomingCrew: crew(h.incomingCrewId),
  };
}
export type HandoverRecordHeader = Awaited<ReturnType<typeof handoverRecordHeader>>;

export function handoverHeaderRoutes(): Router {
  const router = Router();
  router.get('/handovers/:id/header', signedIn, async (req, res) => {
    res.json({ header: await handoverRecordHeader(parseId(req.params.id)) });
  });
  return router;
}
