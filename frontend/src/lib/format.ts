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
