/**
 * Outages, their items and saved scopes within the caller's scope (scope-filter.ts restrictOutagesToScope: every
 * unit of the outage visible to the member), and the recent daily figures an item's cleanliness is priced with.
 */
import type { EntityManager } from 'typeorm';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { OutageItem } from '../entities/outage-item.entity.js';
import { OutageScope } from '../entities/outage-scope.entity.js';
import { OutageUnit } from '../entities/outage-unit.entity.js';
import { Outage } from '../entities/outage.entity.js';
import { Plant } from '../entities/plant.entity.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { restrictOutagesToScope } from './scope-filter.js';

/** The outage, or null outside the scope; `lock` takes its row for the rest of the transaction. */
export function findOutageInScope(em: EntityManager, scope: TenantScope, id: string, lock = false): Promise<Outage | null> {
  const qb = em.getRepository(Outage).createQueryBuilder('o').where('o.id = :id', { id });
  if (lock) qb.setLock('pessimistic_write');
  return restrictOutagesToScope(qb, 'o', scope).getOne();
}

/** Outages within the scope, newest change first; `unitId` keeps those taking that unit off line. */
export function outagesInScope(em: EntityManager, scope: TenantScope, filter: { status?: string; unitId?: string; approvedOnly: boolean }): Promise<Outage[]> {
  const qb = em.getRepository(Outage).createQueryBuilder('o');
  restrictOutagesToScope(qb, 'o', scope);
  if (filter.approvedOnly) qb.andWhere("o.status = 'approved'");
  if (filter.status) qb.andWhere('o.status = :status', { status: filter.status });
  if (filter.unitId) qb.andWhere('EXISTS (SELECT 1 FROM outage_unit fu WHERE fu.outageId = o.id AND fu.unitId = :unitId)', { unitId: filter.unitId });
  return qb.orderBy('o.updatedAt', 'DESC').addOrderBy('o.id', 'ASC').limit(500).getMany();
}

/** An item and its outage, or null when the outage lies outside the scope. */
export async function findOutageItemInScope(
  em: EntityManager,
  scope: TenantScope,
  itemId: string,
  lock = false,
): Promise<{ item: OutageItem; outage: Outage } | null> {
  const item = await em.getRepository(OutageItem).findOneBy({ id: itemId });
  if (!item) return null;
  const outage = await findOutageInScope(em, scope, item.outageId, lock);
  if (!outage) return null;
  return { item, outage };
}

export interface OutageUnitRow {
  outageId: string;
  unit: GeneratingUnit;
  plant: Plant;
}

/** The units of the given outages with their plants (the outages already found in scope), by plant and unit name. */
export async function unitsOfOutages(em: EntityManager, outageIds: readonly string[]): Promise<OutageUnitRow[]> {
  if (outageIds.length === 0) return [];
  const links = await em.getRepository(OutageUnit).createQueryBuilder('ou').where('ou.outageId IN (:...ids)', { ids: outageIds }).getMany();
  if (links.length === 0) return [];
  const units = await em
    .getRepository(GeneratingUnit)
    .createQueryBuilder('u')
    .where('u.id IN (:...ids)', { ids: [...new Set(links.map((l) => l.unitId))] })
    .getMany();
  const plants = await em
    .getRepository(Plant)
    .createQueryBuilder('p')
    .where('p.id IN (:...ids)', { ids: [...new Set(units.map((u) => u.plantId))] })
    .getMany();
  const unitById = new Map(units.map((u) => [u.id, u]));
  const plantById = new Map(plants.map((p) => [p.id, p]));
  return links
    .flatMap((l) => {
      const unit = unitById.get(l.unitId);
      const plant = unit ? plantById.get(unit.plantId) : undefined;
      return unit && plant ? [{ outageId: l.outageId, unit, plant }] : [];
    })
    .sort((a, b) => a.plant.name.localeCompare(b.plant.name) || a.unit.name.localeCompare(b.unit.name));
}

export function itemsOfOutage(em: EntityManager, outageId: string): Promise<OutageItem[]> {
  return em.getRepository(OutageItem).find({ where: { outageId }, order: { createdAt: 'ASC', id: 'ASC' } });
}

export async function itemCountsOfOutages(em: EntityManager, outageIds: readonly string[]): Promise<Map<string, number>> {
  if (outageIds.length === 0) return new Map();
  const rows: { outageId: string; n: string | number }[] = await em
    .getRepository(OutageItem)
    .createQueryBuilder('i')
    .select('i.outageId', 'outageId')
    .addSelect('COUNT(*)', 'n')
    .where('i.outageId IN (:...ids)', { ids: outageIds })
    .groupBy('i.outageId')
    .getRawMany();
  return new Map(rows.map((r) => [r.outageId, Number(r.n)]));
}

export function scopesOfOutage(em: EntityManager, outageId: string): Promise<OutageScope[]> {
  return em.getRepository(OutageScope).find({ where: { outageId }, order: { createdAt: 'ASC', id: 'ASC' } });
}

export interface TypicalDay {
  day: string;
  cleanliness: number;
  cwInletC: number;
  loadMw: number;
}

const dayText = (d: unknown) => (typeof d === 'string' ? d.slice(0, 10) : (d as Date).toISOString().slice(0, 10));

/**
 * A unit's last `days` days with valid data, a measured cleanliness, CW inlet temperature and load (newest last):
 * the recent typical conditions a recovered cleanliness is priced at (the unit already found in scope).
 */
export async function recentOperatingDays(em: EntityManager, unitId: string, days: number): Promise<TypicalDay[]> {
  const rows: { day: string | Date; cleanliness: number; cwInletC: number; loadMw: number }[] = await em.query(
    `SELECT day, medianCleanliness AS cleanliness, meanCwInletC AS cwInletC, meanLoadMw AS loadMw FROM daily_aggregate
      WHERE unitId = ? AND pointsUsed > 0 AND medianCleanliness IS NOT NULL AND meanCwInletC IS NOT NULL AND meanLoadMw > 0
      ORDER BY day DESC LIMIT ?`,
    [unitId, days],
  );
  return rows.map((r) => ({ day: dayText(r.day), cleanliness: Number(r.cleanliness), cwInletC: Number(r.cwInletC), loadMw: Number(r.loadMw) })).reverse();
}
