import { addDays } from '@shared/domain/calendar/plant-date';
import { plantDayOf } from '@shared/domain/calendar/plant-day';
import type { HealthPeriodQuery } from '../api/get-health';

export const PERIOD_CHOICES = [
  // counted back from the last day of data, which may be months ago: the names say so
  { value: '30d', label: 'Last 30 days of data', days: 30 },
  { value: '90d', label: 'Last 90 days of data', days: 90 },
  { value: '1y', label: 'Last 365 days of data', days: 365 },
  { value: 'all', label: 'All data', days: null },
  { value: 'custom', label: 'From – to', days: null },
] as const;

export type PeriodChoice = (typeof PERIOD_CHOICES)[number]['value'];

export interface PeriodSelection {
  choice: PeriodChoice;
  from: string | null;
  to: string | null;
  breakdownBy: 'week' | 'month';
}

const DAY = /^\d{4}-\d{2}-\d{2}$/;
const validDay = (v: string | null) => (v && DAY.test(v) && !Number.isNaN(Date.parse(v)) ? v : null);

/** The period in the address (`?period=90d&by=week`, or `?period=custom&from=…&to=…`), so a view can be shared. */
export function periodFromSearch(search: URLSearchParams): PeriodSelection {
  const raw = search.get('period');
  const choice = (PERIOD_CHOICES.find((c) => c.value === raw)?.value ?? '1y') as PeriodChoice;
  const breakdownBy = search.get('by') === 'week' ? 'week' : 'month';
  return { choice, from: validDay(search.get('from')), to: validDay(search.get('to')), breakdownBy };
}

export function searchFromPeriod(p: PeriodSelection): Record<string, string> {
  const out: Record<string, string> = { period: p.choice, by: p.breakdownBy };
  if (p.choice === 'custom') {
    if (p.from) out.from = p.from;
    if (p.to) out.to = p.to;
  }
  return out;
}

/** A moment as the plant-local calendar day; its UTC day when this browser does not know the plant's zone. */
export function plantDay(iso: string, timeZone: string): string {
  try {
    return plantDayOf(Date.parse(iso), timeZone);
  } catch {
    return iso.slice(0, 10);
  }
}

/**
 * The request for a selection. "Last N days" count back from the unit's last day of data (not from
 * today: a unit whose data stops in spring still shows its last 30 days), "all" starts at its first day.
 */
export function periodQuery(p: PeriodSelection, data: { firstDay: string | null; lastDay: string | null }): HealthPeriodQuery {
  const q: HealthPeriodQuery = { breakdownBy: p.breakdownBy };
  if (p.choice === 'custom') {
    if (p.from) q.from = p.from;
    if (p.to) q.to = p.to;
    if (q.from && q.to && q.from > q.to) [q.from, q.to] = [q.to, q.from];
    return q;
  }
  if (p.choice === 'all') {
    if (data.firstDay) q.from = data.firstDay;
    return q;
  }
  const days = PERIOD_CHOICES.find((c) => c.value === p.choice)?.days ?? 365;
  if (data.lastDay) q.from = addDays(data.lastDay, -(days - 1));
  return q;
}

/** Where a unit's data starts and ends, and its plant's zone: what a period needs to become a request. */
export interface HealthUnitSpan {
  timeZone: string;
  firstSampleUtc: string | null;
  lastSampleUtc: string | null;
}

/** The health request for the period in the address (one computation for the page and its loader). */
export function healthQueryFor(search: URLSearchParams, unit: HealthUnitSpan): HealthPeriodQuery {
  const firstDay = unit.firstSampleUtc ? plantDay(unit.firstSampleUtc, unit.timeZone) : null;
  const lastDay = unit.lastSampleUtc ? plantDay(unit.lastSampleUtc, unit.timeZone) : null;
  return periodQuery(periodFromSearch(search), { firstDay, lastDay });
}
