/**
 * Re-pricing of one fixed schedule under many scenarios, for the tornado and the Monte Carlo: everything that
 * does not depend on the scenario (operating ages, segments between cleanings, reference penalties, lost MWh)
 * is prepared once; a call then costs one pass over the days with no allocation besides the yearly totals.
 * Gives the same yearly totals as priceSchedule (tested).
 */
import { gridPosition } from './penalty-cost-table.js';
import { checkCleanings } from './schedule-pricing.js';
import { foulingIndexByAge, lostMwhOnCleaningDay, onLineDays, type PlannedCleaning, type PricingScenario, type ScheduleProblem } from './schedule-problem.js';

export interface SchedulePricer {
  /** undiscounted total cost (fouling + cleaning + downtime) per horizon year */
  yearlyTotals(scenario: PricingScenario): Float64Array;
}

export function compileSchedulePricer(problem: ScheduleProblem, cleanings: readonly PlannedCleaning[]): SchedulePricer {
  const { sorted } = checkCleanings(problem, cleanings);
  const { days, table } = problem;
  const G = table.size;
  const methods = new Map(problem.methods.map((m) => [m.id, m]));
  const years = problem.yearIndex[days - 1]! + 1;
  const onLine = onLineDays(problem);

  // Per day: the segment (which cleaning the unit is running after, -1 = before the first) and the age, or
  // a flag that the day belongs to a cleaning (and which one, to hold the cleanliness found).
  const segment = new Int32Array(days);
  const age = new Int32Array(days);
  const cleaningOf = new Int32Array(days).fill(-1);
  const lostMwh = new Float64Array(days);
  const chargedDuring = new Uint8Array(days);
  let seg = -1;
  let a = problem.initial.daysSinceCleaning;
  let next = 0;
  for (let d = 0; d < days;) {
    const c = sorted[next];
    if (c && c.startDay === d) {
      const m = methods.get(c.methodId)!;
      for (let j = 0; j < m.durationDays; j++) {
        cleaningOf[d + j] = next;
        segment[d + j] = seg;
        age[d + j] = a;
        lostMwh[d + j] = lostMwhOnCleaningDay(problem, m, d + j);
        chargedDuring[d + j] = m.unitDuringCleaning === 'outage' || !onLine[d + j] ? 0 : 1;
      }
      d += m.durationDays;
      seg = next;
      a = 0;
      next++;
      continue;
    }
    segment[d] = seg;
    age[d] = a;
    a += onLine[d]!;
    d++;
  }
  const segmentMethods = sorted.map((c) => methods.get(c.methodId)!);
  const y = foulingIndexByAge(problem.fouling, days + problem.initial.daysSinceCleaning);

  // Reference penalty components per day (zero on days off line).
  const refPos = gridPosition(table, problem.referenceCleanliness);
  const refFuel = new Float64Array(days);
  const refCo2 = new Float64Array(days);
  const refCap = new Float64Array(days);
  for (let d = 0; d < days; d++) {
    if (!onLine[d]) continue;
    const k = d * G + refPos.index;
    const w = refPos.weight;
    refFuel[d] = table.heatRateFuel[k]! + w * (table.heatRateFuel[k + 1]! - table.heatRateFuel[k]!);
    refCo2[d] = table.co2[k]! + w * (table.co2[k + 1]! - table.co2[k]!);
    refCap[d] = table.capacity[k]! + w * (table.capacity[k + 1]! - table.capacity[k]!);
  }
  const lg = problem.lostGeneration;

  return {
    yearlyTotals(s: PricingScenario): Float64Array {
      const out = new Float64Array(years);
      const invCf0 = segmentMethods.map((m) => 1 / Math.max(0.05, m.recoveredCleanliness + s.recoveredCleanlinessShift));
      const mult = segmentMethods.map((m) => m.foulingRateMultiplier * s.foulingRateScale);
      const initialInv = 1 / problem.initial.cleanlinessAfterCleaning;
      const initialMult = problem.initial.foulingRateMultiplier * s.foulingRateScale;
      const { fuel, co2, replacement } = s.prices;
      for (const c of sorted) out[problem.yearIndex[c.startDay]!]! += methods.get(c.methodId)!.cleaningCost * s.cleaningCostScale;
      for (let d = 0; d < days; d++) {
        const yr = problem.yearIndex[d]!;
        if (lostMwh[d]! > 0) {
          const value = replacement * lg.replacementPricePerMwh[d]! - fuel * lg.ownFuelCostPerMwh[d]! - co2 * lg.ownCo2CostPerMwh[d]!;
          if (value > 0) out[yr]! += lostMwh[d]! * value;
        }
        if (!onLine[d] || (cleaningOf[d]! >= 0 && !chargedDuring[d])) continue;
        const sg = segment[d]!;
        const cf = sg < 0 ? 1 / (initialInv + initialMult * y[age[d]!]!) : 1 / (invCf0[sg]! + mult[sg]! * y[age[d]!]!);
        let x = (cf - table.cfMin) / table.cfStep;
        let i: number;
        if (!(x > 0)) {
          i = 0;
          x = 0;
        } else if (x >= G - 1) {
          i = G - 2;
          x = 1;
        } else {
          i = Math.floor(x);
          x -= i;
        }
        const k = d * G + i;
        const pf = table.heatRateFuel[k]! + x * (table.heatRateFuel[k + 1]! - table.heatRateFuel[k]!);
        const pc = table.co2[k]! + x * (table.co2[k + 1]! - table.co2[k]!);
        const pr = table.capacity[k]! + x * (table.capacity[k + 1]! - table.capacity[k]!);
        out[yr]! += fuel * (pf - refFuel[d]!) + co2 * (pc - refCo2[d]!) + replacement * (pr - refCap[d]!);
      }
      return out;
    },
  };
}
