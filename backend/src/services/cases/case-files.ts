/** A case as a report: the PDF and the workbook drawn by reports/case-report from the same view the API answers. */
import type { DataSource } from 'typeorm';
import { Organisation } from '../../entities/organisation.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { REPORT_CONTENT_TYPES, reportFileName, type ReportFileKind } from '../../reports/report-file-name.js';
import { renderCasePdf, renderCaseXlsx } from '../../reports/case-report/index.js';
import { caseInScope } from './case-access.js';
import { commentsOfCase } from './case-comments.js';
import { caseViewOf } from './case-view.js';

export type CaseFileKind = ReportFileKind;

const CONTENT_TYPES = REPORT_CONTENT_TYPES;

export function caseFileName(title: string, id: string, kind: CaseFileKind): string {
  return reportFileName('cleaning-case', title, id, kind);
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
