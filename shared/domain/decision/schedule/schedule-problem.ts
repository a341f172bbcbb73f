/**
 * The calendar scheduling problem: horizon days, per-day penalty tables, fouling model, cleaning methods,
 * planned outages, windows and spacing, and the economics of lost generation. Day indices run 0 … days − 1
 * from the horizon's start date.
 */
import { foulingIndex, type FoulingModel } from '../fouling/fouling-models.js';
import type { PenaltyCostTable, PriceScales } from './penalty-cost-table.js';

export interface DayRange {
  /** first day, inclusive */
  fromDay: number;
  /** last day, inclusive */
  toDay: number;
}

export type UnitDuringCleaning = 'outage' | 'derate' | 'online';

export interface ScheduleMethod {
  id: string;
  /** money per cleaning: fixed cost plus cost per tube times the active tubes */
  cleaningCost: number;
  durationDays: number;
  unitDuringCleaning: UnitDuringCleaning;
  deratePct: number;
  recoveredCleanliness: number;
  foulingRateMultiplier: number;
  /** when given, the whole cleaning must lie inside one of these ranges (an empty list allows none) */
  windows?: readonly DayRange[];
}

/** Value of generation the unit cannot make: lost MWh × (replacement price − own fuel and CO2 cost per MWh). */
export interface LostGenerationEconomics {
  ratingMw: number;
  /** load the unit would run at each day, fraction of rating; 0 = off line (no fouling growth, nothing to lose) */
  loadFraction: Float64Array;
  replacementPricePerMwh: Float64Array;
  ownFuelCostPerMwh: Float64Array;
  ownCo2CostPerMwh: Float64Array;
}

export interface InitialCondition {
  /** days on line since the last cleaning ended, at the start of the horizon (the fouling model's clock) */
  daysSinceCleaning: number;
  /** cleanliness that cleaning left */
  cleanlinessAfterCleaning: number;
  foulingRateMultiplier: number;
}

export interface ScheduleProblem {
  days: number;
  table: PenaltyCostTable;
  lostGeneration: LostGenerationEconomics;
  fouling: FoulingModel;
  initial: InitialCondition;
  methods: readonly ScheduleMethod[];
  /** 1 on days the unit is down in a planned outage (no generation, no fouling cost or growth, no downtime cost) */
  plannedOutage: Uint8Array;
  /** when given, every cleaning must lie inside one of these ranges (an empty list allows none) */
  windows?: readonly DayRange[];
  /** least days between the starts of two cleanings (the last cleaning before the horizon counts as ending on its day) */
  minSpacingDays: number;
  discountRate: number;
  /** horizon year (0-based) of each day, for year-end discounting */
  yearIndex: Int32Array;
  /** fouling cost on a day is the penalty at the day's cleanliness minus the penalty at this cleanliness */
  referenceCleanliness: number;
}

/** What a trial of the uncertainty analysis changes; the base case is all ones and no shift. */
export interface PricingScenario {
  foulingRateScale: number;
  prices: PriceScales;
  cleaningCostScale: number;
  /** added to every method's recovered cleanliness */
  recoveredCleanlinessShift: number;
  discountRate: number;
}

export function baseScenario(problem: ScheduleProblem): PricingScenario {
  return {
    foulingRateScale: 1,
    prices: { fuel: 1, co2: 1, replacement: 1 },
    cleaningCostScale: 1,
    recoveredCleanlinessShift: 0,
    discountRate: problem.discountRate,
  };
}

export interface PlannedCleaning {
  startDay: number;
  methodId: string;
}

export function validateProblem(p: ScheduleProblem): void {
  if (!(Number.isInteger(p.days) && p.days >= 1)) throw new Error('the horizon needs at least one day');
  if (p.table.days < p.days) throw new Error('the penalty table is shorter than the horizon');
  for (const a of [
    p.plannedOutage,
    p.yearIndex,
    p.lostGeneration.loadFraction,
    p.lostGeneration.replacementPricePerMwh,
    p.lostGeneration.ownFuelCostPerMwh,
    p.lostGeneration.ownCo2CostPerMwh,
  ]) {
    if (a.length < p.days) throw new Error('a daily series is shorter than the horizon');
  }
  if (!(p.discountRate > -1)) throw new Error('the discount rate must be above −1');
  if (!(Number.isInteger(p.initial.daysSinceCleaning) && p.initial.daysSinceCleaning >= 0))
    throw new Error('daysSinceCleaning must be a whole number of days, 0 or more');
  if (!(p.initial.cleanlinessAfterCleaning > 0)) throw new Error('the cleanliness after the last cleaning must be above 0');
  const ids = new Set<string>();
  for (const m of p.methods) {
    if (ids.has(m.id)) throw new Error(`method "${m.id}" is listed twice`);
    ids.add(m.id);
    if (!(Number.isInteger(m.durationDays) && m.durationDays >= 1))
      throw new Error(`method "${m.id}": durationDays must be a whole number of days, at least 1`);
    if (!(m.recoveredCleanliness > 0)) throw new Error(`method "${m.id}": recovered cleanliness must be above 0`);
  }
}

/** Year-end discount factor of each day: (1 + r)^−(year index + 1). */
export function dailyDiscountFactors(yearIndex: Int32Array, days: number, rate: number): Float64Array {
  const out = new Float64Array(days);
  let year = -1;
  let factor = 1;
  for (let d = 0; d < days; d++) {
    if (yearIndex[d] !== year) {
      year = yearIndex[d]!;
      factor = Math.pow(1 + rate, -(year + 1));
    }
    out[d] = factor;
  }
  return out;
}

/** Fouling index y at operating ages 0 … maxAge, scaled. */
export function foulingIndexByAge(model: FoulingModel, maxAge: number, scale = 1): Float64Array {
  const out = new Float64Array(maxAge + 1);
  for (let a = 0; a <= maxAge; a++) out[a] = scale * foulingIndex(model, a);
  return out;
}

/** Value of one lost MWh on a day, never below zero (a unit out of merit loses nothing by standing). */
export function lostMwhValue(e: LostGenerationEconomics, day: number, prices: PriceScales): number {
  return Math.max(0, prices.replacement * e.replacementPricePerMwh[day]! - prices.fuel * e.ownFuelCostPerMwh[day]! - prices.co2 * e.ownCo2CostPerMwh[day]!);
}

/**
 * Lost MWh on one cleaning day: what the unit would have made that day and cannot. An outage method loses
 * load × rating × 24 h; a derate method only the load above the derated limit, max(0, load − (1 − derate)) × rating × 24 h.
 */
export function lostMwhOnCleaningDay(p: ScheduleProblem, m: ScheduleMethod, day: number): number {
  if (p.plannedOutage[day]) return 0;
  const load = Math.max(0, p.lostGeneration.loadFraction[day]!);
  if (m.unitDuringCleaning === 'outage') return load * p.lostGeneration.ratingMw * 24;
  if (m.unitDuringCleaning === 'derate') return Math.max(0, load - (1 - m.deratePct / 100)) * p.lostGeneration.ratingMw * 24;
  return 0;
}

/** 1 on days the unit runs: not in a planned outage and with load. Fouling grows and costs only on these days. */
export function onLineDays(p: ScheduleProblem): Uint8Array {
  const out = new Uint8Array(p.days);
  for (let d = 0; d < p.days; d++) out[d] = !p.plannedOutage[d] && p.lostGeneration.loadFraction[d]! > 0 ? 1 : 0;
  return out;
}

/** Days on line in [0, d) for d = 0 … days: the fouling clock between two days is the difference. */
export function onLineDaysBefore(onLine: Uint8Array): Int32Array {
  const out = new Int32Array(onLine.length + 1);
  for (let d = 0; d < onLine.length; d++) out[d + 1] = out[d]! + onLine[d]!;
  return out;
}

function inside(ranges: readonly DayRange[], from: number, to: number): boolean {
  return ranges.some((r) => from >= r.fromDay && to <= r.toDay);
}

/** Whether method m may start on day `start` (inside the horizon and every window that applies). */
export function mayStart(p: ScheduleProblem, m: ScheduleMethod, start: number): boolean {
  const end = start + m.durationDays - 1;
  if (start < 0 || end >= p.days) return false;
  if (p.windows && !inside(p.windows, start, end)) return false;
  if (m.windows && !inside(m.windows, start, end)) return false;
  return true;
}
