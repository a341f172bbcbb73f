/**
 * The outage-scope problem as the optimiser sees it: candidate work items with cost, duration, crew lane and benefit,
 * a budget and a window. Items in one lane run one after another; lanes run in parallel.
 * Money here is in whole units of the organisation's currency as plain numbers (the service converts from Decimal).
 */
export interface ScopeItem {
  id: string;
  title: string;
  cost: number;
  durationDays: number;
  lane: string;
  benefit: number;
  /** Ids of items this one needs (B needs A: B may be chosen only with A). */
  needs: string[];
}

export interface ScopeProblem {
  items: ScopeItem[];
  budget: number;
  /** Length of the outage window in days: every lane's summed durations must fit it. */
  windowDays: number;
  /** Items the person put in or left out by hand. */
  forcedIn: string[];
  forcedOut: string[];
  /** ISO 4217 code, for the sentences ("benefit per USD"). */
  currency: string;
}

export interface ScopeProposal {
  selectedItemIds: string[];
  totalBenefit: number;
  totalCost: number;
  /** Summed duration of the chosen items per lane. */
  laneDays: Record<string, number>;
  /** One sentence per item saying why it is in or out. */
  reasons: Record<string, string>;
  /** False when the forced items alone break the budget, the window or a dependency; `problems` says how. */
  feasible: boolean;
  problems: string[];
}
