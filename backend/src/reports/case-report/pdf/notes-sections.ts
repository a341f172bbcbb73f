/** Method notes, cautions, warnings, the comment thread and the closing lines on what the figures rest on. */
import type { CaseView } from '@shared/schemas/cases.js';
import { formatDayOfMoment } from '@shared/text/display-format.js';
import { CLEANING_WORK_CAUTION, caseMethods, chosenMethods, reportCautions } from '../case-methods.js';
import { dataBasisLine, ESTIMATES_LINE } from '../data-basis.js';
import type { CaseReportContext } from '../report-context.js';
import { FONT } from './fonts.js';
import { bullets, heading, paragraph, subheading } from './layout.js';
import { COLOR, SIZE } from './theme.js';

type Doc = PDFKit.PDFDocument;

export function methodNotesSection(doc: Doc, view: CaseView): void {
  heading(doc, 'Cleaning methods: notes and sources');
  const chosen = new Set(chosenMethods(view).map((m) => m.id));
  for (const m of caseMethods(view)) {
    subheading(doc, `${m.name}${chosen.has(m.id) ? ' (in the recommended schedule)' : ''}`);
    const source = m.typical
      ? 'Values: typical orders of magnitude (common practice), not the plant’s own quotes.'
      : 'Values: the organisation’s method library.';
    paragraph(doc, m.note ? `${m.note}` : 'No note or source recorded with this method.', { size: SIZE.small });
    if (!m.note || !m.typical) paragraph(doc, source, { size: SIZE.small, color: COLOR.muted });
  }
}

export function cautionsSection(doc: Doc, view: CaseView): void {
  heading(doc, 'Cautions');
  paragraph(doc, CLEANING_WORK_CAUTION, { font: FONT.semibold });
  bullets(doc, reportCautions(view), { size: SIZE.small });
}

export function warningsSection(doc: Doc, view: CaseView): void {
  const warnings = [...view.results.warnings];
  if (warnings.length === 0) return;
  heading(doc, 'Warnings from the calculation', 60);
  bullets(doc, warnings, { size: SIZE.small });
}

export function commentsSection(doc: Doc, view: CaseView, ctx: CaseReportContext): void {
  if (ctx.comments.length === 0) return;
  heading(doc, 'Comments', 60);
  for (const c of ctx.comments) {
    paragraph(doc, `${c.author.name}, ${formatDayOfMoment(c.createdAt, view.timeZone)}`, { size: SIZE.small, font: FONT.semibold, color: COLOR.muted });
    paragraph(doc, c.text, { size: SIZE.small });
  }
}

export function closingSection(doc: Doc, view: CaseView): void {
  heading(doc, 'Basis', 60);
  paragraph(doc, ESTIMATES_LINE, { font: FONT.semibold });
  paragraph(doc, dataBasisLine(view), { size: SIZE.small });
}
