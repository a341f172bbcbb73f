/**
 * A case's status changes: submit (draft or returned → submitted), approve and return (submitted → approved or
 * returned, never by the case's author, its submitter or anyone who changed it since the last decision; a decision
 * naming the version it read is refused when the case changed since), archive (draft, returned or approved → archived). Each one locks the
 * case's row, is written to the audit log and mails the people who act next, all in one transaction.
 */
import type { DataSource } from 'typeorm';
import type { CaseStatus, CaseView } from '@shared/schemas/cases.js';
import { CleaningCase } from '../../entities/cleaning-case.entity.js';
import { AppError } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { recordAudit } from '../audit.service.js';
import { assertMay, caseInScope } from './case-access.js';
import { mailAuthor, mailDeciders } from './case-mail.js';
import type { CaseAction } from './case-rules.js';
import { caseViewOf, namesOf } from './case-view.js';

export type Transition = 'submit' | 'approve' | 'return' | 'archive';

const TARGET: Record<Transition, CaseStatus> = { submit: 'submitted', approve: 'approved', return: 'returned', archive: 'archived' };

export async function changeCaseStatus(
  ds: DataSource,
  scope: TenantScope,
  id: string,
  transition: Transition,
  opts: { reason?: string; seenUpdatedAt?: string; baseUrl: string | null },
): Promise<CaseView> {
  return ds.transaction(async (em) => {
    const found = await caseInScope(em, scope, id, true);
    const { record } = found;
    assertMay(transition satisfies CaseAction, record, scope);
    if (opts.seenUpdatedAt !== undefined && new Date(opts.seenUpdatedAt).getTime() !== record.updatedAt.getTime()) {
      throw new AppError(409, 'The case changed since you opened it: reload it and read it again before deciding');
    }
    const from = record.status;
    const now = new Date();
    record.status = TARGET[transition];
    record.updatedAt = now;
    if (transition === 'submit') {
      record.submittedAt = now;
      record.submittedById = scope.userId;
      record.unitNameAtSubmit = found.unit.name;
      record.plantNameAtSubmit = found.plant.name;
      record.decidedAt = null;
      record.decidedById = null;
      record.returnReason = null;
    }
    if (transition === 'approve' || transition === 'return') {
      record.decidedAt = now;
      record.decidedById = scope.userId;
      record.editorIdsSinceDecision = [];
      record.returnReason = transition === 'return' ? (opts.reason ?? null) : null;
    }
    if (transition === 'archive') record.archivedAt = now;
    await em.getRepository(CleaningCase).save(record);
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: `case.${TARGET[transition]}`,
      entityType: 'cleaning-case',
      entityId: record.id,
      details: { title: record.title, from, to: record.status, ...(transition === 'return' ? { reason: opts.reason } : {}) },
    });
    const name = (await namesOf(em, [scope.userId])).get(scope.userId) ?? 'A member';
    // No address to link to (the demo seed): the change is made without mail.
    if (opts.baseUrl === null) return caseViewOf(em, scope, found);
    if (transition === 'submit') await mailDeciders(em, found, { id: scope.userId, name }, opts.baseUrl);
    if (transition === 'approve' || transition === 'return') await mailAuthor(em, found, record.status as 'approved' | 'returned', name, opts.baseUrl);
    return caseViewOf(em, scope, found);
  });
}
