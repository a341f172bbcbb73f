/**
 * Approve a draft outage's scope: a saved scope named by `scopeId`, or else the latest proposal (which must be
 * current). The selection must keep the budget, the window and every need. The outage then holds a frozen snapshot
 * (items as they were, totals, lane days, the reason for every item) and changes no more. With `seenUpdatedAt`, a
 * decision on an outage changed since is refused. Audited with the approver, the scope and its totals.
 */
import type { DataSource } from 'typeorm';
import { windowDays, type ApprovedSnapshot, type OutageApprove, type OutageView } from '@shared/schemas/outages.js';
import { OutageScope } from '../../entities/outage-scope.entity.js';
import { Outage } from '../../entities/outage.entity.js';
import { AppError, badRequest } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { itemsOfOutage, unitsOfOutages } from '../../repositories/outage.repository.js';
import { recordAudit } from '../audit.service.js';
import { assertMayOutage, assertSeen, outageInScope, touch } from './outage-access.js';
import { itemViews, outageViewOf } from './outage-view.js';
import { currentSelection } from './save-scope.js';
import { selectionFigures } from './scope-figures.js';

export async function approveOutage(ds: DataSource, scope: TenantScope, id: string, body: OutageApprove): Promise<OutageView> {
  return ds.transaction(async (em) => {
    const outage = await outageInScope(em, scope, id, true);
    assertMayOutage('approve', outage, scope);
    assertSeen(outage, body.seenUpdatedAt);
    const items = await itemsOfOutage(em, outage.id);
    let selected: string[];
    let scopeName: string;
    let reasons: Record<string, string>;
    if (body.scopeId !== undefined) {
      const saved = await em.getRepository(OutageScope).findOneBy({ id: body.scopeId.toLowerCase(), outageId: outage.id });
      if (!saved) throw badRequest('Some fields need attention', { fieldErrors: [{ path: 'scopeId', message: 'Not a saved scope of this outage' }] });
      const present = new Set(items.map((i) => i.id));
      if (saved.itemIds.some((i) => !present.has(i))) {
        throw new AppError(409, `The saved scope “${saved.name}” lists items removed since: save it again before approving it`);
      }
      selected = saved.itemIds;
      scopeName = saved.name;
      reasons = Object.fromEntries(
        items.map((i) => [i.id, selected.includes(i.id) ? `In: chosen in the saved scope “${saved.name}”.` : `Left out of the saved scope “${saved.name}”.`]),
      );
    } else {
      selected = currentSelection(outage);
      scopeName = 'Proposal';
      reasons = { ...outage.proposal!.reasons };
    }
    const figures = selectionFigures(outage, items, selected);
    if (!figures.feasible) throw new AppError(409, `This scope cannot be approved: ${figures.problems.join('; ')}`);
    const units = await unitsOfOutages(em, [outage.id]);
    const snapshot: ApprovedSnapshot = {
      scopeName,
      scopeId: body.scopeId?.toLowerCase() ?? null,
      startDate: outage.startDate,
      endDate: outage.endDate,
      windowDays: windowDays(outage.startDate, outage.endDate),
      budget: Number(outage.budget),
      currency: outage.currency,
      items: await itemViews(em, items, units),
      selectedItemIds: selected,
      totalBenefit: figures.totalBenefit,
      totalCost: figures.totalCost,
      laneDays: figures.laneDays,
      reasons,
    };
    const now = new Date();
    outage.status = 'approved';
    outage.approved = snapshot;
    outage.approvedById = scope.userId;
    outage.approvedAt = now;
    touch(outage, false, now);
    await em.getRepository(Outage).save(outage);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'outage.approved',
      entityType: 'outage',
      entityId: outage.id,
      details: {
        name: outage.name,
        scope: scopeName,
        items: items.filter((i) => selected.includes(i.id)).map((i) => i.title),
        totalBenefit: figures.totalBenefit,
        totalCost: figures.totalCost,
        budget: outage.budget,
        currency: outage.currency,
      },
    });
    return outageViewOf(em, scope, outage);
  });
}
