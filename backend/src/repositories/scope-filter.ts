/**
 * The scope as SQL, in one place: a plant is visible when it belongs to the tenant and, for a member limited
 * to client groups, lies in one of them (a plant in no group only without a limit). Units and every record
 * of a unit (samples, daily figures, imports, events, jobs) are visible through their plant.
 */
import type { ObjectLiteral, SelectQueryBuilder } from 'typeorm';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { Plant } from '../entities/plant.entity.js';
import type { TenantScope } from '../policies/tenant-scope.js';

export function restrictPlantsToScope<T extends ObjectLiteral>(qb: SelectQueryBuilder<T>, plantAlias: string, scope: TenantScope): SelectQueryBuilder<T> {
  qb.andWhere(`${plantAlias}.organisationId = :scopeOrg`, { scopeOrg: scope.organisationId });
  if (scope.clientGroupIds !== null) {
    if (scope.clientGroupIds.length === 0) qb.andWhere('1 = 0');
    else qb.andWhere(`${plantAlias}.clientGroupId IN (:...scopeGroups)`, { scopeGroups: scope.clientGroupIds });
  }
  return qb;
}

/**
 * Keeps the rows of a table with a `unitId` column whose unit lies within the scope. Records that carry their
 * tenant themselves (imports, events, jobs) are held to it as well.
 */
export function restrictUnitRecordsToScope<T extends ObjectLiteral>(
  qb: SelectQueryBuilder<T>,
  alias: string,
  scope: TenantScope,
  options: { ownTenantColumn: boolean },
): SelectQueryBuilder<T> {
  qb.innerJoin(GeneratingUnit, 'scopeUnit', `scopeUnit.id = ${alias}.unitId`).innerJoin(Plant, 'scopePlant', 'scopePlant.id = scopeUnit.plantId');
  if (options.ownTenantColumn) qb.andWhere(`${alias}.organisationId = :scopeOrg`, { scopeOrg: scope.organisationId });
  return restrictPlantsToScope(qb, 'scopePlant', scope);
}

/**
 * Keeps the outages within the scope: the tenant's, and for a member limited to client groups only those with at
 * least one unit and every unit on a plant in their groups (an outage reaching beyond them stays out of sight whole).
 */
export function restrictOutagesToScope<T extends ObjectLiteral>(qb: SelectQueryBuilder<T>, alias: string, scope: TenantScope): SelectQueryBuilder<T> {
  qb.andWhere(`${alias}.organisationId = :scopeOrg`, { scopeOrg: scope.organisationId });
  if (scope.clientGroupIds === null) return qb;
  if (scope.clientGroupIds.length === 0) return qb.andWhere('1 = 0');
  return qb
    .andWhere(`EXISTS (SELECT 1 FROM outage_unit scopeOu WHERE scopeOu.outageId = ${alias}.id)`)
    .andWhere(
      `NOT EXISTS (SELECT 1 FROM outage_unit scopeOu2 INNER JOIN generating_unit scopeOuUnit ON scopeOuUnit.id = scopeOu2.unitId ` +
        `INNER JOIN plant scopeOuPlant ON scopeOuPlant.id = scopeOuUnit.plantId WHERE scopeOu2.outageId = ${alias}.id ` +
        `AND (scopeOuPlant.organisationId <> :scopeOrg OR scopeOuPlant.clientGroupId IS NULL OR scopeOuPlant.clientGroupId NOT IN (:...scopeGroups)))`,
      { scopeGroups: scope.clientGroupIds },
    );
}
