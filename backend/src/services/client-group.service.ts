import type { DataSource } from 'typeorm';
import type { ClientGroupView } from '@shared/schemas/accounts.js';
import { ClientGroup } from '../entities/client-group.entity.js';
import { Membership } from '../entities/membership.entity.js';
import { AppError, forbidden, notFound } from '../http/app-error.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { findClientGroup, listClientGroups } from '../repositories/client-group.repository.js';
import { recordAudit } from './audit.service.js';
import { assertWithinPlanLimit } from './billing/plan-limits.js';

const view = (g: ClientGroup): ClientGroupView => ({ id: g.id, name: g.name, createdAt: g.createdAt.toISOString() });

export async function listGroups(ds: DataSource, scope: TenantScope): Promise<ClientGroupView[]> {
  return (await listClientGroups(ds.manager, scope)).map(view);
}

export async function getGroup(ds: DataSource, scope: TenantScope, id: string): Promise<ClientGroupView> {
  const group = await findClientGroup(ds.manager, scope, id);
  if (!group) throw notFound('No such client group');
  return view(group);
}

async function assertNameFree(ds: DataSource, organisationId: string, name: string, exceptId?: string) {
  const same = await ds.getRepository(ClientGroup).findOneBy({ organisationId, name });
  if (same && same.id !== exceptId) throw new AppError(409, `A client group named “${name}” exists already`);
}

export async function createGroup(ds: DataSource, scope: TenantScope, name: string): Promise<ClientGroupView> {
  await assertNameFree(ds, scope.organisationId, name);
  return ds.transaction(async (em) => {
    await assertWithinPlanLimit(em, scope.organisationId, 'clientGroups');
    const group = await em.getRepository(ClientGroup).save({ organisationId: scope.organisationId, name });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'client-group.created',
      entityType: 'client-group',
      entityId: group.id,
      details: { name },
    });
    return view(group);
  });
}

export async function renameGroup(ds: DataSource, scope: TenantScope, id: string, name: string): Promise<ClientGroupView> {
  const group = await findClientGroup(ds.manager, scope, id);
  if (!group) throw notFound('No such client group');
  await assertNameFree(ds, scope.organisationId, name, id);
  return ds.transaction(async (em) => {
    await em.getRepository(ClientGroup).update({ id, organisationId: scope.organisationId }, { name });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'client-group.renamed',
      entityType: 'client-group',
      entityId: id,
      details: { from: group.name, to: name },
    });
    return view({ ...group, name });
  });
}

/** Removes the group and takes it out of every membership limit (a limit that becomes empty stays empty: sees nothing). */
export async function deleteGroup(ds: DataSource, scope: TenantScope, id: string): Promise<void> {
  const group = await findClientGroup(ds.manager, scope, id);
  if (!group) throw notFound('No such client group');
  // It rewrites limits and plants beyond any one group, so someone limited to groups may not do it.
  if (scope.clientGroupIds !== null)
    throw forbidden('Deleting a client group changes people and plants in other groups: only members without a client-group limit can do it');
  await ds.transaction(async (em) => {
    const limited = await em.getRepository(Membership).findBy({ organisationId: scope.organisationId });
    for (const m of limited) {
      if (m.clientGroupIds?.includes(id)) await em.getRepository(Membership).update({ id: m.id }, { clientGroupIds: m.clientGroupIds.filter((g) => g !== id) });
    }
    await em.getRepository(ClientGroup).delete({ id, organisationId: scope.organisationId });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'client-group.deleted',
      entityType: 'client-group',
      entityId: id,
      details: { name: group.name },
    });
  });
}
