/**
 * Least-cost cleaning calendar by dynamic programming over days (ENGINEERING.md §6).
 *
 * The state after a cleaning is fully known (age 0 and the method used, which sets the recovered cleanliness and
 * the fouling multiplier), so the programme runs over "restart" nodes (day the unit restarts, method): from each
 * node it walks forward day by day accumulating the discounted fouling cost at the path's cleanliness, and at each
 * day tries every method that may start there (window, spacing, horizon). This is the same as the day-by-day
 * programme over (day, days since cleaning, method), in O(M²·H²) simple steps, with exact reconstruction.
 * The objective is the discounted total of fouling, cleaning and downtime cost exactly as priceSchedule computes it.
 */
import { combinedCosts, gridPosition, UNIT_PRICE_SCALES } from './penalty-cost-table.js';
import {
  dailyDiscountFactors,
  foulingIndexByAge,
  lostMwhOnCleaningDay,
  lostMwhValue,
  mayStart,
  validateProblem,
  type PlannedCleaning,
  type ScheduleProblem,
} from './schedule-problem.js';

export interface OptimalSchedule {
  cleanings: PlannedCleaning[];
  /** discounted total cost of the schedule (fouling relative to the reference cleanliness + cleaning + downtime) */
  objective: number;
}

interface StateCurve {
  /** grid index and weight of the cleanliness at each age */
  index: Int32Array;
  weight: Float64Array;
}

export function optimiseSchedule(problem: ScheduleProblem): OptimalSchedule {
  validateProblem(problem);
  const { days: H, table, methods } = problem;
  const G = table.size;
  const M = methods.length;
  const discount = dailyDiscountFactors(problem.yearIndex, H, problem.discountRate);
  const base = combinedCosts(table);
  // Discounted penalty per (day, grid point), zero on planned-outage days, and the discounted reference penalty.
  const cost = new Float64Array(H * G);
  const ref = new Float64Array(H);
  const refPos = gridPosition(table, problem.referenceCleanliness);
  for (let d = 0; d < H; d++) {
    if (problem.plannedOutage[d]) continue;
    for (let i = 0; i < G; i++) cost[d * G + i] = discount[d] * base[d * G + i];
    const k = d * G + refPos.index;
    ref[d] = discount[d] * (base[k] + refPos.weight * (base[k + 1] - base[k]));
  }

  const a0 = problem.initial.daysSinceCleaning;
  const y = foulingIndexByAge(problem.fouling, H + a0);
  const curveFor = (cf0: number, multiplier: number, fromAge: number, ages: number): StateCurve => {
    const index = new Int32Array(ages + 1);
    const weight = new Float64Array(ages + 1);
    for (let a = 0; a <= ages; a++) {
      const p = gridPosition(table, 1 / (1 / cf0 + multiplier * y[fromAge + a]));
      index[a] = p.index;
      weight[a] = p.weight;
    }
    return { index, weight };
  };
  const initialCurve = curveFor(problem.initial.cleanlinessAfterCleaning, problem.initial.foulingRateMultiplier, a0, H);
  const methodCurves = methods.map((m) => curveFor(Math.max(0.05, m.recoveredCleanliness), m.foulingRateMultiplier, 0, H));

  // Cost of starting method k on day e that does not depend on the cleanliness found: cleaning + downtime.
  const startCost = methods.map((m) => {
    const out = new Float64Array(H).fill(Number.POSITIVE_INFINITY);
    for (let e = 0; e < H; e++) {
      if (!mayStart(problem, m, e)) continue;
      let c = discount[e] * m.cleaningCost;
      for (let j = 0; j < m.durationDays; j++) c += discount[e + j] * lostMwhOnCleaningDay(problem, m, e + j) * lostMwhValue(problem.lostGeneration, e + j, UNIT_PRICE_SCALES);
      out[e] = c;
    }
    return out;
  });
  // Methods that keep the unit running pay the fouling penalty on their own days at the cleanliness found:
  // window sums of the discounted penalty over the cleaning's days, per grid point.
  const windowCost = methods.map((m) => {
    if (m.unitDuringCleaning === 'outage') return null;
    const sums = new Float64Array(H * G);
    const refSums = new Float64Array(H);
    for (let e = 0; e + m.durationDays <= H; e++) {
      for (let j = 0; j < m.durationDays; j++) {
        const row = (e + j) * G;
        for (let i = 0; i < G; i++) sums[e * G + i] += cost[row + i];
        refSums[e] += ref[e + j];
      }
    }
    return { sums, refSums };
  });

  // Restart nodes: node (d, k) = the unit restarts on day d after method k; d may equal H.
  const nodeCount = (H + 1) * M;
  const best = new Float64Array(nodeCount).fill(Number.POSITIVE_INFINITY);
  const fromNode = new Int32Array(nodeCount).fill(-2);
  const fromStart = new Int32Array(nodeCount);
  let endBest = Number.POSITIVE_INFINITY;
  let endFrom = -2;
  const INITIAL = -1;

  const expand = (node: number, d: number, value: number, curve: StateCurve, gapOffset: number) => {
    let operating = 0;
    for (let e = d; e <= H; e++) {
      if (e === H) {
        if (value + operating < endBest) {
          endBest = value + operating;
          endFrom = node;
        }
        break;
      }
      const age = e - d;
      const gi = curve.index[age];
      const w = curve.weight[age];
      if (e - d + gapOffset >= problem.minSpacingDays) {
        for (let k = 0; k < M; k++) {
          const fixed = startCost[k][e];
          if (fixed === Number.POSITIVE_INFINITY) continue;
          let c = value + operating + fixed;
          const wc = windowCost[k];
          if (wc) {
            const s = e * G + gi;
            c += wc.sums[s] + w * (wc.sums[s + 1] - wc.sums[s]) - wc.refSums[e];
          }
          const target = (e + methods[k].durationDays) * M + k;
          if (c < best[target]) {
            best[target] = c;
            fromNode[target] = node;
            fromStart[target] = e;
          }
        }
      }
      const s = e * G + gi;
      operating += cost[s] + w * (cost[s + 1] - cost[s]) - ref[e];
    }
  };

  expand(INITIAL, 0, 0, initialCurve, a0);
  for (let d = 1; d <= H; d++) {
    for (let k = 0; k < M; k++) {
      const node = d * M + k;
      if (best[node] < Number.POSITIVE_INFINITY) expand(node, d, best[node], methodCurves[k], methods[k].durationDays);
    }
  }

  const cleanings: PlannedCleaning[] = [];
  for (let node = endFrom; node !== INITIAL; node = fromNode[node]) {
    if (node < 0) throw new Error('no feasible schedule was found');
    cleanings.unshift({ startDay: fromStart[node], methodId: methods[node % M].id });
  }
  return { cleanings, objective: endBest };
}
