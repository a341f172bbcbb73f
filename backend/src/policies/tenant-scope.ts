/**
 * The one place that turns the caller into the scope every tenant-scoped query must use: the active
 * tenant, and the client groups the membership is limited to (null: not limited).
 */
import type { Role } from '@shared/permissions.js';
import { badRequest, forbidden, unauthorised } from '../http/app-error.js';
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

/** Whether a client-group limit (null: no limit) lies within what the scope sees: a member or invitation the caller may manage. */
export function coversClientGroups(scope: TenantScope, clientGroupIds: string[] | null): boolean {
  if (scope.clientGroupIds === null) return true;
  const seen = scope.clientGroupIds;
  return clientGroupIds !== null && clientGroupIds.every((id) => seen.includes(id));
}

/**
 * Nobody hands out access they do not have: a limit may name only groups the caller sees, and only a member
 * without a limit can give access to every group. (Whether the groups exist in the tenant is checked apart.)
 */
export function assertMayGrant(scope: TenantScope, clientGroupIds: string[] | null): void {
  if (clientGroupIds === null && scope.clientGroupIds !== null) {
    throw forbidden('Only an administrator without a client-group limit can give access to every client group');
  }
  if (!coversClientGroups(scope, clientGroupIds)) throw badRequest('Unknown client group: choose among your own client groups');
}

/** Records of the organisation as a whole (the audit log) are for members without a client-group limit. */
export function assertWholeTenant(scope: TenantScope, what: string): void {
  if (scope.clientGroupIds !== null) throw forbidden(`${what} covers the whole organisation: only members without a client-group limit can read it`);
}
