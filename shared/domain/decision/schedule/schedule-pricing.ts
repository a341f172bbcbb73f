/**
 * Prices a given list of cleanings day by day: cleanliness path, fouling cost, cleaning and downtime costs,
 * totals, discounted totals and yearly sums. The optimiser's objective equals this pricing at the base scenario,
 * and the uncertainty analysis re-prices a fixed schedule with it.
 */
import { penaltyCostPerDay } from './penalty-cost-table.js';
import {
  dailyDiscountFactors,
  foulingIndexByAge,
  lostMwhOnCleaningDay,
  lostMwhValue,
  mayStart,
  onLineDays,
  type PlannedCleaning,
  type PricingScenario,
  type ScheduleMethod,
  type ScheduleProblem,
} from './schedule-problem.js';

export interface CostTotals {
  foulingCost: number;
  cleaningCost: number;
  downtimeCost: number;
  total: number;
}

export interface PricedCleaning {
  startDay: number;
  methodId: string;
  cleaningCost: number;
  downtimeCost: number;
  /** fouling cost on the cleaning's own days (on-line and derate methods keep running at the cleanliness found) */
  foulingCostDuring: number;
  /** days of the cleaning inside a planned outage */
  daysInPlannedOutage: number;
  cleanlinessBefore: number;
}

export interface PricedSchedule {
  cleanings: PricedCleaning[];
  dailyCleanliness: Float64Array;
  /** fouling cost per day, undiscounted */
  dailyFoulingCost: Float64Array;
  /** cleaning plus downtime cost per day, undiscounted (the cleaning cost falls on its first day) */
  dailyCleaningCost: Float64Array;
  totals: CostTotals;
  discountedTotals: CostTotals;
  /** undiscounted sums per horizon year */
  yearly: CostTotals[];
  /** where the schedule breaks a window or spacing rule (allowed for baselines, never produced by the optimiser) */
  ruleBreaks: string[];
}

function zeroTotals(): CostTotals {
  return { foulingCost: 0, cleaningCost: 0, downtimeCost: 0, total: 0 };
}

function methodById(problem: ScheduleProblem): Map<string, ScheduleMethod> {
  return new Map(problem.methods.map((m) => [m.id, m]));
}

/** Sorts and checks a cleaning list: known methods, inside the horizon, no overlap. Rule breaks are returned. */
export function checkCleanings(problem: ScheduleProblem, cleanings: readonly PlannedCleaning[]): { sorted: PlannedCleaning[]; ruleBreaks: string[] } {
  const methods = methodById(problem);
  const sorted = [...cleanings].sort((a, b) => a.startDay - b.startDay);
  const ruleBreaks: string[] = [];
  let lastStart = -problem.initial.daysSinceCleaning;
  let busyUntil = 0;
  for (const c of sorted) {
    const m = methods.get(c.methodId);
    if (!m) throw new Error(`unknown cleaning method "${c.methodId}"`);
    if (!Number.isInteger(c.startDay) || c.startDay < 0 || c.startDay + m.durationDays > problem.days) {
      throw new Error(`the cleaning on day ${c.startDay} does not fit inside the horizon`);
    }
    if (c.startDay < busyUntil) throw new Error(`the cleaning on day ${c.startDay} overlaps the previous one`);
    if (!mayStart(problem, m, c.startDay)) ruleBreaks.push(`day ${c.startDay}: "${m.id}" lies outside its allowed windows`);
    if (c.startDay - lastStart < problem.minSpacingDays)
      ruleBreaks.push(`day ${c.startDay}: less than ${problem.minSpacingDays} days after the previous cleaning`);
    lastStart = c.startDay;
    busyUntil = c.startDay + m.durationDays;
  }
  return { sorted, ruleBreaks };
}

export function priceSchedule(problem: ScheduleProblem, cleanings: readonly PlannedCleaning[], scenario: PricingScenario): PricedSchedule {
  const { sorted, ruleBreaks } = checkCleanings(problem, cleanings);
  const methods = methodById(problem);
  const { table, days } = problem;
  const discount = dailyDiscountFactors(problem.yearIndex, days, scenario.discountRate);
  const y = foulingIndexByAge(problem.fouling, days + problem.initial.daysSinceCleaning, scenario.foulingRateScale);
  const refCf = problem.referenceCleanliness;
  const onLine = onLineDays(problem);
  const foulingOn = (day: number, cf: number) =>
    !onLine[day] ? 0 : penaltyCostPerDay(table, day, cf, scenario.prices) - penaltyCostPerDay(table, day, refCf, scenario.prices);

  const dailyCleanliness = new Float64Array(days);
  const dailyFoulingCost = new Float64Array(days);
  const dailyCleaningCost = new Float64Array(days);
  const totals = zeroTotals();
  const discountedTotals = zeroTotals();
  const yearly = Array.from({ length: problem.yearIndex[days - 1]! + 1 }, zeroTotals);
  const book = (day: number, key: 'foulingCost' | 'cleaningCost' | 'downtimeCost', amount: number) => {
    totals[key] += amount;
    discountedTotals[key] += amount * discount[day]!;
    yearly[problem.yearIndex[day]!]![key] += amount;
  };

  const priced: PricedCleaning[] = [];
  let age = problem.initial.daysSinceCleaning;
  let inverseCf0 = 1 / problem.initial.cleanlinessAfterCleaning;
  let multiplier = problem.initial.foulingRateMultiplier;
  let next = 0;
  let d = 0;
  while (d < days) {
    const cf = 1 / (inverseCf0 + multiplier * y[age]!);
    const c = sorted[next];
    if (c && c.startDay === d) {
      const m = methods.get(c.methodId) as ScheduleMethod;
      const entry: PricedCleaning = {
        startDay: d,
        methodId: m.id,
        cleaningCost: m.cleaningCost * scenario.cleaningCostScale,
        downtimeCost: 0,
        foulingCostDuring: 0,
        daysInPlannedOutage: 0,
        cleanlinessBefore: cf,
      };
      book(d, 'cleaningCost', entry.cleaningCost);
      dailyCleaningCost[d]! += entry.cleaningCost;
      for (let j = 0; j < m.durationDays; j++) {
        const day = d + j;
        const downtime = lostMwhOnCleaningDay(problem, m, day) * lostMwhValue(problem.lostGeneration, day, scenario.prices);
        const fouling = m.unitDuringCleaning === 'outage' ? 0 : foulingOn(day, cf);
        if (problem.plannedOutage[day]) entry.daysInPlannedOutage++;
        entry.downtimeCost += downtime;
        entry.foulingCostDuring += fouling;
        book(day, 'downtimeCost', downtime);
        book(day, 'foulingCost', fouling);
        dailyCleaningCost[day]! += downtime;
        dailyFoulingCost[day] = fouling;
        dailyCleanliness[day] = cf;
      }
      priced.push(entry);
      d += m.durationDays;
      age = 0;
      inverseCf0 = 1 / Math.max(0.05, m.recoveredCleanliness + scenario.recoveredCleanlinessShift);
      multiplier = m.foulingRateMultiplier;
      next++;
      continue;
    }
    const fouling = foulingOn(d, cf);
    dailyCleanliness[d] = cf;
    dailyFoulingCost[d] = fouling;
    book(d, 'foulingCost', fouling);
    // the fouling clock stops while the unit is off line
    age += onLine[d]!;
    d++;
  }
  for (const t of [totals, discountedTotals, ...yearly]) t.total = t.foulingCost + t.cleaningCost + t.downtimeCost;
  return { cleanings: priced, dailyCleanliness, dailyFoulingCost, dailyCleaningCost, totals, discountedTotals, yearly, ruleBreaks };
}
