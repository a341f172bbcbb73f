/**
 * What every page carries, drawn once all pages exist: the not-approved band at the top of a case that is not
 * approved, and the footer with the case, the day the report was made and "Page n of m".
 */
import type { CaseView } from '@shared/schemas/cases.js';
import { formatDayOfMoment } from '@shared/text/display-format.js';
import { notApprovedMark } from '../approval-mark.js';
import type { CaseReportContext } from '../report-context.js';
import { FONT } from './fonts.js';
import { fitLine } from './layout.js';
import { pdfText } from './pdf-text.js';
import { COLOR, CONTENT_WIDTH, PAGE, SIZE } from './theme.js';

export function framePages(doc: PDFKit.PDFDocument, view: CaseView, ctx: CaseReportContext): void {
  const mark = notApprovedMark(view);
  const range = doc.bufferedPageRange();
  const footerLeft = `${ctx.organisationName} · ${view.plantName} · ${view.unitName} · ${view.title}`;
  const generated = `Report made ${formatDayOfMoment(ctx.generatedAt, view.timeZone)}`;
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // writing in the margins must not start a new page
    const margins = { ...doc.page.margins };
    doc.page.margins = { top: 0, bottom: 0, left: 0, right: 0 };
    if (mark) {
      doc.rect(0, 18, PAGE.width, 24).fill(COLOR.markBand);
      doc
        .font(FONT.bold)
        .fontSize(SIZE.small)
        .fillColor(COLOR.markInk)
        .text(pdfText(mark), PAGE.marginX, 26, { width: CONTENT_WIDTH, align: 'center', lineBreak: false });
    } else {
      doc.font(FONT.semibold).fontSize(SIZE.tiny).fillColor(COLOR.muted);
      doc.text(fitLine(doc, `Approved case · ${view.title}`, CONTENT_WIDTH), PAGE.marginX, 28, { lineBreak: false });
    }
    const y = PAGE.height - 40;
    doc
      .moveTo(PAGE.marginX, y - 6)
      .lineTo(PAGE.marginX + CONTENT_WIDTH, y - 6)
      .lineWidth(0.5)
      .strokeColor(COLOR.rule)
      .stroke();
    doc.font(FONT.regular).fontSize(SIZE.tiny).fillColor(COLOR.muted);
    doc.text(fitLine(doc, footerLeft, CONTENT_WIDTH - 100), PAGE.marginX, y, { lineBreak: false });
    doc.text(`Page ${i - range.start + 1} of ${range.count}`, PAGE.marginX + CONTENT_WIDTH - 90, y, { width: 90, align: 'right', lineBreak: false });
    doc.text(pdfText(`${generated} · Estimates from the data and assumptions shown. · Cleancase`), PAGE.marginX, y + 10, {
      width: CONTENT_WIDTH,
      lineBreak: false,
    });
    doc.page.margins = margins;
  }
}
