import { Router } from 'express';
import { evaluateReadingSet } from '../../../shared/calc/evaluate';
import { CalcInputError } from '../../../shared/calc/input-error';
import { startingLimits } from '../../../shared/calc/limits';
import { readingSetToSi } from '../../../shared/calc/reading-set-si';
import { readingSetInputSchema } from '../../../shared/schemas/reading-set';
import { signedIn } from '../../lib/auth';
import { ValidationError } from '../../lib/errors';
import { parseId, parseInput } from '../../lib/validate';
import { loadCondenserDesign } from './condenser-design';

export function calcRoutes(): Router {
  const router = Router();
  router.use(signedIn);

  /** Every check for one reading set, with units, statuses and possible-cause hints. Saves nothing. */
  router.post('/condenser', async (req, res) => {
    const input = parseInput(readingSetInputSchema, req.body);
    let si;
    try {
      si = readingSetToSi(input);
    } catch (error) {
      if (error instanceof CalcInputError) throw new ValidationError({ [error.field]: error.detail });
      throw error;
    }
    const design = await loadCondenserDesign(input.unitId);
    // Until units carry their own limit sets, the starting limits (common practice) apply.
    const evaluation = evaluateReadingSet(si, design, startingLimits);
    res.json({ ...evaluation, limitsSource: 'starting limits (common practice)', inputsSi: si });
  });

  router.get('/units/:unitId/condenser-design', async (req, res) => {
    res.json({ design: await loadCondenserDesign(parseId(req.params.unitId, 'unitId')), limits: startingLimits });
  });

  return router;
}
