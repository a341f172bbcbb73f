/**
 * The pieces of the search's upper bounds that are worked out once, before the search.
 *
 * Besides the budget, a scope is limited in how many items it can hold: no more than the cheapest ones that fit the
 * budget together (M). Pricing that limit at λ per item gives, for any λ ≥ 0, the bound
 *   benefit ≤ λ·M + (budget filled fractionally with the items' benefit less λ, best per unit of money first),
 * the Lagrangian relaxation of the count limit. λ = 0 is the plain fractional bound; when benefits run close to
 * "cost plus a fixed amount per item" the right λ (about that amount) is far tighter, because the fractional bound
 * then over-counts the whole fixed amount of a partly taken item. The λ that gives the lowest bound for the whole
 * problem is found here (the bound is convex in λ) and the search reuses it at every node: any λ ≥ 0 is valid.
 */

/** The item count limit M: how many of the given items, cheapest first, fit in `money` together. */
export function mostItemsWithin(cheapestFirst: ArrayLike<number>, cost: Float64Array, money: number): number {
  let count = 0;
  let spent = 0;
  for (let k = 0; k < cheapestFirst.length; k++) {
    spent += cost[cheapestFirst[k]!]!;
    if (spent > money) break;
    count++;
  }
  return count;
}

/** λ·M + the fractional fill of `money` with profits (benefit − λ), for the given items. */
export function countPricedBound(items: number[], benefit: Float64Array, cost: Float64Array, money: number, lambda: number): number {
  const count = mostItemsWithin(
    [...items].sort((a, b) => cost[a]! - cost[b]!),
    cost,
    money,
  );
  const profitable = items.filter((j) => benefit[j]! > lambda);
  const perMoney = (j: number) => (cost[j]! > 0 ? (benefit[j]! - lambda) / cost[j]! : Infinity);
  profitable.sort((a, b) => perMoney(b) - perMoney(a));
  let room = money;
  let fill = 0;
  for (const j of profitable) {
    if (cost[j]! <= room) {
      fill += benefit[j]! - lambda;
      room -= cost[j]!;
    } else {
      fill += ((benefit[j]! - lambda) * room) / cost[j]!;
      break;
    }
  }
  return lambda * count + fill;
}

/** The λ in [0, largest benefit] with the lowest count-priced bound (golden-section search on a convex function). */
export function bestCountPrice(items: number[], benefit: Float64Array, cost: Float64Array, money: number): number {
  if (!items.length) return 0;
  const bound = (lambda: number) => countPricedBound(items, benefit, cost, money, lambda);
  let lo = 0;
  let hi = Math.max(...items.map((j) => benefit[j]!));
  const ratio = (Math.sqrt(5) - 1) / 2;
  let a = hi - ratio * (hi - lo);
  let b = lo + ratio * (hi - lo);
  let fa = bound(a);
  let fb = bound(b);
  for (let step = 0; step < 60 && hi - lo > 1e-9 * Math.max(1, hi); step++) {
    if (fa <= fb) {
      hi = b;
      b = a;
      fb = fa;
      a = hi - ratio * (hi - lo);
      fa = bound(a);
    } else {
      lo = a;
      a = b;
      fa = fb;
      b = lo + ratio * (hi - lo);
      fb = bound(b);
    }
  }
  const lambda = (lo + hi) / 2;
  return bound(lambda) < bound(0) ? lambda : 0;
}
