import { Router } from 'express';
import { equipmentSchema, newDesignVersionSchema, newLimitVersionSchema, newPlausibleVersionSchema } from '../../../shared/schemas/plant';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { activePeople } from '../users/index';
import { listCrews, unitSetup, type EquipmentService } from './service';
import { listUnits } from './unit-list';
import type { VersionService } from './versions';


/** Plant setup: everyone signed in reads it; only administrators change it, always as a new version. */
export function plantRoutes(versions: VersionService, equipment: EquipmentService): Router {
  const router = Router();
  router.use(signedIn);

  router.get('/crews', async (_req, res) => {
    res.json({ crews: await listCrews() });
  });

  router.get('/units', async (_req, res) => {
    res.json({ units: await listUnits() });
  });

  router.get('/people', async (_req, res) => {
    // For pickers (who follows up a flag): names and roles of active people, nothing more.
    res.json({ people: await activePeople() });
  });

  router.get('/units/:unitId/setup', async (req, res) => {
    res.json(await unitSetup(parseId(req.params.unitId, 'unitId')));
  });

  router.post('/units/:unitId/design-versions', allow('plant.manage'), async (req, res) => {
    const input = parseInput(newDesignVersionSchema, req.body);
    const created = await versions.addDesignVersion(req.user!.id, parseId(req.params.unitId, 'unitId'), input.design as never, input.note);
    res.status(201).json({ versionId: created.id });
  });

  router.post('/units/:unitId/limit-versions', allow('plant.manage'), async (req, res) => {
    const input = parseInput(newLimitVersionSchema, req.body);
    const created = await versions.addLimitVersion(req.user!.id, parseId(req.params.unitId, 'unitId'), input.limits, input.note);
    res.status(201).json({ versionId: created.id });
  });

  router.post('/units/:unitId/plausible-range-versions', allow('plant.manage'), async (req, res) => {
    const input = parseInput(newPlausibleVersionSchema, req.body);
    const created = await versions.addPlausibleVersion(req.user!.id, parseId(req.params.unitId, 'unitId'), input.ranges, input.note);
    res.status(201).json({ versionId: created.id });
  });

  router.post('/units/:unitId/equipment', allow('plant.manage'), async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    res.status(201).json({ equipment: await equipment.addEquipment(req.user!.id, unitId, parseInput(equipmentSchema, req.body)) });
  });

  return router;
}
