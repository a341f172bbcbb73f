/** An outage as the API answers it: units, items with their priced benefit, the latest proposal, saved scopes side by side, the approval. */
import type { EntityManager } from 'typeorm';
import { In } from 'typeorm';
import { windowDays, type OutageItemView, type OutageView, type SavedScopeView, type ScopeComparison } from '@shared/schemas/outages.js';
import { CleaningCase } from '../../entities/cleaning-case.entity.js';
import type { OutageItem } from '../../entities/outage-item.entity.js';
import type { OutageScope } from '../../entities/outage-scope.entity.js';
import type { Outage } from '../../entities/outage.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { itemsOfOutage, scopesOfOutage, unitsOfOutages, type OutageUnitRow } from '../../repositories/outage.repository.js';
import { namesOf } from '../cases/case-view.js';
import { cautionsFor, outageActionsFor } from './outage-rules.js';
import { selectionFigures } from './scope-figures.js';

export function unitViews(rows: readonly OutageUnitRow[]) {
  return rows.map((r) => ({ id: r.unit.id, name: r.unit.name, plantId: r.plant.id, plantName: r.plant.name, timeZone: r.plant.timeZone }));
}

export async function itemViews(em: EntityManager, items: readonly OutageItem[], units: readonly OutageUnitRow[]): Promise<OutageItemView[]> {
  const caseIds = [...new Set(items.flatMap((i) => (i.caseId ? [i.caseId] : [])))];
  const cases = caseIds.length ? await em.getRepository(CleaningCase).find({ where: { id: In(caseIds) }, select: { id: true, title: true } }) : [];
  const caseTitle = new Map(cases.map((c) => [c.id, c.title]));
  const unitById = new Map(units.map((u) => [u.unit.id, u]));
  return items.map((i) => {
    const u = unitById.get(i.unitId);
    return {
      id: i.id,
      outageId: i.outageId,
      unitId: i.unitId,
      unitName: u?.unit.name ?? 'a unit no longer in the outage',
      plantName: u?.plant.name ?? '',
      kind: i.kind,
      title: i.title,
      cost: Number(i.cost),
      durationDays: i.durationDays,
      lane: i.lane,
      benefitEntered:
        i.benefitMoney !== null
          ? Number(i.benefitMoney)
          : i.cleanlinessRecovered !== null && i.horizonDays !== null
            ? { cleanlinessRecovered: i.cleanlinessRecovered, horizonDays: i.horizonDays }
            : null,
      benefit: Number(i.pricedBenefit),
      pricing: { method: i.pricingMethod, text: i.pricingText },
      caseId: i.caseId,
      caseTitle: i.caseId ? (caseTitle.get(i.caseId) ?? null) : null,
      needs: [...i.needs],
      forced: i.forced,
      createdAt: i.createdAt.toISOString(),
      updatedAt: i.updatedAt.toISOString(),
    };
  });
}

export function scopeViews(outage: Outage, items: readonly OutageItem[], scopes: readonly OutageScope[], names: Map<string, string>): SavedScopeView[] {
  const present = new Set(items.map((i) => i.id));
  return scopes.map((s) => {
    const itemIds = s.itemIds.filter((id) => present.has(id));
    const f = selectionFigures(outage, items, itemIds);
    return {
      id: s.id,
      name: s.name,
      itemIds,
      missingItemIds: s.itemIds.filter((id) => !present.has(id)),
      totalBenefit: f.totalBenefit,
      totalCost: f.totalCost,
      laneDays: f.laneDays,
      criticalLaneDays: f.criticalLaneDays,
      feasible: f.feasible,
      problems: f.problems,
      createdBy: { id: s.createdById, name: names.get(s.createdById) ?? 'a former member' },
      createdAt: s.createdAt.toISOString(),
    };
  });
}

/** Items every saved scope holds, and those some hold and others do not (with the scopes holding them). */
export function compareScopes(items: readonly OutageItem[], scopes: readonly SavedScopeView[]): ScopeComparison {
  const inAll: string[] = [];
  const differences: ScopeComparison['differences'] = [];
  for (const item of items) {
    const holders = scopes.filter((s) => s.itemIds.includes(item.id)).map((s) => s.id);
    if (scopes.length > 0 && holders.length === scopes.length) inAll.push(item.id);
    else if (holders.length > 0) differences.push({ itemId: item.id, title: item.title, inScopeIds: holders });
  }
  return { inAll, differences };
}

export async function outageViewOf(em: EntityManager, scope: TenantScope, outage: Outage): Promise<OutageView> {
  const [units, items, scopes] = await Promise.all([unitsOfOutages(em, [outage.id]), itemsOfOutage(em, outage.id), scopesOfOutage(em, outage.id)]);
  const names = await namesOf(em, [outage.createdById, outage.approvedById, ...scopes.map((s) => s.createdById)]);
  const person = (id: string) => ({ id, name: names.get(id) ?? 'a former member' });
  const savedScopes = scopeViews(outage, items, scopes, names);
  const { planVersion, ...proposal } = outage.proposal ?? { planVersion: -1 };
  const kinds = outage.approved
    ? outage.approved.items.filter((i) => outage.approved!.selectedItemIds.includes(i.id)).map((i) => i.kind)
    : items.map((i) => i.kind);
  return {
    id: outage.id,
    organisationId: outage.organisationId,
    name: outage.name,
    units: unitViews(units),
    startDate: outage.startDate,
    endDate: outage.endDate,
    windowDays: windowDays(outage.startDate, outage.endDate),
    budget: Number(outage.budget),
    currency: outage.currency,
    status: outage.status,
    items: await itemViews(em, items, units),
    proposal: outage.proposal ? (proposal as OutageView['proposal']) : null,
    proposalStale: outage.proposal !== null && planVersion !== outage.planVersion,
    scopes: savedScopes,
    comparison: compareScopes(items, savedScopes),
    approved: outage.approved,
    approvedBy: outage.approvedById ? person(outage.approvedById) : null,
    approvedAt: outage.approvedAt ? outage.approvedAt.toISOString() : null,
    createdBy: person(outage.createdById),
    createdAt: outage.createdAt.toISOString(),
    updatedAt: outage.updatedAt.toISOString(),
    cautions: cautionsFor(kinds),
    actions: outageActionsFor(outage.status, scope.role),
  };
}
