/**
 * Remove an item from a draft outage. Items that need it lose that need (said in the audit entry); saved scopes
 * keep the id and show it as removed. The latest proposal becomes stale.
 */
import type { DataSource } from 'typeorm';
import type { OutageView } from '@shared/schemas/outages.js';
import { OutageItem } from '../../entities/outage-item.entity.js';
import { Outage } from '../../entities/outage.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { itemsOfOutage } from '../../repositories/outage.repository.js';
import { recordAudit } from '../audit.service.js';
import { assertMayOutage, itemInScope, touch } from './outage-access.js';
import { outageViewOf } from './outage-view.js';

export async function deleteItem(ds: DataSource, scope: TenantScope, itemId: string): Promise<OutageView> {
  return ds.transaction(async (em) => {
    const { item, outage } = await itemInScope(em, scope, itemId, true);
    assertMayOutage('edit', outage, scope);
    const now = new Date();
    const freed: string[] = [];
    for (const other of await itemsOfOutage(em, outage.id)) {
      if (other.id !== item.id && other.needs.includes(item.id)) {
        other.needs = other.needs.filter((n) => n !== item.id);
        other.updatedAt = now;
        await em.getRepository(OutageItem).save(other);
        freed.push(other.title);
      }
    }
    await em.getRepository(OutageItem).delete({ id: item.id });
    touch(outage, true, now);
    await em.getRepository(Outage).save(outage);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'outage.item-removed',
      entityType: 'outage',
      entityId: outage.id,
      details: { outage: outage.name, itemId: item.id, title: item.title, cost: item.cost, benefit: item.pricedBenefit, noLongerNeededBy: freed },
    });
    return outageViewOf(em, scope, outage);
  });
}
