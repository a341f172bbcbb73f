/**
 * Background jobs as the views read them, within the caller's scope. The queue's own statements (claims,
 * leases, progress) are in jobs/job-queue.ts.
 */
import type { EntityManager } from 'typeorm';
import { BackgroundJob } from '../entities/background-job.entity.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { restrictUnitRecordsToScope } from './scope-filter.js';

/** The job, or null when it does not exist or its unit lies outside the scope. */
export function findJobInScope(em: EntityManager, scope: TenantScope, id: string): Promise<BackgroundJob | null> {
  const qb = em.getRepository(BackgroundJob).createQueryBuilder('j').where('j.id = :id', { id });
  return restrictUnitRecordsToScope(qb, 'j', scope, { ownTenantColumn: true }).getOne();
}

/** A unit's latest jobs, newest first (the unit already found in scope). */
export function recentJobsOfUnit(em: EntityManager, unitId: string, count: number): Promise<BackgroundJob[]> {
  return em.getRepository(BackgroundJob).find({ where: { unitId }, order: { createdAt: 'DESC' }, take: count });
}
