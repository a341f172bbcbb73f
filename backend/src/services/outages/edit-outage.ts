/**
 * Change a draft outage's name, units, window or budget (409 once approved). A unit with items stays until its items
 * are removed; new units must lie within the scope and count money in the outage's currency. The window, budget and
 * units make the latest proposal stale. Written to the audit log with what changed.
 */
import type { DataSource } from 'typeorm';
import { MAX_OUTAGE_WINDOW_DAYS, windowDays, type OutagePatch, type OutageView } from '@shared/schemas/outages.js';
import { OutageItem } from '../../entities/outage-item.entity.js';
import { OutageUnit } from '../../entities/outage-unit.entity.js';
import { Outage } from '../../entities/outage.entity.js';
import { AppError, badRequest } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { unitsOfOutages } from '../../repositories/outage.repository.js';
import { recordAudit } from '../audit.service.js';
import { unitsForOutage } from './create-outage.js';
import { assertMayOutage, assertSeen, outageInScope, touch } from './outage-access.js';
import { outageViewOf } from './outage-view.js';

const field = (path: string, message: string) => badRequest('Some fields need attention', { fieldErrors: [{ path, message }] });

export async function editOutage(ds: DataSource, scope: TenantScope, id: string, body: OutagePatch): Promise<OutageView> {
  return ds.transaction(async (em) => {
    const outage = await outageInScope(em, scope, id, true);
    assertMayOutage('edit', outage, scope);
    assertSeen(outage, body.seenUpdatedAt);
    const changes: Record<string, unknown> = {};
    let plan = false;
    if (body.name !== undefined && body.name !== outage.name) {
      changes.name = { from: outage.name, to: body.name };
      outage.name = body.name;
    }
    const startDate = body.startDate ?? outage.startDate;
    const endDate = body.endDate ?? outage.endDate;
    if (endDate < startDate) throw field(body.endDate !== undefined ? 'endDate' : 'startDate', 'The last day cannot be before the first day');
    if (windowDays(startDate, endDate) > MAX_OUTAGE_WINDOW_DAYS) throw field('endDate', `An outage window is at most ${MAX_OUTAGE_WINDOW_DAYS} days`);
    if (startDate !== outage.startDate || endDate !== outage.endDate) {
      changes.window = { from: `${outage.startDate}..${outage.endDate}`, to: `${startDate}..${endDate}` };
      outage.startDate = startDate;
      outage.endDate = endDate;
      plan = true;
    }
    if (body.budget !== undefined && Number(outage.budget) !== body.budget) {
      changes.budget = { from: outage.budget, to: body.budget.toFixed(2) };
      outage.budget = body.budget.toFixed(2);
      plan = true;
    }
    if (body.unitIds !== undefined) {
      const { units, currency } = await unitsForOutage(em, scope, body.unitIds);
      if (currency !== outage.currency) throw field('unitIds', `These units count money in ${currency}; the outage counts it in ${outage.currency}`);
      const wanted = new Set(units.map((u) => u.unit.id));
      const before = await unitsOfOutages(em, [outage.id]);
      const had = new Set(before.map((l) => l.unit.id));
      const dropped = [...had].filter((u) => !wanted.has(u));
      const added = [...wanted].filter((u) => !had.has(u));
      if (dropped.length) {
        const busy = await em
          .getRepository(OutageItem)
          .createQueryBuilder('i')
          .where('i.outageId = :o', { o: outage.id })
          .andWhere('i.unitId IN (:...u)', { u: dropped })
          .getCount();
        if (busy > 0) throw new AppError(409, 'A unit with work items stays in the outage: remove its items first');
        await em.getRepository(OutageUnit).delete(dropped.map((unitId) => ({ outageId: outage.id, unitId })));
      }
      if (added.length) await em.getRepository(OutageUnit).insert(added.map((unitId) => ({ outageId: outage.id, unitId })));
      if (dropped.length || added.length) {
        const name = (uid: string) => {
          const row = before.find((u) => u.unit.id === uid) ?? units.find((u) => u.unit.id === uid);
          return row ? `${row.plant.name} ${row.unit.name}` : uid;
        };
        changes.units = { removed: dropped.map(name), added: added.map(name) };
        plan = true;
      }
    }
    if (Object.keys(changes).length > 0) {
      touch(outage, plan);
      await em.getRepository(Outage).save(outage);
      await recordAudit(em, {
        organisationId: scope.organisationId,
        userId: scope.userId,
        action: 'outage.changed',
        entityType: 'outage',
        entityId: outage.id,
        details: { name: outage.name, changes },
      });
    }
    return outageViewOf(em, scope, outage);
  });
}
