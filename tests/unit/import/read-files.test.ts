import { writeFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openCsvTable, detectDelimiter } from '@backend/import/read-csv.js';
import { openXlsxTable } from '@backend/import/read-xlsx.js';
import { openTable } from '@backend/import/open-table.js';
import { ImportFileError } from '@backend/import/import-errors.js';
import type { RawTable } from '@backend/import/raw-table.js';
import { makeTempDir, writeCsv, writeXlsx } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

async function allRows(table: RawTable) {
  const rows = [];
  for await (const r of table.rows) rows.push(r);
  return rows;
}

async function fileError(promise: Promise<unknown>): Promise<ImportFileError> {
  try {
    const t = (await promise) as RawTable;
    await allRows(t);
  } catch (e) {
    expect(e).toBeInstanceOf(ImportFileError);
    return e as ImportFileError;
  }
  throw new Error('expected a file-level error');
}

describe('CSV reader', () => {
  it.each([
    ['comma', ','],
    ['semicolon', ';'],
    ['tab', '\t'],
  ])('detects a %s delimiter and reads every row with its file line', async (_name, d) => {
    const f = await writeCsv(tmp.file(`delim-${_name}.csv`), [
      ['Time', 'Gross MW', 'BP'].join(d),
      ['2024-01-01T00:00Z', '480', '2.1'].join(d),
      ['2024-01-01T00:01Z', '481', '2.2'].join(d),
    ]);
    const t = await openCsvTable(f);
    expect(t.headers).toEqual(['Time', 'Gross MW', 'BP']);
    expect(await allRows(t)).toEqual([
      { line: 2, cells: ['2024-01-01T00:00Z', '480', '2.1'] },
      { line: 3, cells: ['2024-01-01T00:01Z', '481', '2.2'] },
    ]);
  });

  it('does not count delimiters inside quotes', () => {
    expect(detectDelimiter('"1,5";"2,5";x\n"3,5";"4,5";y\n', true)).toBe(';');
    expect(detectDelimiter('a,"1;2;3",b\nc,"4;5;6",d\n', true)).toBe(',');
  });

  it('skips a preamble and folds a units row into the header texts', async () => {
    const f = await writeCsv(tmp.file('preamble.csv'), [
      'Exported from the plant historian',
      'Interval: 1 min',
      'Time,CW In Temp,Gross',
      ',°F,MW',
      '2024-01-01T00:00Z,70.1,480',
    ]);
    const t = await openCsvTable(f);
    expect(t.headers).toEqual(['Time', 'CW In Temp (°F)', 'Gross (MW)']);
    expect(t.headerLine).toBe(4);
    const rows = await allRows(t);
    expect(rows).toEqual([{ line: 5, cells: ['2024-01-01T00:00Z', '70.1', '480'] }]);
  });

  it('reads a UTF-8 byte-order mark and Windows Latin-1 degree signs', async () => {
    const bom = tmp.file('bom.csv');
    await writeFile(bom, '\uFEFFTime,CW In Temp °F\r\n2024-01-01T00:00Z,70\r\n', 'utf8');
    expect((await openCsvTable(bom)).headers).toEqual(['Time', 'CW In Temp °F']);
    const latin = tmp.file('latin1.csv');
    await writeFile(latin, Buffer.from('Time,CW In Temp \xb0F\r\n2024-01-01T00:00Z,70\r\n', 'latin1'));
    expect((await openCsvTable(latin)).headers).toEqual(['Time', 'CW In Temp °F']);
  });

  it('reports a 0-byte file', async () => {
    const f = tmp.file('zero.csv');
    await writeFile(f, '');
    expect((await fileError(openCsvTable(f))).code).toBe('empty-file');
  });

  it('reports a file of blank lines as empty', async () => {
    const f = tmp.file('blank.csv');
    await writeFile(f, '\r\n   \r\n\r\n');
    expect((await fileError(openCsvTable(f))).code).toBe('empty-file');
  });

  it('reports a header without data rows', async () => {
    const f = await writeCsv(tmp.file('header-only.csv'), ['Time,Gross MW,BP']);
    const e = await fileError(openCsvTable(f));
    expect(e.code).toBe('no-data-rows');
  });

  it('reports a line longer than 100,000 characters with its line number', async () => {
    const f = await writeCsv(tmp.file('long-line.csv'), [
      'Time,Gross MW,BP',
      '2024-01-01T00:00Z,480,2.1',
      `2024-01-01T00:01Z,${'9'.repeat(100_001)},2.1`,
      '2024-01-01T00:02Z,480,2.1',
    ]);
    const e = await fileError(openCsvTable(f));
    expect(e.code).toBe('line-too-long');
    expect(e.line).toBe(3);
    expect(e.message).toMatch(/line 3 is longer than 100,000 characters/);
  });

  it('reports a long line spread over many short cells as well', async () => {
    const f = await writeCsv(tmp.file('long-cells.csv'), ['Time,Gross MW,BP', '2024-01-01T00:00Z,480,2.1', `2024-01-01T00:01Z,${'1,'.repeat(50_001)}2`]);
    expect((await fileError(openCsvTable(f))).code).toBe('line-too-long');
  });

  it('refuses binary garbage', async () => {
    const f = tmp.file('garbage.csv');
    const bytes = Buffer.alloc(4096);
    let x = 7;
    for (let i = 0; i < bytes.length; i++) bytes[i] = x = (x * 1103515245 + 12345) & 0xff;
    await writeFile(f, bytes);
    expect((await fileError(openCsvTable(f))).code).toBe('not-text');
  });

  it('refuses an XLSX uploaded as CSV and UTF-16 text with a clear message', async () => {
    const x = await writeXlsx(tmp.file('real.xlsx'), [
      ['Time', 'MW'],
      [45292, 480],
    ]);
    expect((await fileError(openCsvTable(x))).message).toMatch(/XLSX/);
    const u = tmp.file('utf16.csv');
    await writeFile(u, Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('Time,MW\r\n', 'utf16le')]));
    expect((await fileError(openCsvTable(u))).code).toBe('unsupported-encoding');
  });

  it('refuses a file whose first lines name no columns', async () => {
    const f = await writeCsv(tmp.file('numbers-only.csv'), ['1,2,3', '4,5,6', '7,8,9']);
    expect((await fileError(openCsvTable(f))).code).toBe('no-header-row');
  });
});

describe('XLSX reader', () => {
  it('streams the first sheet: numbers as exact text, date cells as Excel serials, short rows padded', async () => {
    const f = await writeXlsx(tmp.file('good.xlsx'), [
      ['Timestamp', 'Gross MW', 'BP (inHgA)', 'Note'],
      [45292.5, 480.25, 2.0625, 'ok'],
      [45292.50069444444, 481, 2.07],
    ]);
    const t = await openXlsxTable(f);
    expect(t.headers).toEqual(['Timestamp', 'Gross MW', 'BP (inHgA)', 'Note']);
    expect(await allRows(t)).toEqual([
      { line: 2, cells: ['45292.5', '480.25', '2.0625', 'ok'] },
      { line: 3, cells: ['45292.50069444444', '481', '2.07', ''] },
    ]);
  });

  it('is chosen by the first bytes, whatever the file is called', async () => {
    const f = await writeXlsx(tmp.file('misnamed.csv'), [
      ['Timestamp', 'Gross MW'],
      [45292, 480],
    ]);
    expect((await openTable(f)).kind).toBe('xlsx');
  });

  it('refuses a file that is not a workbook, a 0-byte file and a sheet with no data', async () => {
    const notZip = await writeCsv(tmp.file('text.xlsx'), ['Time,MW', '1,2']);
    expect((await fileError(openXlsxTable(notZip))).code).toBe('not-xlsx');
    const zero = tmp.file('zero.xlsx');
    await writeFile(zero, '');
    expect((await fileError(openXlsxTable(zero))).code).toBe('empty-file');
    const headerOnly = await writeXlsx(tmp.file('header-only.xlsx'), [['Timestamp', 'Gross MW']]);
    expect((await fileError(openXlsxTable(headerOnly))).code).toBe('no-data-rows');
    const empty = await writeXlsx(tmp.file('empty.xlsx'), []);
    expect((await fileError(openXlsxTable(empty))).code).toBe('empty-file');
  });

  it('refuses a damaged ZIP', async () => {
    const f = tmp.file('broken.xlsx');
    await writeFile(f, Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(2000, 0x41)]));
    expect((await fileError(openXlsxTable(f))).code).toBe('not-xlsx');
  });
});
