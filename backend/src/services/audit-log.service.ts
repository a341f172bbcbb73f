import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { auditQuery, AuditEventView } from '@shared/schemas/accounts.js';
import { AuditEvent } from '../entities/audit-event.entity.js';
import { User } from '../entities/user.entity.js';
import { assertWholeTenant, type TenantScope } from '../policies/tenant-scope.js';

/**
 * Only for members without a client-group limit: entries name plants, units, people and groups, and an entry
 * about a record since deleted can no longer be placed in a client group, so filtering by scope would leak.
 */
export async function listAuditEvents(ds: DataSource, scope: TenantScope, q: z.infer<typeof auditQuery>): Promise<AuditEventView[]> {
  assertWholeTenant(scope, 'The audit log');
  const qb = ds
    .getRepository(AuditEvent)
    .createQueryBuilder('a')
    .leftJoin(User, 'u', 'u.id = a.userId')
    .select([
      'a.id AS id',
      'a.createdAt AS createdAt',
      'a.userId AS userId',
      'u.name AS userName',
      'a.action AS action',
      'a.entityType AS entityType',
      'a.entityId AS entityId',
      'a.details AS details',
    ])
    .where('a.organisationId = :org', { org: scope.organisationId })
    .orderBy('a.createdAt', 'DESC')
    .limit(q.limit);
  if (q.action) qb.andWhere('a.action LIKE :action', { action: `${q.action.replace(/[%_\\]/g, '\\$&')}%` });
  if (q.userId) qb.andWhere('a.userId = :userId', { userId: q.userId });
  if (q.entityType) qb.andWhere('a.entityType = :entityType', { entityType: q.entityType });
  if (q.from) qb.andWhere('a.createdAt >= :from', { from: `${q.from} 00:00:00` });
  if (q.to) qb.andWhere('a.createdAt < DATE_ADD(:to, INTERVAL 1 DAY)', { to: q.to });
  const rows = await qb.getRawMany();
  return rows.map((r) => ({
    id: r.id,
    createdAt: new Date(
      `${String(r.createdAt instanceof Date ? r.createdAt.toISOString() : r.createdAt)
        .replace(' ', 'T')
        .replace(/Z?$/, 'Z')}`,
    ).toISOString(),
    userId: r.userId,
    userName: r.userName,
    action: r.action,
    entityType: r.entityType,
    entityId: r.entityId,
    details: typeof r.details === 'string' ? JSON.parse(r.details) : r.details,
  }));
}
