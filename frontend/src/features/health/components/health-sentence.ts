import { daysBetween } from '@shared/domain/calendar/plant-date';
import { formatCurrency, formatDay, formatNumber, formatPercent } from '@frontend/lib/format';
import type { HealthHeadline } from '../api/get-health';

/** Data older than this (days) is written in the past tense, on its own day. */
export const STALE_AFTER_DAYS = 2;
/** A plan resting on data older than this (days) says so (the same limit as the next-cleaning detail). */
export const STALE_PLAN_DAYS = 14;

const HOW: Record<'outage' | 'derate' | 'online', string> = {
  online: 'clean with the unit on line',
  derate: 'clean at reduced load',
  outage: 'clean in an outage',
};

/**
 * What matters now, in one plain sentence: the condition, what fouling costs a day, what to do and by when.
 * `today` is the plant's calendar day. Pure, so the wording is tested without a browser.
 */
export function healthSentence(h: HealthHeadline, today: string, currency: string): string {
  const ageDays = h.asOf ? daysBetween(h.asOf, today) : null;
  const old = ageDays !== null && ageDays > STALE_AFTER_DAYS;
  const is = old ? 'was' : 'is';
  const costs = old ? 'cost' : 'costs';

  let condition: string;
  if (h.cleanliness === null) condition = 'There is no recent cleanliness figure';
  else {
    const cf = formatPercent(h.cleanliness, 0);
    const ref = h.referenceCleanliness;
    const lead = old && h.asOf ? `On ${formatDay(h.asOf)}, the last day of data, cleanliness ${is} ${cf}` : `Cleanliness ${is} ${cf}`;
    if (ref === null) condition = lead;
    else if (h.cleanliness < ref - 0.005)
      condition = `${lead}, ${formatNumber((ref - h.cleanliness) * 100, 0)} points below the ${formatPercent(ref, 0)} reference`;
    else condition = `${lead}, at or above the ${formatPercent(ref, 0)} reference`;
  }

  const fouling = h.foulingCostPerDay;
  const cost =
    fouling === null
      ? ''
      : fouling >= 0.5
        ? ` and fouling ${costs} about ${formatCurrency(fouling, currency)} a day`
        : ` and fouling ${costs} nothing measurable a day`;

  return `${condition}${cost}: ${action(h.nextCleaning, today)}.`;
}

function action(outlook: HealthHeadline['nextCleaning'], today: string): string {
  if (!outlook || outlook.status === 'not-available') return 'there is no cleaning plan yet';
  if (outlook.status === 'none-needed' || !outlook.next) return 'no cleaning pays for itself in the coming year';
  const first = outlook.plan?.[0];
  const date = first?.date ?? outlook.next.date;
  const how = first ? HOW[first.unitDuringCleaning] : 'clean';
  if (date < today) return `the planned cleaning of ${formatDay(date)} is overdue; import recent data for a current plan`;
  const dataAge = outlook.dataTo ? daysBetween(outlook.dataTo, today) : null;
  const stale = dataAge !== null && dataAge > STALE_PLAN_DAYS ? ` (planned on data that ends ${formatDay(outlook.dataTo)})` : '';
  return `${how} (${outlook.next.methodName}) by ${formatDay(date)}${stale}`;
}
