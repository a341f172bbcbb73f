/**
 * What the hand-made choices fix before any search: the items forced in together with everything they need, and
 * the ways those choices alone break the rules (an item both forced in and left out, a forced item that can never be
 * chosen, the budget or a lane's window exceeded by the forced work), each said with its figures.
 */
import { cannotBeChosenBecause } from './scope-blockers.js';
import { titleOf, type ScopeContext } from './scope-context.js';
import { days, money, quoted, windowOf } from './scope-wording.js';

export interface ForcedScope {
  /** forced items and what they need (only items that can be chosen) */
  inScope: boolean[];
  /** sentences saying how the forced choices break the rules; empty when they can all be honoured */
  problems: string[];
  /** what they break, for the sentences of the items left aside: "the budget", "lane 'Tube crew'", "the needs" */
  broken: string[];
}

export function forcedScope(ctx: ScopeContext): ForcedScope {
  const { items, problem, graph } = ctx;
  const inScope = items.map(() => false);
  const problems: string[] = [];
  const broken = new Set<string>();
  items.forEach((_, i) => {
    if (!ctx.forcedIn[i]) return;
    if (ctx.forcedBothWays[i]) {
      problems.push(`${quoted(titleOf(ctx, i))} is both forced in and left out by you; it stays out until that is settled.`);
      broken.add('the choices made by hand');
      return;
    }
    if (graph.blocker[i]) {
      problems.push(`${quoted(titleOf(ctx, i))} is forced in but cannot be chosen: ${cannotBeChosenBecause(ctx, i)}.`);
      broken.add('the needs');
      return;
    }
    for (const j of graph.closure[i]!) inScope[j] = true;
  });

  const { currency, budget, windowDays } = problem;
  let cost = 0;
  const laneDays = new Float64Array(ctx.lanes.length);
  items.forEach((item, i) => {
    if (!inScope[i]) return;
    cost += item.cost;
    laneDays[ctx.laneOf[i]!]! += item.durationDays;
  });
  if (cost > budget + ctx.slack.cost) {
    problems.push(
      `The forced items and what they need cost ${money(cost, currency)}, ${money(cost - budget, currency)} over the budget of ${money(budget, currency)}.`,
    );
    broken.add('the budget');
  }
  ctx.lanes.forEach((lane, l) => {
    const used = laneDays[l]!;
    if (used <= windowDays + ctx.slack.days) return;
    problems.push(`Lane ${quoted(lane)} has ${days(used)} of forced work in ${windowOf(windowDays)}: ${days(used - windowDays)} too many.`);
    broken.add(`lane ${quoted(lane)}`);
  });
  return { inScope, problems, broken: [...broken] };
}
