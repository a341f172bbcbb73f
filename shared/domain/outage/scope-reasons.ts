/**
 * One sentence per item saying why it is in the proposed scope or left out, taken from the constraint that binds:
 * for an item left out, what adding it to the chosen scope would break (the budget, its lane's window, a need), or
 * that it brings no more than it costs; for an item in, whether it was forced, is needed by a chosen item, or earns
 * its place. The context's `benefit` is each item's value (benefit less cost), what the search weighs.
 */
import { cannotBeChosenBecause, listWords } from './scope-blockers.js';
import { titleOf, type ScopeContext } from './scope-context.js';
import type { ForcedScope } from './scope-forced.js';
import { days, money, quoted, windowOf } from './scope-wording.js';

export interface ChosenScope {
  chosen: boolean[];
  cost: number;
  laneDays: Float64Array;
  /** false when the search stopped before the best scope was proven */
  proven: boolean;
}

export function scopeReasons(ctx: ScopeContext, forced: ForcedScope, scope: ChosenScope): string[] {
  if (forced.problems.length) return ctx.items.map((_, i) => reasonWhenForcedBreak(ctx, forced, scope, i));
  const weighed = new Weighed(ctx, scope);
  return ctx.items.map((_, i) => (scope.chosen[i] ? reasonIn(ctx, forced, scope, weighed, i) : reasonOut(ctx, scope, weighed, i)));
}

/** Items left out that could have been chosen and bring a benefit: the ones the proposal weighed and passed over. */
class Weighed {
  readonly passedOver: number[];
  private readonly ctx: ScopeContext;
  constructor(ctx: ScopeContext, scope: ChosenScope) {
    this.ctx = ctx;
    this.passedOver = ctx.items.map((_, i) => i).filter((i) => !scope.chosen[i] && mayBeChosen(ctx, i) && ctx.items[i]!.benefit > 0);
  }
  perMoney(i: number): number {
    const item = this.ctx.items[i]!;
    return item.cost > 0 ? item.benefit / item.cost : Infinity;
  }
  /** At least as good per unit of money as every item passed over. */
  amongTheBest(i: number): boolean {
    const own = this.perMoney(i);
    return this.passedOver.every((j) => own >= this.perMoney(j) * (1 - 1e-12));
  }
  /** No item passed over (other than i) is worse per unit of money; null when i is the only one passed over. */
  lowestPassedOver(i: number): boolean | null {
    const others = this.passedOver.filter((j) => j !== i);
    if (!others.length) return null;
    const own = this.perMoney(i);
    return others.every((j) => own <= this.perMoney(j) * (1 + 1e-12));
  }
}

const unweighed = 'Left out: the search stopped before every combination was weighed, and the best scope it found leaves this out.';

const mayBeChosen = (ctx: ScopeContext, i: number) => !ctx.outByYou[i] && !ctx.graph.blocker[i];

function reasonIn(ctx: ScopeContext, forced: ForcedScope, scope: ChosenScope, weighed: Weighed, i: number): string {
  const item = ctx.items[i]!;
  const { currency } = ctx.problem;
  if (ctx.forcedIn[i]) return 'In: forced by you.';
  const chosenDependents = ctx.graph.neededBy[i]!.filter((d) => scope.chosen[d]);
  if (forced.inScope[i] || item.benefit <= 0) {
    const byForced = chosenDependents.find((d) => ctx.forcedIn[d]);
    if (byForced !== undefined) return `In: needed by ${quoted(titleOf(ctx, byForced))}, which you forced in.`;
    const by = chosenDependents[0];
    if (by !== undefined) return `In: needed by ${quoted(titleOf(ctx, by))}, which is chosen.`;
  }
  const lane = quoted(item.lane);
  const amongTheBest = weighed.amongTheBest(i);
  if (!amongTheBest && chosenDependents.length) return `In: needed by ${quoted(titleOf(ctx, chosenDependents[0]!))}, which is chosen.`;
  if (item.cost === 0) return `In: it costs nothing, brings ${money(item.benefit, currency)} and fits lane ${lane}.`;
  if (amongTheBest)
    return `In: it adds ${money(item.benefit, currency)} of value (benefit less cost), no item left out adds more per ${currency}, and it fits the budget and lane ${lane}.`;
  return `In: it adds ${money(item.benefit, currency)} of value (benefit less cost); others add more per ${currency}, but with it the budget and lane ${lane} give the most value in total.`;
}

function reasonOut(ctx: ScopeContext, scope: ChosenScope, weighed: Weighed, i: number): string {
  const item = ctx.items[i]!;
  const { currency, budget, windowDays } = ctx.problem;
  const { slack } = ctx;
  if (ctx.forcedBothWays[i]) return 'Left out: you both forced it in and left it out; it stays out until that is settled.';
  if (ctx.outByYou[i]) return 'Left out by you.';
  if (ctx.graph.blocker[i]) return `Left out: ${cannotBeChosenBecause(ctx, i)}.`;
  if (item.benefit <= 0) {
    const benefit = item.benefit + item.cost;
    return benefit <= 0
      ? 'Left out: it brings no benefit.'
      : `Left out: it brings ${money(benefit, currency)} for ${money(item.cost, currency)}, no more than it costs.`;
  }
  const tooDear = item.cost > budget + slack.cost;
  const tooLong = item.durationDays > windowDays + slack.days;
  if (tooDear && tooLong)
    return `Left out: it costs more than the whole budget of ${money(budget, currency)} and takes longer than the ${days(windowDays)} of the window.`;
  if (tooDear) return `Left out: it costs ${money(item.cost, currency)}, more than the whole budget of ${money(budget, currency)}.`;
  if (tooLong) return `Left out: it takes ${days(item.durationDays)}, longer than the whole window of ${days(windowDays)}.`;

  // Would adding it alone break the budget or its lane?
  const lane = item.lane;
  const laneUsed = scope.laneDays[ctx.laneOf[i]!]!;
  const costWith = scope.cost + item.cost;
  const laneWith = laneUsed + item.durationDays;
  const breaksBudget = costWith > budget + slack.cost;
  const breaksLane = laneWith > windowDays + slack.days;
  if (breaksBudget && breaksLane) {
    return `Left out: it would take the cost to ${money(costWith, currency)} against the budget of ${money(budget, currency)} and lane ${quoted(lane)} to ${days(laneWith)} in ${windowOf(windowDays)}.`;
  }
  if (breaksLane) return `Left out: lane ${quoted(lane)} would need ${days(laneWith)} in ${windowOf(windowDays)}.`;
  if (breaksBudget) {
    const left = Math.max(0, budget - scope.cost);
    const spent = Math.round(left) === 0;
    if (weighed.lowestPassedOver(i)) {
      return spent
        ? `Left out: the budget is spent and its value per ${currency} is the lowest of those left.`
        : `Left out: what is left of the budget (${money(left, currency)}) does not cover its ${money(item.cost, currency)}, and its value per ${currency} is the lowest of those left.`;
    }
    if (!scope.proven) return unweighed;
    return spent
      ? `Left out: the budget is spent, and making room for its ${money(item.cost, currency)} would give up at least as much value as it adds.`
      : `Left out: only ${money(left, currency)} of the budget is left, and making room for its ${money(item.cost, currency)} would give up at least as much value as it adds.`;
  }

  // It fits on its own: what it needs and the chosen scope lacks must be what keeps it out.
  const missing = ctx.graph.closure[i]!.filter((j) => !scope.chosen[j]);
  const missingNeeds = ctx.graph.needs[i]!.filter((j) => !scope.chosen[j]);
  if (missingNeeds.length) {
    const needWords = `it needs ${listWords(missingNeeds.map((j) => quoted(titleOf(ctx, j))))}, which ${missingNeeds.length === 1 ? 'is' : 'are'} left out`;
    let cost = scope.cost;
    const laneDays = Float64Array.from(scope.laneDays);
    let benefit = 0;
    for (const j of missing) {
      cost += ctx.items[j]!.cost;
      laneDays[ctx.laneOf[j]!]! += ctx.items[j]!.durationDays;
      benefit += ctx.items[j]!.benefit;
    }
    if (cost > budget + slack.cost) return `Left out: ${needWords}, and together they would go ${money(cost - budget, currency)} over the budget.`;
    const l = laneDays.findIndex((d) => d > windowDays + slack.days);
    if (l >= 0)
      return `Left out: ${needWords}, and together they would need ${days(laneDays[l]!)} in lane ${quoted(ctx.lanes[l]!)}, against ${windowOf(windowDays)}.`;
    if (benefit <= slack.benefit) return `Left out: ${needWords}, and together they would bring no more than they cost.`;
  }
  if (!scope.proven) return unweighed;
  return `Left out: it would add no value that a cheaper choice does not already bring.`;
}

function reasonWhenForcedBreak(ctx: ScopeContext, forced: ForcedScope, scope: ChosenScope, i: number): string {
  if (scope.chosen[i]) {
    if (ctx.forcedIn[i]) return 'In: forced by you.';
    const by = ctx.graph.neededBy[i]!.find((d) => scope.chosen[d] && ctx.forcedIn[d]) ?? ctx.graph.neededBy[i]!.find((d) => scope.chosen[d]);
    return by === undefined
      ? 'In: needed by an item you forced in.'
      : `In: needed by ${quoted(titleOf(ctx, by))}, which ${ctx.forcedIn[by] ? 'you forced in' : 'is chosen'}.`;
  }
  if (ctx.forcedBothWays[i]) return 'Left out: you both forced it in and left it out; it stays out until that is settled.';
  if (ctx.outByYou[i]) return 'Left out by you.';
  if (ctx.forcedIn[i] && ctx.graph.blocker[i]) return `Left out although you forced it in: ${cannotBeChosenBecause(ctx, i)}.`;
  if (ctx.graph.blocker[i]) return `Left out: ${cannotBeChosenBecause(ctx, i)}.`;
  return `Left out: what you forced in already breaks ${listWords(forced.broken)}, so nothing else was added.`;
}
