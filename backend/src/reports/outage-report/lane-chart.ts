/**
 * The lane chart: one row per crew lane, the window's days across, each chosen item a bar after the one before it
 * in its lane (lanes run side by side). Drawn as vector paths with pdfkit; a lane running past the window shows its
 * excess in the warning colour.
 */
import { FONT } from '../case-report/pdf/fonts.js';
import { ensureSpace, fitLine } from '../case-report/pdf/layout.js';
import { pdfText } from '../case-report/pdf/pdf-text.js';
import { COLOR, CONTENT_WIDTH, PAGE, SIZE } from '../case-report/pdf/theme.js';
import type { ReportContent } from './report-content.js';

const LABEL_WIDTH = 90;
const ROW = 22;
const BAR = 14;

/** Day ticks: about eight across the window, on round steps. */
export function dayTicks(windowDays: number): number[] {
  const step = [1, 2, 5, 7, 10, 14, 15, 30, 60, 90].find((s) => windowDays / s <= 8) ?? 120;
  const ticks: number[] = [];
  for (let d = 0; d <= windowDays; d += step) ticks.push(d);
  if (ticks.at(-1) !== windowDays) ticks.push(windowDays);
  return ticks;
}

export function laneChart(doc: PDFKit.PDFDocument, content: ReportContent, windowDays: number): void {
  if (content.lanes.length === 0) return;
  const longest = Math.max(windowDays, ...content.lanes.map((l) => l.days));
  const height = content.lanes.length * ROW + 30;
  ensureSpace(doc, height + 10);
  const x0 = PAGE.marginX + LABEL_WIDTH;
  const width = CONTENT_WIDTH - LABEL_WIDTH;
  const xOf = (day: number) => x0 + (day / longest) * width;
  const top = doc.y + 4;
  const bottom = top + content.lanes.length * ROW;
  doc.font(FONT.regular).fontSize(SIZE.tiny).fillColor(COLOR.muted);
  for (const d of dayTicks(windowDays)) {
    doc.moveTo(xOf(d), top).lineTo(xOf(d), bottom).lineWidth(0.4).strokeColor(COLOR.rule).stroke();
    doc.fillColor(COLOR.muted).text(`${d}`, xOf(d) - 12, bottom + 3, { width: 24, align: 'center', lineBreak: false });
  }
  doc
    .moveTo(xOf(windowDays), top - 2)
    .lineTo(xOf(windowDays), bottom)
    .lineWidth(1.2)
    .strokeColor(COLOR.ink)
    .stroke();
  content.lanes.forEach((lane, r) => {
    const y = top + r * ROW + (ROW - BAR) / 2;
    doc.font(FONT.semibold).fontSize(SIZE.small).fillColor(COLOR.ink);
    doc.text(fitLine(doc, lane.lane, LABEL_WIDTH - 6), PAGE.marginX, y + 3, { width: LABEL_WIDTH - 6, lineBreak: false });
    for (const bar of lane.bars) {
      const inside = Math.min(bar.toDay, windowDays);
      if (inside > bar.fromDay) doc.rect(xOf(bar.fromDay), y, xOf(inside) - xOf(bar.fromDay), BAR).fill(COLOR.accentLight);
      if (bar.toDay > windowDays)
        doc.rect(xOf(Math.max(bar.fromDay, windowDays)), y, xOf(bar.toDay) - xOf(Math.max(bar.fromDay, windowDays)), BAR).fill(COLOR.negative);
      doc
        .rect(xOf(bar.fromDay), y, xOf(bar.toDay) - xOf(bar.fromDay), BAR)
        .lineWidth(0.6)
        .strokeColor(COLOR.accent)
        .stroke();
      const w = xOf(bar.toDay) - xOf(bar.fromDay) - 4;
      if (w > 14) {
        doc.font(FONT.regular).fontSize(SIZE.tiny).fillColor(COLOR.ink);
        doc.text(fitLine(doc, `${bar.item.title} (${bar.item.durationDays} d)`, w), xOf(bar.fromDay) + 2, y + 4, { width: w, lineBreak: false });
      }
    }
  });
  doc.font(FONT.regular).fontSize(SIZE.tiny).fillColor(COLOR.muted);
  doc.text(pdfText(`Days from the window’s first day; the dark line marks the window’s end (${windowDays} days).`), PAGE.marginX, bottom + 14, {
    width: CONTENT_WIDTH,
  });
  doc.x = PAGE.marginX;
  doc.moveDown(0.6);
}
