import type { EntityManager } from 'typeorm';
import { In } from 'typeorm';
import { ClientGroup } from '../entities/client-group.entity.js';
import type { TenantScope } from '../policies/tenant-scope.js';

/** Client groups visible in the scope: all of the tenant's, or only those the membership is limited to. */
export async function listClientGroups(em: EntityManager, scope: TenantScope): Promise<ClientGroup[]> {
  if (scope.clientGroupIds !== null && scope.clientGroupIds.length === 0) return [];
  return em.getRepository(ClientGroup).find({
    where: { organisationId: scope.organisationId, ...(scope.clientGroupIds !== null && { id: In(scope.clientGroupIds) }) },
    order: { name: 'ASC' },
  });
}

export async function findClientGroup(em: EntityManager, scope: TenantScope, id: string): Promise<ClientGroup | null> {
  if (scope.clientGroupIds !== null && !scope.clientGroupIds.includes(id)) return null;
  return em.getRepository(ClientGroup).findOneBy({ id, organisationId: scope.organisationId });
}

/** Ids that all belong to the tenant (for role limits and invitations). */
export async function assertClientGroupsInTenant(em: EntityManager, organisationId: string, ids: string[]): Promise<boolean> {
  if (ids.length === 0) return true;
  const count = await em.getRepository(ClientGroup).countBy({ organisationId, id: In([...new Set(ids)]) });
  return count === new Set(ids).size;
}
