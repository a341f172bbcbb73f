/** The plan's net cash flow against the baseline, one bar per horizon year (the start first). */
import { formatCurrency } from '@shared/text/display-format.js';
import { FONT } from '../fonts.js';
import { pdfText } from '../pdf-text.js';
import { COLOR, SIZE } from '../theme.js';
import type { YearlyRow } from '../../yearly-rows.js';
import { chartTitle, compactMoney, linear, niceDomain, niceTicks, xAxis, yAxis, type Box } from './chart-frame.js';

type Doc = PDFKit.PDFDocument;

export function cashflowChart(doc: Doc, box: Box, rows: YearlyRow[], currency: string): void {
  chartTitle(doc, box, 'Net cash flow by year', 'Fouling cost saved minus extra cleaning and downtime cost, against the baseline');
  const values = rows.map((r) => r.cashflow);
  const [lo, hi] = niceDomain(Math.min(0, ...values), Math.max(0, ...values), 4);
  const y = linear([lo, hi], [box.y + box.height, box.y]);
  yAxis(doc, box, niceTicks(lo, hi, 4), y, (v) => compactMoney(v, currency));
  const slot = box.width / rows.length;
  const barWidth = Math.min(56, slot * 0.55);
  rows.forEach((r, i) => {
    const cx = box.x + slot * (i + 0.5);
    const top = y(Math.max(0, r.cashflow));
    const height = Math.max(0.6, Math.abs(y(r.cashflow) - y(0)));
    doc.rect(cx - barWidth / 2, top, barWidth, height).fill(r.cashflow < 0 ? COLOR.negative : COLOR.positive);
    const label = pdfText(formatCurrency(r.cashflow, currency));
    // above the bar, or above the zero line for a negative year, so the label never meets the axis below
    const ly = (r.cashflow < 0 ? y(0) : top) - 10;
    doc
      .font(FONT.semibold)
      .fontSize(SIZE.tiny)
      .fillColor(COLOR.ink)
      .text(label, cx - slot / 2, ly, { width: slot, align: 'center', lineBreak: false });
  });
  doc
    .moveTo(box.x, y(0))
    .lineTo(box.x + box.width, y(0))
    .lineWidth(0.8)
    .strokeColor(COLOR.ink)
    .stroke();
  xAxis(
    doc,
    box,
    rows.map((r, i) => ({ at: box.x + slot * (i + 0.5), label: r.label })),
  );
}
