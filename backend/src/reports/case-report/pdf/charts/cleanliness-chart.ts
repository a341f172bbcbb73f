/**
 * The cleanliness factor day by day over the horizon, under the recommended schedule: planned outages shaded,
 * each cleaning marked with its number, the reference cleanliness dashed.
 */
import { daysBetween, parsePlantDate } from '@shared/domain/calendar/plant-date.js';
import type { CaseView } from '@shared/schemas/cases.js';
import { formatNumber } from '@shared/text/display-format.js';
import { FONT } from '../fonts.js';
import { COLOR, SIZE } from '../theme.js';
import { chartTitle, legend, linear, niceTicks, xAxis, yAxis, type Box } from './chart-frame.js';

type Doc = PDFKit.PDFDocument;

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** First days of months inside the horizon, every `step` months, as day offsets from the start. */
function monthTicks(start: string, days: number): { day: number; label: string }[] {
  const step = days > 900 ? 6 : days > 400 ? 3 : 1;
  const out: { day: number; label: string }[] = [];
  const s = parsePlantDate(start);
  for (let k = 0; ; k++) {
    const month = ((s.month - 1 + k) % 12) + 1;
    const year = s.year + Math.floor((s.month - 1 + k) / 12);
    const first = `${year}-${String(month).padStart(2, '0')}-01`;
    const day = daysBetween(start, first);
    if (day >= days) break;
    if (day >= 0 && (month - 1) % step === 0) out.push({ day, label: `${MONTHS[month - 1]} ${year}` });
  }
  return out;
}

export function cleanlinessChart(doc: Doc, box: Box, view: CaseView): void {
  const { startDate, horizonDays, plannedOutages } = view.inputs;
  const daily = view.results.daily ?? [];
  chartTitle(doc, box, 'Cleanliness over the horizon', 'Cleanliness factor each day under the recommended schedule');
  const values = daily.map((d) => d.cleanliness);
  const ref = view.results.referenceCleanliness;
  const lo = Math.max(0, Math.floor((Math.min(ref, ...values) - 0.05) * 10) / 10);
  const hi = Math.min(1.2, Math.ceil((Math.max(ref, ...values) + 0.02) * 10) / 10);
  const x = linear([0, horizonDays], [box.x, box.x + box.width]);
  const y = linear([lo, hi], [box.y + box.height, box.y]);

  for (const o of plannedOutages ?? []) {
    const from = Math.max(0, daysBetween(startDate, o.from));
    const to = Math.min(horizonDays, daysBetween(startDate, o.to) + 1);
    if (to > from) doc.rect(x(from), box.y, x(to) - x(from), box.height).fill(COLOR.shade);
  }
  yAxis(doc, box, niceTicks(lo, hi, 5), y, (v) => formatNumber(v, 2));
  xAxis(
    doc,
    box,
    monthTicks(startDate, horizonDays).map((t) => ({ at: x(t.day), label: t.label })),
  );

  doc
    .dash(3, { space: 2 })
    .moveTo(box.x, y(ref))
    .lineTo(box.x + box.width, y(ref))
    .lineWidth(0.8)
    .strokeColor(COLOR.muted)
    .stroke()
    .undash();

  if (daily.length > 0) {
    daily.forEach((d, i) => (i === 0 ? doc.moveTo(x(i + 0.5), y(d.cleanliness)) : doc.lineTo(x(i + 0.5), y(d.cleanliness))));
    doc.lineWidth(1.2).lineJoin('round').strokeColor(COLOR.accent).stroke();
  } else {
    doc
      .font(FONT.regular)
      .fontSize(SIZE.small)
      .fillColor(COLOR.muted)
      .text('The daily path was not kept with this case.', box.x + 10, box.y + box.height / 2, { lineBreak: false });
  }

  // numbered markers while they have room; a plain tick per cleaning when they would touch
  const marks = view.results.cleanings.map((c) => x(daysBetween(startDate, c.date)));
  const numbered = marks.every((at, i) => i === 0 || at - marks[i - 1]! >= 12);
  marks.forEach((at, i) => {
    doc
      .moveTo(at, box.y + 8)
      .lineTo(at, box.y + box.height)
      .lineWidth(numbered ? 0.8 : 0.4)
      .strokeColor(COLOR.negative)
      .stroke();
    if (numbered) {
      doc.circle(at, box.y + 4, 5.5).fill(COLOR.negative);
      doc
        .font(FONT.bold)
        .fontSize(SIZE.tiny)
        .fillColor('#ffffff')
        .text(String(i + 1), at - 5.5, box.y + 1.2, { width: 11, align: 'center', lineBreak: false });
    } else {
      doc.polygon([at - 2.5, box.y + 2], [at + 2.5, box.y + 2], [at, box.y + 8]).fill(COLOR.negative);
    }
  });

  legend(doc, box.x, box.y + box.height + 20, [
    { color: COLOR.accent, label: 'cleanliness factor', kind: 'line' },
    { color: COLOR.muted, label: `reference cleanliness ${formatNumber(ref, 2)}`, kind: 'dash' },
    { color: COLOR.negative, label: numbered ? 'cleaning (numbered as in the schedule)' : 'cleaning (listed in the schedule)', kind: 'line' },
    { color: COLOR.shade, label: 'planned outage' },
  ]);
}
