import { Router } from 'express';
import { stationSettingsSchema } from '../../../shared/schemas/log';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { stationSettings, type StationService } from './service';

export function stationRoutes(stations: StationService): Router {
  const router = Router();

  router.get('/stations/:stationId/settings', signedIn, async (req, res) => {
    res.json({ settings: await stationSettings(parseId(req.params.stationId, 'stationId')) });
  });

  router.put('/stations/:stationId/settings', allow('station.settings'), async (req, res) => {
    const stationId = parseId(req.params.stationId, 'stationId');
    const settings = parseInput(stationSettingsSchema, req.body);
    res.json({ settings: await stations.saveSettings(req.user!, stationId, settings) });
  });

  return router;
}
