import { Router } from 'express';
import { z } from 'zod';
import { closeConditionSchema, newConditionSchema } from '../../../shared/schemas/log';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { settingsForUnit } from '../stations/settings';
import { Condition } from './model';
import { presentConditions, type ConditionService } from './service';

const mayHandle = allow('condition.manage');
const listQuery = z.object({ state: z.enum(['open', 'closed', 'all']).default('open') });

export function conditionRoutes(conditions: ConditionService): Router {
  const router = Router();
  router.get('/units/:unitId/conditions', signedIn, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    const { settings } = await settingsForUnit(unitId);
    const { state } = parseInput(listQuery, req.query);
    const where: Record<string, unknown> = { unitId };
    if (state === 'open') where.closedAt = null;
    const rows = await Condition.findAll({ where, order: [['limitAt', 'ASC']], limit: 200 });
    const shown = await presentConditions(state === 'closed' ? rows.filter((r) => r.closedAt) : rows, settings.timeZone);
    res.json({ conditions: shown });
  });
  router.post('/units/:unitId/conditions', mayHandle, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    const created = await conditions.open(req.user!.id, unitId, parseInput(newConditionSchema, req.body));
    const { settings } = await settingsForUnit(unitId);
    res.status(201).json({ condition: (await presentConditions([created], settings.timeZone))[0] });
  });
  router.post('/conditions/:id/close', mayHandle, async (req, res) => {
    const closed = await conditions.close(req.user!, parseId(req.params.id), parseInput(closeConditionSchema, req.body));
    const { settings } = await settingsForUnit(closed!.unitId);
    res.json({ condition: (await presentConditions([closed!], settings.timeZone))[0] });
  });
  return router;
}
