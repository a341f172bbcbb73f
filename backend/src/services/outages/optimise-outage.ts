/**
 * Run the optimiser (shared/domain/outage/scope-optimiser.ts) on a draft outage's items as they are now and keep its
 * answer as the outage's latest proposal, marked with the plan version it was computed for. Audited with the totals.
 */
import type { DataSource } from 'typeorm';
import { optimiseScope } from '@shared/domain/outage/scope-optimiser.js';
import type { OptimiseResponse } from '@shared/schemas/outages.js';
import { Outage } from '../../entities/outage.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { itemsOfOutage } from '../../repositories/outage.repository.js';
import { recordAudit } from '../audit.service.js';
import { assertMayOutage, outageInScope, touch } from './outage-access.js';
import { scopeProblemOf } from './scope-figures.js';

export async function optimiseOutage(ds: DataSource, scope: TenantScope, id: string): Promise<OptimiseResponse> {
  return ds.transaction(async (em) => {
    const outage = await outageInScope(em, scope, id, true);
    assertMayOutage('optimise', outage, scope);
    const items = await itemsOfOutage(em, outage.id);
    const proposal = optimiseScope(scopeProblemOf(outage, items));
    const now = new Date();
    const answer: OptimiseResponse = {
      selectedItemIds: proposal.selectedItemIds,
      totalBenefit: Math.round(proposal.totalBenefit * 100) / 100,
      totalCost: Math.round(proposal.totalCost * 100) / 100,
      laneDays: proposal.laneDays,
      reasons: proposal.reasons,
      feasible: proposal.feasible,
      problems: proposal.problems,
      computedAt: now.toISOString(),
    };
    outage.proposal = { ...answer, planVersion: outage.planVersion };
    touch(outage, false, now);
    await em.getRepository(Outage).save(outage);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'outage.optimised',
      entityType: 'outage',
      entityId: outage.id,
      details: {
        name: outage.name,
        items: items.length,
        chosen: items.filter((i) => answer.selectedItemIds.includes(i.id)).map((i) => i.title),
        totalBenefit: answer.totalBenefit,
        totalCost: answer.totalCost,
        feasible: answer.feasible,
      },
    });
    return answer;
  });
}
