/**
 * What the outage report shows, read once from the outage view for the PDF and the workbook alike: the selection
 * (the approved snapshot, else the latest current proposal, else none), chosen and left-out items with their
 * reasons, the totals, and each lane's items in order across the window. The totals and days per lane are summed
 * from the chosen items as listed, so the Total row always adds up, a stale proposal's included (its items may have
 * changed since the optimiser ran: the basis says so).
 */
import Decimal from 'decimal.js';
import type { OutageItemView, OutageView } from '@shared/schemas/outages.js';
import { OUTAGE_ITEM_KIND_WORDS } from '@shared/schemas/outages.js';
import { formatDayOfMoment } from '@shared/text/display-format.js';

export interface OutageReportContext {
  organisationName: string;
  generatedAt: Date;
}

export interface LaneBar {
  item: OutageItemView;
  /** days from the window's first day (0-based) */
  fromDay: number;
  toDay: number;
}

export interface ReportContent {
  /** "Approved scope “Base”" / "Latest proposal, not approved yet" / "No proposal yet" */
  basis: string;
  approvedLine: string;
  items: OutageItemView[];
  chosen: OutageItemView[];
  leftOut: OutageItemView[];
  reasons: Record<string, string>;
  totalBenefit: number | null;
  totalCost: number | null;
  laneDays: Record<string, number>;
  lanes: { lane: string; bars: LaneBar[]; days: number }[];
  kindWords: (item: OutageItemView) => string;
  timeZone: string;
}

export function reportContent(view: OutageView): ReportContent {
  const timeZone = view.units[0]?.timeZone ?? 'UTC';
  let items = view.items;
  let selected: string[] = [];
  let reasons: Record<string, string> = {};
  let basis = 'No proposal yet: run the optimiser or approve a saved scope';
  let hasSelection = false;
  if (view.approved) {
    items = view.approved.items;
    selected = view.approved.selectedItemIds;
    reasons = view.approved.reasons;
    basis = view.approved.scopeId ? `Approved scope “${view.approved.scopeName}”` : 'Approved proposal';
    hasSelection = true;
  } else if (view.proposal) {
    selected = view.proposal.selectedItemIds;
    reasons = view.proposal.reasons;
    basis = view.proposalStale
      ? 'Latest proposal, not approved yet; the items, window or budget changed after it (run the optimiser again)'
      : 'Latest proposal, not approved yet';
    hasSelection = true;
  }
  const chosen = items.filter((i) => selected.includes(i.id));
  const leftOut = items.filter((i) => !selected.includes(i.id));
  let totalBenefit = new Decimal(0);
  let totalCost = new Decimal(0);
  const laneDays: Record<string, number> = {};
  const lanes = new Map<string, LaneBar[]>();
  for (const item of chosen) {
    totalBenefit = totalBenefit.plus(item.benefit);
    totalCost = totalCost.plus(item.cost);
    laneDays[item.lane] = (laneDays[item.lane] ?? 0) + item.durationDays;
    const bars = lanes.get(item.lane) ?? [];
    const from = bars.at(-1)?.toDay ?? 0;
    bars.push({ item, fromDay: from, toDay: from + item.durationDays });
    lanes.set(item.lane, bars);
  }
  const approvedLine =
    view.approvedBy && view.approvedAt ? `Approved by ${view.approvedBy.name} on ${formatDayOfMoment(view.approvedAt, timeZone)}` : 'Not approved yet';
  return {
    basis,
    approvedLine,
    items,
    chosen,
    leftOut,
    reasons,
    totalBenefit: hasSelection ? totalBenefit.toNumber() : null,
    totalCost: hasSelection ? totalCost.toNumber() : null,
    laneDays: hasSelection ? laneDays : {},
    lanes: [...lanes.entries()].sort(([a], [b]) => a.localeCompare(b)).map(([lane, bars]) => ({ lane, bars, days: bars.at(-1)?.toDay ?? 0 })),
    kindWords: (item) => OUTAGE_ITEM_KIND_WORDS[item.kind],
    timeZone,
  };
}
