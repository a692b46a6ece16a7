import { Router } from 'express';
import { readingSetInputSchema } from '../../../shared/schemas/reading-set';
import { signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { condenserDesignNow, evaluateNow } from './service';

export function calcRoutes(): Router {
  const router = Router();
  router.use(signedIn);

  /** Every check for one reading set, with units, statuses and possible-cause hints. Saves nothing. */
  router.post('/condenser', async (req, res) => {
    res.json(await evaluateNow(parseInput(readingSetInputSchema, req.body)));
  });

  /** The design data, limits and plausible ranges in force now: what the client needs to compute live. */
  router.get('/units/:unitId/condenser-design', async (req, res) => {
    res.json(await condenserDesignNow(parseId(req.params.unitId, 'unitId')));
  });

  return router;
}
