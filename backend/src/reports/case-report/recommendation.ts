/** The recommendation of a case in one paragraph, with the same figures as the case page. */
import type { CaseView } from '@shared/schemas/cases.js';
import { addDays, daysBetween } from '@shared/domain/calendar/plant-date.js';
import { formatCurrency, formatDay, formatNumber, formatPercent, formatYears } from '@shared/text/display-format.js';
import { methodName } from './case-methods.js';

export function baselineText(view: CaseView): string {
  const b = view.inputs.baseline;
  switch (b.kind) {
    case 'never':
      return 'not cleaning at all in the horizon';
    case 'next-planned-outage':
      return `cleaning by ${methodName(view, b.methodId)} at the next planned outage`;
    case 'every-planned-outage':
      return `cleaning by ${methodName(view, b.methodId)} at every planned outage`;
    case 'fixed':
      return `the fixed plan of ${b.cleanings.length} ${b.cleanings.length === 1 ? 'cleaning' : 'cleanings'}`;
  }
}

const unitDuring = (c: CaseView['results']['cleanings'][number], days: number) =>
  c.daysInPlannedOutage >= days ? 'inside a planned outage' : c.daysInPlannedOutage > 0 ? 'partly inside a planned outage' : 'outside any planned outage';

export function horizonText(view: CaseView): string {
  const end = addDays(view.inputs.startDate, view.inputs.horizonDays - 1);
  return `${formatDay(view.inputs.startDate)} – ${formatDay(end)}`;
}

export function recommendationText(view: CaseView): string {
  const { cleanings, businessCase: bc } = view.results;
  const money = (v: number) => formatCurrency(v, view.currency);
  const horizon = `the horizon of ${formatNumber(view.inputs.horizonDays)} days (${horizonText(view)})`;
  const first = cleanings[0];
  const plan = first
    ? (() => {
        const days = daysBetween(first.date, first.endDate) + 1;
        const count = cleanings.length === 1 ? 'This is the only cleaning' : `It is the first of ${cleanings.length} cleanings`;
        return `Clean the condenser of ${view.unitName} first on ${formatDay(first.date)} by ${first.methodName} (${days} ${days === 1 ? 'day' : 'days'}, ${unitDuring(first, days)}). ${count} in ${horizon}.`;
      })()
    : `No cleaning pays for itself in ${horizon}: the least-cost plan is not to clean ${view.unitName}.`;
  const npv = `Against the baseline of ${baselineText(view)}, the plan's net present value is ${money(bc.npv)} at a discount rate of ${formatPercent(view.inputs.discountRate)}`;
  const payback =
    bc.paybackYears === null
      ? 'it does not pay back within the horizon'
      : bc.paybackYears === 0
        ? 'it pays back at once (its cumulative cash flow is never below zero)'
        : `it pays back in ${formatYears(bc.paybackYears)}${bc.discountedPaybackYears === null ? ' (not within the horizon once discounted)' : ` (${formatYears(bc.discountedPaybackYears)} discounted)`}`;
  return `${plan} ${npv}; ${payback}.`;
}
