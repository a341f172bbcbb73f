/**
 * A candidate item on a draft outage: on one of its units, needing only items of the same outage, priced when
 * added (price-item.ts). A case's cleaning names an approved case of that unit, once per outage. The outage's
 * latest proposal becomes stale. Written to the audit log with its names and figures.
 */
import type { DataSource, EntityManager } from 'typeorm';
import { MAX_OUTAGE_ITEMS, type OutageItemCreate, type OutageView } from '@shared/schemas/outages.js';
import { OutageItem } from '../../entities/outage-item.entity.js';
import { Outage } from '../../entities/outage.entity.js';
import { AppError, badRequest } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { unitsOfOutages, type OutageUnitRow } from '../../repositories/outage.repository.js';
import { recordAudit } from '../audit.service.js';
import { assertMayOutage, outageInScope, touch } from './outage-access.js';
import { outageViewOf } from './outage-view.js';
import { caseCleaning, priceFor, type PricedBenefit } from './price-item.js';

export const fieldError = (path: string, message: string) => badRequest('Some fields need attention', { fieldErrors: [{ path, message }] });

/** The outage's unit named by an item (a unit outside the outage, seen or not, is refused alike). */
export async function unitOfOutage(em: EntityManager, outageId: string, unitId: string): Promise<OutageUnitRow> {
  const row = (await unitsOfOutages(em, [outageId])).find((u) => u.unit.id === unitId.toLowerCase());
  if (!row) throw fieldError('unitId', 'This unit is not in the outage: add it to the outage’s units first');
  return row;
}

/** Every id in `needs` is another item of the same outage. */
export async function checkNeeds(em: EntityManager, outageId: string, needs: readonly string[], selfId?: string): Promise<string[]> {
  const ids = needs.map((n) => n.toLowerCase());
  if (selfId && ids.includes(selfId)) throw fieldError('needs', 'An item cannot need itself');
  if (ids.length === 0) return [];
  const found = await em
    .getRepository(OutageItem)
    .createQueryBuilder('i')
    .where('i.outageId = :o', { o: outageId })
    .andWhere('i.id IN (:...ids)', { ids })
    .getCount();
  if (found !== ids.length) throw fieldError('needs', 'needs lists items of this outage only');
  return ids;
}

export async function addItem(ds: DataSource, scope: TenantScope, outageId: string, body: OutageItemCreate): Promise<OutageView> {
  return ds.transaction(async (em) => {
    const outage = await outageInScope(em, scope, outageId, true);
    assertMayOutage('edit', outage, scope);
    const count = await em.getRepository(OutageItem).countBy({ outageId: outage.id });
    if (count >= MAX_OUTAGE_ITEMS) throw new AppError(409, `An outage holds at most ${MAX_OUTAGE_ITEMS} items: remove one first`);
    const { unit, plant } = await unitOfOutage(em, outage.id, body.unitId);
    const needs = await checkNeeds(em, outage.id, body.needs ?? []);
    let priced: PricedBenefit;
    let title = body.title;
    let cost = body.cost;
    let durationDays = body.durationDays;
    let caseId: string | null = null;
    if (body.kind === 'case-cleaning') {
      const c = await caseCleaning(em, scope, outage, unit.id, body.caseId!);
      const twice = await em.getRepository(OutageItem).countBy({ outageId: outage.id, caseId: c.record.id });
      if (twice > 0) throw new AppError(409, 'This case’s cleaning is in the outage already');
      priced = c.priced;
      caseId = c.record.id;
      title ??= c.defaults.title;
      cost ??= c.defaults.cost;
      durationDays ??= c.defaults.durationDays;
    } else {
      priced = await priceFor(em, unit, body.benefit!, outage.currency);
    }
    const now = new Date();
    const repo = em.getRepository(OutageItem);
    const item = await repo.save(
      repo.create({
        outageId: outage.id,
        unitId: unit.id,
        kind: body.kind,
        title: title!,
        cost: cost!.toFixed(2),
        durationDays: durationDays!,
        lane: body.lane,
        caseId,
        benefitMoney: priced.benefitMoney,
        cleanlinessRecovered: priced.cleanlinessRecovered,
        horizonDays: priced.horizonDays,
        pricedBenefit: priced.pricedBenefit.toFixed(2),
        pricingMethod: priced.pricingMethod,
        pricingText: priced.pricingText.slice(0, 1000),
        needs,
        forced: body.forced ?? null,
        updatedAt: now,
      }),
    );
    touch(outage, true, now);
    await em.getRepository(Outage).save(outage);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'outage.item-added',
      entityType: 'outage',
      entityId: outage.id,
      details: {
        outage: outage.name,
        itemId: item.id,
        title: item.title,
        kind: item.kind,
        unit: `${plant.name} ${unit.name}`,
        cost: item.cost,
        benefit: item.pricedBenefit,
        lane: item.lane,
        durationDays: item.durationDays,
      },
    });
    return outageViewOf(em, scope, outage);
  });
}
