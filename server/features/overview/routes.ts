import { Router } from 'express';
import { signedIn } from '../../lib/auth';
import type { OverviewService } from './service';

export function overviewRoutes(overview: OverviewService): Router {
  const router = Router();

  // Every role sees the front page; what waits on the person depends on who asks.
  router.get('/overview', signedIn, async (req, res) => {
    res.json(await overview.overview(req.user!));
  });

  return router;
}
