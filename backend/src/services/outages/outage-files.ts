/** An outage as a report: the PDF and the workbook drawn by reports/outage-report from the same view the API answers. */
import type { DataSource } from 'typeorm';
import { Organisation } from '../../entities/organisation.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { renderOutagePdf, renderOutageXlsx } from '../../reports/outage-report/index.js';
import { outageInScope } from './outage-access.js';
import { outageViewOf } from './outage-view.js';

export type OutageFileKind = 'pdf' | 'xlsx';

const CONTENT_TYPES: Record<OutageFileKind, string> = {
  pdf: 'application/pdf',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
};

/** A file name in plain ASCII letters, digits and hyphens (safe in a Content-Disposition header). */
export function outageFileName(name: string, id: string, kind: OutageFileKind): string {
  const slug = name
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '')
    .toLowerCase();
  return `outage-${slug || 'untitled'}-${id.slice(0, 8)}.${kind}`;
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
