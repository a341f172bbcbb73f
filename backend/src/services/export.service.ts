/**
 * Downloads of a unit's daily figures and deviation breakdown as CSV or XLSX. Numbers stay numbers (SI,
 * unit in each header); text cells that a spreadsheet could run as a formula (= + - @ tab CR first) are
 * neutralised with a leading apostrophe [pub: OWASP, CSV Injection].
 */
import ExcelJS from 'exceljs';
import type { DataSource } from 'typeorm';
import { neutraliseCell } from '../import/import-errors.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { breakdownByPeriod, loadDailyRows, type DailyRow } from './health.service.js';
import { getUnitOrThrow } from './plant.service.js';

type Cell = string | number | boolean | null;

const DAILY_COLUMNS: [string, (d: DailyRow) => Cell][] = [
  ['Day (plant local)', (d) => d.day],
  ['Points used', (d) => d.pointsUsed],
  ['Points left out', (d) => d.pointsDropped],
  ['Left out by reason', (d) => Object.entries(d.droppedByReason ?? {}).map(([k, v]) => `${k}: ${v}`).join('; ')],
  ['Cleanliness (median)', (d) => d.medianCleanliness],
  ['Cleanliness (fouling trend)', (d) => d.trendCleanliness],
  ['TTD (median) K', (d) => d.medianTtdK],
  ['Backpressure kPa(a)', (d) => d.meanBackpressureKpa],
  ['Expected backpressure at reference cleanliness kPa(a)', (d) => d.meanExpectedBackpressureKpa],
  ['Excess backpressure kPa', (d) => d.meanExcessBackpressureKpa],
  ['CW inlet °C', (d) => d.meanCwInletC],
  ['Load MW', (d) => d.meanLoadMw],
  ['Heat-rate penalty %', (d) => d.meanHeatRatePenaltyPct],
  ['Deviation: CW inlet temperature kPa', (d) => d.cwInletKpa],
  ['Deviation: CW flow kPa', (d) => d.cwFlowKpa],
  ['Deviation: load and duty kPa', (d) => d.loadKpa],
  ['Deviation: plugged tubes kPa', (d) => d.pluggingKpa],
  ['Deviation: fouling kPa', (d) => d.foulingKpa],
  ['Deviation: unexplained (air in-leakage, instruments) kPa', (d) => d.unexplainedKpa],
  ['Fouling cost (money/day)', (d) => d.foulingCost],
  ['Unexplained cost (money/day)', (d) => d.unexplainedCost],
  ['Air in-leakage suspected', (d) => d.airLeakSuspected],
  ['Subcooling K', (d) => d.meanSubcoolingK],
  ['Dissolved oxygen ppb', (d) => d.meanDissolvedOxygenPpb],
  ['Air-removal flow kg/s', (d) => d.meanAirRemovalKgS],
  ['CW-side duty MW', (d) => d.meanDutyMw],
  ['Heat-balance duty MW', (d) => d.heatBalanceDutyMw],
  ['Sensors not changing all day', (d) => (d.stuckSensors ?? []).join('; ')],
];

const safe = (v: Cell): Cell => (typeof v === 'string' ? neutraliseCell(v) : v);

function toCsv(header: string[], rows: Cell[][]): string {
  const cell = (v: Cell) => {
    if (v === null || v === undefined) return '';
    const s = typeof v === 'string' ? v : String(v);
    return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  return [header, ...rows].map((r) => r.map((v) => cell(safe(v))).join(',')).join('\r\n') + '\r\n';
}

async function toXlsx(sheet: string, header: string[], rows: Cell[][]): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet(sheet);
  ws.addRow(header.map((h) => safe(h)));
  ws.getRow(1).font = { bold: true };
  for (const r of rows) ws.addRow(r.map((v) => safe(v)));
  return Buffer.from(await wb.xlsx.writeBuffer());
}

export async function exportUnitData(
  ds: DataSource,
  scope: TenantScope,
  unitId: string,
  q: { dataset: 'daily' | 'breakdown'; format: 'csv' | 'xlsx'; from?: string; to?: string },
): Promise<{ fileName: string; contentType: string; body: string | Buffer }> {
  const unit = await getUnitOrThrow(ds, scope, unitId);
  let header: string[];
  let rows: Cell[][];
  if (q.dataset === 'daily') {
    const days = await loadDailyRows(ds, unitId, q.from, q.to);
    header = DAILY_COLUMNS.map(([h]) => h);
    rows = days.map((d) => DAILY_COLUMNS.map(([, pick]) => pick(d)));
  } else {
    const breakdown = breakdownByPeriod(await loadDailyRows(ds, unitId, q.from, q.to), 'month');
    header = ['Month', 'CW inlet temperature kPa', 'CW flow kPa', 'Load and duty kPa', 'Plugged tubes kPa', 'Fouling kPa', 'Unexplained kPa', 'Excess backpressure kPa', 'Fouling cost (money)', 'Unexplained cost (money)'];
    rows = breakdown.map((b) => [b.period, b.cwInletKpa, b.cwFlowKpa, b.loadKpa, b.pluggingKpa, b.foulingKpa, b.unexplainedKpa, b.meanExcessBackpressureKpa, b.foulingCost, b.unexplainedCost]);
  }
  const base = `${unit.name}-${q.dataset}`.replace(/[^A-Za-z0-9._-]+/g, '-');
  if (q.format === 'csv') return { fileName: `${base}.csv`, contentType: 'text/csv; charset=utf-8', body: toCsv(header, rows) };
  return { fileName: `${base}.xlsx`, contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', body: await toXlsx(q.dataset, header, rows) };
}
