import { REJECTION_REASONS, type RejectionReason } from '@shared/domain/validity/rejection-reasons';
import type { ImportQuantity } from '@shared/schemas/import-mapping';
import type { ImportStatus } from '../api/get-import';

export const QUANTITY_LABELS: Record<ImportQuantity, string> = {
  grossLoad: 'Gross load',
  backpressure: 'Backpressure (absolute)',
  condenserVacuum: 'Condenser vacuum (below barometer)',
  barometer: 'Barometer',
  cwInletTemperature: 'CW inlet temperature',
  cwOutletTemperature: 'CW outlet temperature',
  cwFlow: 'CW flow',
  hotwellTemperature: 'Hotwell temperature',
  dissolvedOxygen: 'Dissolved oxygen',
  airRemovalFlow: 'Air-removal flow',
  cwDifferentialPressure: 'CW differential pressure',
  condensateFlow: 'Condensate flow',
};

const UNIT_LABELS: Record<string, string> = { degC: '°C', degF: '°F', 'm3/h': 'm³/h', 'm3/s': 'm³/s', kPa: 'kPa', inHg: 'inHg', ftH2O: 'ft H₂O' };
export const unitLabel = (code: string): string => UNIT_LABELS[code] ?? code;

export const TIMESTAMP_FORMAT_LABELS = {
  'iso-8601-offset': 'ISO 8601 with UTC offset (2025-03-10T14:00-05:00)',
  'local-text': 'Local date and time as text',
  'excel-serial': 'Excel date number',
} as const;

export const DATE_ORDER_LABELS = { ymd: 'Year-month-day (2025-03-10)', mdy: 'Month/day/year (03/10/2025)', dmy: 'Day.month.year (10.03.2025)' } as const;

export const REPEATED_HOUR_LABELS = {
  'by-file-order': 'By the order in the file (first pass is the earlier)',
  earlier: 'Always the earlier (daylight time)',
  later: 'Always the later (standard time)',
  reject: 'Treat as an error',
} as const;

export const STATUS_LABELS: Record<ImportStatus, string> = {
  mapping: 'Waiting for column mapping',
  checking: 'Checking',
  rejected: 'Rejected: file errors',
  importing: 'Importing',
  complete: 'Imported',
  failed: 'Failed',
  undone: 'Undone',
};

/** A reason code as words people read; unknown codes (newer server) as they are. */
export const reasonLabel = (code: string): string => {
  const text: string | undefined = REJECTION_REASONS[code as RejectionReason];
  return text ? text.charAt(0).toUpperCase() + text.slice(1) : code;
};
