import { formatNumber } from '@shared/text/display-format';
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
