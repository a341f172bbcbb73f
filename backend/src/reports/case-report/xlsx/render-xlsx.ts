/**
 * The case as a workbook: Summary, Inputs, Yearly cash flows, Schedule, Daily path and Comments. Money is in the
 * case's currency (named in each header) to the cent, as the calculation gives it.
 */
import ExcelJS from 'exceljs';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import type { CaseView } from '@shared/schemas/cases.js';
import { decisionLine, notApprovedMark, STATUS_LABELS } from '../approval-mark.js';
import { dataBasisLine, ESTIMATES_LINE } from '../data-basis.js';
import { inputRows } from '../input-rows.js';
import { recommendationText } from '../recommendation.js';
import type { CaseReportContext } from '../report-context.js';
import { yearlyRows } from '../yearly-rows.js';
import { fillSheet, MONEY_FMT, type Cell } from './sheet-writer.js';
import { casePhysicalSentence } from '@shared/text/case-physical-text.js';

const SOURCE_WORDS = { measured: 'measured', prefilled: 'prefilled', entered: 'entered' } as const;

function dayOf(iso: string | Date | null, timeZone: string): Cell {
  if (iso === null) return null;
  return { day: plantDayOf(typeof iso === 'string' ? Date.parse(iso) : iso.getTime(), timeZone) };
}

function summary(wb: ExcelJS.Workbook, view: CaseView, ctx: CaseReportContext): void {
  const cur = view.currency;
  const bc = view.results.businessCase;
  const mc = view.results.monteCarlo;
  const tz = view.timeZone;
  const rows: (Cell | [Cell, string])[][] = [
    ['Title', view.title],
    ['Organisation', ctx.organisationName],
    ['Plant', view.plantName],
    ['Unit', view.unitName],
    ['Status', STATUS_LABELS[view.status]],
    ['Approval', notApprovedMark(view) ?? 'Approved'],
    ['Author', view.author.name],
    ['Decision', decisionLine(view)],
    ['Reason returned', view.returnReason],
    ['Created', dayOf(view.createdAt, tz)],
    ['Submitted', dayOf(view.submittedAt, tz)],
    ['Decided', dayOf(view.decidedAt, tz)],
    ['Currency', cur],
    ['Recommendation', recommendationText(view)],
    ['Fouling as CO2 and output', casePhysicalSentence(view.inputs, view.results.totals.foulingCost, view.results.baseline.totals.foulingCost)],
    [`NPV against the baseline (${cur})`, [bc.npv, MONEY_FMT]],
    ['IRR', bc.irr === null ? (bc.irrReason ?? 'none') : [bc.irr, '0.0%']],
    ['Payback (years)', bc.paybackYears === null ? 'not in the horizon' : [bc.paybackYears, '0.0']],
    ['Discounted payback (years)', bc.discountedPaybackYears === null ? 'not in the horizon' : [bc.discountedPaybackYears, '0.0']],
    ['Benefit–cost ratio', bc.benefitCostRatio === null ? (bc.benefitCostReason ?? 'none') : [bc.benefitCostRatio, '0.00']],
  ];
  if (mc) {
    rows.push(
      [`P10 NPV (${cur})`, [mc.p10Npv, MONEY_FMT]],
      [`P50 NPV (${cur})`, [mc.p50Npv, MONEY_FMT]],
      [`P90 NPV (${cur})`, [mc.p90Npv, MONEY_FMT]],
      [`Mean NPV (${cur})`, [mc.meanNpv, MONEY_FMT]],
      ['Chance the NPV is positive', [mc.probabilityNpvPositive, '0.0%']],
      ['Monte Carlo trials', mc.trials],
    );
  }
  rows.push(
    ['Warnings', view.results.warnings.join('\n') || null],
    ['Basis', ESTIMATES_LINE],
    ['Engine and data', dataBasisLine(view)],
    ['Report made', dayOf(ctx.generatedAt, tz)],
  );
  fillSheet(
    wb.addWorksheet('Summary'),
    [
      { header: 'Item', width: 30 },
      { header: 'Value', width: 90 },
    ],
    rows,
  );
}

function inputs(wb: ExcelJS.Workbook, view: CaseView): void {
  const rows: (Cell | [Cell, string])[][] = [];
  for (const r of inputRows(view)) {
    const source = r.source === null ? 'no source recorded' : SOURCE_WORDS[r.source];
    const parts = r.parts ?? [{ name: r.name, value: r.value, numFmt: r.numFmt }];
    for (const p of parts) {
      const value: Cell | [Cell, string] = typeof p.value === 'number' && p.numFmt ? [p.value, p.numFmt] : p.value;
      rows.push([r.group, p.name, value, r.unit, source, r.detail]);
    }
  }
  fillSheet(
    wb.addWorksheet('Inputs'),
    [
      { header: 'Group', width: 20 },
      { header: 'Input', width: 48 },
      { header: 'Value', width: 18 },
      { header: 'Unit', width: 18 },
      { header: 'Source', width: 12 },
      { header: 'Detail', width: 80 },
    ],
    rows,
  );
}

function yearly(wb: ExcelJS.Workbook, view: CaseView): void {
  const cur = view.currency;
  const money = (h: string) => ({ header: `${h} (${cur})`, width: 20, numFmt: MONEY_FMT });
  fillSheet(
    wb.addWorksheet('Yearly cash flows'),
    [
      { header: 'Year', width: 10 },
      { header: 'First day', width: 12 },
      { header: 'Last day', width: 12 },
      money('Fouling cost saved'),
      money('Extra cleaning and downtime cost'),
      money('Net cash flow'),
      money('Cumulative cash flow'),
      money('Plan fouling cost'),
      money('Plan cleaning cost'),
      money('Plan downtime cost'),
      money('Plan total cost'),
    ],
    yearlyRows(view).map((y) => [
      y.label,
      { day: y.from },
      { day: y.to },
      y.foulingSavings,
      y.extraCleaningCosts,
      y.cashflow,
      y.cumulative,
      y.planCosts?.foulingCost ?? null,
      y.planCosts?.cleaningCost ?? null,
      y.planCosts?.downtimeCost ?? null,
      y.planCosts?.total ?? null,
    ]),
  );
}

function schedule(wb: ExcelJS.Workbook, view: CaseView): void {
  const cur = view.currency;
  const money = (h: string) => ({ header: `${h} (${cur})`, width: 18, numFmt: MONEY_FMT });
  const rows = (which: string, list: CaseView['results']['cleanings']) =>
    list.map((c, i) => [
      which,
      i + 1,
      { day: c.date },
      { day: c.endDate },
      c.methodName,
      c.cleaningCost,
      c.downtimeCost,
      c.foulingCostDuring,
      c.daysInPlannedOutage,
      c.cleanlinessBefore,
      c.cleanlinessAfter,
      c.typicalValues ? 'yes' : 'no',
      c.cautions.join('\n'),
    ]);
  fillSheet(
    wb.addWorksheet('Schedule'),
    [
      { header: 'Schedule', width: 12 },
      { header: 'Cleaning', width: 9 },
      { header: 'First day', width: 12 },
      { header: 'Last day', width: 12 },
      { header: 'Method', width: 40 },
      money('Cleaning cost'),
      money('Downtime cost'),
      money('Fouling cost during the cleaning'),
      { header: 'Days in a planned outage', width: 12 },
      { header: 'Cleanliness before', width: 12, numFmt: '0.000' },
      { header: 'Cleanliness after', width: 12, numFmt: '0.000' },
      { header: 'Typical values', width: 10 },
      { header: 'Cautions', width: 100 },
    ],
    [...rows('Recommended', view.results.cleanings), ...rows('Baseline', view.results.baseline.cleanings)],
  );
}

function daily(wb: ExcelJS.Workbook, view: CaseView): void {
  const cur = view.currency;
  fillSheet(
    wb.addWorksheet('Daily path'),
    [
      { header: 'Day', width: 12 },
      { header: 'Cleanliness factor', width: 14, numFmt: '0.000000' },
      { header: `Fouling cost (${cur})`, width: 16, numFmt: MONEY_FMT },
      { header: `Cleaning cost (${cur})`, width: 16, numFmt: MONEY_FMT },
    ],
    (view.results.daily ?? []).map((d) => [{ day: d.date }, d.cleanliness, d.foulingCost, d.cleaningCost]),
  );
}

function comments(wb: ExcelJS.Workbook, view: CaseView, ctx: CaseReportContext): void {
  fillSheet(
    wb.addWorksheet('Comments'),
    [
      { header: 'Day', width: 12 },
      { header: 'Author', width: 24 },
      { header: 'Comment', width: 100 },
    ],
    ctx.comments.map((c) => [dayOf(c.createdAt, view.timeZone), c.author.name, c.text]),
  );
}

export async function renderCaseXlsx(view: CaseView, ctx: CaseReportContext): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Cleancase';
  wb.created = ctx.generatedAt;
  summary(wb, view, ctx);
  inputs(wb, view);
  yearly(wb, view);
  schedule(wb, view);
  daily(wb, view);
  comments(wb, view, ctx);
  return Buffer.from(await wb.xlsx.writeBuffer());
}
