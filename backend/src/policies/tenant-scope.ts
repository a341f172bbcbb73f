/**
 * The one place that turns the caller into the scope every tenant-scoped query must use: the active
 * tenant, and the client groups the membership is limited to (null: not limited).
 */
import type { Role } from '@shared/permissions.js';
import { forbidden, unauthorised } from '../http/app-error.js';
import type { Actor } from '../http/request-types.js';

export interface TenantScope {
  organisationId: string;
  userId: string;
  role: Role;
  /** null: the whole tenant; otherwise only plants in these groups (and never plants in no group). */
  clientGroupIds: string[] | null;
}

export function scopeOf(actor: Actor | undefined): TenantScope {
  if (!actor) throw unauthorised();
  if (!actor.membership) throw forbidden('Choose an organisation first');
  return {
    organisationId: actor.membership.organisationId,
    userId: actor.user.id,
    role: actor.membership.role,
    clientGroupIds: actor.membership.clientGroupIds ?? null,
  };
}

/** Whether a record in the given client group (null: in no group) is visible within the scope. */
export function seesClientGroup(scope: TenantScope, clientGroupId: string | null): boolean {
  if (scope.clientGroupIds === null) return true;
  return clientGroupId !== null && scope.clientGroupIds.includes(clientGroupId);
}
