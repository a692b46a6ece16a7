// The audit trail as administrators read it: newest first, paged by id, with each actor's name.
import { Op } from 'sequelize';
import { namesOf } from '../users/index';
import { AuditEvent } from './model';

export type AuditQuery = { entity?: string; entityId?: string; before?: number; limit: number };

export async function listAuditEvents(q: AuditQuery) {
  const where: Record<string | symbol, unknown> = {};
  if (q.entity) where.entity = q.entity;
  if (q.entityId) where.entityId = q.entityId;
  if (q.before) where.id = { [Op.lt]: q.before };
  const events = await AuditEvent.findAll({ where, order: [['id', 'DESC']], limit: q.limit });
  const names = await namesOf(events.map((e) => e.actorId));
  return events.map((e) => ({
    id: e.id,
    at: e.at.toISOString(),
    actor: e.actorId ? (names.get(e.actorId) ?? `#${e.actorId}`) : 'system',
    action: e.action,
    entity: e.entity,
    entityId: e.entityId,
    before: e.before,
    after: e.after,
  }));
}
