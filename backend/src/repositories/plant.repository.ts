/**
 * Plants and units within a scope. A member limited to client groups sees only plants in those groups;
 * a plant in no group is visible only to members without a limit. Every finder takes the scope.
 */
import type { EntityManager } from 'typeorm';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { Plant } from '../entities/plant.entity.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { restrictPlantsToScope } from './scope-filter.js';

export function plantsInScope(em: EntityManager, scope: TenantScope): Promise<Plant[]> {
  return restrictPlantsToScope(em.getRepository(Plant).createQueryBuilder('p'), 'p', scope).orderBy('p.name', 'ASC').getMany();
}

export function findPlant(em: EntityManager, scope: TenantScope, id: string): Promise<Plant | null> {
  return restrictPlantsToScope(em.getRepository(Plant).createQueryBuilder('p').where('p.id = :id', { id }), 'p', scope).getOne();
}

export function unitsInScope(em: EntityManager, scope: TenantScope, plantId?: string): Promise<GeneratingUnit[]> {
  const qb = em.getRepository(GeneratingUnit).createQueryBuilder('u').innerJoin(Plant, 'p', 'p.id = u.plantId');
  if (plantId) qb.where('u.plantId = :plantId', { plantId });
  return restrictPlantsToScope(qb, 'p', scope).orderBy('u.name', 'ASC').getMany();
}

export function findUnit(em: EntityManager, scope: TenantScope, id: string): Promise<GeneratingUnit | null> {
  const qb = em.getRepository(GeneratingUnit).createQueryBuilder('u').innerJoin(Plant, 'p', 'p.id = u.plantId').where('u.id = :id', { id });
  return restrictPlantsToScope(qb, 'p', scope).getOne();
}

/** The unit with its plant (for the time zone), or null outside the scope. */
export async function findUnitWithPlant(em: EntityManager, scope: TenantScope, id: string): Promise<{ unit: GeneratingUnit; plant: Plant } | null> {
  const unit = await findUnit(em, scope, id);
  if (!unit) return null;
  const plant = await em.getRepository(Plant).findOneByOrFail({ id: unit.plantId, organisationId: scope.organisationId });
  return { unit, plant };
}
