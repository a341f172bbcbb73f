/**
 * An outage's items as the optimiser's problem (shared/domain/outage/scope-problem.ts: money as plain numbers), and
 * the figures of any selection of them: total benefit and cost (summed as Decimal), days per lane, the critical
 * lane, and whether it keeps the budget, the window and every item's needs.
 */
import Decimal from 'decimal.js';
import type { ScopeItem, ScopeProblem } from '@shared/domain/outage/scope-problem.js';
import { windowDays } from '@shared/schemas/outages.js';
import { formatCurrency } from '@shared/text/display-format.js';
import type { OutageItem } from '../../entities/outage-item.entity.js';
import type { Outage } from '../../entities/outage.entity.js';

export function scopeItemOf(item: OutageItem): ScopeItem {
  return {
    id: item.id,
    title: item.title,
    cost: Number(item.cost),
    durationDays: item.durationDays,
    lane: item.lane,
    benefit: Number(item.pricedBenefit),
    needs: [...item.needs],
  };
}

export function scopeProblemOf(outage: Outage, items: readonly OutageItem[]): ScopeProblem {
  return {
    items: items.map(scopeItemOf),
    budget: Number(outage.budget),
    windowDays: windowDays(outage.startDate, outage.endDate),
    forcedIn: items.filter((i) => i.forced === 'in').map((i) => i.id),
    forcedOut: items.filter((i) => i.forced === 'out').map((i) => i.id),
    currency: outage.currency,
  };
}

export interface SelectionFigures {
  totalBenefit: number;
  totalCost: number;
  laneDays: Record<string, number>;
  criticalLaneDays: number;
  feasible: boolean;
  problems: string[];
}

export function selectionFigures(outage: Outage, items: readonly OutageItem[], selectedIds: readonly string[]): SelectionFigures {
  const chosen = new Set(selectedIds);
  const selected = items.filter((i) => chosen.has(i.id));
  const byId = new Map(items.map((i) => [i.id, i]));
  let benefit = new Decimal(0);
  let cost = new Decimal(0);
  const laneDays: Record<string, number> = {};
  for (const i of selected) {
    benefit = benefit.plus(i.pricedBenefit);
    cost = cost.plus(i.cost);
    laneDays[i.lane] = (laneDays[i.lane] ?? 0) + i.durationDays;
  }
  const days = windowDays(outage.startDate, outage.endDate);
  const problems: string[] = [];
  if (cost.greaterThan(outage.budget)) {
    // cents shown when whole units would read the same
    const decimals = cost.isInteger() && new Decimal(outage.budget).isInteger() ? 0 : 2;
    problems.push(
      `The cost ${formatCurrency(cost.toNumber(), outage.currency, decimals)} is over the budget of ${formatCurrency(Number(outage.budget), outage.currency, decimals)}`,
    );
  }
  for (const [lane, d] of Object.entries(laneDays)) {
    if (d > days) problems.push(`Lane “${lane}” needs ${d} days; the window has ${days}`);
  }
  for (const i of selected) {
    for (const need of i.needs) {
      if (!chosen.has(need)) problems.push(`“${i.title}” needs “${byId.get(need)?.title ?? 'an item removed since'}”, which is not in the scope`);
    }
  }
  return {
    totalBenefit: benefit.toDecimalPlaces(2).toNumber(),
    totalCost: cost.toDecimalPlaces(2).toNumber(),
    laneDays,
    criticalLaneDays: Math.max(0, ...Object.values(laneDays)),
    feasible: problems.length === 0,
    problems,
  };
}
