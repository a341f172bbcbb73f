/**
 * The business case by horizon year: what the plan saves in fouling cost against the baseline, what it spends
 * more on cleaning and downtime, the net cash flow and its running sum. Row 0 is the start of the horizon (the
 * upfront cost); year k ends on the k-th anniversary of the start (or at the end of the horizon).
 */
import Decimal from 'decimal.js';
import { addDays, addYears, daysBetween } from '@shared/domain/calendar/plant-date.js';
import type { CaseView } from '@shared/schemas/cases.js';

export interface YearlyRow {
  /** "Start" or "Year 1" */
  label: string;
  /** first and last day of the year (the start row: the first day twice) */
  from: string;
  to: string;
  foulingSavings: number;
  extraCleaningCosts: number;
  cashflow: number;
  cumulative: number;
  /** the plan's own costs that year (not on the start row) */
  planCosts: CaseView['results']['yearly'][number] | null;
}

export function yearlyRows(view: CaseView): YearlyRow[] {
  const { startDate, horizonDays } = view.inputs;
  const lastDay = addDays(startDate, horizonDays - 1);
  const bc = view.results.businessCase;
  let running = new Decimal(0);
  return bc.cashflows.map((cashflow, k) => {
    running = running.plus(cashflow);
    const cumulative = running.toNumber();
    if (k === 0) {
      return { label: 'Start', from: startDate, to: startDate, foulingSavings: 0, extraCleaningCosts: 0, cashflow, cumulative, planCosts: null };
    }
    const from = addYears(startDate, k - 1);
    const anniversaryEve = addDays(addYears(startDate, k), -1);
    const to = daysBetween(anniversaryEve, lastDay) < 0 ? lastDay : anniversaryEve;
    return {
      label: `Year ${k}`,
      from,
      to,
      foulingSavings: bc.foulingSavings[k - 1] ?? 0,
      extraCleaningCosts: bc.extraCleaningCosts[k - 1] ?? 0,
      cashflow,
      cumulative,
      planCosts: view.results.yearly[k - 1] ?? null,
    };
  });
}
