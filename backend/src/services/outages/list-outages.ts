/** The outages a member may see (all their units in the member's scope; viewers: approved ones), newest change first. */
import type { DataSource } from 'typeorm';
import type { OutageListQuery, OutageSummary } from '@shared/schemas/outages.js';
import { notFound } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { itemCountsOfOutages, outagesInScope, unitsOfOutages } from '../../repositories/outage.repository.js';
import { findUnit } from '../../repositories/plant.repository.js';
import { unitViews } from './outage-view.js';

export async function listOutages(ds: DataSource, scope: TenantScope, q: OutageListQuery): Promise<OutageSummary[]> {
  const em = ds.manager;
  if (q.unitId && !(await findUnit(em, scope, q.unitId))) throw notFound('No such unit');
  const outages = await outagesInScope(em, scope, { status: q.status, unitId: q.unitId, approvedOnly: scope.role === 'viewer' });
  const ids = outages.map((o) => o.id);
  const [units, counts] = await Promise.all([unitsOfOutages(em, ids), itemCountsOfOutages(em, ids)]);
  return outages.map((o) => {
    const figures = o.approved ?? o.proposal;
    return {
      id: o.id,
      name: o.name,
      units: unitViews(units.filter((u) => u.outageId === o.id)),
      startDate: o.startDate,
      endDate: o.endDate,
      budget: Number(o.budget),
      currency: o.currency,
      status: o.status,
      itemCount: counts.get(o.id) ?? 0,
      totalBenefit: figures ? figures.totalBenefit : null,
      totalCost: figures ? figures.totalCost : null,
      approvedAt: o.approvedAt ? o.approvedAt.toISOString() : null,
      updatedAt: o.updatedAt.toISOString(),
    };
  });
}
