import { Router } from 'express';
import { crewRotationSchema, crewSwapSchema } from '../../../shared/schemas/handovers';
import { allow } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import type { ShiftService } from './service';

export function shiftRoutes(shifts: ShiftService): Router {
  const router = Router();

  router.put('/stations/:stationId/crew-rotation', allow('shifts.manage'), async (req, res) => {
    const rotation = await shifts.setRotation(req.user!.id, parseId(req.params.stationId, 'stationId'), parseInput(crewRotationSchema, req.body));
    res.json({ rotation });
  });

  router.post('/stations/:stationId/crew-swaps', allow('shifts.manage'), async (req, res) => {
    const created = await shifts.addSwap(req.user!.id, parseId(req.params.stationId, 'stationId'), parseInput(crewSwapSchema, req.body));
    res.status(201).json({ id: created.id });
  });

  return router;
}
