/**
 * The outage-scope problem with its items indexed once: lanes as numbers, what was forced in or left out by hand
 * (an item both forced in and left out counts as left out until the person settles it), and the needs between items.
 */
import { needsGraph, type NeedsGraph } from './scope-needs.js';
import type { ScopeItem, ScopeProblem } from './scope-problem.js';

export interface ScopeContext {
  problem: ScopeProblem;
  items: ScopeItem[];
  index: Map<string, number>;
  lanes: string[];
  laneOf: Int32Array;
  forcedIn: boolean[];
  /** left out by hand (including items also forced in) */
  outByYou: boolean[];
  /** both forced in and left out */
  forcedBothWays: boolean[];
  graph: NeedsGraph;
  /** How far sums may stray from a limit or from each other through rounding and still count as within or equal. */
  slack: Slack;
}

export interface Slack {
  benefit: number;
  cost: number;
  days: number;
}

export function scopeContext(problem: ScopeProblem): ScopeContext {
  const items = problem.items;
  const index = new Map<string, number>();
  items.forEach((item, i) => {
    if (!index.has(item.id)) index.set(item.id, i);
  });
  const lanes = [...new Set(items.map((item) => item.lane))];
  const laneIndex = new Map(lanes.map((lane, l) => [lane, l]));
  const laneOf = Int32Array.from(items, (item) => laneIndex.get(item.lane)!);
  const inIds = new Set(problem.forcedIn);
  const outIds = new Set(problem.forcedOut);
  const forcedIn = items.map((item) => inIds.has(item.id));
  const outByYou = items.map((item) => outIds.has(item.id));
  const forcedBothWays = items.map((item) => inIds.has(item.id) && outIds.has(item.id));
  const sumAbs = (f: (item: ScopeItem) => number) => items.reduce((s, item) => s + Math.abs(f(item)), 0);
  const slack = {
    benefit:
      1e-9 *
      Math.max(
        1,
        sumAbs((item) => item.benefit),
      ),
    cost:
      1e-9 *
      Math.max(
        1,
        problem.budget,
        sumAbs((item) => item.cost),
      ),
    days:
      1e-9 *
      Math.max(
        1,
        problem.windowDays,
        sumAbs((item) => item.durationDays),
      ),
  };
  return { problem, items, index, lanes, laneOf, forcedIn, outByYou, forcedBothWays, graph: needsGraph(items, index, outByYou), slack };
}

/** The item's title for a sentence, or its id when it has none. */
export const titleOf = (ctx: ScopeContext, i: number): string => ctx.items[i]!.title || ctx.items[i]!.id;
