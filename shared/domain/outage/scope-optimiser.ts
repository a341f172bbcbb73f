/**
 * The outage scope with the most value — total benefit less total cost — such that the total cost stays within the budget and every crew
 * lane's work (items in one lane run one after another, lanes run in parallel) fits the outage window; items forced
 * in are always in, items left out by hand never; an item is chosen only with everything it needs. Exact (branch and
 * bound, see scope-search.ts, which weighs each item's value as its "benefit"); equal value goes to the lower cost, then
 * fewer days, then id order. Every item gets
 * a sentence saying why it is in or out.
 *
 * When the hand-made choices alone break the budget, a window or a need, the proposal is marked infeasible, says how
 * in `problems`, and holds only what was forced in (with what that needs). Needs on unknown ids and circles of needs
 * are listed in `problems` too; the items they concern are left out.
 */
import { needsProblems } from './scope-blockers.js';
import { scopeContext, type ScopeContext } from './scope-context.js';
import { forcedScope } from './scope-forced.js';
import { inputProblems } from './scope-input-check.js';
import type { ScopeProblem, ScopeProposal } from './scope-problem.js';
import { scopeReasons } from './scope-reasons.js';
import { searchScope } from './scope-search.js';

/**
 * More nodes than 60 realistic items need (a few hundred to tens of thousands); a guard that keeps a request to about
 * a second on adversarial figures (benefit equal to cost, whole-number costs, a tight budget: a subset-sum search),
 * where the proposal then says it is the best found, not proven the best.
 */
const NODE_LIMIT = 1_000_000;

export function optimiseScope(problem: ScopeProblem): ScopeProposal {
  const bad = inputProblems(problem);
  if (bad.length) return unusable(problem, bad);
  // The search weighs each item's value, its benefit less its cost (the most value within the budget, as capital is
  // rationed between projects): work that brings less than it costs stays out unless forced or needed.
  const ctx = scopeContext({ ...problem, items: problem.items.map((item) => ({ ...item, benefit: item.benefit - item.cost })) });
  const forced = forcedScope(ctx);
  const chosen = forced.problems.length ? { chosen: forced.inScope, proven: true } : search(ctx, forced.inScope);
  const totals = totalsOf(ctx, chosen.chosen);
  const problems = [...needsProblems(ctx), ...forced.problems];
  if (!chosen.proven) problems.push('The search stopped before every combination was weighed: the proposal is the best found, not proven the best.');
  const reasons = scopeReasons(ctx, forced, { chosen: chosen.chosen, cost: totals.cost, laneDays: totals.laneDays, proven: chosen.proven });
  return {
    selectedItemIds: problem.items.filter((_, i) => chosen.chosen[i]).map((item) => item.id),
    totalBenefit: totals.benefit,
    totalCost: totals.cost,
    laneDays: Object.fromEntries(ctx.lanes.map((lane, l) => [lane, totals.laneDays[l]!])),
    reasons: Object.fromEntries(problem.items.map((item, i) => [item.id, reasons[i]!])),
    feasible: forced.problems.length === 0,
    problems,
  };
}

function search(ctx: ScopeContext, inScope: boolean[]): { chosen: boolean[]; proven: boolean } {
  const { items, problem, graph } = ctx;
  const start = Int8Array.from(items, (_, i) => (inScope[i] ? 1 : ctx.outByYou[i] || graph.blocker[i] ? 2 : 0));
  const idRank = new Int32Array(items.length);
  items
    .map((_, i) => i)
    .sort((a, b) => (items[a]!.id < items[b]!.id ? -1 : items[a]!.id > items[b]!.id ? 1 : a - b))
    .forEach((i, rank) => (idRank[i] = rank));
  const result = searchScope({
    cost: Float64Array.from(items, (item) => item.cost),
    days: Float64Array.from(items, (item) => item.durationDays),
    benefit: Float64Array.from(items, (item) => item.benefit),
    lane: ctx.laneOf,
    laneCount: ctx.lanes.length,
    budget: problem.budget,
    windowDays: problem.windowDays,
    closure: graph.closure,
    dependents: graph.dependents,
    start,
    idRank,
    nodeLimit: NODE_LIMIT,
    slack: ctx.slack,
  });
  return { chosen: Array.from(result.chosen, (v) => v === 1), proven: result.proven };
}

function totalsOf(ctx: ScopeContext, chosen: boolean[]) {
  let benefit = 0;
  let cost = 0;
  const laneDays = new Float64Array(ctx.lanes.length);
  ctx.items.forEach((item, i) => {
    if (!chosen[i]) return;
    // ctx holds values (benefit less cost): the benefit is the value plus the cost again
    benefit += item.benefit + item.cost;
    cost += item.cost;
    laneDays[ctx.laneOf[i]!]! += item.durationDays;
  });
  return { benefit, cost, laneDays };
}

/** Figures that cannot be weighed: nothing is chosen and every item says so. */
function unusable(problem: ScopeProblem, problems: string[]): ScopeProposal {
  const lanes = [...new Set(problem.items.map((item) => item.lane))];
  return {
    selectedItemIds: [],
    totalBenefit: 0,
    totalCost: 0,
    laneDays: Object.fromEntries(lanes.map((lane) => [lane, 0])),
    reasons: Object.fromEntries(problem.items.map((item) => [item.id, 'Left out: nothing can be weighed until the figures listed as problems are fixed.'])),
    feasible: false,
    problems,
  };
}
