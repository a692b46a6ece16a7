import { Router } from 'express';
import { assignFlagSchema, clearFlagSchema, flagQuerySchema, raiseFlagSchema } from '../../../shared/schemas/flags';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { listFlags, type FlagService } from './service';

// The shift lead owns abnormal readings: raising, assigning and clearing flags.
const leadsFlags = allow('flag.manage');

export function flagRoutes(flags: FlagService): Router {
  const router = Router();
  router.get('/units/:unitId/flags', signedIn, async (req, res) => {
    res.json({ flags: await listFlags(parseId(req.params.unitId, 'unitId'), parseInput(flagQuerySchema, req.query)) });
  });
  router.post('/units/:unitId/flags', leadsFlags, async (req, res) => {
    res.status(201).json({ flag: await flags.raise(req.user!.id, parseId(req.params.unitId, 'unitId'), parseInput(raiseFlagSchema, req.body)) });
  });
  router.post('/flags/:id/assign', leadsFlags, async (req, res) => {
    res.json({ flag: await flags.assign(req.user!.id, parseId(req.params.id), parseInput(assignFlagSchema, req.body)) });
  });
  router.post('/flags/:id/clear', leadsFlags, async (req, res) => {
    res.json({ flag: await flags.clear(req.user!.id, parseId(req.params.id), parseInput(clearFlagSchema, req.body)) });
  });
  return router;
}
