/** A unit's timeline events (cleanings, plugging, repairs, outages), looked up within the caller's scope. */
import type { EntityManager } from 'typeorm';
import { UnitEvent } from '../entities/unit-event.entity.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { findUnit } from './plant.repository.js';
import { restrictUnitRecordsToScope } from './scope-filter.js';

/** The event, or null when it does not exist or its unit lies outside the scope. */
export function findEventInScope(em: EntityManager, scope: TenantScope, id: string): Promise<UnitEvent | null> {
  const qb = em.getRepository(UnitEvent).createQueryBuilder('e').where('e.id = :id', { id });
  return restrictUnitRecordsToScope(qb, 'e', scope, { ownTenantColumn: true }).getOne();
}

/** A unit's events by date (the unit already found in scope, or read by the recompute). */
export function eventsOfUnit(em: EntityManager, unitId: string): Promise<UnitEvent[]> {
  return em.getRepository(UnitEvent).find({ where: { unitId }, order: { startDate: 'ASC', createdAt: 'ASC' } });
}

/** A unit's events by date, or null when the unit lies outside the scope. */
export async function eventsOfUnitInScope(em: EntityManager, scope: TenantScope, unitId: string): Promise<UnitEvent[] | null> {
  if (!(await findUnit(em, scope, unitId))) return null;
  return em.getRepository(UnitEvent).find({ where: { unitId, organisationId: scope.organisationId }, order: { startDate: 'ASC', createdAt: 'ASC' } });
}
