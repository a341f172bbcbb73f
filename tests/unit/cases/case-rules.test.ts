import { describe, expect, it } from 'vitest';
import { CASE_STATUSES, type CaseStatus } from '@shared/schemas/cases.js';
import type { Role } from '@shared/permissions.js';
import { actionsFor, refusal, visibleTo } from '../../../backend/src/services/cases/case-rules.js';

const AUTHOR = 'author-id';
const other = (role: Role) => ({ userId: 'someone-else', role });

describe('who may do what with a cleaning case', () => {
  it('a case is edited only as a draft or returned, by an analyst or administrator', () => {
    const editable = CASE_STATUSES.filter((status) => refusal('edit', { status, authorId: AUTHOR }, other('analyst')) === null);
    expect(editable).toEqual(['draft', 'returned']);
    expect(refusal('edit', { status: 'draft', authorId: AUTHOR }, other('approver'))?.status).toBe(403);
    expect(refusal('edit', { status: 'approved', authorId: AUTHOR }, other('admin'))).toEqual({ status: 409, message: expect.stringMatching(/approved/) });
  });

  it('only a submitted case is decided, and never by its author', () => {
    const decidable = CASE_STATUSES.filter((status) => refusal('approve', { status, authorId: AUTHOR }, other('approver')) === null);
    expect(decidable).toEqual(['submitted']);
    expect(refusal('return', { status: 'submitted', authorId: AUTHOR }, { userId: AUTHOR, role: 'admin' })?.status).toBe(403);
    expect(refusal('approve', { status: 'submitted', authorId: AUTHOR }, other('analyst'))?.status).toBe(403);
  });

  it('a member who changed the case since its last decision, or submitted it, does not decide it; others do', () => {
    const c = { status: 'submitted' as const, authorId: AUTHOR, submittedById: 'submitter', editorIdsSinceDecision: ['editor-1', 'editor-2'] };
    for (const userId of ['editor-1', 'editor-2', 'submitter']) {
      expect(refusal('approve', c, { userId, role: 'admin' })).toEqual({ status: 403, message: expect.stringMatching(/changed|submitted/) });
      expect(refusal('return', c, { userId, role: 'approver' })?.status).toBe(403);
      expect(actionsFor(c, { userId, role: 'admin' })).toMatchObject({ approve: false, return: false });
    }
    expect(refusal('approve', c, other('approver'))).toBeNull();
    expect(refusal('approve', { ...c, editorIdsSinceDecision: [] }, { userId: 'editor-1', role: 'admin' })).toBeNull();
  });

  it('draft, returned and approved cases may be archived; a submitted or archived one may not', () => {
    const archivable = CASE_STATUSES.filter((status) => refusal('archive', { status, authorId: AUTHOR }, other('analyst')) === null);
    expect(archivable).toEqual(['draft', 'approved', 'returned']);
  });

  it('viewers see approved cases only and may do nothing with them', () => {
    expect(CASE_STATUSES.filter((s: CaseStatus) => visibleTo('viewer', s))).toEqual(['approved']);
    expect(CASE_STATUSES.every((s) => visibleTo('approver', s))).toBe(true);
    expect(Object.values(actionsFor({ status: 'approved', authorId: AUTHOR }, other('viewer'))).some(Boolean)).toBe(false);
  });
});
