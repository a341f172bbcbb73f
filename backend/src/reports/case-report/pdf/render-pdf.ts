/** The case report as an A4 PDF: Inter throughout, charts as vector paths, every page marked and numbered. */
import PDFDocument from 'pdfkit';
import type { CaseView } from '@shared/schemas/cases.js';
import type { CaseReportContext } from '../report-context.js';
import { FONT, registerFonts, regularFontPath } from './fonts.js';
import { inputSection } from './input-section.js';
import { cautionsSection, closingSection, commentsSection, methodNotesSection, warningsSection } from './notes-sections.js';
import { framePages } from './page-frame.js';
import { pdfText } from './pdf-text.js';
import { cashflowSection, scheduleSection, uncertaintySection } from './result-sections.js';
import { PAGE } from './theme.js';
import { titleBlock } from './title-block.js';

export function renderCasePdf(view: CaseView, ctx: CaseReportContext): Promise<Buffer> {
  const doc = new PDFDocument({
    size: PAGE.size,
    margins: { top: PAGE.marginTop, bottom: PAGE.marginBottom, left: PAGE.marginX, right: PAGE.marginX },
    bufferPages: true,
    font: regularFontPath(),
    info: {
      Title: pdfText(view.title),
      Author: pdfText(view.author.name),
      Subject: pdfText(`Condenser cleaning case, ${view.plantName} ${view.unitName}`),
      Creator: 'Cleancase',
    },
  });
  registerFonts(doc);
  doc.font(FONT.regular);
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  titleBlock(doc, view, ctx);
  scheduleSection(doc, view);
  cashflowSection(doc, view);
  uncertaintySection(doc, view);
  inputSection(doc, view);
  methodNotesSection(doc, view);
  cautionsSection(doc, view);
  warningsSection(doc, view);
  commentsSection(doc, view, ctx);
  closingSection(doc, view);
  framePages(doc, view, ctx);
  doc.end();
  return done;
}
