/** Dates and times for display: one place, so every table reads the same way. */
const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
const dateTimeFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

export const formatDate = (iso: string | null | undefined): string => (iso ? dateFormat.format(new Date(iso)) : '—');
export const formatDateTime = (iso: string | null | undefined): string => (iso ? dateTimeFormat.format(new Date(iso)) : '—');

export const ROLE_LABELS = { admin: 'Administrator', analyst: 'Analyst', approver: 'Approver', viewer: 'Viewer' } as const;
export const ROLE_NOTES = {
  admin: 'everything, including members and billing',
  analyst: 'plants, data and cases',
  approver: 'reads everything, approves cases',
  viewer: 'reads dashboards and approved cases',
} as const;

/** A number with fixed decimals and thousands grouping, or a dash. */
export const formatNumber = (value: number | null | undefined, decimals = 0): string =>
  value === null || value === undefined || !Number.isFinite(value)
    ? '—'
    : value.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });

/** Money with its currency code, e.g. "USD 48,200". */
export const formatMoney = (value: number | null | undefined, currency = 'USD', decimals = 0): string =>
  value === null || value === undefined ? '—' : `${currency} ${formatNumber(value, decimals)}`;

/**
 * Money with the currency's own sign where it has one, e.g. "$48,200" or "€48,200"; an unknown code
 * falls back to "XYZ 48,200".
 */
export function formatCurrency(value: number | null | undefined, currency = 'USD', decimals = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  try {
    return new Intl.NumberFormat('en-US', { style: 'currency', currency, minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(value);
  } catch {
    return formatMoney(value, currency, decimals);
  }
}

/** A fraction as a percentage, e.g. 0.853 → "85.3 %". */
export const formatPercent = (fraction: number | null | undefined, decimals = 1): string =>
  fraction === null || fraction === undefined ? '—' : `${formatNumber(fraction * 100, decimals)} %`;

/** Bytes as KB/MB for file sizes. */
export const formatBytes = (bytes: number): string =>
  bytes >= 1024 * 1024 ? `${formatNumber(bytes / 1024 / 1024, 1)} MB` : `${formatNumber(Math.max(1, Math.round(bytes / 1024)))} KB`;

/** A moment on a plant's own clock, with the zone's short name, e.g. "2 Jun 2025, 00:00 CDT". */
export function formatPlantTime(iso: string | null | undefined, timeZone: string): string {
  if (!iso) return '—';
  try {
    return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone, timeZoneName: 'short' }).format(new Date(iso));
  } catch {
    return formatDateTime(iso);
  }
}

/** A plant-local calendar day. */
export function formatPlantDate(iso: string | null | undefined, timeZone: string): string {
  if (!iso) return '—';
  try {
    return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone }).format(new Date(iso));
  } catch {
    return formatDate(iso);
  }
}

const dayFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** A calendar day already in the plant's time ("2025-04-20") as "20 Apr 2025", with no zone shift. */
export const formatDay = (day: string | null | undefined): string => (day ? dayFormat.format(new Date(`${day.slice(0, 10)}T00:00:00Z`)) : '—');
