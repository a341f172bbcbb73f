/**
 * Save a named selection of a draft outage's items to compare side by side: the items listed, or the latest
 * proposal's selection (which must be current). Saving under the name of a saved scope replaces it; a fourth name
 * is refused (at most three are kept side by side, and none is dropped without the planner saying so: remove-scope.ts).
 */
import type { DataSource } from 'typeorm';
import { MAX_SAVED_SCOPES, type OutageView, type ScopeSave } from '@shared/schemas/outages.js';
import { OutageScope } from '../../entities/outage-scope.entity.js';
import { Outage } from '../../entities/outage.entity.js';
import { AppError, badRequest } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { itemsOfOutage, scopesOfOutage } from '../../repositories/outage.repository.js';
import { recordAudit } from '../audit.service.js';
import { assertMayOutage, outageInScope, touch } from './outage-access.js';
import { outageViewOf } from './outage-view.js';
import { selectionFigures } from './scope-figures.js';

/** The latest proposal's selection, refused when there is none or the plan changed after it. */
export function currentSelection(outage: Outage): string[] {
  if (!outage.proposal) throw new AppError(409, 'There is no proposal yet: run the optimiser first, or list the items');
  if (outage.proposal.planVersion !== outage.planVersion) {
    throw new AppError(409, 'The items, window or budget changed since the last proposal: run the optimiser again');
  }
  return [...outage.proposal.selectedItemIds];
}

export async function saveScope(ds: DataSource, scope: TenantScope, id: string, body: ScopeSave): Promise<OutageView> {
  return ds.transaction(async (em) => {
    const outage = await outageInScope(em, scope, id, true);
    assertMayOutage('saveScope', outage, scope);
    const items = await itemsOfOutage(em, outage.id);
    let itemIds: string[];
    if (body.itemIds !== undefined) {
      const known = new Set(items.map((i) => i.id));
      itemIds = body.itemIds.map((i) => i.toLowerCase());
      const fieldErrors = itemIds.flatMap((i, n) => (known.has(i) ? [] : [{ path: `itemIds.${n}`, message: 'Not an item of this outage' }]));
      if (fieldErrors.length) throw badRequest('Some fields need attention', { fieldErrors });
    } else {
      itemIds = currentSelection(outage);
    }
    const scopes = await scopesOfOutage(em, outage.id);
    const repo = em.getRepository(OutageScope);
    const same = scopes.find((s) => s.name.toLowerCase() === body.name.toLowerCase());
    if (same) {
      same.itemIds = itemIds;
      same.createdById = scope.userId;
      same.createdAt = new Date();
      await repo.save(same);
    } else {
      if (scopes.length >= MAX_SAVED_SCOPES) {
        throw new AppError(
          409,
          `An outage keeps ${MAX_SAVED_SCOPES} saved scopes side by side (${scopes.map((s) => `“${s.name}”`).join(', ')}): save under one of their names to replace it, or remove one`,
        );
      }
      await repo.save(repo.create({ outageId: outage.id, name: body.name, itemIds, createdById: scope.userId }));
    }
    touch(outage, false);
    await em.getRepository(Outage).save(outage);
    const f = selectionFigures(outage, items, itemIds);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'outage.scope-saved',
      entityType: 'outage',
      entityId: outage.id,
      details: {
        outage: outage.name,
        scope: body.name,
        replaced: !!same,
        items: items.filter((i) => itemIds.includes(i.id)).map((i) => i.title),
        totalBenefit: f.totalBenefit,
        totalCost: f.totalCost,
      },
    });
    return outageViewOf(em, scope, outage);
  });
}
