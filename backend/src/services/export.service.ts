/**
 * Downloads of a unit's daily figures and deviation breakdown as CSV or XLSX. Numbers stay numbers, in the
 * person's units (US or SI) with the unit in each header and the unit's currency on money; text cells that a spreadsheet could run as a formula (= + - @ tab CR first) are
 * neutralised with a leading apostrophe [pub: OWASP, CSV Injection].
 */
import ExcelJS from 'exceljs';
import type { DataSource } from 'typeorm';
import { DISPLAY_PRESETS, type DisplayUnit } from '@shared/units.js';
import { User } from '../entities/user.entity.js';
import { neutraliseCell } from '../import/import-errors.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { dailyFiguresOfUnit } from '../repositories/daily-aggregate.repository.js';
import { foundInScope } from '../repositories/found-in-scope.js';
import { findUnit } from '../repositories/plant.repository.js';
import { breakdownByPeriod, type DailyRow } from './health.service.js';

type Cell = string | number | boolean | null;
type UnitSystem = 'us' | 'si';

/** How one column is written: its header in the person's units and its value converted from the stored SI. */
interface Units {
  pressure: DisplayUnit;
  pressureDifference: DisplayUnit;
  temperature: DisplayUnit;
  temperatureDifference: DisplayUnit;
  massFlow: DisplayUnit;
}

function unitsFor(system: UnitSystem): Units {
  const preset = DISPLAY_PRESETS[system];
  return {
    pressure: preset.pressure,
    // a difference of pressures: the absolute mark dropped (inHg, kPa)
    pressureDifference: { ...preset.pressure, label: system === 'us' ? 'inHg' : 'kPa' },
    temperature: preset.temperature,
    temperatureDifference: preset.temperatureDifference,
    massFlow: preset.massFlow,
  };
}

const inUnit = (v: number | null | undefined, unit: DisplayUnit): number | null => (v === null || v === undefined ? null : unit.fromSi(v));

type Column = [header: string, pick: (d: DailyRow) => Cell];

function dailyColumns(u: Units, currency: string): Column[] {
  const p = u.pressure;
  const dp = u.pressureDifference;
  return [
    ['Day (plant local)', (d) => d.day],
    ['Points used', (d) => d.pointsUsed],
    ['Points left out', (d) => d.pointsDropped],
    [
      'Left out by reason',
      (d) =>
        Object.entries(d.droppedByReason ?? {})
          .map(([k, v]) => `${k}: ${v}`)
          .join('; '),
    ],
    ['Cleanliness (median)', (d) => d.medianCleanliness],
    ['Cleanliness (fouling trend)', (d) => d.trendCleanliness],
    [`TTD (median) ${u.temperatureDifference.label}`, (d) => inUnit(d.medianTtdK, u.temperatureDifference)],
    [`Backpressure ${p.label}`, (d) => inUnit(d.meanBackpressureKpa, p)],
    [`Expected backpressure at reference cleanliness ${p.label}`, (d) => inUnit(d.meanExpectedBackpressureKpa, p)],
    [`Excess backpressure ${dp.label}`, (d) => inUnit(d.meanExcessBackpressureKpa, dp)],
    [`CW inlet ${u.temperature.label}`, (d) => inUnit(d.meanCwInletC, u.temperature)],
    ['Load MW', (d) => d.meanLoadMw],
    ['Heat-rate penalty %', (d) => d.meanHeatRatePenaltyPct],
    [`Deviation: CW inlet temperature ${dp.label}`, (d) => inUnit(d.cwInletKpa, dp)],
    [`Deviation: CW flow ${dp.label}`, (d) => inUnit(d.cwFlowKpa, dp)],
    [`Deviation: load and duty ${dp.label}`, (d) => inUnit(d.loadKpa, dp)],
    [`Deviation: plugged tubes ${dp.label}`, (d) => inUnit(d.pluggingKpa, dp)],
    [`Deviation: fouling ${dp.label}`, (d) => inUnit(d.foulingKpa, dp)],
    [`Deviation: unexplained (air in-leakage, instruments) ${dp.label}`, (d) => inUnit(d.unexplainedKpa, dp)],
    [`Fouling cost ${currency}/day`, (d) => d.foulingCost],
    [`Unexplained cost ${currency}/day`, (d) => d.unexplainedCost],
    ['Air in-leakage suspected', (d) => d.airLeakSuspected],
    [`Subcooling ${u.temperatureDifference.label}`, (d) => inUnit(d.meanSubcoolingK, u.temperatureDifference)],
    ['Dissolved oxygen ppb', (d) => d.meanDissolvedOxygenPpb],
    [`Air-removal flow ${u.massFlow.label}`, (d) => inUnit(d.meanAirRemovalKgS, u.massFlow)],
    ['CW-side duty MW', (d) => d.meanDutyMw],
    ['Heat-balance duty MW', (d) => d.heatBalanceDutyMw],
    ['Sensors not changing all day', (d) => (d.stuckSensors ?? []).join('; ')],
  ];
}

const safe = (v: Cell): Cell => (typeof v === 'string' ? neutraliseCell(v) : v);

function toCsv(header: string[], rows: Cell[][]): string {
  const cell = (v: Cell) => {
    if (v === null || v === undefined) return '';
    const s = typeof v === 'string' ? v : String(v);
    return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  // the byte-order mark tells a spreadsheet the file is UTF-8, so °C, °F and m² read right
  return '\uFEFF' + [header, ...rows].map((r) => r.map((v) => cell(safe(v))).join(',')).join('\r\n') + '\r\n';
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
  const unit = await foundInScope(findUnit(ds.manager, scope, unitId), 'No such unit');
  const person = await ds.getRepository(User).findOne({ where: { id: scope.userId }, select: { id: true, unitPreference: true } });
  const u = unitsFor(person?.unitPreference === 'si' ? 'si' : 'us');
  const currency = unit.economics?.currency ?? 'USD';
  let header: string[];
  let rows: Cell[][];
  if (q.dataset === 'daily') {
    const days = await dailyFiguresOfUnit(ds.manager, unitId, q);
    const columns = dailyColumns(u, currency);
    header = columns.map(([h]) => h);
    rows = days.map((d) => columns.map(([, pick]) => pick(d)));
  } else {
    const breakdown = breakdownByPeriod(await dailyFiguresOfUnit(ds.manager, unitId, q), 'month');
    const dp = u.pressureDifference;
    const parts = ['CW inlet temperature', 'CW flow', 'Load and duty', 'Plugged tubes', 'Fouling', 'Unexplained', 'Excess backpressure'];
    header = ['Month', ...parts.map((part) => `${part} ${dp.label}`), `Fouling cost ${currency}`, `Unexplained cost ${currency}`];
    rows = breakdown.map((b) => [
      b.period,
      ...[b.cwInletKpa, b.cwFlowKpa, b.loadKpa, b.pluggingKpa, b.foulingKpa, b.unexplainedKpa, b.meanExcessBackpressureKpa].map((v) => inUnit(v, dp)),
      b.foulingCost,
      b.unexplainedCost,
    ]);
  }
  const base = `${unit.name}-${q.dataset}`.replace(/[^A-Za-z0-9._-]+/g, '-');
  if (q.format === 'csv') return { fileName: `${base}.csv`, contentType: 'text/csv; charset=utf-8', body: toCsv(header, rows) };
  return {
    fileName: `${base}.xlsx`,
    contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    body: await toXlsx(q.dataset, header, rows),
  };
}
