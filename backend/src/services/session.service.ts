import type { DataSource } from 'typeorm';
import { permissionsOf } from '@shared/permissions.js';
import type { SessionResponse } from '@shared/schemas/session.js';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import type { Actor } from '../http/request-types.js';

export async function describeSession(dataSource: DataSource, actor: Actor | undefined, devMailbox: boolean): Promise<SessionResponse> {
  if (!actor) return { user: null, activeOrganisationId: null, permissions: [], memberships: [], devMailbox };
  const rows = await dataSource
    .getRepository(Membership)
    .createQueryBuilder('m')
    .innerJoin(Organisation, 'o', 'o.id = m.organisationId')
    .select(['m.organisationId AS organisationId', 'o.name AS organisationName', 'm.role AS role', 'm.clientGroupIds AS clientGroupIds'])
    .where('m.userId = :userId', { userId: actor.user.id })
    .orderBy('o.name', 'ASC')
    .getRawMany<{ organisationId: string; organisationName: string; role: SessionResponse['memberships'][number]['role']; clientGroupIds: unknown }>();
  return {
    user: { id: actor.user.id, email: actor.user.email, name: actor.user.name, unitPreference: actor.user.unitPreference },
    activeOrganisationId: actor.membership?.organisationId ?? null,
    permissions: permissionsOf(actor.membership?.role),
    devMailbox,
    memberships: rows.map((r) => {
      const groups = typeof r.clientGroupIds === 'string' ? JSON.parse(r.clientGroupIds) : r.clientGroupIds;
      return { organisationId: r.organisationId, organisationName: r.organisationName, role: r.role, limitedToClientGroups: Array.isArray(groups) };
    }),
  };
}
