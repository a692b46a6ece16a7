import { Router } from 'express';
import { z } from 'zod';
import { allow } from '../../lib/auth';
import { parseInput } from '../../lib/validate';
import { listAuditEvents } from './service';

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
    res.json({ events: await listAuditEvents(parseInput(auditQuery, req.query)) });
  });
  return router;
}
