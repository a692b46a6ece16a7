import { Router } from 'express';
import { signedIn } from '../../lib/auth';
import { Crew, PlantUnit, Station } from './model';

/** Read-only plant lists every signed-in role needs (crews for forms, units for pickers). */
export function plantRoutes(): Router {
  const router = Router();
  router.use(signedIn);
  router.get('/crews', async (_req, res) => {
    const crews = await Crew.findAll({ order: [['name', 'ASC']] });
    res.json({ crews: crews.map((c) => ({ id: c.id, name: c.name, stationId: c.stationId })) });
  });
  router.get('/units', async (_req, res) => {
    const [units, stations] = await Promise.all([PlantUnit.findAll({ order: [['code', 'ASC']] }), Station.findAll()]);
    const stationNames = new Map(stations.map((s) => [s.id, s.name]));
    res.json({
      units: units.map((u) => ({ id: u.id, code: u.code, name: u.name, station: stationNames.get(u.stationId) ?? '' })),
    });
  });
  return router;
}
