/** The portfolio's own short names for conditions and case statuses. */
import type { UnitConditionKind } from '@shared/domain/portfolio/unit-conditions';
import type { CaseStatus } from '@shared/schemas/cases';

export const CONDITION_WORDS: Record<UnitConditionKind, string> = {
  'cleaning-now-pays': 'Cleaning pays now',
  'backpressure-unexplained': 'Backpressure not from fouling',
  'data-stopped': 'Data stopped',
};

export const CASE_WORDS: Record<CaseStatus, string> = {
  draft: 'draft',
  submitted: 'awaiting decision',
  approved: 'approved',
  returned: 'sent back',
  archived: 'archived',
};
