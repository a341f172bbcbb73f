/** The results: the schedule against the baseline, the costs, the cash flows by year and the uncertainty. */
import type { CaseView } from '@shared/schemas/cases.js';
import { formatCurrency, formatDay, formatNumber, formatPercent } from '@shared/text/display-format.js';
import { baselineText } from '../recommendation.js';
import { yearlyRows } from '../yearly-rows.js';
import { cashflowChart } from './charts/cashflow-chart.js';
import { cleanlinessChart } from './charts/cleanliness-chart.js';
import { npvHistogram } from './charts/npv-histogram.js';
import { sensitivityChart, sensitivityChartHeight } from './charts/sensitivity-chart.js';
import { ensureSpace, heading, paragraph, subheading, table, type TableRow } from './layout.js';
import { COLOR, CONTENT_WIDTH, PAGE, SIZE } from './theme.js';

type Doc = PDFKit.PDFDocument;
type Cleaning = CaseView['results']['cleanings'][number];

/** Room for a chart: its title above (30 pt) and axis labels and legend below (34 pt). */
function chartBox(doc: Doc, plotHeight: number, leftAxis = 52) {
  ensureSpace(doc, plotHeight + 30 + 40);
  const box = { x: PAGE.marginX + leftAxis, y: doc.y + 30, width: CONTENT_WIDTH - leftAxis, height: plotHeight };
  return { box, after: () => ((doc.y = box.y + box.height + 40), (doc.x = PAGE.marginX)) };
}

function cleaningRows(cleanings: Cleaning[], currency: string): TableRow[] {
  return cleanings.map((c, i) => ({
    cells: [
      String(i + 1),
      `${formatDay(c.date)} – ${formatDay(c.endDate)}`,
      c.methodName,
      formatCurrency(c.cleaningCost, currency),
      formatCurrency(c.downtimeCost, currency),
      `${formatNumber(c.cleanlinessBefore, 2)} to ${formatNumber(c.cleanlinessAfter, 2)}`,
      String(c.daysInPlannedOutage),
    ],
  }));
}

const CLEANING_COLUMNS = [
  { header: '#', width: 4 },
  { header: 'Dates', width: 24 },
  { header: 'Method', width: 28 },
  { header: 'Cleaning cost', width: 13, align: 'right' as const },
  { header: 'Downtime cost', width: 13, align: 'right' as const },
  { header: 'Cleanliness', width: 12 },
  { header: 'Days in outage', width: 9, align: 'right' as const },
];

export function scheduleSection(doc: Doc, view: CaseView): void {
  const r = view.results;
  heading(doc, 'Recommended schedule', 260);
  const chart = chartBox(doc, 150);
  cleanlinessChart(doc, chart.box, view);
  chart.after();
  if (r.cleanings.length) table(doc, CLEANING_COLUMNS, cleaningRows(r.cleanings, view.currency));
  else paragraph(doc, 'No cleaning in the horizon.');
  subheading(doc, `Baseline: ${baselineText(view)}`);
  if (r.baseline.cleanings.length) table(doc, CLEANING_COLUMNS, cleaningRows(r.baseline.cleanings, view.currency));
  else paragraph(doc, 'The baseline has no cleaning in the horizon.', { size: SIZE.small });
  if (r.baseline.ruleBreaks.length)
    paragraph(doc, `The baseline breaks these rules: ${r.baseline.ruleBreaks.join('; ')}`, { size: SIZE.small, color: COLOR.muted });

  subheading(doc, 'Costs over the horizon');
  const money = (v: number) => formatCurrency(v, view.currency);
  const line = (name: string, k: 'foulingCost' | 'cleaningCost' | 'downtimeCost' | 'total'): TableRow => ({
    cells: [name, money(r.totals[k]), money(r.baseline.totals[k]), money(r.discountedTotals[k]), money(r.baseline.discountedTotals[k])],
    bold: k === 'total',
  });
  table(
    doc,
    [
      { header: 'Cost', width: 28 },
      { header: 'Plan', width: 18, align: 'right' },
      { header: 'Baseline', width: 18, align: 'right' },
      { header: 'Plan, discounted', width: 18, align: 'right' },
      { header: 'Baseline, discounted', width: 18, align: 'right' },
    ],
    [line('Fouling (lost output and fuel)', 'foulingCost'), line('Cleaning', 'cleaningCost'), line('Downtime', 'downtimeCost'), line('Total', 'total')],
  );
}

export function cashflowSection(doc: Doc, view: CaseView): void {
  const rows = yearlyRows(view);
  const money = (v: number) => formatCurrency(v, view.currency);
  heading(doc, 'Cash flows by year', 250);
  const chart = chartBox(doc, 120);
  cashflowChart(doc, chart.box, rows, view.currency);
  chart.after();
  table(
    doc,
    [
      { header: 'Year', width: 9 },
      { header: 'Period', width: 25 },
      { header: 'Fouling cost saved', width: 16, align: 'right' },
      { header: 'Extra cleaning and downtime', width: 17, align: 'right' },
      { header: 'Net cash flow', width: 16, align: 'right' },
      { header: 'Cumulative', width: 17, align: 'right' },
    ],
    rows.map((y) => ({
      cells: [
        y.label,
        y.label === 'Start' ? `${formatDay(y.from)} (upfront cost)` : `${formatDay(y.from)} – ${formatDay(y.to)}`,
        money(y.foulingSavings),
        money(y.extraCleaningCosts),
        money(y.cashflow),
        money(y.cumulative),
      ],
    })),
  );
  paragraph(
    doc,
    `Net present value at ${formatPercent(view.inputs.discountRate)}: ${money(view.results.businessCase.npv)} (cash flows at the end of each year, the upfront cost at the start).`,
    {
      size: SIZE.small,
    },
  );
}

export function uncertaintySection(doc: Doc, view: CaseView): void {
  const { sensitivity, monteCarlo } = view.results;
  heading(doc, 'Uncertainty', 240);
  if (!sensitivity && !monteCarlo) {
    paragraph(doc, 'No sensitivity or Monte Carlo analysis was run for this case.');
    return;
  }
  if (sensitivity && sensitivity.bars.length) {
    const chart = chartBox(doc, sensitivityChartHeight(sensitivity), 0);
    sensitivityChart(doc, chart.box, sensitivity, view.currency);
    chart.after();
  }
  if (monteCarlo) {
    const money = (v: number) => formatCurrency(v, view.currency);
    const chart = chartBox(doc, 150);
    npvHistogram(doc, chart.box, monteCarlo, view.currency);
    chart.after();
    doc.y -= 14;
    table(
      doc,
      [
        { header: 'P10 NPV', width: 1, align: 'right' },
        { header: 'P50 NPV', width: 1, align: 'right' },
        { header: 'P90 NPV', width: 1, align: 'right' },
        { header: 'Mean NPV', width: 1, align: 'right' },
        { header: 'Chance NPV > 0', width: 1, align: 'right' },
        { header: 'Trials', width: 0.7, align: 'right' },
      ],
      [
        {
          cells: [
            money(monteCarlo.p10Npv),
            money(monteCarlo.p50Npv),
            money(monteCarlo.p90Npv),
            money(monteCarlo.meanNpv),
            formatPercent(monteCarlo.probabilityNpvPositive, 1),
            formatNumber(monteCarlo.trials),
          ],
        },
      ],
    );
    paragraph(
      doc,
      'P10 is the NPV that nine trials in ten exceed; P90 the one that one trial in ten exceeds. Inputs vary independently, each on a triangular distribution over its low, base and high values.',
      {
        size: SIZE.tiny,
        color: COLOR.muted,
      },
    );
  }
}
