/** Who chose alerts in an organisation: each person's membership, address, scope and stored choices (two statements). */
import type { EntityManager } from 'typeorm';
import { In } from 'typeorm';
import { AlertSubscription } from '../../entities/alert-subscription.entity.js';
import { Membership } from '../../entities/membership.entity.js';
import { User } from '../../entities/user.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import type { StoredChoice } from './alert-rules.js';

export interface Subscriber {
  membershipId: string;
  email: string;
  /** what the person may see, as their own requests would (client-group limit, viewers' approved cases only) */
  scope: TenantScope;
  choices: StoredChoice[];
  /** the person-wide row (weekly digest), if saved */
  person: AlertSubscription | null;
}

export async function subscribersOf(em: EntityManager, organisationId: string): Promise<Subscriber[]> {
  const rows = await em.getRepository(AlertSubscription).find({ where: { organisationId }, order: { membershipId: 'ASC' } });
  if (rows.length === 0) return [];
  const memberships = await em.getRepository(Membership).find({ where: { id: In([...new Set(rows.map((r) => r.membershipId))]), organisationId } });
  const users = await em.getRepository(User).find({ where: { id: In(memberships.map((m) => m.userId)) } });
  return memberships.flatMap((m) => {
    const user = users.find((u) => u.id === m.userId);
    if (!user) return [];
    const own = rows.filter((r) => r.membershipId === m.id);
    return [
      {
        membershipId: m.id,
        email: user.email,
        scope: { organisationId, userId: m.userId, role: m.role, clientGroupIds: m.clientGroupIds ?? null },
        choices: own.map((r) => ({ unitId: r.unitId, kinds: r.kinds, dataStoppedDays: r.dataStoppedDays })),
        person: own.find((r) => r.unitId === null) ?? null,
      },
    ];
  });
}

/** Rows changed by an INSERT or UPDATE through TypeORM's MariaDB driver (an OkPacket, or [rows, OkPacket]). */
export function affectedRows(result: unknown): number {
  const packet = Array.isArray(result) ? (result[1] ?? result[0]) : result;
  return Number((packet as { affectedRows?: number } | undefined)?.affectedRows ?? 0);
}
