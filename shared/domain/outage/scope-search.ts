/**
 * Exact search for the outage scope: depth-first branch and bound over the free items that bring a benefit, ranked by
 * benefit per unit of money (then lower cost, fewer days, id), trying "in" before "out". Taking an item takes
 * everything it needs; leaving it out leaves out everything that needs it, so every node keeps the needs, and a
 * branch that would break the budget or a lane's window is never opened.
 *
 * A node is cut when none of its completions can beat the best scope found so far: more benefit, or equal benefit at
 * a lower cost, or equal benefit and cost in fewer days. Its benefit is bounded by the smallest of three relaxations
 * over the undecided items that still fit on their own: the budget filled fractionally by benefit per money, the
 * same with the item count limit priced in (scope-bounds.ts), and each lane filled fractionally by benefit per day.
 * Where benefit can at best tie, the cheapest (and the shortest) fractional way to reach it bounds cost and days.
 *
 * Leaves are met in a fixed order (in before out, by rank), and only a strictly better scope replaces the best one,
 * so among scopes equal in benefit, cost and days the one kept includes the best-ranked item where they differ.
 */
import { bestCountPrice, mostItemsWithin } from './scope-bounds.js';

export interface SearchInput {
  cost: Float64Array;
  days: Float64Array;
  benefit: Float64Array;
  lane: Int32Array;
  laneCount: number;
  budget: number;
  windowDays: number;
  /** per item, itself and everything it needs (transitively) */
  closure: Int32Array[];
  /** per item, itself and everything that needs it (transitively) */
  dependents: Int32Array[];
  /** per item: 1 in (forced and what forced items need), 2 out (by hand, or can never be chosen), 0 free */
  start: Int8Array;
  /** per item, its place in id order (the last key of the ranking) */
  idRank: Int32Array;
  /** nodes after which the search stops with the best scope found so far */
  nodeLimit: number;
  /** rounding slack on benefit, cost and days sums */
  slack: { benefit: number; cost: number; days: number };
}

export interface SearchResult {
  /** 1 for each chosen item */
  chosen: Uint8Array;
  nodes: number;
  /** false when the node limit stopped the search before the best scope was proven */
  proven: boolean;
}

const FREE = 0;
const IN = 1;
const OUT = 2;

export function searchScope(input: SearchInput): SearchResult {
  const { cost, days, benefit, lane, laneCount, closure, dependents, idRank, nodeLimit } = input;
  const { benefit: epsBenefit, cost: epsCost, days: epsDays } = input.slack;
  const n = cost.length;
  const budgetCap = input.budget + epsCost;
  const laneCap = input.windowDays + epsDays;

  const state = Int8Array.from(input.start);
  const laneDays = new Float64Array(laneCount);
  let curBenefit = 0;
  let curCost = 0;
  let curDays = 0;
  for (let i = 0; i < n; i++) {
    if (state[i] !== IN) continue;
    curBenefit += benefit[i]!;
    curCost += cost[i]!;
    curDays += days[i]!;
    laneDays[lane[i]!]! += days[i]!;
  }

  // The items the search decides on: free ones with a benefit. Free items without one come in only when needed.
  const decide: number[] = [];
  for (let i = 0; i < n; i++) if (state[i] === FREE && benefit[i]! > 0) decide.push(i);
  const perMoney = (i: number) => (cost[i]! > 0 ? benefit[i]! / cost[i]! : Infinity);
  const perDay = (i: number) => (days[i]! > 0 ? benefit[i]! / days[i]! : Infinity);
  const tieOrder = (a: number, b: number) => cost[a]! - cost[b]! || days[a]! - days[b]! || idRank[a]! - idRank[b]!;
  const ranked = (key: (i: number) => number, among: number[] = decide) =>
    Int32Array.from([...among].sort((a, b) => key(b) - key(a) || benefit[b]! - benefit[a]! || tieOrder(a, b)));
  const order = ranked(perMoney);
  const byDay = ranked(perDay);
  const laneOrder = Array.from({ length: laneCount }, (_, l) =>
    ranked(
      perDay,
      decide.filter((i) => lane[i] === l),
    ),
  );
  const cheapestFirst = Int32Array.from([...decide].sort((a, b) => cost[a]! - cost[b]! || idRank[a]! - idRank[b]!));
  const lambda = bestCountPrice(
    decide.filter((i) => cost[i]! <= budgetCap - curCost),
    benefit,
    cost,
    budgetCap - curCost,
  );
  const byPricedMoney = ranked(
    (i) => (cost[i]! > 0 ? (benefit[i]! - lambda) / cost[i]! : Infinity),
    decide.filter((i) => benefit[i]! > lambda),
  );

  const best = Uint8Array.from(state, (s) => (s === IN ? 1 : 0));
  let found = false;
  let bestBenefit = -Infinity;
  let bestCost = Infinity;
  let bestDays = Infinity;

  const trail: number[] = [];
  const laneAdd = new Float64Array(laneCount);
  const touched: number[] = [];
  const fitting: number[] = [];
  let nodes = 0;
  let stopped = false;

  const beatsBest = (): boolean => {
    if (!found) return true;
    if (curBenefit !== bestBenefit && Math.abs(curBenefit - bestBenefit) > epsBenefit) return curBenefit > bestBenefit;
    if (Math.abs(curCost - bestCost) > epsCost) return curCost < bestCost;
    return curDays < bestDays - epsDays;
  };

  const fitsAlone = (j: number, moneyLeft: number) => state[j] === FREE && cost[j]! <= moneyLeft && laneDays[lane[j]!]! + days[j]! <= laneCap;

  /** Fractional fill of `room` along `ranking` with profit benefit − λ per item, over the items that fit alone. */
  const fill = (ranking: Int32Array, size: Float64Array, room: number, moneyLeft: number, lambdaHere: number): number => {
    let total = 0;
    for (const j of ranking) {
      if (!fitsAlone(j, moneyLeft)) continue;
      const profit = benefit[j]! - lambdaHere;
      if (size[j]! <= room) {
        total += profit;
        room -= size[j]!;
      } else {
        total += (profit * room) / size[j]!;
        break;
      }
    }
    return total;
  };

  /** The least of `size` (cost or days) that gains `missing` benefit, fractionally, along `ranking`. */
  const cover = (ranking: Int32Array, size: Float64Array, missing: number, moneyLeft: number): number => {
    let total = 0;
    for (const j of ranking) {
      if (missing <= 0) return total;
      if (!fitsAlone(j, moneyLeft)) continue;
      const share = Math.min(1, missing / benefit[j]!);
      total += share * size[j]!;
      missing -= share * benefit[j]!;
    }
    return missing <= 0 ? total : Infinity;
  };

  /** Could some completion of this node beat the best scope found? */
  const worthOpening = (): boolean => {
    const moneyLeft = budgetCap - curCost;
    const floor = bestBenefit - epsBenefit - curBenefit;
    let upper = fill(order, cost, moneyLeft, moneyLeft, 0);
    if (upper < floor) return false;
    if (lambda > 0) {
      fitting.length = 0;
      for (const j of cheapestFirst) if (fitsAlone(j, moneyLeft)) fitting.push(j);
      upper = Math.min(upper, lambda * mostItemsWithin(fitting, cost, moneyLeft) + fill(byPricedMoney, cost, moneyLeft, moneyLeft, lambda));
      if (upper < floor) return false;
    }
    let byLanes = 0;
    for (let l = 0; l < laneCount && byLanes <= upper; l++) byLanes += fill(laneOrder[l]!, days, laneCap - laneDays[l]!, moneyLeft, 0);
    upper = Math.min(upper, byLanes);
    if (upper < floor) return false;
    if (upper > floor + 2 * epsBenefit) return true;
    // At best a tie on benefit: only a lower cost, or the same cost in fewer days, would beat the best scope.
    const leastCost = curCost + cover(order, cost, floor, moneyLeft);
    if (leastCost < bestCost - epsCost) return true;
    if (leastCost > bestCost + epsCost) return false;
    return curDays + cover(byDay, days, floor, moneyLeft) < bestDays - epsDays;
  };

  /** Take item i and what it needs; false (nothing changed) if a need is out or the budget or a lane would break. */
  const take = (i: number): boolean => {
    let addCost = 0;
    for (const j of closure[i]!) {
      if (state[j] === OUT) return false;
      if (state[j] === IN) continue;
      addCost += cost[j]!;
      touched.push(lane[j]!);
      laneAdd[lane[j]!]! += days[j]!;
    }
    let fits = curCost + addCost <= budgetCap;
    for (const l of touched) {
      if (laneDays[l]! + laneAdd[l]! > laneCap) fits = false;
      laneAdd[l] = 0;
    }
    touched.length = 0;
    if (!fits) return false;
    for (const j of closure[i]!) {
      if (state[j] !== FREE) continue;
      state[j] = IN;
      trail.push(j);
      curBenefit += benefit[j]!;
      curCost += cost[j]!;
      curDays += days[j]!;
      laneDays[lane[j]!]! += days[j]!;
    }
    return true;
  };

  const leave = (i: number) => {
    for (const j of dependents[i]!) {
      if (state[j] !== FREE) continue;
      state[j] = OUT;
      trail.push(j);
    }
  };

  const undo = (mark: number) => {
    while (trail.length > mark) {
      const j = trail.pop()!;
      if (state[j] === IN) {
        curBenefit -= benefit[j]!;
        curCost -= cost[j]!;
        curDays -= days[j]!;
        laneDays[lane[j]!]! -= days[j]!;
      }
      state[j] = FREE;
    }
  };

  const visit = (from: number): void => {
    if (stopped) return;
    if (++nodes > nodeLimit) {
      stopped = true;
      return;
    }
    let k = from;
    while (k < order.length && state[order[k]!] !== FREE) k++;
    if (k === order.length) {
      if (beatsBest()) {
        found = true;
        bestBenefit = curBenefit;
        bestCost = curCost;
        bestDays = curDays;
        for (let i = 0; i < n; i++) best[i] = state[i] === IN ? 1 : 0;
      }
      return;
    }
    if (found && !worthOpening()) return;
    const i = order[k]!;
    const mark = trail.length;
    if (take(i)) {
      visit(k + 1);
      undo(mark);
    }
    leave(i);
    visit(k + 1);
    undo(mark);
  };

  visit(0);
  return { chosen: best, nodes, proven: !stopped };
}
