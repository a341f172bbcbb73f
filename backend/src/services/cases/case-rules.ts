/**
 * Who may do what with a cleaning case, and in which status: one table read by every status change and by the
 * view's `actions`, so the screens offer exactly what the server allows. Viewers see approved cases only.
 */
import { can, type Role } from '@shared/permissions.js';
import type { CaseActions, CaseStatus } from '@shared/schemas/cases.js';

export type CaseAction = keyof CaseActions;

export interface Refusal {
  status: 403 | 409;
  message: string;
}

const WHY_LOCKED: Record<CaseStatus, string> = {
  draft: 'it is a draft',
  submitted: 'it is submitted and waits for an approver’s decision (an approver can send it back)',
  approved: 'it is approved and kept as decided (copy it as a new draft to change it)',
  returned: 'it was returned to its author',
  archived: 'it is archived (copy it as a new draft to work on it again)',
};

export function visibleTo(role: Role, status: CaseStatus): boolean {
  return role !== 'viewer' || status === 'approved';
}

/** What the rules read of a case: its status and the people who wrote, changed and submitted it. */
export interface CaseParties {
  status: CaseStatus;
  authorId: string;
  /** who submitted it last */
  submittedById?: string | null;
  /** everyone who changed its title or inputs since the last decision (or since it was created) */
  editorIdsSinceDecision?: string[] | null;
}

/** Why the member may not take the action now, or null when they may. */
export function refusal(action: CaseAction, c: CaseParties, who: { userId: string; role: Role }): Refusal | null {
  const writer = can(who.role, 'data.write');
  const decider = can(who.role, 'cases.approve');
  const status = c.status;
  switch (action) {
    case 'edit':
      if (!writer) return { status: 403, message: 'Only administrators and analysts can change a case' };
      if (status !== 'draft' && status !== 'returned') return { status: 409, message: `This case cannot be changed: ${WHY_LOCKED[status]}` };
      return null;
    case 'submit':
      if (!writer) return { status: 403, message: 'Only the author, an analyst or an administrator can submit a case' };
      if (status !== 'draft' && status !== 'returned')
        return { status: 409, message: `Only a draft or a returned case can be submitted: ${WHY_LOCKED[status]}` };
      return null;
    case 'approve':
    case 'return': {
      const verb = action === 'approve' ? 'approved' : 'sent back';
      if (!decider) return { status: 403, message: 'Only approvers and administrators decide on a case' };
      if (c.authorId === who.userId) return { status: 403, message: 'You wrote this case: another approver or administrator decides on it' };
      if (c.editorIdsSinceDecision?.includes(who.userId))
        return { status: 403, message: 'You changed this case since its last decision: another approver or administrator decides on it' };
      if (c.submittedById === who.userId) return { status: 403, message: 'You submitted this case: another approver or administrator decides on it' };
      if (status !== 'submitted') return { status: 409, message: `Only a submitted case can be ${verb}: ${WHY_LOCKED[status]}` };
      return null;
    }
    case 'archive':
      if (!writer) return { status: 403, message: 'Only administrators and analysts can archive a case' };
      if (status === 'submitted') return { status: 409, message: 'A submitted case cannot be archived: it waits for an approver’s decision' };
      if (status === 'archived') return { status: 409, message: 'This case is archived already' };
      return null;
    case 'copy':
      return writer ? null : { status: 403, message: 'Only administrators and analysts can copy a case' };
    case 'comment':
      return who.role === 'viewer' ? { status: 403, message: 'Viewers read cases; members with another role comment on them' } : null;
  }
}

export function actionsFor(c: CaseParties, who: { userId: string; role: Role }): CaseActions {
  const ok = (a: CaseAction) => refusal(a, c, who) === null;
  return {
    edit: ok('edit'),
    submit: ok('submit'),
    approve: ok('approve'),
    return: ok('return'),
    archive: ok('archive'),
    copy: ok('copy'),
    comment: ok('comment'),
  };
}
