/**
 * Header shapes of historian exports: title lines above the header (export notes, the query's time range), a
 * two-row header (names, then units) whose units are proposed in the mapping, and the sheet of a workbook.
 */
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { guessMapping } from '@backend/import/column-mapping.js';
import { openTable } from '@backend/import/open-table.js';
import { checkImportFile, importSamples, type ImportSample } from '@backend/import/parse-rows.js';
import { US_MAPPING, makeTempDir, usRow, writeCsv } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

const TITLED = [
  'Export of unit 2 condenser tags',
  'Query range,2024-06-01 00:00,2024-06-01 03:00',
  'Interval,1 minute',
  'Timestamp,Gross,BP,CW In Temp,CW Out Temp,Circ Water Flow',
  ',MW,inHgA,°F,°F,gpm',
];

describe('title lines and a units row', () => {
  it('skips the title lines (also one holding a date range), reads names and units as two rows, and keeps both', async () => {
    const f = await writeCsv(tmp.file('titled.csv'), [...TITLED, usRow(0), usRow(1)]);
    const table = await openTable(f);
    await table.close();
    expect(table.headers).toEqual(['Timestamp', 'Gross (MW)', 'BP (inHgA)', 'CW In Temp (°F)', 'CW Out Temp (°F)', 'Circ Water Flow (gpm)']);
    expect(table.units).toEqual(['', 'MW', 'inHgA', '°F', '°F', 'gpm']);
    expect(table.titleLines).toEqual(['Export of unit 2 condenser tags', 'Query range 2024-06-01 00:00 2024-06-01 03:00', 'Interval 1 minute']);
    expect(table.headerLine).toBe(5);
  });

  it('proposes the units the units row gives', async () => {
    const f = await writeCsv(tmp.file('titled-guess.csv'), [...TITLED, usRow(0), usRow(1)]);
    const table = await openTable(f);
    await table.close();
    const guess = guessMapping(table.headers, table.sampleRows);
    expect(guess.mapping.columns).toEqual({
      grossLoad: { column: 'Gross (MW)', unit: 'MW' },
      backpressure: { column: 'BP (inHgA)', unit: 'inHg' },
      cwInletTemperature: { column: 'CW In Temp (°F)', unit: 'degF' },
      cwOutletTemperature: { column: 'CW Out Temp (°F)', unit: 'degF' },
      cwFlow: { column: 'Circ Water Flow (gpm)', unit: 'gpm' },
    });
  });

  it('skips a time-range title line in a two-column file (one file per tag) too', async () => {
    const f = await writeCsv(tmp.file('one-tag.csv'), ['From,2024-06-01T00:00Z', 'To,2024-06-02T00:00Z', 'Time,U2_GROSS_MW', '2024-06-01T00:00Z,480']);
    const table = await openTable(f);
    await table.close();
    expect(table.headers).toEqual(['Time', 'U2_GROSS_MW']);
    expect(table.titleLines).toEqual(['From 2024-06-01T00:00Z', 'To 2024-06-02T00:00Z']);
    expect(table.units).toEqual([]);
  });

  it('imports a titled two-row-header file to the same samples as the plain file', async () => {
    const rows = [0, 1, 2, 3].map((m) => usRow(m, 470 + m));
    const titled = await writeCsv(tmp.file('titled-import.csv'), [...TITLED, ...rows]);
    const plain = await writeCsv(tmp.file('plain-import.csv'), ['Timestamp,Gross MW,BP (inHgA),CW In Temp °F,CW Out Temp °F,Circ Water Flow gpm', ...rows]);
    const titledMapping = guessMapping((await openTable(titled).then(async (t) => (await t.close(), t))).headers).mapping;
    const read = async (file: string, mapping: unknown) => {
      expect((await checkImportFile(file, { mapping })).ok).toBe(true);
      const out: ImportSample[] = [];
      await importSamples(file, { mapping, fileOrder: 'ascending', onBatch: (b) => void out.push(...b) });
      return out.map(({ line: _line, ...s }) => s);
    };
    const plainMapping = {
      ...US_MAPPING,
      columns: { ...US_MAPPING.columns, grossLoad: { column: 'Gross MW', unit: 'MW' }, cwInletTemperature: { column: 'CW In Temp °F', unit: 'degF' } },
    };
    const a = await read(titled, { ...titledMapping, timestamp: { column: 'Timestamp', format: 'iso-8601-offset' } });
    const b = await read(plain, plainMapping);
    expect(a).toHaveLength(4);
    expect(a).toEqual(b);
  });
});

async function twoSheetWorkbook(file: string): Promise<string> {
  const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: file, useStyles: false, useSharedStrings: true });
  const notes = wb.addWorksheet('Notes');
  notes.addRow(['Exported for the unit 2 condenser review']).commit();
  notes.commit();
  const data = wb.addWorksheet('Hourly data');
  data.addRow(['Timestamp', 'Gross MW', 'BP (inHgA)', 'CW In Temp °F', 'CW Out Temp °F', 'Circ Water Flow gpm']).commit();
  for (let m = 0; m < 3; m++) data.addRow(usRow(m).split(',')).commit();
  data.commit();
  await wb.commit();
  return file;
}

describe('the sheet of a workbook', () => {
  it('lists every sheet, reads the first that is a table by default and any by name', async () => {
    const f = await twoSheetWorkbook(tmp.file('two-sheets.xlsx'));
    const first = await openTable(f);
    await first.close();
    expect(first).toMatchObject({ sheet: 'Hourly data', sheets: ['Notes', 'Hourly data'] });
    await expect(openTable(f, { sheet: 'Notes' })).rejects.toMatchObject({ code: 'no-header-row' });
    const table = await openTable(f, { sheet: 'Hourly data' });
    await table.close();
    expect(table.sheets).toEqual(['Notes', 'Hourly data']);
    expect(table.sheet).toBe('Hourly data');
    expect(table.headers[1]).toBe('Gross MW');
  });

  it('refuses a sheet the workbook lacks, naming the ones it has', async () => {
    const f = await twoSheetWorkbook(tmp.file('two-sheets-missing.xlsx'));
    await expect(openTable(f, { sheet: 'Daily' })).rejects.toMatchObject({
      code: 'no-such-sheet',
      message: 'the workbook has no sheet named "Daily"; its sheets are "Notes", "Hourly data"',
    });
  });

  it('checks and imports the sheet the mapping names', async () => {
    const f = await twoSheetWorkbook(tmp.file('two-sheets-import.xlsx'));
    const mapping = {
      ...US_MAPPING,
      sheet: 'Hourly data',
      columns: { ...US_MAPPING.columns, grossLoad: { column: 'Gross MW', unit: 'MW' }, cwInletTemperature: { column: 'CW In Temp °F', unit: 'degF' } },
    };
    const check = await checkImportFile(f, { mapping });
    expect(check.errors).toEqual([]);
    expect(check).toMatchObject({ ok: true, dataRows: 3 });
  });
});
