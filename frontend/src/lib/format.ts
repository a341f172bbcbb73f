import { formatNumber, threeLetterMonths } from '@shared/text/display-format';
/**
 * Dates and times for display: one place, so every screen reads the same way. A day reads "14 Mar 2026"; a
 * moment reads "14 Mar 2026, 09:05 UTC+1" and always names its zone, in one style everywhere: the offset from
 * UTC (the short names browsers give differ by zone and language: "CET" for Berlin but "GMT-6" for Chicago).
 */
const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
const readerZone = (): string => Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';

/** A zone at a moment as its offset from UTC: "UTC", "UTC+1", "UTC−6", "UTC+5:30". */
export function zoneName(at: Date, timeZone: string): string {
  const raw =
    new Intl.DateTimeFormat('en-GB', { timeZone, timeZoneName: 'shortOffset' }).formatToParts(at).find((p) => p.type === 'timeZoneName')?.value ?? 'GMT';
  return raw
    .replace(/^GMT/, 'UTC')
    .replace(/^UTC\+0$/, 'UTC')
    .replace('-', '−');
}

function moment(at: Date, timeZone: string): string {
  const text = new Intl.DateTimeFormat('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    timeZone,
  }).format(at);
  return `${threeLetterMonths(text)} ${zoneName(at, timeZone)}`;
}

export const formatDate = (iso: string | null | undefined): string => (iso ? threeLetterMonths(dateFormat.format(new Date(iso))) : '—');

/** A moment of the records (an import, a recompute, an audit entry) on the reader's clock, or a given zone's, with the zone named. */
export function formatDateTime(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '—';
  try {
    return moment(new Date(iso), timeZone ?? readerZone());
  } catch {
    return moment(new Date(iso), 'UTC');
  }
}

/** A calendar month ("2025-09" or a day in it) as "Sep 2025": chart axes and breakdown bars. */
export function formatMonth(monthOrDay: string): string {
  // en-US: three letters for every month (en-GB writes "Sept")
  return new Intl.DateTimeFormat('en-US', { month: 'short', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${monthOrDay.slice(0, 7)}-01T00:00:00Z`));
}

export const ROLE_LABELS = { admin: 'Administrator', analyst: 'Analyst', approver: 'Approver', viewer: 'Viewer' } as const;
export const ROLE_NOTES = {
  admin: 'everything, including members and billing',
  analyst: 'plants, data and cases',
  approver: 'reads everything, approves cases',
  viewer: 'reads dashboards and approved cases',
} as const;

/**
 * Numbers, money, percentages and plant-local days read the same on every screen and in the reports: one
 * implementation in shared (never "-$0", the currency's own sign, grouped thousands, "14 Mar 2026").
 */
export { formatCurrency, formatDay, formatNumber, formatPercent } from '@shared/text/display-format';
/** Money: the same as formatCurrency (one currency format everywhere). */
export { formatCurrency as formatMoney } from '@shared/text/display-format';

/** A file size: bytes below 1 KB, then KB, then MB with one decimal. */
export const formatBytes = (bytes: number): string =>
  bytes >= 1024 * 1024 ? `${formatNumber(bytes / 1024 / 1024, 1)} MB` : bytes >= 1024 ? `${formatNumber(bytes / 1024)} KB` : `${formatNumber(bytes)} bytes`;

/** A moment on a plant's own clock, its zone named as every zone is, e.g. "2 Jun 2025, 00:00 UTC−5". */
export function formatPlantTime(iso: string | null | undefined, timeZone: string): string {
  if (!iso) return '—';
  try {
    return moment(new Date(iso), timeZone);
  } catch {
    return formatDateTime(iso);
  }
}

/** A plant-local calendar day. */
export function formatPlantDate(iso: string | null | undefined, timeZone: string): string {
  if (!iso) return '—';
  try {
    return threeLetterMonths(new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone }).format(new Date(iso)));
  } catch {
    return formatDate(iso);
  }
}
