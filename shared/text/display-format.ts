/**
 * Figures as people read them, the same on the case page and in the case report (PDF and spreadsheet), so a
 * number in the report reads exactly as on screen: calendar days as "14 Mar 2026", money with the currency's own
 * sign rounded to whole units unless asked otherwise, grouped thousands. Pure: only Intl, no clock, no zone of
 * the machine (a plant-local day is formatted as the day it names).
 */

const dayFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** Three letters for every month, as on the chart axes: recent ICU writes September "Sept" in en-GB. */
export const threeLetterMonths = (text: string): string => text.replace(/\bSept\b/g, 'Sep');

/** A plant-local calendar day ("2026-03-14") as "14 Mar 2026"; a dash when there is none. */
export function formatDay(day: string | null | undefined): string {
  return day ? threeLetterMonths(dayFormat.format(new Date(`${day.slice(0, 10)}T00:00:00Z`))) : '—';
}

/** A moment (ISO timestamp) as the calendar day it falls on in a time zone, e.g. the plant's; "14 Mar 2026". */
export function formatDayOfMoment(iso: string | Date | null | undefined, timeZone: string): string {
  if (!iso) return '—';
  const at = typeof iso === 'string' ? new Date(iso) : iso;
  try {
    return threeLetterMonths(new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone }).format(at));
  } catch {
    return threeLetterMonths(dayFormat.format(at));
  }
}

/** A number with fixed decimals and thousands grouping, or a dash; never "-0". */
export function formatNumber(value: number | null | undefined, decimals = 0): string {
  return value === null || value === undefined || !Number.isFinite(value)
    ? '—'
    : value.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals, signDisplay: 'negative' });
}

/** A typed value as entered: grouped thousands, up to `maxDecimals` decimals without trailing zeros. */
export function formatPlain(value: number, maxDecimals = 6): string {
  return Number.isFinite(value) ? value.toLocaleString('en-US', { minimumFractionDigits: 0, maximumFractionDigits: maxDecimals }) : '—';
}

/**
 * Money with the currency's own sign where it has one ("$48,200", "€48,200", "-$1,250"); an unknown code reads
 * "XYZ 48,200". Whole currency units by default, as every money figure of a case is shown. A value that rounds
 * to zero reads "$0", never "-$0".
 */
export function formatCurrency(value: number | null | undefined, currency: string, decimals = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  try {
    return new Intl.NumberFormat('en-US', {
      style: 'currency',
      currency,
      minimumFractionDigits: decimals,
      maximumFractionDigits: decimals,
      signDisplay: 'negative',
    }).format(value);
  } catch {
    return `${currency} ${formatNumber(value, decimals)}`;
  }
}

/** A fraction as a percentage: 0.853 → "85.3 %". */
export function formatPercent(fraction: number | null | undefined, decimals = 1): string {
  return fraction === null || fraction === undefined || !Number.isFinite(fraction) ? '—' : `${formatNumber(fraction * 100, decimals)} %`;
}

/** Years with one decimal: 1.44 → "1.4 years", 1 → "1.0 year". */
export function formatYears(years: number | null | undefined): string {
  if (years === null || years === undefined || !Number.isFinite(years)) return '—';
  const text = formatNumber(years, 1);
  return `${text} ${text === '1.0' ? 'year' : 'years'}`;
}
