import type { CleaningMethod } from '@shared/schemas/cleaning-method';
import { formatNumber } from '@frontend/lib/format';

export const UNIT_DURING_CLEANING_LABELS: Record<CleaningMethod['unitDuringCleaning'], string> = {
  outage: 'Outage',
  derate: 'Derate',
  online: 'On line',
};

/** What the unit does while the cleaning runs, e.g. "Derate 50 %". */
export const unitDuringCleaningText = (m: Pick<CleaningMethod, 'unitDuringCleaning' | 'deratePct'>): string =>
  m.unitDuringCleaning === 'derate'
    ? `Derate ${formatNumber(m.deratePct, m.deratePct % 1 === 0 ? 0 : 1)} %`
    : UNIT_DURING_CLEANING_LABELS[m.unitDuringCleaning];

export const TYPICAL_VALUES_TITLE =
  'Typical orders of magnitude seeded with the library, not plant data: replace them with the plant’s own quotes and results.';
