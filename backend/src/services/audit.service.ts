import type { EntityManager } from 'typeorm';
import { AuditEvent } from '../entities/audit-event.entity.js';

export interface AuditEntry {
  organisationId: string;
  userId: string | null;
  action: string;
  entityType: string;
  entityId?: string | null;
  details?: Record<string, unknown> | null;
}

/** Written inside the same transaction as the change it records. */
export async function recordAudit(em: EntityManager, entry: AuditEntry): Promise<void> {
  const repo = em.getRepository(AuditEvent);
  await repo.save(
    repo.create({
      organisationId: entry.organisationId,
      userId: entry.userId,
      action: entry.action,
      entityType: entry.entityType,
      entityId: entry.entityId ?? null,
      details: entry.details ?? null,
    }),
  );
}
