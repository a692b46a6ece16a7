import { Router } from 'express';
import { z } from 'zod';
import { closeConditionSchema, newConditionSchema } from '../../../shared/schemas/log';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { listConditions, presentCondition, type ConditionService } from './service';

const mayHandle = allow('condition.manage');
const listQuery = z.object({ state: z.enum(['open', 'closed', 'all']).default('open') });

export function conditionRoutes(conditions: ConditionService): Router {
  const router = Router();
  router.get('/units/:unitId/conditions', signedIn, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    res.json({ conditions: await listConditions(unitId, parseInput(listQuery, req.query).state) });
  });
  router.post('/units/:unitId/conditions', mayHandle, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    const created = await conditions.open(req.user!.id, unitId, parseInput(newConditionSchema, req.body));
    res.status(201).json({ condition: await presentCondition(created) });
  });
  router.post('/conditions/:id/close', mayHandle, async (req, res) => {
    const closed = await conditions.close(req.user!, parseId(req.params.id), parseInput(closeConditionSchema, req.body));
    res.json({ condition: await presentCondition(closed!) });
  });
  return router;
}
