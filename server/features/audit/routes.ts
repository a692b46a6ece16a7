import { Router } from 'express';
import { z } from 'zod';
import { Op } from 'sequelize';
import { allow } from '../../lib/auth';
import { parseInput } from '../../lib/validate';
import { User } from '../users/model';
import { AuditEvent } from './model';

const auditQuery = z.object({
  entity: z.string().max(64).optional(),
  entityId: z.string().max(64).optional(),
  before: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

/** The audit trail, newest first, paged by id. Administrators only. */
export function adminAuditRoutes(): Router {
  const router = Router();
  router.use(allow('audit.read'));
  router.get('/', async (req, res) => {
    const q = parseInput(auditQuery, req.query);
    const where: Record<string | symbol, unknown> = {};
    if (q.entity) where.entity = q.entity;
    if (q.entityId) where.entityId = q.entityId;
    if (q.before) where.id = { [Op.lt]: q.before };
    const events = await AuditEvent.findAll({ where, order: [['id', 'DESC']], limit: q.limit });
    const actorIds = [...new Set(events.map((e) => e.actorId).filter((id): id is number => id !== null))];
    const actors = await User.findAll({ where: { id: actorIds }, attributes: ['id', 'name'] });
    const names = new Map(actors.map((a) => [a.id, a.name]));
    res.json({
      events: events.map((e) => ({
        id: e.id,
        at: e.at.toISOString(),
        actor: e.actorId ? (names.get(e.actorId) ?? `#${e.actorId}`) : 'system',
        action: e.action,
        entity: e.entity,
        entityId: e.entityId,
        before: e.before,
        after: e.after,
      })),
    });
  });
  return router;
}
