/** What a report downloads as: its media type and a file name safe in a Content-Disposition header on every system. */
export type ReportFileKind = 'pdf' | 'xlsx';

export const REPORT_CONTENT_TYPES: Record<ReportFileKind, string> = {
  pdf: 'application/pdf',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
};

/** `<prefix>-<name in plain ASCII letters, digits and hyphens>-<first 8 of the id>.<kind>`. */
export function reportFileName(prefix: string, name: string, id: string, kind: ReportFileKind): string {
  const slug = name
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '')
    .toLowerCase();
  return `${prefix}-${slug || 'untitled'}-${id.slice(0, 8)}.${kind}`;
}
