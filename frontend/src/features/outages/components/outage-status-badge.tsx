import type { OutageStatus } from '@shared/schemas/outages';

export const OUTAGE_STATUS_WORDS: Record<OutageStatus, string> = {
  draft: 'Being planned',
  approved: 'Scope approved',
};

const STYLE: Record<OutageStatus, string> = {
  draft: 'border-rule bg-paper-sunk text-ink-soft',
  approved: 'border-ok/40 bg-paper-raised text-ok',
};

export function OutageStatusBadge({ status }: { status: OutageStatus }) {
  return (
    <span className={`inline-block rounded border px-1.5 py-px text-xs font-medium whitespace-nowrap ${STYLE[status]}`} data-testid="outage-status">
      {OUTAGE_STATUS_WORDS[status]}
    </span>
  );
}
