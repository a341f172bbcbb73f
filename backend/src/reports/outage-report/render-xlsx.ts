/** The outage as a workbook: the outage's facts, every item with its figures, choice and reason, and each lane's days. */
import ExcelJS from 'exceljs';
import type { OutageView } from '@shared/schemas/outages.js';
import { fillSheet, MONEY_FMT, type Cell } from '../case-report/xlsx/sheet-writer.js';
import { reportContent, type OutageReportContext } from './report-content.js';

export async function renderOutageXlsx(view: OutageView, ctx: OutageReportContext): Promise<Buffer> {
  const c = reportContent(view);
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Cleancase';
  wb.created = ctx.generatedAt;
  const start = view.approved?.startDate ?? view.startDate;
  const end = view.approved?.endDate ?? view.endDate;
  const budget = view.approved?.budget ?? view.budget;
  fillSheet(
    wb.addWorksheet('Outage'),
    [
      { header: 'Field', width: 24 },
      { header: 'Value', width: 60 },
    ],
    [
      ['Organisation', ctx.organisationName],
      ['Outage', view.name],
      ['Units', view.units.map((u) => `${u.plantName} ${u.name}`).join(', ')],
      ['First day', { day: start }],
      ['Last day', { day: end }],
      ['Window days', view.approved?.windowDays ?? view.windowDays],
      ['Currency', view.currency],
      [`Budget (${view.currency})`, [budget, MONEY_FMT]],
      ['Scope', c.basis],
      [`Chosen benefit (${view.currency})`, c.totalBenefit === null ? null : [c.totalBenefit, MONEY_FMT]],
      [`Chosen cost (${view.currency})`, c.totalCost === null ? null : [c.totalCost, MONEY_FMT]],
      ['Status', view.status],
      ['Approval', c.approvedLine],
      ...view.cautions.map((text, n): (Cell | [Cell, string])[] => [n === 0 ? 'Cautions' : '', text]),
    ],
  );
  fillSheet(
    wb.addWorksheet('Items'),
    [
      { header: 'Item', width: 36 },
      { header: 'Kind', width: 26 },
      { header: 'Unit', width: 18 },
      { header: 'Lane', width: 16 },
      { header: 'Duration (days)', width: 14 },
      { header: `Cost (${view.currency})`, width: 16, numFmt: MONEY_FMT },
      { header: `Benefit (${view.currency})`, width: 16, numFmt: MONEY_FMT },
      { header: 'Chosen', width: 9 },
      { header: 'Why', width: 60 },
      { header: 'How the benefit was priced', width: 80 },
    ],
    c.items.map((i) => [
      i.title,
      c.kindWords(i),
      i.unitName,
      i.lane,
      i.durationDays,
      i.cost,
      i.benefit,
      c.chosen.includes(i) ? 'yes' : 'no',
      c.reasons[i.id] ?? '',
      i.pricing.text,
    ]),
  );
  fillSheet(
    wb.addWorksheet('Lanes'),
    [
      { header: 'Lane', width: 18 },
      { header: 'Item', width: 36 },
      { header: 'From day', width: 10 },
      { header: 'To day', width: 10 },
    ],
    c.lanes.flatMap((l) => l.bars.map((b) => [l.lane, b.item.title, b.fromDay + 1, b.toDay])),
  );
  return Buffer.from(await wb.xlsx.writeBuffer());
}
