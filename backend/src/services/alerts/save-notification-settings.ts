/**
 * Saves a person's own alert choices in the active organisation, all or nothing: every unit named must be in their
 * scope (otherwise 404 and nothing written). Saves of the same person are serialised by locking their membership
 * row; the week of the last digest is kept, so saving twice in a week does not send a second digest.
 */
import type { DataSource } from 'typeorm';
import { DATA_STOPPED_DAYS, type NotificationSettingsBody, type NotificationSettingsResponse } from '@shared/schemas/notifications.js';
import { AlertSubscription } from '../../entities/alert-subscription.entity.js';
import { notFound } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { membershipOf, readNotificationSettings, unitsToChoose } from './read-notification-settings.js';

export async function saveNotificationSettings(ds: DataSource, scope: TenantScope, body: NotificationSettingsBody): Promise<NotificationSettingsResponse> {
  await ds.transaction(async (em) => {
    const membership = await membershipOf(em, scope, true);
    const visible = new Set((await unitsToChoose(em, scope)).map((u) => u.unitId));
    const unknown = body.units.find((u) => !visible.has(u.unitId));
    if (unknown) throw notFound(`No such unit: ${unknown.unitId}`);
    const repo = em.getRepository(AlertSubscription);
    const existing = await repo.findBy({ membershipId: membership.id });
    const person = existing.find((r) => r.unitId === null);
    const base = { organisationId: scope.organisationId, membershipId: membership.id, userId: scope.userId };
    const personRow = {
      kinds: body.allUnits?.kinds ?? [],
      dataStoppedDays: body.allUnits?.dataStoppedDays ?? DATA_STOPPED_DAYS.default,
      weeklyDigest: body.weeklyDigest,
    };
    if (person) await repo.update({ id: person.id }, personRow);
    else await repo.insert({ ...base, unitId: null, ...personRow, digestWeek: null });
    // Units outside the scope keep their rows (the person may see them again); the ones in scope are replaced.
    const replaced = existing.filter((r) => r.unitId !== null && visible.has(r.unitId)).map((r) => r.id);
    if (replaced.length > 0) await repo.delete(replaced);
    if (body.units.length > 0)
      await repo.insert(
        body.units.map((u) => ({ ...base, unitId: u.unitId, kinds: u.kinds, dataStoppedDays: u.dataStoppedDays, weeklyDigest: false, digestWeek: null })),
      );
  });
  return readNotificationSettings(ds, scope);
}
