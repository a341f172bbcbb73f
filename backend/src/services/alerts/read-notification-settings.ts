/** A person's own alert choices in the active organisation, with the units in their scope to choose among. */
import type { DataSource, EntityManager } from 'typeorm';
import { DATA_STOPPED_DAYS, type NotificationSettingsResponse, type NotificationUnit } from '@shared/schemas/notifications.js';
import { AlertSubscription } from '../../entities/alert-subscription.entity.js';
import { Membership } from '../../entities/membership.entity.js';
import { notFound } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { portfolioUnitsInScope } from '../../repositories/portfolio.repository.js';

export async function membershipOf(em: EntityManager, scope: TenantScope, lock = false): Promise<Membership> {
  const qb = em
    .getRepository(Membership)
    .createQueryBuilder('m')
    .where('m.organisationId = :o AND m.userId = :u', { o: scope.organisationId, u: scope.userId });
  const m = await (lock ? qb.setLock('pessimistic_write') : qb).getOne();
  if (!m) throw notFound('No such membership');
  return m;
}

export async function unitsToChoose(em: EntityManager, scope: TenantScope): Promise<NotificationUnit[]> {
  return (await portfolioUnitsInScope(em, scope)).map((r) => ({
    unitId: r.unitId,
    unitName: r.unitName,
    plantId: r.plantId,
    plantName: r.plantName,
    clientGroup: r.clientGroupId && r.clientGroupName ? { id: r.clientGroupId, name: r.clientGroupName } : null,
  }));
}

export async function readNotificationSettings(ds: DataSource, scope: TenantScope): Promise<NotificationSettingsResponse> {
  const membership = await membershipOf(ds.manager, scope);
  const [rows, available] = await Promise.all([ds.getRepository(AlertSubscription).findBy({ membershipId: membership.id }), unitsToChoose(ds.manager, scope)]);
  const person = rows.find((r) => r.unitId === null);
  const visible = new Set(available.map((u) => u.unitId));
  return {
    weeklyDigest: person?.weeklyDigest ?? false,
    allUnits: person && person.kinds.length > 0 ? { kinds: person.kinds, dataStoppedDays: person.dataStoppedDays } : null,
    // A unit that left the person's scope (a narrowed client-group limit) is not shown, and not alerted on.
    units: rows
      .filter((r): r is AlertSubscription & { unitId: string } => r.unitId !== null && visible.has(r.unitId))
      .map((r) => ({ unitId: r.unitId, kinds: r.kinds, dataStoppedDays: r.dataStoppedDays }))
      .sort((a, b) => a.unitId.localeCompare(b.unitId)),
    available,
    dataStoppedDays: { ...DATA_STOPPED_DAYS },
  };
}
