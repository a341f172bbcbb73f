/**
 * How far the NPV moves when one input goes to its low or its high value, the others at base: one bar per
 * input, the widest swing on top, around the base NPV.
 */
import type { CaseView } from '@shared/schemas/cases.js';
import { formatCurrency, formatPercent, formatPlain } from '@shared/text/display-format.js';
import { FONT } from '../fonts.js';
import { pdfText } from '../pdf-text.js';
import { COLOR, SIZE } from '../theme.js';
import { UNCERTAIN_INPUT_LABELS } from '../../report-labels.js';
import { chartTitle, compactMoney, legend, linear, niceDomain, niceTicks, xAxis, type Box } from './chart-frame.js';

type Doc = PDFKit.PDFDocument;
type Sensitivity = NonNullable<CaseView['results']['sensitivity']>;

const LABEL_WIDTH = 150;

function rangeText(input: Sensitivity['bars'][number]): string {
  if (input.input === 'discountRate') return `${formatPercent(input.low)} to ${formatPercent(input.high)}`;
  if (input.input === 'recoveredCleanliness') return `${formatPlain(input.low)} to ${formatPlain(input.high)}`;
  return `×${formatPlain(input.low)} to ×${formatPlain(input.high)}`;
}

export function sensitivityChartHeight(s: Sensitivity): number {
  return s.bars.length * 20 + 4;
}

export function sensitivityChart(doc: Doc, outer: Box, s: Sensitivity, currency: string): void {
  chartTitle(doc, outer, 'Sensitivity of the NPV', `Each input at its low and high value, the others at base; base NPV ${formatCurrency(s.baseNpv, currency)}`);
  const box = { ...outer, x: outer.x + LABEL_WIDTH, width: outer.width - LABEL_WIDTH };
  const bars = [...s.bars].sort((a, b) => b.swing - a.swing);
  const all = bars.flatMap((b) => [b.npvAtLow, b.npvAtHigh]).concat(s.baseNpv);
  const [lo, hi] = niceDomain(Math.min(...all), Math.max(...all), 5);
  const x = linear([lo, hi], [box.x, box.x + box.width]);
  const rowH = box.height / bars.length;
  const ticks = niceTicks(lo, hi, 5);
  doc.lineWidth(0.4).strokeColor(COLOR.rule);
  for (const t of ticks)
    doc
      .moveTo(x(t), box.y)
      .lineTo(x(t), box.y + box.height)
      .stroke();
  bars.forEach((b, i) => {
    const cy = box.y + rowH * i + rowH / 2;
    const label = UNCERTAIN_INPUT_LABELS[b.input].name;
    doc
      .font(FONT.semibold)
      .fontSize(SIZE.tiny)
      .fillColor(COLOR.ink)
      .text(pdfText(label), outer.x, cy - 7, { width: LABEL_WIDTH - 8, lineBreak: false });
    doc
      .font(FONT.regular)
      .fontSize(SIZE.tiny)
      .fillColor(COLOR.muted)
      .text(pdfText(rangeText(b)), outer.x, cy + 1, { width: LABEL_WIDTH - 8, lineBreak: false });
    const base = x(s.baseNpv);
    const h = Math.min(12, rowH * 0.6);
    for (const [npv, color] of [
      [b.npvAtLow, COLOR.accentLight],
      [b.npvAtHigh, COLOR.accent],
    ] as const) {
      const end = x(npv);
      doc.rect(Math.min(base, end), cy - h / 2, Math.max(0.6, Math.abs(end - base)), h).fill(color);
    }
  });
  doc
    .moveTo(x(s.baseNpv), box.y - 2)
    .lineTo(x(s.baseNpv), box.y + box.height)
    .lineWidth(1)
    .strokeColor(COLOR.ink)
    .stroke();
  xAxis(
    doc,
    box,
    ticks.map((t) => ({ at: x(t), label: compactMoney(t, currency) })),
  );
  legend(doc, box.x, box.y + box.height + 20, [
    { color: COLOR.accentLight, label: 'NPV with the input at its low value' },
    { color: COLOR.accent, label: 'at its high value' },
    { color: COLOR.ink, label: 'base NPV', kind: 'line' },
  ]);
}
