/** An outage as a report: the PDF and the workbook drawn by reports/outage-report from the same view the API answers. */
import type { DataSource } from 'typeorm';
import { Organisation } from '../../entities/organisation.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { REPORT_CONTENT_TYPES, reportFileName, type ReportFileKind } from '../../reports/report-file-name.js';
import { renderOutagePdf, renderOutageXlsx } from '../../reports/outage-report/index.js';
import { outageInScope } from './outage-access.js';
import { outageViewOf } from './outage-view.js';

export type OutageFileKind = ReportFileKind;

const CONTENT_TYPES = REPORT_CONTENT_TYPES;

export function outageFileName(name: string, id: string, kind: OutageFileKind): string {
  return reportFileName('outage', name, id, kind);
}

export async function outageFile(
  ds: DataSource,
  scope: TenantScope,
  id: string,
  kind: OutageFileKind,
): Promise<{ fileName: string; contentType: string; body: Buffer }> {
  const em = ds.manager;
  const view = await outageViewOf(em, scope, await outageInScope(em, scope, id));
  const organisation = await em.getRepository(Organisation).findOneByOrFail({ id: scope.organisationId });
  const ctx = { organisationName: organisation.name, generatedAt: new Date() };
  const body = kind === 'pdf' ? await renderOutagePdf(view, ctx) : await renderOutageXlsx(view, ctx);
  return { fileName: outageFileName(view.name, view.id, kind), contentType: CONTENT_TYPES[kind], body };
}
