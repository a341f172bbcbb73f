/** A case as a report: the PDF and the workbook drawn by reports/case-report from the same view the API answers. */
import type { DataSource } from 'typeorm';
import { Organisation } from '../../entities/organisation.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { renderCasePdf, renderCaseXlsx } from '../../reports/case-report/index.js';
import { caseInScope } from './case-access.js';
import { commentsOfCase } from './case-comments.js';
import { caseViewOf } from './case-view.js';

export type CaseFileKind = 'pdf' | 'xlsx';

const CONTENT_TYPES: Record<CaseFileKind, string> = {
  pdf: 'application/pdf',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
};

/** A file name in plain ASCII letters, digits and hyphens (safe in a Content-Disposition header on every system). */
export function caseFileName(title: string, id: string, kind: CaseFileKind): string {
  const slug = title
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '')
    .toLowerCase();
  return `cleaning-case-${slug || 'untitled'}-${id.slice(0, 8)}.${kind}`;
}

export async function caseFile(
  ds: DataSource,
  scope: TenantScope,
  id: string,
  kind: CaseFileKind,
): Promise<{ fileName: string; contentType: string; body: Buffer }> {
  const em = ds.manager;
  const found = await caseInScope(em, scope, id);
  const view = await caseViewOf(em, scope, found);
  const organisation = await em.getRepository(Organisation).findOneByOrFail({ id: scope.organisationId });
  const ctx = { organisationName: organisation.name, generatedAt: new Date(), comments: await commentsOfCase(em, found.record.id) };
  const body = kind === 'pdf' ? await renderCasePdf(view, ctx) : await renderCaseXlsx(view, ctx);
  return { fileName: caseFileName(view.title, view.id, kind), contentType: CONTENT_TYPES[kind], body };
}
