/** An administrator deletes an outage, approved or not; the audit log keeps its name, window, budget, status and approved scope. */
import type { DataSource } from 'typeorm';
import { Outage } from '../../entities/outage.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { itemsOfOutage, unitsOfOutages } from '../../repositories/outage.repository.js';
import { recordAudit } from '../audit.service.js';
import { assertMayOutage, outageInScope } from './outage-access.js';

export async function deleteOutage(ds: DataSource, scope: TenantScope, id: string): Promise<void> {
  await ds.transaction(async (em) => {
    const outage = await outageInScope(em, scope, id, true);
    assertMayOutage('delete', outage, scope);
    const [units, items] = await Promise.all([unitsOfOutages(em, [outage.id]), itemsOfOutage(em, outage.id)]);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'outage.deleted',
      entityType: 'outage',
      entityId: outage.id,
      details: {
        name: outage.name,
        status: outage.status,
        units: units.map((u) => `${u.plant.name} ${u.unit.name}`),
        startDate: outage.startDate,
        endDate: outage.endDate,
        budget: outage.budget,
        currency: outage.currency,
        items: items.map((i) => ({ title: i.title, cost: i.cost, benefit: i.pricedBenefit, lane: i.lane, durationDays: i.durationDays })),
        approved: outage.approved,
        approvedById: outage.approvedById,
        approvedAt: outage.approvedAt?.toISOString() ?? null,
      },
    });
    await em.getRepository(Outage).delete({ id: outage.id });
  });
}
