import { Router } from 'express';
import { trendQuerySchema } from '../../../shared/schemas/trends';
import { signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import type { TrendService } from './service';

/** Time series of computed checks with the limit bands in force over the range and flag markers. */
export function trendRoutes(trends: TrendService): Router {
  const router = Router();
  router.get('/units/:unitId/trends', signedIn, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    res.json(await trends.trends(unitId, parseInput(trendQuerySchema, req.query)));
  });
  return router;
}
