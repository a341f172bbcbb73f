/** Text blocks and tables that flow down the page and break to the next one cleanly. */
import { FONT } from './fonts.js';
import { pdfText } from './pdf-text.js';
import { COLOR, CONTENT_WIDTH, PAGE, SIZE } from './theme.js';

type Doc = PDFKit.PDFDocument;

const bottom = (doc: Doc) => doc.page.height - doc.page.margins.bottom;

/** The text cut with "…" to fit one line of `width` points in the current font and size. */
export function fitLine(doc: Doc, text: string, width: number): string {
  const t = pdfText(text);
  if (doc.widthOfString(t) <= width) return t;
  let keep = t.length;
  while (keep > 0 && doc.widthOfString(`${t.slice(0, keep).trimEnd()}…`) > width) keep--;
  return `${t.slice(0, keep).trimEnd()}…`;
}

/** Starts a new page unless `height` points still fit below the current position. */
export function ensureSpace(doc: Doc, height: number): void {
  if (doc.y + height > bottom(doc)) doc.addPage();
}

export function heading(doc: Doc, text: string, spaceNeeded = 90): void {
  ensureSpace(doc, spaceNeeded);
  doc.moveDown(0.8);
  doc.font(FONT.bold).fontSize(SIZE.heading).fillColor(COLOR.accent).text(pdfText(text), PAGE.marginX, doc.y, { width: CONTENT_WIDTH });
  const y = doc.y + 2;
  doc
    .moveTo(PAGE.marginX, y)
    .lineTo(PAGE.marginX + CONTENT_WIDTH, y)
    .lineWidth(0.6)
    .strokeColor(COLOR.rule)
    .stroke();
  doc.y = y + 6;
}

export function subheading(doc: Doc, text: string): void {
  ensureSpace(doc, 40);
  doc.moveDown(0.4);
  doc.font(FONT.semibold).fontSize(SIZE.subheading).fillColor(COLOR.ink).text(pdfText(text), PAGE.marginX, doc.y, { width: CONTENT_WIDTH });
  doc.moveDown(0.2);
}

export function paragraph(doc: Doc, text: string, options: { size?: number; color?: string; font?: string } = {}): void {
  doc
    .font(options.font ?? FONT.regular)
    .fontSize(options.size ?? SIZE.body)
    .fillColor(options.color ?? COLOR.ink);
  const t = pdfText(text);
  ensureSpace(doc, Math.min(doc.heightOfString(t, { width: CONTENT_WIDTH }), 60));
  doc.text(t, PAGE.marginX, doc.y, { width: CONTENT_WIDTH, lineGap: 1.5 });
  doc.moveDown(0.35);
}

export function bullets(doc: Doc, items: string[], options: { size?: number } = {}): void {
  const size = options.size ?? SIZE.body;
  for (const item of items) {
    doc.font(FONT.regular).fontSize(size).fillColor(COLOR.ink);
    const t = pdfText(item);
    const h = doc.heightOfString(t, { width: CONTENT_WIDTH - 12, lineGap: 1 });
    ensureSpace(doc, h + 2);
    const y = doc.y;
    doc.circle(PAGE.marginX + 3, y + size * 0.55, 1.4).fill(COLOR.muted);
    doc.fillColor(COLOR.ink).text(t, PAGE.marginX + 12, y, { width: CONTENT_WIDTH - 12, lineGap: 1 });
    doc.y += 3;
  }
}

export interface Column {
  header: string;
  /** share of the content width */
  width: number;
  align?: 'left' | 'right';
}

export interface TableRow {
  cells: string[];
  /** a group title spanning the row */
  band?: boolean;
  bold?: boolean;
}

const PAD = 3;

function rowHeight(doc: Doc, columns: Column[], widths: number[], row: TableRow, size: number): number {
  doc.font(row.bold || row.band ? FONT.semibold : FONT.regular).fontSize(size);
  if (row.band) return doc.heightOfString(pdfText(row.cells[0] ?? ''), { width: CONTENT_WIDTH - 2 * PAD }) + 2 * PAD;
  return Math.max(...row.cells.map((c, i) => doc.heightOfString(pdfText(c), { width: widths[i]! - 2 * PAD, lineGap: 0.5 }))) + 2 * PAD;
}

function drawHeader(doc: Doc, columns: Column[], widths: number[], size: number): void {
  doc.font(FONT.semibold).fontSize(size).fillColor(COLOR.muted);
  const h = Math.max(...columns.map((c, i) => doc.heightOfString(pdfText(c.header), { width: widths[i]! - 2 * PAD }))) + 2 * PAD;
  const y = doc.y;
  let x = PAGE.marginX;
  columns.forEach((c, i) => {
    doc.text(pdfText(c.header), x + PAD, y + PAD, { width: widths[i]! - 2 * PAD, align: c.align ?? 'left' });
    x += widths[i]!;
  });
  doc
    .moveTo(PAGE.marginX, y + h)
    .lineTo(PAGE.marginX + CONTENT_WIDTH, y + h)
    .lineWidth(0.8)
    .strokeColor(COLOR.ink)
    .stroke();
  doc.y = y + h + 1;
}

/** A table with its header repeated on every page it runs onto. */
export function table(doc: Doc, columns: Column[], rows: TableRow[], options: { size?: number } = {}): void {
  const size = options.size ?? SIZE.small;
  const total = columns.reduce((s, c) => s + c.width, 0);
  const widths = columns.map((c) => (c.width / total) * CONTENT_WIDTH);
  ensureSpace(doc, 40);
  drawHeader(doc, columns, widths, size);
  rows.forEach((row, r) => {
    const h = rowHeight(doc, columns, widths, row, size);
    if (doc.y + h > bottom(doc)) {
      doc.addPage();
      drawHeader(doc, columns, widths, size);
    }
    const y = doc.y;
    if (row.band) {
      doc.rect(PAGE.marginX, y, CONTENT_WIDTH, h).fill(COLOR.shade);
      doc
        .font(FONT.semibold)
        .fontSize(size)
        .fillColor(COLOR.ink)
        .text(pdfText(row.cells[0] ?? ''), PAGE.marginX + PAD, y + PAD, { width: CONTENT_WIDTH - 2 * PAD });
    } else {
      if (r % 2 === 1) doc.rect(PAGE.marginX, y, CONTENT_WIDTH, h).fill(COLOR.zebra);
      doc
        .font(row.bold ? FONT.semibold : FONT.regular)
        .fontSize(size)
        .fillColor(COLOR.ink);
      let x = PAGE.marginX;
      row.cells.forEach((cell, i) => {
        doc.text(pdfText(cell), x + PAD, y + PAD, { width: widths[i]! - 2 * PAD, align: columns[i]?.align ?? 'left', lineGap: 0.5 });
        x += widths[i]!;
      });
    }
    doc.y = y + h;
  });
  doc
    .moveTo(PAGE.marginX, doc.y)
    .lineTo(PAGE.marginX + CONTENT_WIDTH, doc.y)
    .lineWidth(0.5)
    .strokeColor(COLOR.rule)
    .stroke();
  doc.x = PAGE.marginX;
  doc.moveDown(0.5);
}

/** Label–value pairs in two columns of pairs, as in the title block. */
export function facts(doc: Doc, pairs: [string, string][]): void {
  const colWidth = CONTENT_WIDTH / 2;
  const labelWidth = 92;
  for (let i = 0; i < pairs.length; i += 2) {
    const row = pairs.slice(i, i + 2);
    doc.fontSize(SIZE.body);
    const h = Math.max(...row.map(([, v]) => doc.font(FONT.regular).heightOfString(pdfText(v), { width: colWidth - labelWidth - 8 }))) + 4;
    ensureSpace(doc, h);
    const y = doc.y;
    row.forEach(([label, value], k) => {
      const x = PAGE.marginX + k * colWidth;
      doc.font(FONT.semibold).fillColor(COLOR.muted).text(pdfText(label), x, y, { width: labelWidth });
      doc
        .font(FONT.regular)
        .fillColor(COLOR.ink)
        .text(pdfText(value), x + labelWidth, y, { width: colWidth - labelWidth - 8 });
    });
    doc.y = y + h;
  }
  doc.x = PAGE.marginX;
}
