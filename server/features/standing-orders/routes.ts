import { Router } from 'express';
import { z } from 'zod';
import { orderQuerySchema, standingOrderSchema } from '../../../shared/schemas/log';
import { allow, signedIn } from '../../lib/auth';
import { NotFound } from '../../lib/errors';
import { parseId, parseInput } from '../../lib/validate';
import { Station } from '../plant/model';
import { StandingOrder } from './model';
import { listOrders, pendingFor, presentOrder, type StandingOrderService } from './service';

const mayIssue = allow('order.issue');
const stationQuery = z.object({ stationId: z.coerce.number().int().positive().optional() });

async function stationOf(raw: unknown) {
  const { stationId } = parseInput(stationQuery, raw);
  const station = stationId ? await Station.findByPk(stationId) : await Station.findOne({ order: [['id', 'ASC']] });
  if (!station) throw new NotFound('That station');
  return station.id;
}

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
    const order = await StandingOrder.findByPk(parseId(req.params.id));
    if (!order) throw new NotFound('That standing order');
    res.json({ order: await presentOrder(order, true) });
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
