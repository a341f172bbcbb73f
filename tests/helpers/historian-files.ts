/**
 * Historian files for the API tests: hourly rows made physical with the engineering core (the measured
 * point of a given cleanliness, ENGINEERING.md §3), written as a US-unit CSV or XLSX in a temp dir.
 */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import ExcelJS from 'exceljs';
import { backpressureAtCleanlinessKpa, cwRiseK, type CondenserGeometry } from '@shared/domain/condenser/index.js';
import { liquidDensityKgM3 } from '@shared/domain/steam/index.js';
import type { ImportMappingInput } from '@shared/schemas/import-mapping.js';
import type { CondenserSetup, TurbineSetup } from '@shared/schemas/unit-setup.js';

/** NIST SP 811 (2008), B.8: 1 inHg (conventional, 32 °F) = 3.386389 kPa. */
const KPA_PER_INHG = 3.386389;
/** NIST SP 811 (2008), B.8: 1 US liquid gallon = 3.785411784 × 10⁻³ m³ (exact). */
const M3_PER_US_GALLON = 3.785411784e-3;
const cToF = (c: number) => c * 1.8 + 32;

export const US_HEADERS = ['Timestamp', 'Gross MW', 'BP inHgA', 'CW In Temp F', 'CW Out Temp F', 'CW Flow gpm'] as const;

/** The mapping a user would confirm for US_HEADERS files with ISO 8601 timestamps. */
export const US_MAPPING: ImportMappingInput = {
  timestamp: { column: 'Timestamp', format: 'iso-8601-offset' },
  columns: {
    grossLoad: { column: 'Gross MW', unit: 'MW' },
    backpressure: { column: 'BP inHgA', unit: 'inHg' },
    cwInletTemperature: { column: 'CW In Temp F', unit: 'degF' },
    cwOutletTemperature: { column: 'CW Out Temp F', unit: 'degF' },
    cwFlow: { column: 'CW Flow gpm', unit: 'gpm' },
  },
};

/** One hour of plant operation: the truth in SI and its US-unit cells as written to the file. */
export interface HistorianRow {
  timestampUtc: number;
  loadMw: number;
  cwInletC: number;
  cwOutletC: number;
  cwFlowM3s: number;
  backpressureKpa: number;
  /** cleanliness the row was generated with (NaN for rows made non-physical on purpose) */
  cleanliness: number;
  cells: string[];
}

export interface HistoryOptions {
  startUtc: number;
  hours: number;
  condenser: CondenserSetup;
  turbine: TurbineSetup;
  /** Cleanliness at an hour from the start (default 0.85). */
  cleanlinessAt?: (hour: number) => number;
  /** Plugged tubes at an hour from the start (default: the setup's). */
  pluggedTubesAt?: (hour: number) => number;
  /** Gross load at an hour (default: about 88 % of rating with a small daily swing). */
  loadAt?: (hour: number) => number;
}

export const geometryOf = (c: CondenserSetup): CondenserGeometry => ({
  surfaceM2: c.surfaceM2,
  tubeCount: c.tubeCount,
  passes: c.passes,
  tubeOdMm: c.tubeOdMm,
  tubeBwg: c.tubeBwg,
  tubeMaterial: c.tubeMaterial,
});

/** Heat-balance duty at a load fraction, linear between the setup's points (as the unit model reads it). */
function heatBalanceDutyMw(turbine: TurbineSetup, loadFraction: number): number {
  const pts = [...turbine.heatBalanceDuty].sort((a, b) => a.loadFraction - b.loadFraction);
  let i = 0;
  while (i < pts.length - 2 && loadFraction > pts[i + 1]!.loadFraction) i++;
  const [a, b] = [pts[i]!, pts[i + 1]!];
  return a.dutyMw + ((b.dutyMw - a.dutyMw) * (loadFraction - a.loadFraction)) / (b.loadFraction - a.loadFraction);
}

export function isoUtc(ms: number): string {
  return new Date(ms).toISOString().replace('.000Z', 'Z');
}

/** US-unit cells of a row, with enough digits that the SI values come back to about 1e-6. */
export function usCells(r: Omit<HistorianRow, 'cells' | 'cleanliness'>): string[] {
  return [
    isoUtc(r.timestampUtc),
    r.loadMw.toFixed(3),
    (r.backpressureKpa / KPA_PER_INHG).toFixed(6),
    cToF(r.cwInletC).toFixed(5),
    cToF(r.cwOutletC).toFixed(5),
    (r.cwFlowM3s / (M3_PER_US_GALLON / 60)).toFixed(1),
  ];
}

/**
 * Hourly rows: load and CW inlet follow a daily swing, the duty comes from the heat balance, the rise from
 * Q = W·cp·Δt (cwRiseK) and the backpressure from the condenser model at the row's cleanliness, so that
 * the measured cleanliness of each row is the one it was generated with.
 */
export function physicalHistory(o: HistoryOptions): HistorianRow[] {
  const geometry = geometryOf(o.condenser);
  const rows: HistorianRow[] = [];
  for (let h = 0; h < o.hours; h++) {
    const loadMw = o.loadAt ? o.loadAt(h) : 0.88 * o.turbine.ratingMw + 4 * Math.sin((2 * Math.PI * h) / 24);
    const cwInletC = 22 + 2.5 * Math.sin((2 * Math.PI * (h - 9)) / 24);
    const cwFlowM3s = 14.5;
    const cleanliness = o.cleanlinessAt ? o.cleanlinessAt(h) : 0.85;
    const pluggedTubes = o.pluggedTubesAt ? o.pluggedTubesAt(h) : o.condenser.pluggedTubes;
    const dutyMw = heatBalanceDutyMw(o.turbine, loadMw / o.turbine.ratingMw);
    const rise = cwRiseK(cwInletC, liquidDensityKgM3(cwInletC) * cwFlowM3s, dutyMw);
    const backpressureKpa = backpressureAtCleanlinessKpa({ geometry, cwInletC, cwFlowM3s, dutyMw, pluggedTubes, cleanliness });
    const base = { timestampUtc: o.startUtc + h * 3_600_000, loadMw, cwInletC, cwOutletC: cwInletC + rise, cwFlowM3s, backpressureKpa };
    rows.push({ ...base, cleanliness, cells: usCells(base) });
  }
  return rows;
}

export async function makeTempDir(): Promise<{ dir: string; file: (name: string) => string; cleanup: () => Promise<void> }> {
  const dir = await mkdtemp(path.join(tmpdir(), 'cleancase-api-import-'));
  return { dir, file: (name) => path.join(dir, name), cleanup: () => rm(dir, { recursive: true, force: true }) };
}

export async function writeCsvLines(filePath: string, lines: string[]): Promise<string> {
  await writeFile(filePath, lines.join('\r\n') + '\r\n', 'utf8');
  return filePath;
}

export function csvLines(rows: { cells: string[] }[], headers: readonly string[] = US_HEADERS): string[] {
  return [headers.join(','), ...rows.map((r) => r.cells.join(','))];
}

export async function writeHistorianCsv(filePath: string, rows: { cells: string[] }[], headers: readonly string[] = US_HEADERS): Promise<string> {
  return writeCsvLines(filePath, csvLines(rows, headers));
}

/** The same table as an XLSX workbook: timestamps as text, every other cell as a number. */
export async function writeHistorianXlsx(filePath: string, rows: { cells: string[] }[], headers: readonly string[] = US_HEADERS): Promise<string> {
  const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: filePath, useStyles: false, useSharedStrings: true });
  const sheet = wb.addWorksheet('History');
  sheet.addRow([...headers]).commit();
  for (const r of rows) sheet.addRow(r.cells.map((c, k) => (k === 0 ? c : Number(c)))).commit();
  sheet.commit();
  await wb.commit();
  return filePath;
}
