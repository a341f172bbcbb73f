/** Helpers for the import tests: a temp dir per test file and small CSV/XLSX writers. */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import ExcelJS from 'exceljs';
import type { ImportMappingInput } from '@shared/schemas/import-mapping.js';

export async function makeTempDir(): Promise<{ dir: string; file: (name: string) => string; cleanup: () => Promise<void> }> {
  const dir = await mkdtemp(path.join(tmpdir(), 'cleancase-import-test-'));
  return { dir, file: (name) => path.join(dir, name), cleanup: () => rm(dir, { recursive: true, force: true }) };
}

export async function writeCsv(filePath: string, lines: string[], eol = '\r\n'): Promise<string> {
  await writeFile(filePath, lines.join(eol) + eol, 'utf8');
  return filePath;
}

export async function writeXlsx(filePath: string, rows: (string | number | null)[][]): Promise<string> {
  const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: filePath, useStyles: false, useSharedStrings: true });
  const sheet = wb.addWorksheet('Data');
  for (const r of rows) sheet.addRow(r).commit();
  sheet.commit();
  await wb.commit();
  return filePath;
}

export const US_HEADER = 'Timestamp,Gross MW,BP (inHgA),CW In Temp °F,CW Out Temp °F,Circ Water Flow gpm';

/** Mapping for US_HEADER files with ISO timestamps. */
export const US_MAPPING: ImportMappingInput = {
  timestamp: { column: 'Timestamp', format: 'iso-8601-offset' },
  columns: {
    grossLoad: { column: 'Gross MW', unit: 'MW' },
    backpressure: { column: 'BP (inHgA)', unit: 'inHg' },
    cwInletTemperature: { column: 'CW In Temp °F', unit: 'degF' },
    cwOutletTemperature: { column: 'CW Out Temp °F', unit: 'degF' },
    cwFlow: { column: 'Circ Water Flow gpm', unit: 'gpm' },
  },
};

/**
 * A plausible steady row at minute `m` after 2024-06-01T00:00Z: 2.0 inHgA (101.1 °F saturation),
 * 75 °F in, 93 °F out, 250,000 gpm.
 */
export const usRow = (m: number, load = 480, over: Partial<{ bp: string; t1: string; t2: string; flow: string; ts: string }> = {}): string => {
  const ts = over.ts ?? new Date(Date.UTC(2024, 5, 1) + m * 60_000).toISOString().replace('.000Z', 'Z');
  return [ts, String(load), over.bp ?? '2.000', over.t1 ?? '75.0', over.t2 ?? '93.0', over.flow ?? '250000'].join(',');
};
