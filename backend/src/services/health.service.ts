/**
 * The condenser health view of one unit over a period: headline figures, daily series, the fouling trend
 * with its forecast band, the deviation breakdown by week or month, events, suspected air in-leakage and
 * data quality. Everything comes from the stored daily aggregates and the unit's last analysis.
 */
import type { DataSource } from 'typeorm';
import { backpressureAtCleanlinessKpa, expectedWithinBounds, PLAUSIBLE_CLEANLINESS } from '@shared/domain/condenser/index.js';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { plantDayFormatter } from '@shared/domain/calendar/plant-day.js';
import { lttbKeepingGaps } from '@shared/domain/monitoring/index.js';
import { MAX_SERIES_POINTS } from '@shared/limits.js';
import { physicalCost, type PhysicalCostBasis } from '@shared/domain/turbine/physical-cost.js';
import {
  BREAKDOWN_CAUSES,
  samplesQuery,
  type DailyFigure,
  type HealthQuery,
  type HealthTrend,
  type SamplesResponse,
  type UnitHealthResponse,
} from '@shared/schemas/health.js';
import { storedUnitAnalysis, type StoredUnitAnalysis } from '@shared/schemas/unit-analysis.js';
import type { z } from 'zod';
import type { TenantScope } from '../policies/tenant-scope.js';
import { dailyFiguresOfUnit } from '../repositories/daily-aggregate.repository.js';
import { eventsOfUnit } from '../repositories/event.repository.js';
import { foundInScope } from '../repositories/found-in-scope.js';
import { findUnitWithPlant } from '../repositories/plant.repository.js';
import { chartPointsOfUnit, lastSampleTimeOfUnit } from '../repositories/sample.repository.js';
import { unitVersionInScope } from '../repositories/unit-version.repository.js';
import { forecastBand } from './derived/forecast-band.js';
import { eventView } from './unit-event.service.js';
import { UnitViewCache } from './unit-view-cache.js';

export type DailyRow = DailyFigure;

/** Points the models left out as implausible, in the words the view shows. */
const IMPLAUSIBLE_WORDS = {
  'implausible-cleanliness': `cleanliness outside ${PLAUSIBLE_CLEANLINESS.min}–${PLAUSIBLE_CLEANLINESS.max}; check the surface, tube count and clean coefficient in the setup, or the instruments.`,
  // Velocity and pressure bands are named, not quoted, so the words hold in the person's units (US or SI).
  'implausible-velocity': 'tube velocity outside its plausible band (a wrong CW flow, tube count or number of passes); check them in the setup.',
  'expected-out-of-range': 'the model’s backpressure lies outside the range a condenser may read; check the setup (design duty, CW flow, surface, tube count).',
} as const;

function isoWeekStart(day: string): string {
  const d = new Date(`${day}T00:00:00Z`);
  const weekday = (d.getUTCDay() + 6) % 7;
  return addDays(day, -weekday);
}

const mean = (values: (number | null)[]) => {
  const v = values.filter((x): x is number => x !== null && Number.isFinite(x));
  return v.length ? v.reduce((a, b) => a + b, 0) / v.length : null;
};
const sum = (values: (number | null)[]) => values.reduce<number>((a, b) => a + (b ?? 0), 0);

/** Mean deviation parts and summed costs of the valid days, per ISO week (starting Monday) or calendar month. */
export function breakdownByPeriod(days: DailyRow[], by: 'week' | 'month') {
  const buckets = new Map<string, DailyRow[]>();
  for (const d of days.filter((x) => x.pointsUsed > 0)) {
    const key = by === 'week' ? isoWeekStart(d.day) : d.day.slice(0, 7);
    const list = buckets.get(key);
    if (list) list.push(d);
    else buckets.set(key, [d]);
  }
  return [...buckets.entries()].map(([bucket, rows]) => ({
    period: bucket,
    ...(Object.fromEntries(BREAKDOWN_CAUSES.map((cause) => [cause, mean(rows.map((r) => r[cause]))])) as Record<
      (typeof BREAKDOWN_CAUSES)[number],
      number | null
    >),
    meanExcessBackpressureKpa: mean(rows.map((r) => r.meanExcessBackpressureKpa)),
    foulingCost: sum(rows.map((r) => r.foulingCost)),
    unexplainedCost: sum(rows.map((r) => r.unexplainedCost)),
  }));
}

/** The prices and heat rate that turn a cost back into MW and t CO2; null until the turbine and economics are set up. */
export function physicalBasisOf(unit: { turbine: { designHeatRateBtuKwh: number } | null; economics: Omit<PhysicalCostBasis, 'heatRateBtuKwh'> | null }) {
  if (!unit.turbine || !unit.economics) return null;
  const e = unit.economics;
  return {
    heatRateBtuKwh: unit.turbine.designHeatRateBtuKwh,
    fuelPricePerMmbtu: e.fuelPricePerMmbtu,
    co2KgPerMmbtu: e.co2KgPerMmbtu,
    co2PricePerTonne: e.co2PricePerTonne,
    replacementPricePerMwh: e.replacementPricePerMwh,
    capacityLimitedShare: e.capacityLimitedShare,
  } satisfies PhysicalCostBasis;
}

/** The unit's stored analysis read with its schema; one that does not fit it (written by an older version) reads as unreadable. */
function readAnalysis(stored: unknown): StoredUnitAnalysis | 'unreadable' | null {
  if (stored === null || stored === undefined) return null;
  const parsed = storedUnitAnalysis.safeParse(typeof stored === 'string' ? JSON.parse(stored) : stored);
  return parsed.success ? parsed.data : 'unreadable';
}

/** Health views of recently asked units and periods in this process (about 0.2 MB each). */
export const unitHealthCache = new UnitViewCache<UnitHealthResponse>(128);

/**
 * The health view, from the cache when nothing it depends on has changed since it was computed: the unit's
 * versions are read from the database on every request (one statement that also checks the scope), so a
 * recompute, a setup save, an import or an event in any process is seen by the next request.
 */
export async function unitHealth(ds: DataSource, scope: TenantScope, unitId: string, q: HealthQuery): Promise<UnitHealthResponse> {
  const version = await foundInScope(unitVersionInScope(ds.manager, scope, unitId), 'No such unit');
  const key = UnitViewCache.keyOf(version, [q.from ?? null, q.to ?? null, q.breakdownBy]);
  return unitHealthCache.get(key, () => computeUnitHealth(ds, scope, unitId, q));
}

/** The health view computed from the stored daily figures, events and analysis (no cache). */
export async function computeUnitHealth(ds: DataSource, scope: TenantScope, unitId: string, q: HealthQuery): Promise<UnitHealthResponse> {
  const { unit, plant } = await foundInScope(findUnitWithPlant(ds.manager, scope, unitId), 'No such unit');
  const stored = readAnalysis(unit.analysis);
  const analysis = stored === 'unreadable' ? null : stored;
  const all = await dailyFiguresOfUnit(ds.manager, unitId);
  const withData = all.filter((d) => d.pointsUsed > 0);
  const lastDay = withData.at(-1)?.day ?? null;
  const to = q.to ?? lastDay ?? undefined;
  const from = q.from ?? (to ? addDays(to, -364) : undefined);
  const period = all.filter((d) => (!from || d.day >= from) && (!to || d.day <= to));
  const events = (await eventsOfUnit(ds.manager, unitId)).map(eventView);
  const cleanings = events.filter((e) => e.kind === 'cleaning');
  const lastCleaning = cleanings.filter((e) => !lastDay || (e.endDate ?? e.startDate) <= lastDay).at(-1) ?? null;
  const sinceCleaning = withData.filter((d) => !lastCleaning || d.day >= (lastCleaning.endDate ?? lastCleaning.startDate));
  const lastWeek = withData.slice(-7);
  const lastSampleUtc = await lastSampleTimeOfUnit(ds.manager, unitId);

  const c = unit.condenser;
  const warnings: string[] = [];
  if (stored === 'unreadable') warnings.push('The stored trend and cleaning outlook are from an older version and cannot be read; recompute the unit.');
  let designModelKpa: number | null = null;
  if (c) {
    // The stored setup may be one the form would refuse today: the view then says so instead of failing.
    try {
      designModelKpa = expectedWithinBounds(
        () =>
          backpressureAtCleanlinessKpa({
            geometry: {
              surfaceM2: c.surfaceM2,
              tubeCount: c.tubeCount,
              passes: c.passes,
              tubeOdMm: c.tubeOdMm,
              tubeBwg: c.tubeBwg,
              tubeMaterial: c.tubeMaterial,
            },
            cwInletC: c.designCwInletC,
            cwFlowM3s: c.designCwFlowM3s,
            dutyMw: c.designDutyMw,
            pluggedTubes: c.designPluggedTubes,
            cleanliness: c.designCleanliness,
          }),
        c.designCleanliness,
        'the design point',
      );
    } catch {
      warnings.push(
        'The design point cannot be modelled with this setup: the model’s backpressure there lies outside the range a condenser may read. Check the design duty, CW flow, surface and tube count.',
      );
    }
  }

  // The forecast band: the latest cycle refitted on its daily medians (air-leak days left out). The recompute
  // stores it with the analysis; an analysis stored before it did (or for other days) has it drawn here.
  let forecast: { day: string; cleanliness: number; low: number; high: number }[] = [];
  let trendFit: HealthTrend | null = analysis?.cycles.at(-1) ?? null;
  if (lastDay && trendFit && trendFit.status === 'fitted' && (!to || to >= lastDay)) {
    const stored = analysis?.forecast;
    const band = stored && stored.lastDay === lastDay && stored.cycleStartDay === trendFit.startDay ? stored : forecastBand(all, trendFit);
    if (band?.status === 'failed') warnings.push('The fouling forecast could not be drawn from the stored trend; recompute the unit.');
    if (band?.status === 'fitted') {
      forecast = band.points;
      trendFit = { ...trendFit, bandProbability: band.bandProbability };
    }
  }

  const basis = physicalBasisOf(unit);
  const physical = (cost: number | null, hours?: number) => (basis ? physicalCost(cost, basis, hours) : null);
  let cumulative = 0;
  const series = period.map((d) => {
    const p = physical(d.foulingCost);
    cumulative += d.foulingCost ?? 0;
    return {
      day: d.day,
      cleanliness: d.medianCleanliness,
      trendCleanliness: d.trendCleanliness,
      backpressureKpa: d.meanBackpressureKpa,
      expectedBackpressureKpa: d.meanExpectedBackpressureKpa,
      excessBackpressureKpa: d.meanExcessBackpressureKpa,
      ttdK: d.medianTtdK,
      cwInletC: d.meanCwInletC,
      loadMw: d.meanLoadMw,
      foulingCost: d.foulingCost,
      unexplainedCost: d.unexplainedCost,
      cumulativeFoulingCost: cumulative,
      foulingCo2Tonnes: p?.co2Tonnes ?? null,
      foulingLostMwh: p?.lostMwh ?? null,
      airLeakSuspected: d.airLeakSuspected,
    };
  });
  const downsampled =
    series.length > MAX_SERIES_POINTS
      ? lttbKeepingGaps(
          series,
          MAX_SERIES_POINTS,
          (p) => Date.parse(p.day),
          (p) => p.cleanliness,
        )
      : series;

  const breakdown = breakdownByPeriod(period, q.breakdownBy).map((b) => {
    const p = physical(b.foulingCost);
    return { ...b, foulingCo2Tonnes: p?.co2Tonnes ?? null, foulingLostMwh: p?.lostMwh ?? null };
  });

  const dropped: Record<string, number> = {};
  for (const d of period) for (const [k, v] of Object.entries(d.droppedByReason ?? {})) dropped[k] = (dropped[k] ?? 0) + v;
  const dutyGaps = period
    .filter((d) => d.meanDutyMw !== null && d.heatBalanceDutyMw)
    .map((d) => ({ day: d.day, gapPct: (100 * (d.meanDutyMw! - d.heatBalanceDutyMw!)) / d.heatBalanceDutyMw! }));
  const stuck: Record<string, string[]> = {};
  for (const d of period) for (const s of d.stuckSensors ?? []) (stuck[s] ??= []).push(d.day);

  for (const [reason, words] of Object.entries(IMPLAUSIBLE_WORDS)) {
    const n = dropped[`model:${reason}`] ?? 0;
    if (n > 0) warnings.push(`${n.toLocaleString('en-US')} points left out: ${words}`);
  }

  const leaks = (analysis?.airLeakPeriods ?? []).filter((p) => (!from || p.to >= from) && (!to || p.from <= to));
  const econ = unit.economics;
  const foulingCostPerDay = mean(lastWeek.map((d) => d.foulingCost));
  const foulingCostSinceCleaning = sinceCleaning.length ? sum(sinceCleaning.map((d) => d.foulingCost)) : null;
  return {
    unit: {
      id: unit.id,
      name: unit.name,
      plant: { id: plant.id, name: plant.name, timeZone: plant.timeZone },
      setupComplete: !!(unit.condenser && unit.turbine && unit.economics),
    },
    period: { from: from ?? null, to: to ?? null, breakdownBy: q.breakdownBy },
    analysedAt: analysis?.computedAt ?? null,
    headline: {
      asOf: lastDay,
      cleanliness: withData.at(-1)?.medianCleanliness ?? null,
      trendCleanliness: withData.at(-1)?.trendCleanliness ?? null,
      referenceCleanliness: c ? (c.referenceCleanliness ?? c.designCleanliness) : null,
      designCleanliness: c?.designCleanliness ?? null,
      excessBackpressureKpa: mean(lastWeek.map((d) => d.meanExcessBackpressureKpa)),
      foulingCostPerDay,
      unexplainedCostPerDay: mean(lastWeek.map((d) => d.unexplainedCost)),
      foulingCostSinceCleaning,
      lastCleaning: lastCleaning
        ? { date: lastCleaning.endDate ?? lastCleaning.startDate, notes: lastCleaning.notes, cleanlinessAfter: lastCleaning.cleanlinessAfter }
        : null,
      lastSampleUtc,
      nextCleaning: analysis?.outlook ?? null,
      averagingNote: 'Cleanliness is the last day’s median; backpressure excess and costs are means of the last 7 days with valid data.',
      costBasis: econ
        ? `Fuel${econ.co2PricePerTonne > 0 ? ' and CO2' : ''} with load held for ${Math.round((1 - econ.capacityLimitedShare) * 100)} % of hours; replacement power with firing held for ${Math.round(econ.capacityLimitedShare * 100)} %.`
        : null,
      // A day's cost covers its hours of data (24 for a whole day), so the per-day figure's MW is over 24 h.
      foulingPhysical: basis
        ? { capacityLimitedShare: basis.capacityLimitedShare, perDay: physical(foulingCostPerDay, 24), sinceCleaning: physical(foulingCostSinceCleaning) }
        : null,
    },
    design: c
      ? {
          datasheetBackpressureKpa: c.designBackpressureKpa,
          modelBackpressureKpa: designModelKpa,
          modelOffsetKpa: designModelKpa === null ? null : designModelKpa - c.designBackpressureKpa,
        }
      : null,
    trend: trendFit,
    forecast,
    series: downsampled,
    seriesDownsampled: downsampled.length < series.length,
    breakdown,
    events: events.filter((e) => (!from || (e.endDate ?? e.startDate) >= from) && (!to || e.startDate <= to)),
    airLeakPeriods: leaks.map((p) => ({ ...p, note: 'Cleaning would not recover this: find and seal the air in-leakage (and check the instruments).' })),
    warnings,
    dataQuality: {
      daysInPeriod: period.length,
      daysWithValidData: period.filter((d) => d.pointsUsed > 0).length,
      pointsUsed: sum(period.map((d) => d.pointsUsed)),
      pointsDropped: sum(period.map((d) => d.pointsDropped)),
      droppedByReason: dropped,
      dutyGap: {
        meanPct: mean(dutyGaps.map((g) => g.gapPct)),
        daysOver5Pct: dutyGaps.filter((g) => Math.abs(g.gapPct) > 5).length,
        note: 'CW-side duty against the heat-balance duty at the day’s load; gaps over 5 % point to unmetered flow or a stratified outlet temperature (a 5 % flow error is a 2.5 % cleanliness error).',
      },
      stuckSensors: Object.entries(stuck).map(([sensor, days]) => ({ sensor, days: days.length, lastDay: days.at(-1)! })),
    },
  };
}

/** Hourly points of recently asked units and periods in this process (about 0.2 MB each). */
export const unitSamplesCache = new UnitViewCache<SamplesResponse>(128);

/** Hourly points, from the cache while the unit's versions, imports and stored data are unchanged (as for the health view). */
export async function unitSamples(ds: DataSource, scope: TenantScope, unitId: string, q: z.infer<typeof samplesQuery>): Promise<SamplesResponse> {
  const version = await foundInScope(unitVersionInScope(ds.manager, scope, unitId), 'No such unit');
  return unitSamplesCache.get(UnitViewCache.keyOf(version, [q.from, q.to, q.quantity]), () => computeUnitSamples(ds, scope, unitId, q));
}

/** Hourly points of one quantity over a period, downsampled (LTTB) to at most MAX_SERIES_POINTS (no cache). */
export async function computeUnitSamples(ds: DataSource, scope: TenantScope, unitId: string, q: z.infer<typeof samplesQuery>): Promise<SamplesResponse> {
  const { plant } = await foundInScope(findUnitWithPlant(ds.manager, scope, unitId), 'No such unit');
  const columns: Record<SamplesResponse['quantity'], SamplesResponse['columns']> = {
    backpressure: ['backpressureKpa', 'expectedBackpressureKpa'],
    cleanliness: ['cleanliness'],
    ttd: ['ttdK'],
    cwInlet: ['cwInletC'],
    load: ['loadMw'],
  };
  const cols = columns[q.quantity];
  // Plant-local days: widen by a day on each side in UTC, then keep what falls inside.
  const rows = await chartPointsOfUnit(ds.manager, unitId, cols, `${addDays(q.from, -1)} 00:00:00`, `${addDays(q.to, 2)} 00:00:00`);
  const dayOf = plantDayFormatter(plant.timeZone);
  const points = rows
    .map((r) => ({ t: new Date(r.ts).toISOString(), valid: r.passedChecks, ...r.values }))
    .filter((p) => {
      const day = dayOf(Date.parse(p.t));
      return day >= q.from && day <= q.to;
    });
  const first = (p: (typeof points)[number]) => (p as Record<string, unknown>)[cols[0]!] as number | null; // every quantity has at least one column
  const sampled = points.length > MAX_SERIES_POINTS ? lttbKeepingGaps(points, MAX_SERIES_POINTS, (p) => Date.parse(p.t), first) : points;
  return { quantity: q.quantity, columns: cols, total: points.length, points: sampled };
}
