/**
 * Change an item of a draft outage (title, cost, duration, lane, benefit, needs, forced in or out); a new benefit is
 * priced again, a case's cleaning keeps the case's. The latest proposal becomes stale. Audited with what changed.
 */
import type { DataSource } from 'typeorm';
import type { OutageItemPatch, OutageView } from '@shared/schemas/outages.js';
import { OutageItem } from '../../entities/outage-item.entity.js';
import { Outage } from '../../entities/outage.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { recordAudit } from '../audit.service.js';
import { checkNeeds, fieldError, unitOfOutage } from './add-item.js';
import { assertMayOutage, itemInScope, touch } from './outage-access.js';
import { outageViewOf } from './outage-view.js';
import { priceFor } from './price-item.js';

export async function editItem(ds: DataSource, scope: TenantScope, itemId: string, body: OutageItemPatch): Promise<OutageView> {
  return ds.transaction(async (em) => {
    const { item, outage } = await itemInScope(em, scope, itemId, true);
    assertMayOutage('edit', outage, scope);
    const changes: Record<string, { from: unknown; to: unknown }> = {};
    const set = <K extends keyof OutageItem>(key: K, value: OutageItem[K]) => {
      if (JSON.stringify(item[key]) !== JSON.stringify(value)) {
        changes[key] = { from: item[key], to: value };
        item[key] = value;
      }
    };
    if (body.title !== undefined) set('title', body.title);
    if (body.cost !== undefined) set('cost', body.cost.toFixed(2));
    if (body.durationDays !== undefined) set('durationDays', body.durationDays);
    if (body.lane !== undefined) set('lane', body.lane);
    if (body.forced !== undefined) set('forced', body.forced);
    if (body.needs !== undefined) set('needs', await checkNeeds(em, outage.id, body.needs, item.id));
    if (body.benefit !== undefined) {
      if (item.kind === 'case-cleaning') throw fieldError('benefit', 'A case’s cleaning takes its benefit from the case: it cannot be changed here');
      const { unit } = await unitOfOutage(em, outage.id, item.unitId);
      const priced = await priceFor(em, unit, body.benefit, outage.currency);
      set('benefitMoney', priced.benefitMoney);
      set('cleanlinessRecovered', priced.cleanlinessRecovered);
      set('horizonDays', priced.horizonDays);
      set('pricedBenefit', priced.pricedBenefit.toFixed(2));
      set('pricingMethod', priced.pricingMethod);
      set('pricingText', priced.pricingText.slice(0, 1000));
    }
    if (Object.keys(changes).length > 0) {
      const now = new Date();
      item.updatedAt = now;
      await em.getRepository(OutageItem).save(item);
      touch(outage, true, now);
      await em.getRepository(Outage).save(outage);
      await recordAudit(em, {
        organisationId: scope.organisationId,
        userId: scope.userId,
        action: 'outage.item-changed',
        entityType: 'outage',
        entityId: outage.id,
        details: { outage: outage.name, itemId: item.id, title: item.title, changes },
      });
    }
    return outageViewOf(em, scope, outage);
  });
}
