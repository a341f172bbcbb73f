/**
 * Least-cost cleaning calendar by dynamic programming over days (ENGINEERING.md §6).
 *
 * The state after a cleaning is fully known (age 0 and the method used, which sets the recovered cleanliness and
 * the fouling multiplier), so the programme runs over "restart" nodes (day the unit restarts, method): from each
 * node a walk runs forward day by day accumulating the discounted fouling cost at the path's cleanliness, and at
 * each day tries every method that may start there (window, spacing, horizon). This is the day-by-day programme
 * over (day, days since cleaning, method) with exact reconstruction. Walks run in step so that a walk dominated
 * by a younger, cheaper walk of the same method is dropped (valid when cost rises with age, which is checked).
 * Fouling ages only on days on line, so walks that restarted within one stretch off line stay alike for good: of
 * those the oldest at the least cost is kept, which also settles ties towards the earlier cleaning.
 * The objective is the discounted total of fouling, cleaning and downtime cost exactly as priceSchedule computes it.
 */
import { combinedCosts, gridPosition, UNIT_PRICE_SCALES } from './penalty-cost-table.js';
import {
  dailyDiscountFactors,
  foulingIndexByAge,
  lostMwhOnCleaningDay,
  lostMwhValue,
  mayStart,
  onLineDays,
  onLineDaysBefore,
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
  // Discounted penalty per (day, grid point), zero on days off line, and the discounted reference penalty.
  const cost = new Float64Array(H * G);
  const ref = new Float64Array(H);
  const refPos = gridPosition(table, problem.referenceCleanliness);
  const onLine = onLineDays(problem);
  // fouling age of a walk on day e = days on line since its restart = onLineBefore[e] − onLineBefore[restart]
  const onLineBefore = onLineDaysBefore(onLine);
  for (let d = 0; d < H; d++) {
    if (!onLine[d]) continue;
    for (let i = 0; i < G; i++) cost[d * G + i] = discount[d]! * base[d * G + i]!;
    const k = d * G + refPos.index;
    ref[d] = discount[d]! * (base[k]! + refPos.weight * (base[k + 1]! - base[k]!));
  }

  const a0 = problem.initial.daysSinceCleaning;
  const y = foulingIndexByAge(problem.fouling, H + a0);
  const curveFor = (cf0: number, multiplier: number, fromAge: number, ages: number): StateCurve => {
    const index = new Int32Array(ages + 1);
    const weight = new Float64Array(ages + 1);
    for (let a = 0; a <= ages; a++) {
      const p = gridPosition(table, 1 / (1 / cf0 + multiplier * y[fromAge + a]!));
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
      let c = discount[e]! * m.cleaningCost;
      for (let j = 0; j < m.durationDays; j++)
        c += discount[e + j]! * lostMwhOnCleaningDay(problem, m, e + j) * lostMwhValue(problem.lostGeneration, e + j, UNIT_PRICE_SCALES);
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
        for (let i = 0; i < G; i++) sums[e * G + i]! += cost[row + i]!;
        refSums[e]! += ref[e + j]!;
      }
    }
    return { sums, refSums };
  });

  // Restart nodes: node (d, k) = the unit restarts on day d after method k; d may equal H.
  const nodeCount = (H + 1) * M;
  const best = new Float64Array(nodeCount).fill(Number.POSITIVE_INFINITY);
  const fromNode = new Int32Array(nodeCount).fill(-2);
  const fromStart = new Int32Array(nodeCount);
  const INITIAL = -1;
  const stateFree = methods.map((_, k) => k).filter((k) => windowCost[k] === null);
  const stateDependent = methods.map((_, k) => k).filter((k) => windowCost[k] !== null);
  const sdStart = stateDependent.map((k) => startCost[k]);
  const sdSums = stateDependent.map((k) => windowCost[k]!.sums);
  const sdRefSums = stateDependent.map((k) => windowCost[k]!.refSums);
  const sdDuration = stateDependent.map((k) => methods[k]!.durationDays);
  const pruning = costRisesWithAge(problem, base, y);

  // Walks run in step, day by day. Group g = method index (M for the walk from the initial condition); within a
  // group, walks are kept oldest first.
  interface Walk {
    node: number;
    restartDay: number;
    /** days on line before the restart day (the walk's fouling clock started there) */
    clockStart: number;
    /** cost so far, at the start of the current day */
    cost: number;
    firstStart: number;
    curve: StateCurve;
  }
  const groups: Walk[][] = Array.from({ length: M + 1 }, () => []);
  groups[M]!.push({ node: INITIAL, restartDay: 0, clockStart: 0, cost: 0, firstStart: Math.max(0, problem.minSpacingDays - a0), curve: initialCurve });

  for (let e = 0; e < H; e++) {
    for (let k = 0; k < M; k++) {
      const node = e * M + k;
      if (best[node]! < Number.POSITIVE_INFINITY) {
        groups[k]!.push({
          node,
          restartDay: e,
          clockStart: onLineBefore[e]!,
          cost: best[node]!,
          firstStart: e + Math.max(0, problem.minSpacingDays - methods[k]!.durationDays),
          curve: methodCurves[k]!,
        });
      }
    }
    // Cleanings that start today.
    let arrive = Number.POSITIVE_INFINITY;
    let arriveFrom = -2;
    for (const group of groups) {
      for (const walk of group) {
        if (e < walk.firstStart) continue;
        if (walk.cost < arrive) {
          arrive = walk.cost;
          arriveFrom = walk.node;
        }
        const age = onLineBefore[e]! - walk.clockStart;
        const gi = walk.curve.index[age]!;
        const w = walk.curve.weight[age]!;
        for (let j = 0; j < stateDependent.length; j++) {
          const fixed = sdStart[j]![e]!;
          if (fixed === Number.POSITIVE_INFINITY) continue;
          const sums = sdSums[j]!;
          const s = e * G + gi;
          const c = walk.cost + fixed + sums[s]! + w * (sums[s + 1]! - sums[s]!) - sdRefSums[j]![e]!;
          const target = (e + sdDuration[j]!) * M + stateDependent[j]!;
          if (c < best[target]!) {
            best[target] = c;
            fromNode[target] = walk.node;
            fromStart[target] = e;
          }
        }
      }
    }
    // Methods that stop the unit pay nothing that depends on the cleanliness found: only the cheapest arrival counts.
    if (arrive < Number.POSITIVE_INFINITY) {
      for (const k of stateFree) {
        const fixed = startCost[k]![e]!;
        if (fixed === Number.POSITIVE_INFINITY) continue;
        const target = (e + methods[k]!.durationDays) * M + k;
        if (arrive + fixed < best[target]!) {
          best[target] = arrive + fixed;
          fromNode[target] = arriveFrom;
          fromStart[target] = e;
        }
      }
    }
    for (let g = 0; g <= M; g++) {
      if (groups[g]!.length > 1) groups[g] = dropDominated(groups[g]!, e, pruning);
      for (const walk of groups[g]!) {
        const age = onLineBefore[e]! - walk.clockStart;
        const gi = walk.curve.index[age]!;
        const s = e * G + gi;
        walk.cost += cost[s]! + walk.curve.weight[age]! * (cost[s + 1]! - cost[s]!) - ref[e]!;
      }
    }
  }
  let endBest = Number.POSITIVE_INFINITY;
  let endFrom = -2;
  for (const group of groups) {
    for (const walk of group) {
      if (walk.cost < endBest) {
        endBest = walk.cost;
        endFrom = walk.node;
      }
    }
  }
  for (let k = 0; k < M; k++) {
    const node = H * M + k;
    if (best[node]! < endBest) {
      endBest = best[node]!;
      endFrom = node;
    }
  }

  const cleanings: PlannedCleaning[] = [];
  for (let node = endFrom; node !== INITIAL; node = fromNode[node]!) {
    if (node < 0) throw new Error('no feasible schedule was found');
    cleanings.unshift({ startDay: fromStart[node]!, methodId: methods[node % M]!.id });
  }
  return { cleanings, objective: endBest };
}

interface WalkOrder {
  cost: number;
  firstStart: number;
  clockStart: number;
}

/**
 * Drops walks of one group (same method, oldest first) that can never do better from day e on. Walks with the same
 * fouling age (restarted within one stretch off line) have the same cleanliness every day from here: a younger one
 * costing no less than an older one is dropped (the older has every choice the younger has), and so are the older
 * ones once a cheaper one may already clean. With `ageRule` (cost rises with age), an older walk costing at least as
 * much as a walk of lower fouling age that may already clean is dropped too (the younger is cleaner every day and
 * has the same choices).
 */
function dropDominated<T extends WalkOrder>(group: T[], e: number, ageRule: boolean): T[] {
  const keep = new Uint8Array(group.length);
  let bestYounger = Number.POSITIVE_INFINITY;
  for (let last = group.length - 1; last >= 0;) {
    let first = last;
    while (first > 0 && group[first - 1]!.clockStart === group[last]!.clockStart) first--;
    let olderMin = Number.POSITIVE_INFINITY;
    for (let i = first; i <= last; i++) {
      if (group[i]!.cost < olderMin) {
        keep[i] = 1;
        olderMin = group[i]!.cost;
      }
    }
    let youngerReadyMin = Number.POSITIVE_INFINITY;
    for (let i = last; i >= first; i--) {
      const w = group[i]!;
      if (youngerReadyMin < w.cost || (ageRule && w.cost >= bestYounger)) keep[i] = 0;
      if (e >= w.firstStart && w.cost < youngerReadyMin) youngerReadyMin = w.cost;
    }
    if (youngerReadyMin < bestYounger) bestYounger = youngerReadyMin;
    last = first - 1;
  }
  return group.filter((_, i) => keep[i] === 1);
}

/**
 * Whether the daily cost can only rise with age for every method: fouling index non-decreasing with age,
 * multipliers not negative, and each day's penalty non-increasing in cleanliness. Dominance pruning relies on it;
 * without it every walk is kept (same answer, slower).
 */
function costRisesWithAge(problem: ScheduleProblem, base: Float64Array, y: Float64Array): boolean {
  for (let a = 1; a < y.length; a++) if (y[a]! < y[a - 1]!) return false;
  if (problem.initial.foulingRateMultiplier < 0 || problem.methods.some((m) => m.foulingRateMultiplier < 0)) return false;
  const G = problem.table.size;
  for (let d = 0; d < problem.days; d++) {
    for (let i = 1; i < G; i++) if (base[d * G + i]! > base[d * G + i - 1]!) return false;
  }
  return true;
}
