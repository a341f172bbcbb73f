import { describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { renderCaseXlsx } from '@backend/reports/case-report/index.js';
import { CONTEXT, caseViewFixture } from './case-view-fixture.js';

async function workbookOf(overrides = {}) {
  const view = caseViewFixture(overrides);
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load((await renderCaseXlsx(view, CONTEXT)) as unknown as ArrayBuffer);
  return { view, wb };
}

/** The sheet's rows under its header as arrays of cell values (column A first). */
function rowsOf(ws: ExcelJS.Worksheet): unknown[][] {
  const out: unknown[][] = [];
  ws.eachRow((row, n) => {
    if (n > 1) out.push((row.values as unknown[]).slice(1));
  });
  return out;
}

const summaryValue = (wb: ExcelJS.Workbook, item: string) => rowsOf(wb.getWorksheet('Summary')!).find((r) => r[0] === item)?.[1];

describe('case report as a workbook', () => {
  const built = workbookOf({ title: '=HYPERLINK("http://example.invalid","open")' });

  it('has the summary, inputs, yearly cash flows, schedule, daily path and comments sheets', async () => {
    const { wb } = await built;
    expect(wb.worksheets.map((w) => w.name)).toEqual(['Summary', 'Inputs', 'Yearly cash flows', 'Schedule', 'Daily path', 'Comments']);
  });

  it('gives the NPV and the yearly cash flows as numbers equal to the case’s', async () => {
    const { wb, view } = await built;
    expect(summaryValue(wb, 'NPV against the baseline (USD)')).toBe(view.results.businessCase.npv);
    expect(summaryValue(wb, 'P50 NPV (USD)')).toBe(view.results.monteCarlo!.p50Npv);
    const yearly = rowsOf(wb.getWorksheet('Yearly cash flows')!);
    // + 0: the calculation gives an upfront cost of 0 as −0, which JSON (and so the API) answers as 0
    expect(yearly.map((r) => r[5])).toEqual(view.results.businessCase.cashflows.map((v) => v + 0));
    expect(yearly.slice(1).map((r) => r[3])).toEqual(view.results.businessCase.foulingSavings);
    // the running sum ends at the sum of the cash flows (to the cent)
    const sum = view.results.businessCase.cashflows.reduce((a, b) => a + b, 0);
    expect(yearly.at(-1)?.[6]).toBeCloseTo(sum, 2);
    expect(wb.getWorksheet('Yearly cash flows')!.getCell('F2').numFmt).toBe('#,##0.00');
  });

  it('writes the schedule and the daily path with days as dates and figures as numbers', async () => {
    const { wb, view } = await built;
    const schedule = rowsOf(wb.getWorksheet('Schedule')!);
    const first = schedule[0];
    expect(first?.[0]).toBe('Recommended');
    expect(first?.[2]).toEqual(new Date(`${view.results.cleanings[0]?.date}T00:00:00.000Z`));
    expect(first?.[5]).toBe(view.results.cleanings[0]?.cleaningCost);
    expect(String(first?.[12])).toMatch(/local codes/);
    expect(schedule.filter((r) => r[0] === 'Baseline')).toHaveLength(view.results.baseline.cleanings.length);
    const daily = rowsOf(wb.getWorksheet('Daily path')!);
    expect(daily).toHaveLength(view.results.daily!.length);
    expect(daily[100]).toEqual([
      new Date(`${view.results.daily![100]?.date}T00:00:00.000Z`),
      view.results.daily![100]?.cleanliness,
      view.results.daily![100]?.foulingCost,
      view.results.daily![100]?.cleaningCost,
    ]);
  });

  it('lists every input with its unit and source, monthly values one per row', async () => {
    const { wb } = await built;
    const inputs = rowsOf(wb.getWorksheet('Inputs')!);
    const cw = inputs.filter((r) => String(r[1]).startsWith('Cooling-water inlet temperature, '));
    expect(cw.map((r) => r[2])).toEqual([8, 9, 12, 16, 20, 25, 28, 28, 24, 18, 12, 9]);
    expect(cw[0]?.slice(3)).toEqual(['°C', 'measured', 'monthly means of the CW inlet readings from 2023 to 2026']);
    const fuel = inputs.find((r) => r[1] === 'Fuel price');
    expect(fuel).toEqual(['Drivers', 'Fuel price', 3.5, 'USD/MMBtu', 'entered', 'changed by the analyst from 3.20 to 3.50']);
    expect(inputs.find((r) => r[1] === 'Planned outage 1, first day')?.[2]).toEqual(new Date('2027-04-05T00:00:00.000Z'));
  });

  it('neutralises text that a spreadsheet could run as a formula, in the title and in comments', async () => {
    const { wb } = await built;
    expect(summaryValue(wb, 'Title')).toBe('\'=HYPERLINK("http://example.invalid","open")');
    const comments = rowsOf(wb.getWorksheet('Comments')!);
    expect(comments[1]?.[2]).toBe('\'=HYPERLINK("http://example.invalid","click")');
    wb.eachSheet((ws) =>
      ws.eachRow((row) =>
        row.eachCell((cell) => {
          expect(cell.type).not.toBe(ExcelJS.ValueType.Formula);
          if (typeof cell.value === 'string') expect(cell.value).not.toMatch(/^[=+\-@\t\r]/);
        }),
      ),
    );
  });

  it('says in the summary when a case is not approved', async () => {
    const { wb } = await built;
    expect(String(summaryValue(wb, 'Approval'))).toMatch(/^NOT APPROVED — DRAFT/);
  });
});
