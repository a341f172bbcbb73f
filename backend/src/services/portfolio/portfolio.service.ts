/**
 * The portfolio: every unit the member may see, with its figures now (stored by the recompute with the unit's
 * analysis), its next recommended cleaning, open cases, next outage, data age and current conditions, grouped
 * by client group with totals per group and for the organisation. Whatever the number of units: one statement
 * when the cached answer still holds, four when it is computed (portfolio.repository.ts); money is summed per
 * currency, never across currencies.
 */
import Decimal from 'decimal.js';
import type { DataSource } from 'typeorm';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import { physicalCost, type PhysicalCostBasis } from '@shared/domain/turbine/physical-cost.js';
import { dataAgeDays, isStale, STALE_AFTER_DAYS, unitConditions } from '@shared/domain/portfolio/unit-conditions.js';
import { CASE_STATUSES, type CaseStatus } from '@shared/schemas/cases.js';
import { UNIT_DURING_CLEANING } from '@shared/schemas/cleaning-method.js';
import type { PortfolioGroup, PortfolioResponse, PortfolioTotals, PortfolioUnit } from '@shared/schemas/portfolio.js';
import { storedCurrentFigures } from '@shared/schemas/unit-analysis.js';
import { z } from 'zod';
import type { TenantScope } from '../../policies/tenant-scope.js';
import {
  comingOutagesInScope,
  openCasesInScope,
  portfolioUnitsInScope,
  portfolioVersionInScope,
  type PortfolioCaseRow,
  type PortfolioOutageRow,
  type PortfolioUnitRow,
} from '../../repositories/portfolio.repository.js';

/** The parts of the stored cleaning outlook the portfolio reads (portfolio.repository.ts selects them). */
const outlookParts = z.object({
  status: z.enum(['planned', 'none-needed', 'not-available']).nullable(),
  reason: z.string().nullable(),
  next: z.object({ date: z.iso.date(), methodName: z.string() }).loose().nullable(),
  firstDuring: z.enum(UNIT_DURING_CLEANING).nullable(),
  saving: z.number().nullable(),
});

const finiteOrNull = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

function nextCleaningOf(row: PortfolioUnitRow): Pick<PortfolioUnit, 'nextCleaning' | 'nextCleaningNote'> {
  if (!row.setupComplete) return { nextCleaning: null, nextCleaningNote: 'Setup incomplete' };
  const parsed = outlookParts.safeParse(row.outlook);
  if (!row.analysed || !parsed.success || parsed.data.status === null) return { nextCleaning: null, nextCleaningNote: 'Not analysed yet' };
  const o = parsed.data;
  if (o.status === 'planned' && o.next)
    return { nextCleaning: { date: o.next.date, methodName: o.next.methodName, unitDuringCleaning: o.firstDuring, saving: o.saving }, nextCleaningNote: null };
  return { nextCleaning: null, nextCleaningNote: o.reason ?? (o.status === 'none-needed' ? 'No cleaning pays within the coming year' : 'Not available') };
}

const basisParts = z.object({
  heatRateBtuKwh: z.number(),
  fuelPricePerMmbtu: z.number(),
  co2KgPerMmbtu: z.number(),
  co2PricePerTonne: z.number(),
  replacementPricePerMwh: z.number(),
  capacityLimitedShare: z.number(),
}) satisfies z.ZodType<PhysicalCostBasis>;

/** The MW and t CO2 behind the stored fouling cost, as the health view computes them (a day's cost over 24 h). */
function physicalOf(row: PortfolioUnitRow, perDay: number | null, sinceCleaning: number | null): PortfolioUnit['foulingPhysical'] {
  const basis = basisParts.safeParse(row.physicalBasis);
  if (!row.setupComplete || !basis.success) return null;
  return {
    capacityLimitedShare: basis.data.capacityLimitedShare,
    perDay: physicalCost(perDay, basis.data, 24),
    sinceCleaning: physicalCost(sinceCleaning, basis.data),
  };
}

function unitView(row: PortfolioUnitRow, today: string, cases: PortfolioCaseRow[], outage: PortfolioOutageRow | null): PortfolioUnit {
  const current = storedCurrentFigures.safeParse(row.current);
  const now = current.success ? current.data : null;
  const currency = row.setupComplete && typeof row.currency === 'string' ? row.currency : null;
  const reference = finiteOrNull(row.referenceCleanliness) ?? finiteOrNull(row.designCleanliness);
  const next = nextCleaningOf(row);
  const dataThrough = now?.asOf ?? null;
  const note = !row.setupComplete
    ? 'The unit’s setup is incomplete: figures follow once the condenser, turbine and economics are saved.'
    : !row.analysed
      ? 'Not analysed yet: figures follow once data is imported.'
      : !current.success && row.current !== null
        ? 'The stored figures are from an older version: recompute the unit.'
        : null;
  return {
    unitId: row.unitId,
    unitName: row.unitName,
    plantId: row.plantId,
    plantName: row.plantName,
    clientGroup: row.clientGroupId && row.clientGroupName ? { id: row.clientGroupId, name: row.clientGroupName } : null,
    currency,
    cleanliness: now?.cleanliness ?? null,
    referenceCleanliness: reference,
    excessBackpressureKpa: now?.excessBackpressureKpa ?? null,
    foulingCostPerDay: now?.foulingCostPerDay ?? null,
    foulingCostSinceCleaning: now?.foulingCostSinceCleaning ?? null,
    foulingPhysical: physicalOf(row, now?.foulingCostPerDay ?? null, now?.foulingCostSinceCleaning ?? null),
    lastCleaningDate: now?.lastCleaningDate ?? null,
    ...next,
    openCases: cases.map((c) => ({ id: c.id, title: c.title, status: c.status })),
    nextOutage: outage ? { id: outage.id, name: outage.name, startDate: outage.startDate, endDate: outage.endDate } : null,
    dataThrough,
    dataAgeDays: dataAgeDays(today, dataThrough),
    stale: isStale(today, dataThrough),
    alerts: unitConditions({
      today,
      dataThrough,
      nextCleaning: next.nextCleaning
        ? { date: next.nextCleaning.date, methodName: next.nextCleaning.methodName, savingsVersusNoCleaning: next.nextCleaning.saving }
        : null,
      currency,
      airLeakDaysInLastWeek: now?.airLeakSuspectedDaysInLastWeek ?? 0,
    }),
    note,
  };
}

/** Totals of a set of units: counts, open cases by status, money per currency (decimal sums, rounded to cents). */
export function totalsOf(units: readonly PortfolioUnit[]): PortfolioTotals {
  const openCases = Object.fromEntries(CASE_STATUSES.map((s) => [s, 0])) as Record<CaseStatus, number>;
  for (const u of units) for (const c of u.openCases) openCases[c.status] += 1;
  const money = new Map<string, { units: number; perDay: Decimal; since: Decimal; savings: Decimal }>();
  for (const u of units) {
    if (!u.currency) continue;
    const m = money.get(u.currency) ?? { units: 0, perDay: new Decimal(0), since: new Decimal(0), savings: new Decimal(0) };
    m.units += 1;
    m.perDay = m.perDay.plus(u.foulingCostPerDay ?? 0);
    m.since = m.since.plus(u.foulingCostSinceCleaning ?? 0);
    m.savings = m.savings.plus(u.nextCleaning?.saving ?? 0);
    money.set(u.currency, m);
  }
  return {
    units: units.length,
    unitsWithAlerts: units.filter((u) => u.alerts.length > 0).length,
    staleUnits: units.filter((u) => u.stale).length,
    openCases,
    money: [...money.entries()]
      .sort((a, b) => a[0].localeCompare(b[0]))
      .map(([currency, m]) => ({
        currency,
        units: m.units,
        foulingCostPerDay: m.perDay.toDecimalPlaces(2).toNumber(),
        foulingCostSinceCleaning: m.since.toDecimalPlaces(2).toNumber(),
        nextCleaningSavings: m.savings.toDecimalPlaces(2).toNumber(),
      })),
  };
}

const NO_GROUP = 'Not in a client group';

/** Portfolios recently asked for, per scope and version (a few tens of kB each). */
const cache = new Map<string, Promise<PortfolioResponse>>();
const CACHE_ENTRIES = 64;
/** Plant-local days change only at quarter hours (every zone's offset is a multiple of 15 minutes). */
const QUARTER_HOUR_MS = 900_000;

/**
 * The portfolio, from this process's cache while nothing it depends on has changed: one statement reads the
 * scope's version from the database (portfolio.repository.ts) on every request, so a recompute, setup save,
 * case or outage change made by any process is seen by the next request; the quarter hour is in the key so the
 * plants' todays (data age, stale flags, conditions) are never older than their clocks.
 */
export async function portfolioView(ds: DataSource, scope: TenantScope, now = new Date()): Promise<PortfolioResponse> {
  const version = await portfolioVersionInScope(ds.manager, scope);
  const key = JSON.stringify([scope.organisationId, scope.role, scope.clientGroupIds, version, Math.floor(now.getTime() / QUARTER_HOUR_MS)]);
  const hit = cache.get(key);
  if (hit) {
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const pending = portfolioOf(ds, scope, now);
  cache.set(key, pending);
  while (cache.size > CACHE_ENTRIES) cache.delete(cache.keys().next().value!);
  try {
    return await pending;
  } catch (err) {
    if (cache.get(key) === pending) cache.delete(key);
    throw err;
  }
}

/** The portfolio computed afresh (three statements whatever the number of units). */
export async function portfolioOf(ds: DataSource, scope: TenantScope, now = new Date()): Promise<PortfolioResponse> {
  const rows = await portfolioUnitsInScope(ds.manager, scope);
  const todayByZone = new Map<string, string>();
  const todayOf = (timeZone: string) => {
    let day = todayByZone.get(timeZone);
    if (day === undefined) {
      day = plantDayOf(now.getTime(), timeZone);
      todayByZone.set(timeZone, day);
    }
    return day;
  };
  const todays = rows.map((r) => todayOf(r.timeZone));
  const earliest = todays.reduce<string | null>((a, d) => (a === null || d < a ? d : a), null) ?? addDays(now.toISOString().slice(0, 10), -1);
  const [cases, outages] = await Promise.all([openCasesInScope(ds.manager, scope), comingOutagesInScope(ds.manager, scope, earliest)]);
  const casesByUnit = new Map<string, PortfolioCaseRow[]>();
  for (const c of cases) casesByUnit.set(c.unitId, [...(casesByUnit.get(c.unitId) ?? []), c]);
  const units = rows.map((row, i) => {
    const today = todays[i]!; // one today per row
    const outage = outages.find((o) => o.unitId === row.unitId && o.endDate >= today) ?? null;
    return unitView(row, today, casesByUnit.get(row.unitId) ?? [], outage);
  });

  const grouped = units.some((u) => u.clientGroup !== null);
  const groups: PortfolioGroup[] = [];
  if (grouped) {
    const byGroup = new Map<string | null, PortfolioUnit[]>();
    for (const u of units) byGroup.set(u.clientGroup?.id ?? null, [...(byGroup.get(u.clientGroup?.id ?? null) ?? []), u]);
    for (const [id, members] of byGroup)
      groups.push({ id, name: members[0]?.clientGroup?.name ?? NO_GROUP, unitIds: members.map((u) => u.unitId), totals: totalsOf(members) });
    groups.sort((a, b) => (a.id === null ? 1 : b.id === null ? -1 : a.name.localeCompare(b.name)));
  }
  return { units, groups, totals: totalsOf(units), staleAfterDays: STALE_AFTER_DAYS, outagesAvailable: true };
}
