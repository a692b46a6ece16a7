import { Router } from 'express';
import { evaluateReadingSet } from '../../../shared/calc/evaluate';
import { readingSetInputSchema } from '../../../shared/schemas/reading-set';
import { signedIn } from '../../lib/auth';
import { convertReadingSet } from '../../lib/convert-readings';
import { parseId, parseInput } from '../../lib/validate';
import { designInForce, limitsInForce, plausibleInForce, requireUnit } from '../plant/index';

export function calcRoutes(): Router {
  const router = Router();
  router.use(signedIn);

  /** Every check for one reading set, with units, statuses and possible-cause hints. Saves nothing. */
  router.post('/condenser', async (req, res) => {
    const input = parseInput(readingSetInputSchema, req.body);
    const si = convertReadingSet(input);
    await requireUnit(input.unitId);
    const [design, limits, plausible] = await Promise.all([designInForce(input.unitId), limitsInForce(input.unitId), plausibleInForce(input.unitId)]);
    const evaluation = evaluateReadingSet(si, design.data, limits.limits, plausible.ranges);
    res.json({ ...evaluation, designVersionId: design.id, limitVersionId: limits.id, plausibleVersionId: plausible.versionId, inputsSi: si });
  });

  /** The design data, limits and plausible ranges in force now: what the client needs to compute live. */
  router.get('/units/:unitId/condenser-design', async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    await requireUnit(unitId);
    const [design, limits, plausible] = await Promise.all([designInForce(unitId), limitsInForce(unitId), plausibleInForce(unitId)]);
    res.json({ design: design.data, limits: limits.limits, plausible: plausible.ranges, designVersionId: design.id, limitVersionId: limits.id, plausibleVersionId: plausible.versionId });
  });

  return router;
}
