/** The first part of the report: who, what and where, the status, the recommendation and the headline figures. */
import type { CaseView } from '@shared/schemas/cases.js';
import { formatCurrency, formatDayOfMoment, formatNumber, formatPercent, formatYears } from '@shared/text/display-format.js';
import { decisionLine, notApprovedMark, STATUS_LABELS } from '../approval-mark.js';
import { newerDataLine } from '../data-basis.js';
import { horizonText, recommendationText } from '../recommendation.js';
import type { CaseReportContext } from '../report-context.js';
import { FONT } from './fonts.js';
import { facts, heading, paragraph } from './layout.js';
import { pdfText } from './pdf-text.js';
import { COLOR, CONTENT_WIDTH, PAGE, SIZE } from './theme.js';
import { casePhysicalSentence } from '@shared/text/case-physical-text.js';

type Doc = PDFKit.PDFDocument;

export function titleBlock(doc: Doc, view: CaseView, ctx: CaseReportContext): void {
  doc
    .font(FONT.semibold)
    .fontSize(SIZE.small)
    .fillColor(COLOR.accent)
    .text(pdfText(`Condenser cleaning case · ${ctx.organisationName}`), PAGE.marginX, doc.y, { width: CONTENT_WIDTH });
  doc.moveDown(0.2);
  doc.font(FONT.bold).fontSize(SIZE.title).fillColor(COLOR.ink).text(pdfText(view.title), { width: CONTENT_WIDTH });
  doc.moveDown(0.5);
  const day = (iso: string | null) => formatDayOfMoment(iso, view.timeZone);
  const pairs: [string, string][] = [
    ['Organisation', ctx.organisationName],
    ['Status', STATUS_LABELS[view.status]],
    ['Plant', view.plantName],
    ['Unit', view.unitName],
    ['Author', view.author.name],
    ['Decision', decisionLine(view)],
    ['Created', day(view.createdAt)],
    ['Submitted', view.submittedAt ? day(view.submittedAt) : 'not yet'],
    ['Horizon', horizonText(view)],
    ['Currency', view.currency],
  ];
  if (view.archivedAt) pairs.push(['Archived', day(view.archivedAt)]);
  facts(doc, pairs);
  if (view.returnReason !== null && view.status === 'returned') paragraph(doc, `Returned because: ${view.returnReason}`, { color: COLOR.markInk });
  const mark = notApprovedMark(view);
  if (mark)
    paragraph(doc, 'This case is not approved: its figures are for discussion and are not a budget document until an approver approves it.', {
      color: COLOR.markInk,
      font: FONT.semibold,
    });

  heading(doc, 'Recommendation');
  paragraph(doc, recommendationText(view), { size: 10.5 });
  paragraph(doc, casePhysicalSentence(view.inputs, view.results.totals.foulingCost, view.results.baseline.totals.foulingCost), { size: SIZE.small });
  const newer = newerDataLine(view);
  if (newer) paragraph(doc, newer, { color: COLOR.muted, size: SIZE.small });
  keyFigures(doc, view);
}

function keyFigures(doc: Doc, view: CaseView): void {
  const bc = view.results.businessCase;
  const mc = view.results.monteCarlo;
  const money = (v: number) => formatCurrency(v, view.currency);
  const tiles: [string, string][] = [
    ['NPV against the baseline', money(bc.npv)],
    ['IRR', bc.irr === null ? 'none' : formatPercent(bc.irr)],
    ['Payback', bc.paybackYears === null ? 'not in the horizon' : formatYears(bc.paybackYears)],
    ['Discounted payback', bc.discountedPaybackYears === null ? 'not in the horizon' : formatYears(bc.discountedPaybackYears)],
    ['Benefit–cost ratio', bc.benefitCostRatio === null ? 'none' : formatNumber(bc.benefitCostRatio, 2)],
    ['Chance the NPV is positive', mc ? formatPercent(mc.probabilityNpvPositive) : 'not run'],
  ];
  const cols = 3;
  const w = CONTENT_WIDTH / cols;
  const h = 38;
  doc.moveDown(0.3);
  const top = doc.y;
  tiles.forEach(([label, value], i) => {
    const x = PAGE.marginX + (i % cols) * w;
    const y = top + Math.floor(i / cols) * (h + 6);
    doc.rect(x + 2, y, w - 4, h).fill(COLOR.zebra);
    doc
      .font(FONT.regular)
      .fontSize(SIZE.tiny)
      .fillColor(COLOR.muted)
      .text(pdfText(label), x + 9, y + 6, { width: w - 18, lineBreak: false });
    doc
      .font(FONT.bold)
      .fontSize(12)
      .fillColor(COLOR.ink)
      .text(pdfText(value), x + 9, y + 17, { width: w - 18, lineBreak: false });
  });
  doc.y = top + Math.ceil(tiles.length / cols) * (h + 6);
  doc.x = PAGE.marginX;
  const reasons = [bc.irrReason && `IRR: ${bc.irrReason}.`, bc.benefitCostReason && `Benefit–cost ratio: ${bc.benefitCostReason}.`].filter(Boolean) as string[];
  if (reasons.length) paragraph(doc, reasons.join(' '), { size: SIZE.tiny, color: COLOR.muted });
}
