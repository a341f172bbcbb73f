import type { DataSource, EntityManager } from 'typeorm';
import type { z } from 'zod';
import type { MemberView, memberUpdate } from '@shared/schemas/accounts.js';
import { Membership } from '../entities/membership.entity.js';
import { User } from '../entities/user.entity.js';
import { AppError, badRequest, notFound } from '../http/app-error.js';
import { assertMayGrant, coversClientGroups, type TenantScope } from '../policies/tenant-scope.js';
import { assertClientGroupsInTenant } from '../repositories/client-group.repository.js';
import { recordAudit } from './audit.service.js';
import { assertWithinPlanLimit } from './billing/plan-limits.js';

export async function listMembers(ds: DataSource, scope: TenantScope): Promise<MemberView[]> {
  const rows = await ds
    .getRepository(Membership)
    .createQueryBuilder('m')
    .innerJoin(User, 'u', 'u.id = m.userId')
    .select([
      'm.id AS membershipId',
      'm.userId AS userId',
      'u.name AS name',
      'u.email AS email',
      'm.role AS role',
      'm.clientGroupIds AS clientGroupIds',
      'm.createdAt AS joinedAt',
    ])
    .where('m.organisationId = :org', { org: scope.organisationId })
    .orderBy('u.name', 'ASC')
    .getRawMany();
  const members: MemberView[] = rows.map((r) => ({
    membershipId: r.membershipId,
    userId: r.userId,
    name: r.name,
    email: r.email,
    role: r.role,
    clientGroupIds: typeof r.clientGroupIds === 'string' ? JSON.parse(r.clientGroupIds) : (r.clientGroupIds ?? null),
    joinedAt: new Date(r.joinedAt).toISOString(),
  }));
  // A member limited to client groups sees only the people whose access lies within those groups.
  return members.filter((m) => coversClientGroups(scope, m.clientGroupIds));
}

async function lockedMembership(em: EntityManager, scope: TenantScope, membershipId: string): Promise<Membership> {
  const m = await em
    .getRepository(Membership)
    .createQueryBuilder('m')
    .setLock('pessimistic_write')
    .where('m.id = :id AND m.organisationId = :org', { id: membershipId, org: scope.organisationId })
    .getOne();
  if (!m || !coversClientGroups(scope, m.clientGroupIds)) throw notFound('No such member');
  return m;
}

async function assertAnotherAdminRemains(em: EntityManager, organisationId: string, membershipId: string) {
  const admins = await em
    .getRepository(Membership)
    .createQueryBuilder('m')
    .setLock('pessimistic_write')
    .where('m.organisationId = :org AND m.role = :role AND m.clientGroupIds IS NULL', { org: organisationId, role: 'admin' })
    .getMany();
  if (!admins.some((a) => a.id !== membershipId)) throw new AppError(409, 'The organisation needs at least one administrator without a client-group limit');
}

export async function updateMember(ds: DataSource, scope: TenantScope, membershipId: string, input: z.infer<typeof memberUpdate>): Promise<void> {
  await ds.transaction(async (em) => {
    const m = await lockedMembership(em, scope, membershipId);
    const role = input.role ?? m.role;
    const clientGroupIds = input.clientGroupIds === undefined ? m.clientGroupIds : input.clientGroupIds;
    if (input.clientGroupIds !== undefined) assertMayGrant(scope, input.clientGroupIds);
    if (clientGroupIds && !(await assertClientGroupsInTenant(em, scope.organisationId, clientGroupIds))) throw badRequest('Unknown client group');
    const wasFullAdmin = m.role === 'admin' && m.clientGroupIds === null;
    if (wasFullAdmin && (role !== 'admin' || clientGroupIds !== null)) await assertAnotherAdminRemains(em, scope.organisationId, m.id);
    if (clientGroupIds && !m.clientGroupIds) await assertWithinPlanLimit(em, scope.organisationId, 'seats');
    await em.getRepository(Membership).update({ id: m.id }, { role, clientGroupIds });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'member.updated',
      entityType: 'membership',
      entityId: m.id,
      details: { from: { role: m.role, clientGroupIds: m.clientGroupIds }, to: { role, clientGroupIds } },
    });
  });
}

export async function removeMember(ds: DataSource, scope: TenantScope, membershipId: string): Promise<void> {
  await ds.transaction(async (em) => {
    const m = await lockedMembership(em, scope, membershipId);
    if (m.role === 'admin' && m.clientGroupIds === null) await assertAnotherAdminRemains(em, scope.organisationId, m.id);
    await em.getRepository(Membership).delete({ id: m.id });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'member.removed',
      entityType: 'membership',
      entityId: m.id,
      details: { userId: m.userId, role: m.role },
    });
  });
}
