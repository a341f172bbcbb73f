/** The comment thread of a case: whoever sees the case reads it; members other than viewers write in it. */
import type { DataSource, EntityManager } from 'typeorm';
import type { CaseComment, CaseCommentCreate } from '@shared/schemas/cases.js';
import { CaseCommentRecord } from '../../entities/case-comment.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { recordAudit } from '../audit.service.js';
import { assertMay, caseInScope } from './case-access.js';
import { namesOf } from './case-view.js';

async function views(em: EntityManager, rows: CaseCommentRecord[]): Promise<CaseComment[]> {
  const names = await namesOf(
    em,
    rows.map((r) => r.authorId),
  );
  return rows.map((r) => ({
    id: r.id,
    author: { id: r.authorId ?? '', name: (r.authorId && names.get(r.authorId)) || 'a former member' },
    text: r.text,
    createdAt: r.createdAt.toISOString(),
  }));
}

/** The thread, oldest first (for the report too). */
export async function commentsOfCase(em: EntityManager, caseId: string): Promise<CaseComment[]> {
  return views(em, await em.getRepository(CaseCommentRecord).find({ where: { caseId }, order: { createdAt: 'ASC', id: 'ASC' } }));
}

export async function listComments(ds: DataSource, scope: TenantScope, caseId: string): Promise<CaseComment[]> {
  const { record } = await caseInScope(ds.manager, scope, caseId);
  return commentsOfCase(ds.manager, record.id);
}

export async function addComment(ds: DataSource, scope: TenantScope, caseId: string, body: CaseCommentCreate): Promise<CaseComment> {
  return ds.transaction(async (em) => {
    const { record } = await caseInScope(em, scope, caseId);
    assertMay('comment', record, scope);
    const saved = await em
      .getRepository(CaseCommentRecord)
      .save({ organisationId: scope.organisationId, caseId: record.id, authorId: scope.userId, text: body.text });
    const stored = await em.getRepository(CaseCommentRecord).findOneByOrFail({ id: saved.id });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'case.commented',
      entityType: 'cleaning-case',
      entityId: record.id,
      details: { commentId: saved.id },
    });
    return (await views(em, [stored]))[0]!; // one stored comment in, one view out
  });
}
