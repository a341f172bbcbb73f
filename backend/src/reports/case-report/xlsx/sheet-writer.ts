/**
 * Writing a sheet of the case workbook: a bold header row, numbers as numbers with their format, days as dates
 * (plant-local, written as UTC midnight so no zone shifts them), and every text cell neutralised so a spreadsheet
 * never runs it as a formula (the same rule as the other downloads).
 */
import type ExcelJS from 'exceljs';
import { neutraliseCell } from '../../../import/import-errors.js';

export type Cell = string | number | { day: string } | null;

export interface SheetColumn {
  header: string;
  width: number;
  numFmt?: string;
}

export const MONEY_FMT = '#,##0.00';
export const DATE_FMT = 'yyyy-mm-dd';

const dayAsDate = (day: string) => new Date(`${day.slice(0, 10)}T00:00:00.000Z`);

function write(c: ExcelJS.Cell, value: Cell, numFmt?: string): void {
  if (value === null) return;
  if (typeof value === 'string') {
    c.value = neutraliseCell(value);
  } else if (typeof value === 'number') {
    c.value = value;
    if (numFmt) c.numFmt = numFmt;
  } else {
    c.value = dayAsDate(value.day);
    c.numFmt = DATE_FMT;
  }
}

/** Rows of cells under the columns' headers; a row may give a cell's own number format as [value, numFmt]. */
export function fillSheet(ws: ExcelJS.Worksheet, columns: SheetColumn[], rows: (Cell | [Cell, string])[][]): void {
  ws.columns = columns.map((c) => ({ width: c.width }));
  const header = ws.addRow([]);
  columns.forEach((c, i) => write(header.getCell(i + 1), c.header));
  header.font = { bold: true };
  ws.views = [{ state: 'frozen', ySplit: 1 }];
  for (const r of rows) {
    const row = ws.addRow([]);
    r.forEach((cell, i) => {
      const [value, fmt] = Array.isArray(cell) ? cell : [cell, columns[i]?.numFmt];
      write(row.getCell(i + 1), value, fmt);
    });
  }
}
