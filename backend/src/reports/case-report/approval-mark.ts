/**
 * Whether a case is the approved document or not, and the words that say so on every page of its report.
 * Only an approved case (or an archived one that had been approved) goes without the mark.
 */
import type { CaseView } from '@shared/schemas/cases.js';
import { formatDayOfMoment } from '@shared/text/display-format.js';

export const STATUS_LABELS: Record<CaseView['status'], string> = {
  draft: 'Draft',
  submitted: 'Submitted for approval',
  approved: 'Approved',
  returned: 'Returned to the author',
  archived: 'Archived',
};

export function wasApproved(view: CaseView): boolean {
  if (view.status === 'approved') return true;
  return view.status === 'archived' && view.decidedBy !== null && view.decidedAt !== null && view.returnReason === null;
}

/** The band printed at the top of every page of a case that is not approved; null for an approved case. */
export function notApprovedMark(view: CaseView): string | null {
  if (wasApproved(view)) return null;
  return `NOT APPROVED — ${STATUS_LABELS[view.status].toUpperCase()}: for discussion, not a budget document`;
}

/** "Approved by Dana Whitlock on 14 Mar 2026", "Returned by … on …", or "Not decided yet". */
export function decisionLine(view: CaseView): string {
  if (!view.decidedBy || !view.decidedAt) return 'Not decided yet';
  const day = formatDayOfMoment(view.decidedAt, view.timeZone);
  if (wasApproved(view)) return `Approved by ${view.decidedBy.name} on ${day}`;
  if (view.returnReason !== null) return `Returned by ${view.decidedBy.name} on ${day}`;
  return 'Not decided yet';
}
