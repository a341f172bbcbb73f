/** A new draft outage on units the member may see, in the units' one currency; written to the audit log with its names. */
import type { DataSource, EntityManager } from 'typeorm';
import type { OutageCreate, OutageView } from '@shared/schemas/outages.js';
import { OutageUnit } from '../../entities/outage-unit.entity.js';
import { Outage } from '../../entities/outage.entity.js';
import { badRequest } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { findUnitWithPlant } from '../../repositories/plant.repository.js';
import { recordAudit } from '../audit.service.js';
import type { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import type { Plant } from '../../entities/plant.entity.js';
import { outageViewOf } from './outage-view.js';

/**
 * The units named in a body, each within the scope: one the member cannot see is refused like one that does not
 * exist (400 on its field), and all must count money in one currency.
 */
export async function unitsForOutage(
  em: EntityManager,
  scope: TenantScope,
  unitIds: readonly string[],
): Promise<{ units: { unit: GeneratingUnit; plant: Plant }[]; currency: string }> {
  const units: { unit: GeneratingUnit; plant: Plant }[] = [];
  const fieldErrors: { path: string; message: string }[] = [];
  for (const [n, id] of unitIds.entries()) {
    const found = await findUnitWithPlant(em, scope, id.toLowerCase());
    if (found) units.push(found);
    else fieldErrors.push({ path: `unitIds.${n}`, message: 'No such unit' });
  }
  if (fieldErrors.length) throw badRequest('Some fields need attention', { fieldErrors });
  const currencies = [...new Set(units.map((u) => u.unit.economics?.currency ?? 'USD'))];
  if (currencies.length > 1) {
    throw badRequest('Some fields need attention', {
      fieldErrors: [{ path: 'unitIds', message: `These units count money in different currencies (${currencies.join(', ')}): an outage adds money in one` }],
    });
  }
  return { units, currency: currencies[0] ?? 'USD' };
}

export async function createOutage(ds: DataSource, scope: TenantScope, body: OutageCreate): Promise<OutageView> {
  return ds.transaction(async (em) => {
    const { units, currency } = await unitsForOutage(em, scope, body.unitIds);
    const now = new Date();
    const repo = em.getRepository(Outage);
    const outage = await repo.save(
      repo.create({
        organisationId: scope.organisationId,
        name: body.name,
        startDate: body.startDate,
        endDate: body.endDate,
        budget: body.budget.toFixed(2),
        currency,
        status: 'draft',
        planVersion: 1,
        version: 1,
        proposal: null,
        approved: null,
        approvedById: null,
        approvedAt: null,
        createdById: scope.userId,
        updatedAt: now,
      }),
    );
    await em.getRepository(OutageUnit).insert(units.map((u) => ({ outageId: outage.id, unitId: u.unit.id })));
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'outage.created',
      entityType: 'outage',
      entityId: outage.id,
      details: {
        name: outage.name,
        units: units.map((u) => `${u.plant.name} ${u.unit.name}`),
        startDate: outage.startDate,
        endDate: outage.endDate,
        budget: outage.budget,
        currency,
      },
    });
    return outageViewOf(em, scope, await repo.findOneByOrFail({ id: outage.id }));
  });
}
