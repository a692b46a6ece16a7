import type { Transaction } from 'sequelize';
import { AuditEvent } from '../features/audit/model';

export type AuditInput = {
  actorId: number | null;
  action: string;
  entity: string;
  entityId: string | number | null;
  before?: unknown;
  after?: unknown;
};

/** The one way every feature records who changed what. Runs inside the caller's transaction. */
export async function recordAudit(input: AuditInput, transaction: Transaction): Promise<void> {
  await AuditEvent.create(
    {
      actorId: input.actorId,
      action: input.action,
      entity: input.entity,
      entityId: input.entityId === null ? null : String(input.entityId),
      before: input.before ?? null,
      after: input.after ?? null,
      at: new Date(),
    },
    { transaction },
  );
}
