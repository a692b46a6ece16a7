// What a printed or archived handover names at its head: station, unit, the shift change in the
// station's own time, and both crews with their people. Its own read, so the board's
// acknowledgement path does not pay for it.
import { Router } from 'express';
import { stationLocalLabel } from '../../../shared/shift-time';
import { signedIn } from '../../lib/auth';
import { NotFound } from '../../lib/errors';
import { parseId } from '../../lib/validate';
import { crewNamesOf, findStation, findUnit } from '../plant/index';
import { shiftRoles } from '../../../shared/policies/handover';
import { stationShiftSetup } from '../stations/index';
import { findPeople } from '../users/index';
import { Handover } from './model';


export async function handoverRecordHeader(id: number) {
  const h = await Handover.findByPk(id, { attributes: ['id', 'unitId', 'shiftStart', 'handoverAt', 'outgoingCrewId', 'incomingCrewId'] });
  if (!h) throw new NotFound('That handover');
  const unit = (await findUnit(h.unitId))!;
  const crewIds = [h.outgoingCrewId, h.incomingCrewId].filter((x): x is number => x !== null);
  const [station, { settings }, crews, people] = await Promise.all([
    findStation(unit.stationId),
    stationShiftSetup(unit.stationId),
    crewNamesOf(crewIds),
    crewIds.length ? findPeople({ crewIds, activeOnly: true, roles: shiftRoles }) : [],
  ]);
  const crew = (crewId: number | null) => {
    const name = crewId === null ? undefined : crews.get(crewId);
    if (crewId === null || name === undefined) return null;
    return { id: crewId, name, members: people.filter((p) => p.crewId === crewId).map((p) => ({ name: p.name, role: p.role })) };
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
