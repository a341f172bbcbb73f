import type { CaseStatus } from '@shared/schemas/cases';

export const STATUS_WORDS: Record<CaseStatus, string> = {
  draft: 'Draft',
  submitted: 'Waiting for approval',
  approved: 'Approved',
  returned: 'Sent back',
  archived: 'Archived',
};

const STYLE: Record<CaseStatus, string> = {
  draft: 'border-rule bg-paper-sunk text-ink-soft',
  submitted: 'border-tube-600/40 bg-tube-50 text-tube-700',
  approved: 'border-ok/40 bg-paper-raised text-ok',
  returned: 'border-warn/40 bg-ledger-50 text-warn',
  archived: 'border-rule bg-paper-raised text-ink-faint',
};

export function CaseStatusBadge({ status }: { status: CaseStatus }) {
  return (
    <span className={`inline-block rounded border px-1.5 py-px text-xs font-medium whitespace-nowrap ${STYLE[status]}`} data-testid="case-status">
      {STATUS_WORDS[status]}
    </span>
  );
}
