/**
 * Streaming XLSX reader (exceljs WorkbookReader): rows of the first worksheet are parsed as the ZIP
 * is inflated, so the workbook is never held whole. Styles are ignored, so date cells arrive as
 * their Excel serial numbers (map the timestamp column as "excel-serial" with the plant's zone).
 * Cells are turned into text: numbers in their shortest exact form, formulas by their cached result.
 */
import { createReadStream } from 'node:fs';
import { open, stat } from 'node:fs/promises';
import ExcelJS from 'exceljs';
import { ImportFileError, NOT_A_READABLE_WORKBOOK } from './import-errors.js';
import { CHUNK_ROWS, HEADER_SEARCH_ROWS, MAX_LINE_CHARS, readHeaderBlock, tableFrom, titleLinesOf, type RawRow, type RawTable } from './raw-table.js';

const MS_PER_DAY = 86_400_000;
const EXCEL_SERIAL_UNIX_EPOCH = 25_569;

/** One cell value of exceljs as text. */
export function cellText(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'string') return value;
  if (typeof value === 'number') return String(value);
  if (typeof value === 'boolean') return value ? 'TRUE' : 'FALSE';
  if (value instanceof Date) return String(value.getTime() / MS_PER_DAY + EXCEL_SERIAL_UNIX_EPOCH);
  if (typeof value === 'object') {
    const v = value as { richText?: { text: string }[]; result?: unknown; formula?: string; error?: string; text?: unknown };
    if (Array.isArray(v.richText)) return v.richText.map((r) => r.text).join('');
    if ('result' in v || 'formula' in v) return cellText(v.result);
    if (typeof v.error === 'string') return v.error;
    if ('text' in v) return cellText(v.text);
  }
  return String(value);
}

async function assertZip(filePath: string): Promise<void> {
  const { size } = await stat(filePath);
  if (size === 0) throw new ImportFileError('empty-file', 'the file is empty (0 bytes)');
  const fh = await open(filePath, 'r');
  try {
    const sig = Buffer.alloc(4);
    await fh.read(sig, 0, 4, 0);
    if (!(sig[0] === 0x50 && sig[1] === 0x4b && sig[2] === 0x03 && sig[3] === 0x04)) {
      throw new ImportFileError('not-xlsx', 'this is not an XLSX workbook (an .xlsx file is a ZIP archive)');
    }
  } finally {
    await fh.close();
  }
}

/** How long the reader may wait for the next row while the file is not being read any further. */
export const XLSX_STALL_MS = 10_000;

/**
 * An iterator of the workbook reader that cannot wait for ever: some damaged ZIP archives leave the streaming
 * reader waiting for data that never comes (no error, no end). A wait during which the file is not read any
 * further for XLSX_STALL_MS ends with the damaged-workbook error instead; a large sheet still being read keeps
 * the file's position moving and is never cut short.
 */
function guardedIterator<T>(inner: AsyncIterator<T>, input: { bytesRead: number }): AsyncIterator<T> {
  return {
    next: () =>
      new Promise<IteratorResult<T>>((resolve, reject) => {
        let seen = input.bytesRead;
        let movedAt = Date.now();
        const timer = setInterval(() => {
          if (input.bytesRead !== seen) {
            seen = input.bytesRead;
            movedAt = Date.now();
          } else if (Date.now() - movedAt >= XLSX_STALL_MS) {
            clearInterval(timer);
            reject(new ImportFileError('not-xlsx', NOT_A_READABLE_WORKBOOK));
          }
        }, 1_000);
        inner.next().then(
          (r) => {
            clearInterval(timer);
            resolve(r);
          },
          (e: unknown) => {
            clearInterval(timer);
            reject(e instanceof Error ? e : new Error(String(e)));
          },
        );
      }),
  };
}

export interface XlsxReadOptions {
  maxLineChars?: number;
  /** The sheet to read by name (default: the first). */
  sheet?: string;
}

export async function openXlsxTable(filePath: string, options: XlsxReadOptions = {}): Promise<RawTable> {
  const maxLine = options.maxLineChars ?? MAX_LINE_CHARS;
  await assertZip(filePath);
  const input = createReadStream(filePath);
  const reader = new ExcelJS.stream.xlsx.WorkbookReader(input, {
    worksheets: 'emit',
    sharedStrings: 'cache',
    hyperlinks: 'ignore',
    styles: 'ignore',
    entries: 'ignore',
  });
  const sheets = guardedIterator(reader[Symbol.asyncIterator](), input);
  let rowIterator: AsyncIterator<ExcelJS.Row> | null = null;
  let sawSheet = false;
  let sheetNames: string[] = [];
  let sheetName: string | undefined;
  let width = 0;
  const close = async () => {
    input.destroy();
  };
  const broken = (e: unknown) => (e instanceof ImportFileError ? e : new ImportFileError('not-xlsx', NOT_A_READABLE_WORKBOOK, undefined, e));

  /** Opens the next sheet for reading (after one that did not read as a table); false when there is none. */
  const moreSheets = async (): Promise<boolean> => {
    try {
      // the rest of the sheet passed over is read to its end first
      if (rowIterator) for (let r = await rowIterator.next(); !r.done; r = await rowIterator.next());
      rowIterator = null;
      const sheet = await sheets.next();
      if (sheet.done) return false;
      const ws = sheet.value as unknown as { name?: string } & AsyncIterable<ExcelJS.Row>;
      sheetName = ws.name;
      rowIterator = guardedIterator(ws[Symbol.asyncIterator](), input);
      return true;
    } catch (e) {
      throw broken(e);
    }
  };
  const next = async (): Promise<RawRow | null> => {
    try {
      while (!rowIterator) {
        const sheet = await sheets.next();
        if (sheet.done) {
          if (sawSheet) return null;
          if (options.sheet !== undefined && sheetNames.length > 0) {
            throw new ImportFileError(
              'no-such-sheet',
              `the workbook has no sheet named "${options.sheet}"; its sheets are ${sheetNames.map((n) => `"${n}"`).join(', ')}`,
            );
          }
          throw new ImportFileError(
            'not-xlsx',
            'the file is a ZIP archive but holds no worksheet: is it an XLSX workbook? Save it again from your spreadsheet program as .xlsx and upload that',
          );
        }
        const ws = sheet.value as unknown as { name?: string } & AsyncIterable<ExcelJS.Row>;
        if (sheetNames.length === 0) {
          const model = (reader as unknown as { model?: { sheets?: { name?: unknown }[] } }).model;
          sheetNames = (model?.sheets ?? []).map((m) => String(m.name ?? '')).filter(Boolean);
        }
        // a sheet not chosen is passed over: its rows are read to the end (the reader may have parked it in a temporary file)
        if (options.sheet !== undefined && ws.name !== options.sheet) {
          const passed = guardedIterator(ws[Symbol.asyncIterator](), input);
          for (let r = await passed.next(); !r.done; r = await passed.next());
          continue;
        }
        sawSheet = true;
        sheetName = ws.name;
        rowIterator = guardedIterator(ws[Symbol.asyncIterator](), input);
      }
      for (;;) {
        const r = await rowIterator.next();
        if (r.done) return null;
        const values = r.value.values as unknown[];
        const cells: string[] = [];
        let chars = 0;
        for (let k = 1; k < values.length; k++) {
          const t = cellText(values[k]);
          cells.push(t);
          chars += t.length + 1;
        }
        if (chars > maxLine)
          throw new ImportFileError('line-too-long', `row ${r.value.number} is longer than ${maxLine.toLocaleString('en-US')} characters`, r.value.number);
        if (cells.every((c) => c.trim() === '')) continue;
        while (cells.length < width) cells.push('');
        return { line: r.value.number, cells };
      }
    } catch (e) {
      throw broken(e);
    }
  };

  try {
    const messages = {
      empty: options.sheet !== undefined ? `the sheet "${options.sheet}" is empty` : 'the first worksheet is empty',
      noHeader: `no header row found in the first ${HEADER_SEARCH_ROWS} rows: the sheet must name its columns`,
      noData: 'the sheet has a header but no data rows',
    };
    let block: Awaited<ReturnType<typeof readHeaderBlock>> | null = null;
    let firstProblem: unknown = null;
    // No sheet named: the first sheet that reads as a table (a notes sheet before the data is passed over).
    while (!block) {
      try {
        block = await readHeaderBlock(next, messages);
      } catch (e) {
        const tableProblem = e instanceof ImportFileError && (e.code === 'no-header-row' || e.code === 'empty-file' || e.code === 'no-data-rows');
        if (options.sheet !== undefined || !tableProblem) throw e;
        firstProblem ??= e;
        if (!(await moreSheets())) throw firstProblem;
      }
    }
    const { head, located, buffered } = block;
    width = located.headers.length;
    for (const r of buffered) while (r.cells.length < width) r.cells.push('');
    async function* chunks(): AsyncGenerator<RawRow[]> {
      try {
        yield buffered;
        for (;;) {
          const chunk: RawRow[] = [];
          for (let row = await next(); row; row = chunk.length < CHUNK_ROWS ? await next() : null) chunk.push(row);
          if (chunk.length === 0) return;
          yield chunk;
        }
      } finally {
        await close();
      }
    }
    const table = tableFrom(
      'xlsx',
      { ...located, titleLines: titleLinesOf(head, located.headerIndex) },
      head[located.dataIndex - 1]!.line,
      buffered,
      chunks(),
      close,
    );
    return { ...table, sheets: sheetNames.length ? sheetNames : sheetName ? [sheetName] : [], ...(sheetName !== undefined ? { sheet: sheetName } : {}) };
  } catch (e) {
    await close();
    throw e;
  }
}
