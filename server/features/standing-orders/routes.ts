import { Router } from 'express';
import { z } from 'zod';
import { orderQuerySchema, standingOrderSchema } from '../../../shared/schemas/log';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { getOrder, listOrders, pendingFor, presentOrder, stationIdOrFirst, type StandingOrderService } from './service';

const mayIssue = allow('order.issue');
const stationQuery = z.object({ stationId: z.coerce.number().int().positive().optional() });

const stationOf = (raw: unknown) => stationIdOrFirst(parseInput(stationQuery, raw).stationId);

export function standingOrderRoutes(orders: StandingOrderService): Router {
  const router = Router();
  router.get('/standing-orders', signedIn, async (req, res) => {
    res.json({ orders: await listOrders(await stationOf(req.query), parseInput(orderQuerySchema, req.query)) });
  });
  router.post('/standing-orders', mayIssue, async (req, res) => {
    const order = await orders.issue(req.user!.id, await stationOf(req.query), parseInput(standingOrderSchema, req.body));
    res.status(201).json({ order: await presentOrder(order, true) });
  });
  router.get('/standing-orders/:id', signedIn, async (req, res) => {
    res.json({ order: await getOrder(parseId(req.params.id)) });
  });
  router.post('/standing-orders/:id/acknowledge', allow('order.acknowledge'), async (req, res) => {
    const ack = await orders.acknowledge(req.user!, parseId(req.params.id));
    res.status(201).json({ acknowledgedAt: ack.acknowledgedAt.toISOString() });
  });
  router.get('/me/pending-orders', signedIn, async (req, res) => {
    res.json({ orders: await pendingFor(req.user!.id) });
  });
  return router;
}
