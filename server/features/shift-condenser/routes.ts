import { Router } from 'express';
import { shiftCondenserQuerySchema } from '../../../shared/schemas/shift-condenser';
import { signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import type { ShiftCondenserService } from './service';

/** Read-only for every signed-in role: the condenser over the shift in progress or a past one. */
export function shiftCondenserRoutes(service: ShiftCondenserService): Router {
  const router = Router();
  router.get('/units/:unitId/shift-condenser', signedIn, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    const query = parseInput(shiftCondenserQuerySchema, req.query);
    res.json({ state: await service.forShift(unitId, query.shiftStart) });
  });
  return router;
}
