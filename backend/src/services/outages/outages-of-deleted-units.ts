/**
 * What happens to outages when one of their units (or its plant) is deleted. An approved outage is a frozen record
 * of a decision (outage-rules.ts) and keeps its units: the unit is not deleted while one takes it off line (409
 * saying so, as for an approved case). A draft outage loses the unit and the unit's items (the foreign keys
 * cascade); its other items no longer need those items, its plan version rises so its latest proposal reads as
 * stale, and its own audit says what went.
 */
import { In, type EntityManager } from 'typeorm';
import { OutageItem } from '../../entities/outage-item.entity.js';
import { OutageUnit } from '../../entities/outage-unit.entity.js';
import { Outage } from '../../entities/outage.entity.js';
import { AppError } from '../../http/app-error.js';
import { recordAudit } from '../audit.service.js';
import { touch } from './outage-access.js';

export interface UnitsLeaving {
  organisationId: string;
  userId: string;
  /** the units deleted, with their names for the audit */
  units: { id: string; name: string }[];
  what: 'unit' | 'plant';
}

/** Refuses when an approved outage covers one of the units; otherwise detaches them from draft outages (same transaction, before the delete). */
export async function refuseApprovedOutagesOrDetach(em: EntityManager, leaving: UnitsLeaving): Promise<string[]> {
  const unitIds = leaving.units.map((u) => u.id);
  if (unitIds.length === 0) return [];
  const links = await em.getRepository(OutageUnit).find({ where: { unitId: In(unitIds) } });
  const outageIds = [...new Set(links.map((l) => l.outageId))];
  if (outageIds.length === 0) return [];
  const outages = await em.getRepository(Outage).find({
    where: { id: In(outageIds), organisationId: leaving.organisationId },
    order: { name: 'ASC', id: 'ASC' },
    lock: { mode: 'pessimistic_write' },
  });
  const approved = outages.filter((o) => o.status === 'approved');
  if (approved.length) {
    const names = approved.map((o) => `“${o.name}”`).join(', ');
    throw new AppError(
      409,
      `This ${leaving.what} cannot be deleted: ${approved.length === 1 ? 'the approved outage' : `${approved.length} approved outages`} ${names} ` +
        `take${approved.length === 1 ? 's' : ''} it off line and ${approved.length === 1 ? 'is' : 'are'} kept as decided. ` +
        'An administrator may delete the outage first; a unit only in draft outages can be deleted (it leaves them).',
    );
  }
  const now = new Date();
  const touched: string[] = [];
  for (const outage of outages) {
    const items = await em.getRepository(OutageItem).find({ where: { outageId: outage.id }, order: { createdAt: 'ASC', id: 'ASC' } });
    const going = items.filter((i) => unitIds.includes(i.unitId));
    const goingIds = new Set(going.map((i) => i.id));
    const freed: string[] = [];
    for (const other of items) {
      if (goingIds.has(other.id) || !other.needs.some((n) => goingIds.has(n))) continue;
      other.needs = other.needs.filter((n) => !goingIds.has(n));
      other.updatedAt = now;
      await em.getRepository(OutageItem).save(other);
      freed.push(other.title);
    }
    const unitsGoing = leaving.units.filter((u) => links.some((l) => l.outageId === outage.id && l.unitId === u.id));
    touch(outage, true, now);
    await em.getRepository(Outage).save(outage);
    await recordAudit(em, {
      organisationId: leaving.organisationId,
      userId: leaving.userId,
      action: 'outage.unit-removed',
      entityType: 'outage',
      entityId: outage.id,
      details: {
        outage: outage.name,
        reason: `${leaving.what} deleted`,
        units: unitsGoing.map((u) => ({ id: u.id, name: u.name })),
        itemsRemoved: going.map((i) => ({ id: i.id, title: i.title, cost: i.cost, benefit: i.pricedBenefit })),
        noLongerNeededBy: freed,
      },
    });
    touched.push(outage.name);
  }
  return touched;
}
