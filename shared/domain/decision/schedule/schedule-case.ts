/**
 * A cleaning case end to end: from plant-local dates, drivers, the unit's penalty model, methods, outages and
 * windows to the least-cost schedule, its baseline, the business case and (optionally) its uncertainty.
 */
import type { CleaningMethod } from '../../../schemas/cleaning-method.js';
import { cautionsFor } from '../../../schemas/cleaning-method.js';
import { addDays, daysBetween, horizonYearIndex } from '../../calendar/plant-date.js';
import { expandDrivers, type DriverSpecs, type MonthlyInterpolation } from '../drivers/seasonal-drivers.js';
import { businessCase, type BusinessCase } from '../economics/business-case.js';
import type { FoulingModel } from '../fouling/fouling-models.js';
import { monteCarlo, tornado, typicalRanges, type MonteCarloSummary, type Tornado, type UncertaintyRanges } from '../uncertainty/schedule-uncertainty.js';
import { baselineCleanings, type BaselinePolicy } from './baseline-schedules.js';
import { optimiseSchedule } from './optimal-schedule.js';
import { DEFAULT_CLEANLINESS_GRID, tableFromCostCurve, type CleanlinessGrid, type CostAtCleanliness, type PenaltyCostTable } from './penalty-cost-table.js';
import { buildPenaltyTable, lostGenerationFromDrivers, type UnitPenaltyModel } from './penalty-table-builder.js';
import { priceSchedule, type CostTotals, type PricedSchedule } from './schedule-pricing.js';
import { baseScenario, type DayRange, type InitialCondition, type PlannedCleaning, type ScheduleProblem } from './schedule-problem.js';

export interface DateRange {
  /** first day, 'YYYY-MM-DD', inclusive */
  from: string;
  /** last day, inclusive */
  to: string;
}

export type PenaltySource =
  | { kind: 'models'; unit: UnitPenaltyModel }
  /** simplified: one cost-vs-cleanliness curve, optionally scaled by 12 monthly factors */
  | { kind: 'direct'; curve: CostAtCleanliness[]; monthlyFactors?: number[] };

export interface UnitEconomics {
  ratingMw: number;
  heatRateBtuKwh: number;
  co2KgPerMmbtu: number;
  /** tubes in service, for the per-tube part of a cleaning's cost */
  activeTubes: number;
}

export interface ScheduleCaseSpec {
  startDate: string;
  horizonDays: number;
  drivers: DriverSpecs;
  interpolation?: MonthlyInterpolation;
  penalty: PenaltySource;
  economics: UnitEconomics;
  fouling: FoulingModel;
  initial: InitialCondition;
  methods: CleaningMethod[];
  plannedOutages?: DateRange[];
  windows?: DateRange[];
  methodWindows?: Record<string, DateRange[]>;
  minSpacingDays?: number;
  discountRate: number;
  /** default: the highest recovered cleanliness among the methods */
  referenceCleanliness?: number;
  grid?: CleanlinessGrid;
  baseline?: BaselinePolicy;
  upfrontCost?: number;
  uncertainty?: { ranges?: Partial<UncertaintyRanges>; trials?: number; seed?: number };
}

export interface ScheduledCleaning {
  date: string;
  endDate: string;
  methodId: string;
  methodName: string;
  cleaningCost: number;
  downtimeCost: number;
  foulingCostDuring: number;
  daysInPlannedOutage: number;
  cleanlinessBefore: number;
  cleanlinessAfter: number;
  typicalValues: boolean;
  cautions: string[];
}

export interface ScheduleCaseResult {
  referenceCleanliness: number;
  cleanings: ScheduledCleaning[];
  daily: { date: string; cleanliness: number; foulingCost: number; cleaningCost: number }[];
  totals: CostTotals;
  discountedTotals: CostTotals;
  yearly: CostTotals[];
  baseline: { cleanings: ScheduledCleaning[]; totals: CostTotals; discountedTotals: CostTotals; ruleBreaks: string[] };
  businessCase: BusinessCase;
  sensitivity?: Tornado;
  monteCarlo?: MonteCarloSummary;
  warnings: string[];
}

export interface AssembledCase {
  problem: ScheduleProblem;
  methods: Map<string, CleaningMethod>;
  dates: string[];
}

function toDayRange(startDate: string, r: DateRange): DayRange {
  const fromDay = daysBetween(startDate, r.from);
  const toDay = daysBetween(startDate, r.to);
  if (toDay < fromDay) throw new Error(`the range ${r.from} … ${r.to} ends before it starts`);
  return { fromDay, toDay };
}

export function assembleCase(spec: ScheduleCaseSpec): AssembledCase {
  const days = spec.horizonDays;
  if (!(Number.isInteger(days) && days >= 1 && days <= 5 * 366)) throw new Error('horizonDays must be a whole number from 1 to 1830');
  const drivers = expandDrivers(spec.drivers, spec.startDate, days, spec.interpolation);
  const plannedOutage = new Uint8Array(days);
  for (const r of spec.plannedOutages ?? []) {
    const { fromDay, toDay } = toDayRange(spec.startDate, r);
    for (let d = Math.max(0, fromDay); d <= Math.min(days - 1, toDay); d++) plannedOutage[d] = 1;
  }
  const grid = spec.grid ?? DEFAULT_CLEANLINESS_GRID;
  let table: PenaltyCostTable;
  if (spec.penalty.kind === 'models') {
    table = buildPenaltyTable(spec.penalty.unit, drivers, grid, plannedOutage);
  } else {
    const factors = spec.penalty.monthlyFactors;
    if (factors && factors.length !== 12) throw new Error('monthlyFactors needs 12 values, January first');
    const month = (d: number) => Number(drivers.dates[d]!.slice(5, 7)) - 1;
    table = tableFromCostCurve(days, spec.penalty.curve, factors ? (d) => factors[month(d)]! : undefined, grid);
  }
  if (spec.methods.length === 0) throw new Error('at least one cleaning method is needed');
  const methodWindows = spec.methodWindows ?? {};
  for (const id of Object.keys(methodWindows)) if (!spec.methods.some((m) => m.id === id)) throw new Error(`methodWindows names unknown method "${id}"`);
  const problem: ScheduleProblem = {
    days,
    table,
    lostGeneration: lostGenerationFromDrivers(spec.economics, drivers),
    fouling: spec.fouling,
    initial: spec.initial,
    methods: spec.methods.map((m) => {
      const windows = methodWindows[m.id];
      return {
        id: m.id,
        cleaningCost: m.fixedCost + m.costPerTube * spec.economics.activeTubes,
        durationDays: m.durationDays,
        unitDuringCleaning: m.unitDuringCleaning,
        deratePct: m.deratePct,
        recoveredCleanliness: m.recoveredCleanliness,
        foulingRateMultiplier: m.foulingRateMultiplier,
        ...(windows ? { windows: windows.map((r) => toDayRange(spec.startDate, r)) } : {}),
      };
    }),
    plannedOutage,
    ...(spec.windows ? { windows: spec.windows.map((r) => toDayRange(spec.startDate, r)) } : {}),
    minSpacingDays: spec.minSpacingDays ?? 0,
    discountRate: spec.discountRate,
    yearIndex: horizonYearIndex(spec.startDate, days),
    referenceCleanliness: spec.referenceCleanliness ?? Math.max(...spec.methods.map((m) => m.recoveredCleanliness)),
  };
  return { problem, methods: new Map(spec.methods.map((m) => [m.id, m])), dates: drivers.dates };
}

function describeCleanings(a: AssembledCase, priced: PricedSchedule): ScheduledCleaning[] {
  return priced.cleanings.map((c) => {
    const m = a.methods.get(c.methodId) as CleaningMethod;
    const date = a.dates[c.startDay]!; // a priced cleaning starts within the horizon
    return {
      date,
      endDate: addDays(date, m.durationDays - 1),
      methodId: m.id,
      methodName: m.name,
      cleaningCost: c.cleaningCost,
      downtimeCost: c.downtimeCost,
      foulingCostDuring: c.foulingCostDuring,
      daysInPlannedOutage: c.daysInPlannedOutage,
      cleanlinessBefore: c.cleanlinessBefore,
      cleanlinessAfter: m.recoveredCleanliness,
      typicalValues: m.typical,
      cautions: cautionsFor(m),
    };
  });
}

/** Common practice: a cleaning that returns more than ten times what it costs is rare enough to check the inputs. */
const PLAUSIBLE_BENEFIT_COST = 10;

/** The unit's fuel bill over a year of the horizon's load and fuel price: rating × load × 24 h × heat rate × price. */
function yearlyFuelBill(problem: ScheduleProblem): number {
  const g = problem.lostGeneration;
  let sum = 0;
  for (let d = 0; d < problem.days; d++) sum += g.ratingMw * g.loadFraction[d]! * 24 * g.ownFuelCostPerMwh[d]!;
  return (sum * 365.25) / problem.days;
}

/** Warnings for business-case figures outside the band a plant sees. */
function implausibleResults(bc: BusinessCase, problem: ScheduleProblem): string[] {
  const out: string[] = [];
  const ratio = bc.benefitCostRatio === null ? null : bc.benefitCostRatio.toNumber();
  if (ratio !== null && ratio > PLAUSIBLE_BENEFIT_COST) {
    out.push(
      `the benefit–cost ratio ${ratio.toFixed(1)} is above ${PLAUSIBLE_BENEFIT_COST}: check the fouling trend, the baseline and the penalty before relying on it`,
    );
  }
  const bill = yearlyFuelBill(problem);
  const npv = bc.npv.toNumber();
  if (bill > 0 && npv > bill) {
    out.push(
      `the NPV ${Math.round(npv).toLocaleString('en-US')} is above the unit’s yearly fuel bill (about ${Math.round(bill).toLocaleString('en-US')}): cleaning rarely saves more than the fuel burnt; check the inputs`,
    );
  }
  return out;
}

export function runScheduleCase(spec: ScheduleCaseSpec): ScheduleCaseResult {
  const assembled = assembleCase(spec);
  const { problem } = assembled;
  const warnings: string[] = [];
  if (spec.penalty.kind === 'models' && !spec.penalty.unit.curve)
    warnings.push("the generic exhaust-pressure correction curve was used: replace it with the turbine maker's curve");
  if (spec.penalty.kind === 'direct') warnings.push('a simplified direct penalty curve was used instead of the condenser and turbine models');
  for (const m of spec.methods)
    if (m.typical) warnings.push(`method "${m.id}" carries typical values (common practice, typical order of magnitude): edit them to the plant's own`);

  const optimum = optimiseSchedule(problem);
  const scenario = baseScenario(problem);
  const proposed = priceSchedule(problem, optimum.cleanings, scenario);
  const baselinePlan: PlannedCleaning[] = baselineCleanings(problem, spec.baseline ?? { kind: 'never' });
  const baseline = priceSchedule(problem, baselinePlan, scenario);
  const gridMin = (spec.grid ?? DEFAULT_CLEANLINESS_GRID).cfMin;
  const minProposed = Math.min(...proposed.dailyCleanliness);
  const minBaseline = Math.min(...baseline.dailyCleanliness);
  if (minProposed < gridMin)
    warnings.push(`cleanliness falls to ${minProposed.toFixed(3)}, below the table's lowest point ${gridMin}: the penalty there is held at that point's value`);
  if (minBaseline < gridMin) {
    warnings.push(
      `the baseline's cleanliness falls to ${minBaseline.toFixed(3)}, below the table's lowest point ${gridMin}: a condenser rarely runs that dirty, so the savings against this baseline are doubtful; compare with a baseline that cleans at planned outages`,
    );
  }

  const result: ScheduleCaseResult = {
    referenceCleanliness: problem.referenceCleanliness,
    cleanings: describeCleanings(assembled, proposed),
    daily: assembled.dates.map((date, d) => ({
      date,
      cleanliness: proposed.dailyCleanliness[d]!,
      foulingCost: proposed.dailyFoulingCost[d]!,
      cleaningCost: proposed.dailyCleaningCost[d]!,
    })),
    totals: proposed.totals,
    discountedTotals: proposed.discountedTotals,
    yearly: proposed.yearly,
    baseline: {
      cleanings: describeCleanings(assembled, baseline),
      totals: baseline.totals,
      discountedTotals: baseline.discountedTotals,
      ruleBreaks: baseline.ruleBreaks,
    },
    businessCase: businessCase({
      proposedYearly: proposed.yearly,
      baselineYearly: baseline.yearly,
      discountRate: spec.discountRate,
      upfrontCost: spec.upfrontCost,
    }),
    warnings,
  };
  warnings.push(...implausibleResults(result.businessCase, problem));
  if (spec.uncertainty) {
    const ranges = { ...typicalRanges(spec.discountRate), ...(spec.uncertainty.ranges ?? {}) };
    const compared = { problem, proposed: optimum.cleanings, baseline: baselinePlan, upfrontCost: spec.upfrontCost };
    result.sensitivity = tornado(compared, ranges);
    result.monteCarlo = monteCarlo(compared, ranges, spec.uncertainty.trials ?? 5000, spec.uncertainty.seed ?? 1);
    if (!spec.uncertainty.ranges) warnings.push('uncertainty ranges are typical spreads (common practice), not plant data');
  }
  return result;
}
