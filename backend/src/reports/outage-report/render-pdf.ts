/**
 * The outage-scope report as an A4 PDF, with the case report's fonts (Inter), page geometry and table layout:
 * the outage and its window, budget and totals, the chosen items, what was left out and why, the lane chart, the
 * approver (or "Not approved yet") and the cautions for the kinds of work chosen.
 */
import PDFDocument from 'pdfkit';
import type { OutageView } from '@shared/schemas/outages.js';
import { formatCurrency, formatDay, formatDayOfMoment } from '@shared/text/display-format.js';
import { FONT, registerFonts, regularFontPath } from '../case-report/pdf/fonts.js';
import { bullets, facts, fitLine, heading, paragraph, table } from '../case-report/pdf/layout.js';
import { pdfText } from '../case-report/pdf/pdf-text.js';
import { COLOR, CONTENT_WIDTH, PAGE, SIZE } from '../case-report/pdf/theme.js';
import { laneChart } from './lane-chart.js';
import { reportContent, type OutageReportContext } from './report-content.js';

export function renderOutagePdf(view: OutageView, ctx: OutageReportContext): Promise<Buffer> {
  const doc = new PDFDocument({
    size: PAGE.size,
    margins: { top: PAGE.marginTop, bottom: PAGE.marginBottom, left: PAGE.marginX, right: PAGE.marginX },
    bufferPages: true,
    font: regularFontPath(),
    info: { Title: pdfText(view.name), Subject: pdfText('Outage scope'), Creator: 'Cleancase' },
  });
  registerFonts(doc);
  doc.font(FONT.regular);
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const c = reportContent(view);
  const money = (v: number | null) => formatCurrency(v, view.currency);
  const days = view.approved?.windowDays ?? view.windowDays;
  const start = view.approved?.startDate ?? view.startDate;
  const end = view.approved?.endDate ?? view.endDate;
  const budget = view.approved?.budget ?? view.budget;

  doc
    .font(FONT.semibold)
    .fontSize(SIZE.small)
    .fillColor(COLOR.muted)
    .text(pdfText(`Outage scope · ${ctx.organisationName}`), PAGE.marginX, doc.y);
  doc
    .font(FONT.bold)
    .fontSize(SIZE.title)
    .fillColor(COLOR.ink)
    .text(pdfText(view.name), PAGE.marginX, doc.y + 2, { width: CONTENT_WIDTH });
  doc.moveDown(0.5);
  facts(doc, [
    ['Units', view.units.map((u) => `${u.plantName} ${u.name}`).join(', ') || '—'],
    ['Window', `${formatDay(start)} to ${formatDay(end)} (${days} days, both inside)`],
    ['Budget', money(budget)],
    ['Scope', c.basis],
    ['Chosen benefit', money(c.totalBenefit)],
    ['Chosen cost', money(c.totalCost)],
    ['Status', view.status === 'approved' ? 'Approved' : 'Draft'],
    ['Approval', c.approvedLine],
  ]);

  heading(doc, 'Chosen work');
  if (c.chosen.length === 0) paragraph(doc, 'No item is chosen yet.');
  else
    table(
      doc,
      [
        { header: 'Item', width: 30 },
        { header: 'Unit', width: 14 },
        { header: 'Lane', width: 12 },
        { header: 'Days', width: 7, align: 'right' },
        { header: 'Cost', width: 13, align: 'right' },
        { header: 'Benefit', width: 13, align: 'right' },
      ],
      [
        ...c.chosen.map((i) => ({ cells: [`${i.title}\n${c.kindWords(i)}`, i.unitName, i.lane, `${i.durationDays}`, money(i.cost), money(i.benefit)] })),
        { cells: ['Total', '', '', '', money(c.totalCost), money(c.totalBenefit)], bold: true },
      ],
    );

  heading(doc, 'Lanes across the window');
  if (c.lanes.length === 0) paragraph(doc, 'No lane has work yet.');
  else {
    paragraph(doc, c.lanes.map((l) => `${l.lane}: ${l.days} of ${days} days`).join(' · '), { size: SIZE.small, color: COLOR.muted });
    laneChart(doc, c, days);
  }

  heading(doc, 'Left out, and why');
  if (c.leftOut.length === 0) paragraph(doc, 'Nothing is left out.');
  else
    table(
      doc,
      [
        { header: 'Item', width: 28 },
        { header: 'Cost', width: 12, align: 'right' },
        { header: 'Benefit', width: 12, align: 'right' },
        { header: 'Why', width: 48 },
      ],
      c.leftOut.map((i) => ({ cells: [i.title, money(i.cost), money(i.benefit), c.reasons[i.id] ?? 'No reason recorded (added after the proposal)'] })),
    );

  heading(doc, 'How each benefit was priced');
  bullets(
    doc,
    c.items.map((i) => `${i.title}: ${i.pricing.text}`),
    { size: SIZE.small },
  );

  heading(doc, 'Why each chosen item is in');
  bullets(
    doc,
    c.chosen.map((i) => `${i.title}: ${c.reasons[i.id] ?? 'chosen'}`),
    { size: SIZE.small },
  );

  heading(doc, 'Safety cautions for this work');
  bullets(doc, view.cautions, { size: SIZE.small });

  const range = doc.bufferedPageRange();
  for (let p = range.start; p < range.start + range.count; p++) {
    doc.switchToPage(p);
    const margins = { ...doc.page.margins };
    doc.page.margins = { top: 0, bottom: 0, left: 0, right: 0 };
    if (view.status !== 'approved') {
      doc.rect(0, 18, PAGE.width, 24).fill(COLOR.markBand);
      doc
        .font(FONT.bold)
        .fontSize(SIZE.small)
        .fillColor(COLOR.markInk)
        .text('Not approved yet: a planning draft', PAGE.marginX, 26, { width: CONTENT_WIDTH, align: 'center', lineBreak: false });
    }
    const y = PAGE.height - 40;
    doc.font(FONT.regular).fontSize(SIZE.tiny).fillColor(COLOR.muted);
    doc.text(fitLine(doc, `${ctx.organisationName} · ${view.name}`, CONTENT_WIDTH - 100), PAGE.marginX, y, { lineBreak: false });
    doc.text(`Page ${p - range.start + 1} of ${range.count}`, PAGE.marginX + CONTENT_WIDTH - 90, y, { width: 90, align: 'right', lineBreak: false });
    doc.text(
      pdfText(`Report made ${formatDayOfMoment(ctx.generatedAt, c.timeZone)} · Estimates from the data and assumptions shown. · Cleancase`),
      PAGE.marginX,
      y + 10,
      { width: CONTENT_WIDTH, lineBreak: false },
    );
    doc.page.margins = margins;
  }
  doc.end();
  return done;
}
