/** Scales, ticks and axes shared by the report's vector charts. */
import { FONT } from '../fonts.js';
import { fitLine } from '../layout.js';
import { pdfText } from '../pdf-text.js';
import { COLOR, SIZE } from '../theme.js';

type Doc = PDFKit.PDFDocument;

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export type Scale = (v: number) => number;

export function linear(domain: [number, number], range: [number, number]): Scale {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const span = d1 - d0 || 1;
  return (v) => r0 + ((v - d0) / span) * (r1 - r0);
}

/** Round tick values covering [min, max], about `count` of them (steps of 1, 2 or 5 × 10^n). */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!(max > min)) return [min];
  const raw = (max - min) / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const ticks: number[] = [];
  for (let v = Math.ceil(min / step) * step; v <= max + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

/** The domain widened to whole ticks, so bars and lines end on a labelled value. */
export function niceDomain(min: number, max: number, count = 5): [number, number] {
  if (!(max > min)) return [min - 1, max + 1];
  const ticks = niceTicks(min, max, count);
  const [firstTick = min, secondTick] = ticks;
  const lastTick = ticks.at(-1) ?? max;
  const step = secondTick !== undefined ? secondTick - firstTick : (max - min) / count;
  return [Math.min(firstTick, Math.floor(min / step) * step), Math.max(lastTick, Math.ceil(max / step) * step)];
}

/** Money on an axis, short: "$250K", "-$1.2M". */
export function compactMoney(value: number, currency: string): string {
  try {
    return new Intl.NumberFormat('en-US', {
      style: 'currency',
      currency,
      notation: 'compact',
      minimumFractionDigits: 0,
      maximumFractionDigits: 1,
      signDisplay: 'negative',
    }).format(value);
  } catch {
    return `${currency} ${new Intl.NumberFormat('en-US', { notation: 'compact', maximumFractionDigits: 1 }).format(value)}`;
  }
}

export function chartTitle(doc: Doc, box: Box, title: string, note?: string): void {
  doc.font(FONT.semibold).fontSize(SIZE.subheading).fillColor(COLOR.ink);
  doc.text(fitLine(doc, title, box.width), box.x, box.y - 30, { lineBreak: false });
  if (note) {
    doc.font(FONT.regular).fontSize(SIZE.tiny).fillColor(COLOR.muted);
    doc.text(fitLine(doc, note, box.width), box.x, box.y - 16, { lineBreak: false });
  }
}

/** Horizontal grid lines with labels on the left. */
export function yAxis(doc: Doc, box: Box, ticks: number[], y: Scale, label: (v: number) => string): void {
  doc.lineWidth(0.4).strokeColor(COLOR.rule);
  for (const t of ticks) {
    const py = y(t);
    doc
      .moveTo(box.x, py)
      .lineTo(box.x + box.width, py)
      .stroke();
    doc
      .font(FONT.regular)
      .fontSize(SIZE.tiny)
      .fillColor(COLOR.muted)
      .text(pdfText(label(t)), box.x - 52, py - 3.5, { width: 48, align: 'right', lineBreak: false });
  }
}

/** Vertical ticks with labels below the plot area. */
export function xAxis(doc: Doc, box: Box, ticks: { at: number; label: string }[]): void {
  const base = box.y + box.height;
  doc
    .moveTo(box.x, base)
    .lineTo(box.x + box.width, base)
    .lineWidth(0.6)
    .strokeColor(COLOR.muted)
    .stroke();
  for (const t of ticks) {
    doc
      .moveTo(t.at, base)
      .lineTo(t.at, base + 3)
      .lineWidth(0.6)
      .strokeColor(COLOR.muted)
      .stroke();
    doc
      .font(FONT.regular)
      .fontSize(SIZE.tiny)
      .fillColor(COLOR.muted)
      .text(pdfText(t.label), t.at - 30, base + 5, { width: 60, align: 'center', lineBreak: false });
  }
}

/** A small legend row: coloured swatches with their labels, left to right. */
export function legend(doc: Doc, x: number, y: number, items: { color: string; label: string; kind?: 'box' | 'line' | 'dash' }[]): void {
  let cx = x;
  doc.font(FONT.regular).fontSize(SIZE.tiny);
  for (const item of items) {
    if (item.kind === 'line' || item.kind === 'dash') {
      if (item.kind === 'dash') doc.dash(2.5, { space: 2 });
      doc
        .moveTo(cx, y + 3.5)
        .lineTo(cx + 12, y + 3.5)
        .lineWidth(1.2)
        .strokeColor(item.color)
        .stroke();
      doc.undash();
    } else {
      doc.rect(cx, y + 0.5, 10, 6).fill(item.color);
    }
    const t = pdfText(item.label);
    doc.fillColor(COLOR.muted).text(t, cx + 15, y, { lineBreak: false });
    cx += 15 + doc.widthOfString(t) + 12;
  }
}
