/** The spread of the NPV over the Monte Carlo trials, with P10, P50 and P90 marked. */
import type { CaseView } from '@shared/schemas/cases.js';
import { formatCurrency, formatNumber } from '@shared/text/display-format.js';
import { FONT } from '../fonts.js';
import { pdfText } from '../pdf-text.js';
import { COLOR, SIZE } from '../theme.js';
import { chartTitle, compactMoney, linear, niceTicks, xAxis, yAxis, type Box } from './chart-frame.js';

type Doc = PDFKit.PDFDocument;
type MonteCarlo = NonNullable<CaseView['results']['monteCarlo']>;

export function npvHistogram(doc: Doc, box: Box, mc: MonteCarlo, currency: string): void {
  chartTitle(doc, box, 'Distribution of the NPV', `${formatNumber(mc.trials)} trials (seed ${mc.seed}); P10, P50 and P90 marked`);
  const bins = mc.histogram;
  const firstBin = bins[0];
  const lastBin = bins.at(-1);
  if (!firstBin || !lastBin) return;
  const from = Math.min(firstBin.from, mc.p10Npv);
  const to = Math.max(lastBin.to, mc.p90Npv);
  const plot = { ...box, y: box.y + 30, height: box.height - 30 };
  const x = linear([from, to], [plot.x, plot.x + plot.width]);
  const maxCount = Math.max(...bins.map((b) => b.count), 1);
  const yTicks = niceTicks(0, maxCount, 3);
  const y = linear([0, Math.max(maxCount, yTicks.at(-1) ?? maxCount)], [plot.y + plot.height, plot.y]);
  yAxis(doc, plot, yTicks, y, (v) => formatNumber(v));
  for (const b of bins) {
    const left = x(b.from);
    const w = Math.max(0.5, x(b.to) - left - 0.8);
    const top = y(b.count);
    const fill = b.to <= 0 ? COLOR.negative : COLOR.accentLight;
    if (b.count > 0) doc.rect(left + 0.4, top, w, plot.y + plot.height - top).fill(fill);
  }
  if (from < 0 && to > 0)
    doc
      .moveTo(x(0), plot.y)
      .lineTo(x(0), plot.y + plot.height)
      .lineWidth(0.8)
      .strokeColor(COLOR.ink)
      .stroke();
  // P10, P50 and P90 on three label rows so close values never print over each other
  const marks: [string, number][] = [
    ['P10', mc.p10Npv],
    ['P50', mc.p50Npv],
    ['P90', mc.p90Npv],
  ];
  marks.forEach(([name, value], i) => {
    const at = x(value);
    const labelY = box.y + i * 10;
    doc
      .moveTo(at, labelY + 9)
      .lineTo(at, plot.y + plot.height)
      .lineWidth(0.9)
      .strokeColor(COLOR.ink)
      .dash(2, { space: 1.5 })
      .stroke()
      .undash();
    const text = pdfText(`${name} ${formatCurrency(value, currency)}`);
    doc.font(FONT.semibold).fontSize(SIZE.tiny).fillColor(COLOR.ink);
    const w = doc.widthOfString(text);
    const left = Math.min(Math.max(at - w / 2, box.x), box.x + box.width - w);
    doc.text(text, left, labelY, { lineBreak: false });
  });
  xAxis(
    doc,
    plot,
    niceTicks(from, to, 6).map((t) => ({ at: x(t), label: compactMoney(t, currency) })),
  );
}
