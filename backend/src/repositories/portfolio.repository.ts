/**
 * The portfolio's reads: one statement each for the units in scope (with the parts of their setup and stored
 * analysis the portfolio shows), their open cases and their coming outages, whatever the number of units.
 */
import type { EntityManager } from 'typeorm';
import type { CaseStatus } from '@shared/schemas/cases.js';
import { CleaningCase } from '../entities/cleaning-case.entity.js';
import { ClientGroup } from '../entities/client-group.entity.js';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { Plant } from '../entities/plant.entity.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { restrictOutagesToScope, restrictPlantsToScope } from './scope-filter.js';

/** A day column as 'YYYY-MM-DD' whether the driver hands back text or a Date. */
export const dayText = (d: unknown): string => (typeof d === 'string' ? d.slice(0, 10) : (d as Date).toISOString().slice(0, 10));
/** A JSON value as MariaDB hands it back (text), parsed; null for SQL NULL. */
const json = (v: unknown): unknown => (v === null || v === undefined ? null : typeof v === 'string' ? JSON.parse(v) : v);

export interface PortfolioUnitRow {
  unitId: string;
  unitName: string;
  plantId: string;
  plantName: string;
  timeZone: string;
  clientGroupId: string | null;
  clientGroupName: string | null;
  setupComplete: boolean;
  analysed: boolean;
  /** the parts of the setup and the stored analysis read, each as parsed JSON (unknown: the caller checks them) */
  currency: unknown;
  referenceCleanliness: unknown;
  designCleanliness: unknown;
  /** the heat rate and prices that turn a cost back into MW and t CO2 (physical-cost.ts), each unknown until checked */
  physicalBasis: Record<string, unknown>;
  current: unknown;
  outlook: unknown;
}

/** Every unit in scope, by client group, plant and unit name. */
export async function portfolioUnitsInScope(em: EntityManager, scope: TenantScope): Promise<PortfolioUnitRow[]> {
  const qb = em
    .getRepository(GeneratingUnit)
    .createQueryBuilder('u')
    .innerJoin(Plant, 'p', 'p.id = u.plantId')
    .leftJoin(ClientGroup, 'g', 'g.id = p.clientGroupId AND g.organisationId = p.organisationId')
    .select('u.id', 'unitId')
    .addSelect('u.name', 'unitName')
    .addSelect('p.id', 'plantId')
    .addSelect('p.name', 'plantName')
    .addSelect('p.timeZone', 'timeZone')
    .addSelect('g.id', 'clientGroupId')
    .addSelect('g.name', 'clientGroupName')
    .addSelect('(u.condenser IS NOT NULL AND u.turbine IS NOT NULL AND u.economics IS NOT NULL)', 'setupComplete')
    // The setup's small parts through MariaDB's JSON functions; the stored analysis (~15 kB) whole: parsing it
    // here is several times cheaper than MariaDB's JSON functions reading its parts one path at a time.
    .addSelect(
      "JSON_OBJECT('currency', JSON_EXTRACT(u.economics, '$.currency'), 'referenceCleanliness', JSON_EXTRACT(u.condenser, '$.referenceCleanliness'), 'designCleanliness', JSON_EXTRACT(u.condenser, '$.designCleanliness'), " +
        "'heatRateBtuKwh', JSON_EXTRACT(u.turbine, '$.designHeatRateBtuKwh'), 'fuelPricePerMmbtu', JSON_EXTRACT(u.economics, '$.fuelPricePerMmbtu'), " +
        "'co2KgPerMmbtu', JSON_EXTRACT(u.economics, '$.co2KgPerMmbtu'), 'co2PricePerTonne', JSON_EXTRACT(u.economics, '$.co2PricePerTonne'), " +
        "'replacementPricePerMwh', JSON_EXTRACT(u.economics, '$.replacementPricePerMwh'), 'capacityLimitedShare', JSON_EXTRACT(u.economics, '$.capacityLimitedShare'))",
      'parts',
    )
    .addSelect('u.analysis', 'analysis');
  const rows: Record<string, unknown>[] = await restrictPlantsToScope(qb, 'p', scope)
    .orderBy('g.name', 'ASC')
    .addOrderBy('p.name', 'ASC')
    .addOrderBy('u.name', 'ASC')
    .getRawMany();
  return rows.map((r) => {
    const parts = (json(r.parts) ?? {}) as Record<string, unknown>;
    const analysis = (json(r.analysis) ?? {}) as { current?: unknown; outlook?: Record<string, unknown> | null };
    const outlook = analysis.outlook ?? null;
    const plan = Array.isArray(outlook?.plan) ? (outlook.plan as { unitDuringCleaning?: unknown }[]) : [];
    return {
      unitId: String(r.unitId),
      unitName: String(r.unitName),
      plantId: String(r.plantId),
      plantName: String(r.plantName),
      timeZone: String(r.timeZone),
      clientGroupId: (r.clientGroupId as string | null) ?? null,
      clientGroupName: (r.clientGroupName as string | null) ?? null,
      setupComplete: Number(r.setupComplete) === 1,
      analysed: r.analysis !== null && r.analysis !== undefined,
      currency: parts.currency ?? null,
      referenceCleanliness: parts.referenceCleanliness ?? null,
      physicalBasis: {
        heatRateBtuKwh: parts.heatRateBtuKwh,
        fuelPricePerMmbtu: parts.fuelPricePerMmbtu,
        co2KgPerMmbtu: parts.co2KgPerMmbtu,
        co2PricePerTonne: parts.co2PricePerTonne,
        replacementPricePerMwh: parts.replacementPricePerMwh,
        capacityLimitedShare: parts.capacityLimitedShare,
      },
      designCleanliness: parts.designCleanliness ?? null,
      current: analysis.current ?? null,
      outlook: outlook && {
        status: outlook.status ?? null,
        reason: outlook.reason ?? null,
        next: outlook.next ?? null,
        firstDuring: plan[0]?.unitDuringCleaning ?? null,
        saving: outlook.savingsVersusNoCleaning ?? null,
      },
    };
  });
}

export interface PortfolioCaseRow {
  id: string;
  unitId: string;
  title: string;
  status: CaseStatus;
}

/** Cases not archived on the units in scope (viewers: approved ones only), latest change first. */
export async function openCasesInScope(em: EntityManager, scope: TenantScope): Promise<PortfolioCaseRow[]> {
  const qb = em
    .getRepository(CleaningCase)
    .createQueryBuilder('c')
    .innerJoin(GeneratingUnit, 'u', 'u.id = c.unitId')
    .innerJoin(Plant, 'p', 'p.id = u.plantId')
    .select(['c.id AS id', 'c.unitId AS unitId', 'c.title AS title', 'c.status AS status'])
    .where('c.organisationId = :caseOrg', { caseOrg: scope.organisationId })
    .andWhere("c.status <> 'archived'");
  if (scope.role === 'viewer') qb.andWhere("c.status = 'approved'");
  return restrictPlantsToScope(qb, 'p', scope).orderBy('c.updatedAt', 'DESC').addOrderBy('c.id', 'ASC').getRawMany();
}

export interface PortfolioOutageRow {
  id: string;
  unitId: string;
  name: string;
  startDate: string;
  endDate: string;
}

/**
 * Outages the member may open (as GET /api/outages/:id decides) that take a unit in scope off line and end on or after `fromDay` (the earliest of the
 * plants' todays; the caller keeps those not ended by each plant's own today), by start date.
 */
export async function comingOutagesInScope(em: EntityManager, scope: TenantScope, fromDay: string): Promise<PortfolioOutageRow[]> {
  const qb = em
    .createQueryBuilder()
    .select(['o.id AS id', 'ou.unitId AS unitId', 'o.name AS name', 'o.startDate AS startDate', 'o.endDate AS endDate'])
    .from('outage', 'o')
    .innerJoin('outage_unit', 'ou', 'ou.outageId = o.id')
    .innerJoin(GeneratingUnit, 'u', 'u.id = ou.unitId')
    .innerJoin(Plant, 'p', 'p.id = u.plantId')
    .where('o.organisationId = :outageOrg', { outageOrg: scope.organisationId })
    .andWhere('o.endDate >= :fromDay', { fromDay });
  // The outage itself as the outage pages show it: every unit it takes off line in scope, and viewers see approved ones only.
  restrictOutagesToScope(qb, 'o', scope);
  if (scope.role === 'viewer') qb.andWhere("o.status = 'approved'");
  const rows: Record<string, unknown>[] = await restrictPlantsToScope(qb, 'p', scope).orderBy('o.startDate', 'ASC').addOrderBy('o.id', 'ASC').getRawMany();
  return rows.map((r) => ({
    id: String(r.id),
    unitId: String(r.unitId),
    name: String(r.name),
    startDate: dayText(r.startDate),
    endDate: dayText(r.endDate),
  }));
}

/**
 * What the portfolio of a scope depends on, in one cheap statement (no stored analysis is read): the units in
 * scope with their names, plants, groups and setup and data versions (raised by a setup save and by the
 * recompute), and fingerprints of the tenant's cases, outages and the units outages take off line.
 */
export async function portfolioVersionInScope(em: EntityManager, scope: TenantScope): Promise<string> {
  const qb = em
    .getRepository(GeneratingUnit)
    .createQueryBuilder('u')
    .innerJoin(Plant, 'p', 'p.id = u.plantId')
    .leftJoin(ClientGroup, 'g', 'g.id = p.clientGroupId')
    .select('COUNT(*)', 'units')
    .addSelect('COALESCE(SUM(u.dataVersion + u.setupVersion), 0)', 'versions')
    .addSelect("COALESCE(BIT_XOR(CRC32(CONCAT_WS('|', u.id, u.name, u.setupVersion, u.dataVersion, p.id, p.name, p.timeZone, g.id, g.name))), 0)", 'unitsMark')
    .addSelect(
      "(SELECT CONCAT(COUNT(*), ':', COALESCE(BIT_XOR(CRC32(CONCAT_WS('|', c.id, c.unitId, c.status, c.title, c.updatedAt))), 0)) FROM cleaning_case c WHERE c.organisationId = :scopeOrg)",
      'cases',
    )
    .addSelect(
      "(SELECT CONCAT(COUNT(*), ':', COALESCE(BIT_XOR(CRC32(CONCAT_WS('|', o.id, o.name, o.startDate, o.endDate, o.updatedAt))), 0)) FROM outage o WHERE o.organisationId = :scopeOrg)",
      'outages',
    )
    .addSelect(
      "(SELECT COALESCE(BIT_XOR(CRC32(CONCAT_WS('|', ou.outageId, ou.unitId))), 0) FROM outage_unit ou JOIN outage o2 ON o2.id = ou.outageId WHERE o2.organisationId = :scopeOrg)",
      'outageUnits',
    );
  const row: Record<string, unknown> | undefined = await restrictPlantsToScope(qb, 'p', scope).getRawOne();
  return JSON.stringify([row?.units, row?.versions, row?.unitsMark, row?.cases, row?.outages, row?.outageUnits].map((v) => String(v ?? '')));
}
