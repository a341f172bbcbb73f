import type { DataSource } from 'typeorm';
import type { SessionResponse } from '@shared/schemas/session.js';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import type { Actor } from '../http/request-types.js';

export async function describeSession(dataSource: DataSource, actor: Actor | undefined): Promise<SessionResponse> {
  if (!actor) return { user: null, activeOrganisationId: null, memberships: [] };
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
    memberships: rows.map((r) => {
      const groups = typeof r.clientGroupIds === 'string' ? JSON.parse(r.clientGroupIds) : r.clientGroupIds;
      return {
        organisationId: r.organisationId,
        organisationName: r.organisationName,
        role: r.role,
        limitedToClientGroups: Array.isArray(groups),
      };
    }),
  };
}
