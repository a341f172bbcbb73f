/**
 * A unit's current conditions, each with one sentence in the product's words, from its stored figures only:
 * the portfolio lists them and the e-mail alerts reuse the same rule. Pure: the caller passes the plant's today.
 *
 * - cleaning-now-pays: the cleaning outlook (the recompute's least-cost plan) puts its first cleaning on or
 *   before today, i.e. the plan says cleaning pays for itself now rather than later;
 * - backpressure-unexplained: the air in-leakage verdicts flagged one or more of the last 7 days with data: the
 *   backpressure is up in a way the fouling trend does not explain (air in-leakage or instruments);
 * - data-stopped: the last day with valid data is more than `staleAfterDays` days before today.
 */
import { daysBetween } from '../calendar/plant-date.js';
import { formatCurrency, formatDay } from '../../text/display-format.js';

export const UNIT_CONDITION_KINDS = ['cleaning-now-pays', 'backpressure-unexplained', 'data-stopped'] as const;
export type UnitConditionKind = (typeof UNIT_CONDITION_KINDS)[number];

export interface UnitCondition {
  kind: UnitConditionKind;
  sentence: string;
}

/** Days without data before a unit's figures count as stale (and "data stopped" is raised). */
export const STALE_AFTER_DAYS = 3;

export interface UnitConditionInput {
  /** the plant's today (plant-local day) */
  today: string;
  /** the last day with valid data, or null when the unit has none */
  dataThrough: string | null;
  /** the stored cleaning outlook's first cleaning, when it plans one */
  nextCleaning: { date: string; methodName: string; savingsVersusNoCleaning: number | null } | null;
  /** the unit's currency (ISO 4217), for the sentence; null when the economics are not set up */
  currency: string | null;
  /** of the last 7 days with data, how many the air in-leakage verdicts flagged */
  airLeakDaysInLastWeek: number;
  staleAfterDays?: number;
}

/** Days from the last day with data to today (0: data through today), or null without data. */
export function dataAgeDays(today: string, dataThrough: string | null): number | null {
  return dataThrough === null ? null : Math.max(0, daysBetween(dataThrough, today));
}

/** Whether the unit's figures are stale: no data at all, or none for more than `staleAfterDays` days. */
export function isStale(today: string, dataThrough: string | null, staleAfterDays = STALE_AFTER_DAYS): boolean {
  const age = dataAgeDays(today, dataThrough);
  return age === null || age > staleAfterDays;
}

export function unitConditions(input: UnitConditionInput): UnitCondition[] {
  const out: UnitCondition[] = [];
  const n = input.nextCleaning;
  if (n && n.date <= input.today) {
    const saving =
      n.savingsVersusNoCleaning !== null && input.currency
        ? ` Over the coming year its plan saves ${formatCurrency(n.savingsVersusNoCleaning, input.currency)} against not cleaning.`
        : '';
    out.push({
      kind: 'cleaning-now-pays',
      sentence: `Cleaning now pays: the cleaning outlook puts the next cleaning (${n.methodName}) on ${formatDay(n.date)}.${saving}`,
    });
  }
  if (input.airLeakDaysInLastWeek > 0) {
    const days = input.airLeakDaysInLastWeek === 1 ? '1 of the last 7 days' : `${input.airLeakDaysInLastWeek} of the last 7 days`;
    out.push({
      kind: 'backpressure-unexplained',
      sentence: `Backpressure rose on ${days} with data in a way fouling does not explain: suspect air in-leakage or the instruments. Cleaning would not recover it.`,
    });
  }
  const age = dataAgeDays(input.today, input.dataThrough);
  const limit = input.staleAfterDays ?? STALE_AFTER_DAYS;
  if (age !== null && age > limit) {
    out.push({
      kind: 'data-stopped',
      sentence: `Data stopped arriving: the last day with data is ${formatDay(input.dataThrough)}, ${age} days ago.`,
    });
  }
  return out;
}
