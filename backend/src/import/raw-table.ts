/**
 * What a reader hands to the row parser: the header texts and an async stream of raw rows,
 * each with its 1-based line in the file. A table is read once; open it again for a second pass.
 */
import { ImportFileError } from './import-errors.js';

export interface RawRow {
  /** 1-based line of the file (CSV) or row number of the sheet (XLSX). */
  line: number;
  cells: string[];
}

export interface RawTable {
  kind: 'csv' | 'xlsx';
  headers: string[];
  /** 1-based line of the header row (the last one when a units row follows it). */
  headerLine: number;
  /** Per column, the text of the units row(s) under the names ('' where none); empty without such a row. */
  units: string[];
  /** Lines above the header (export notes, the query's time range), their cells joined, at most 10. */
  titleLines: string[];
  /** XLSX: every sheet of the workbook, and the one read. */
  sheets?: string[];
  sheet?: string;
  /** A plain CSV file (no quotes, one kind of line end): how to split its lines, for readers that scan it themselves. */
  plain?: { encoding: 'utf8' | 'latin1'; delimiter: string; ends: 'lf' | 'crlf'; maxLine: number };
  /** The first data rows, for guessing a mapping (they are also yielded by `rows`). */
  sampleRows: string[][];
  rows: AsyncIterable<RawRow>;
  /** The same rows in runs (cheaper per row than `rows`); use one or the other, once. */
  chunks: AsyncIterable<RawRow[]>;
  /** Stop reading and release the file (also happens when `rows` is finished or left early). */
  close(): Promise<void>;
}

export const HEADER_SEARCH_ROWS = 25;
export const CHUNK_ROWS = 2048;
export const SAMPLE_ROWS = 20;
/** Lines longer than this are a file-level error (guards against a wrong delimiter or a binary file). */
export const MAX_LINE_CHARS = 100_000;

const NUMERIC = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;
export const looksNumeric = (cell: string): boolean => NUMERIC.test(cell.trim());

/**
 * Finds the header row among the first records: the first row with at least two named cells,
 * mostly non-numeric, and about as wide as the rows below it (preamble lines of one or two cells
 * are skipped). Rows right below it without a single number (a units row, a description row) are
 * folded into the header texts as "Name (unit)".
 */
export function locateHeader(records: string[][]): { headerIndex: number; dataIndex: number; headers: string[]; units: string[] } | null {
  const widths = new Map<number, number>();
  for (const r of records) widths.set(r.length, (widths.get(r.length) ?? 0) + 1);
  let modal = 0;
  let best = -1;
  for (const [w, n] of widths) if (n > best || (n === best && w > modal)) [modal, best] = [w, n];
  for (let i = 0; i < records.length; i++) {
    const cells = records[i]!.map((c) => c.trim());
    const named = cells.filter((c) => c !== '');
    if (named.length < 2 || named.length < Math.ceil(0.6 * modal)) continue;
    // a title line giving the export's time range ("From", "2024-01-01 00:00") names no columns
    if (named.some(looksLikeDateTime)) continue;
    // nor does one naming the tag of a one-tag file ("Tag,U1.GEN.MW") above the file's own header row
    if (named.length === 2 && TAG_LABEL.test(cells[0]!) && i + 1 < records.length && looksLikeHeaderRow(records[i + 1]!)) continue;
    const numeric = named.filter(looksNumeric).length;
    if (numeric > named.length / 2) return null;
    const headers = cells.map((c, k) => c || `(column ${k + 1})`);
    const units: string[] = [];
    let j = i + 1;
    while (j < records.length && j <= i + 3) {
      const extra = records[j]!.map((c) => c.trim());
      if (extra.every((c) => !looksNumeric(c)) && extra.some((c) => c !== '') && !extra.some(looksLikeDateTime)) {
        for (let k = 0; k < headers.length; k++) {
          if (extra[k]) headers[k] = `${headers[k]} (${extra[k]})`;
          units[k] = [units[k], extra[k]].filter(Boolean).join(' ');
        }
        j++;
      } else break;
    }
    return { headerIndex: i, dataIndex: j, headers, units: units.length ? headers.map((_, k) => units[k] ?? '') : [] };
  }
  return null;
}

/**
 * Reads up to HEADER_SEARCH_ROWS rows and finds the header among them; the data rows after it start the
 * table (at least one is required). `words` names the source in the messages ('file'/'lines' or 'sheet'/'rows').
 */
export async function readHeaderBlock(
  next: () => Promise<RawRow | null>,
  messages: { empty: string; noHeader: string; noData: string },
): Promise<{ head: RawRow[]; located: NonNullable<ReturnType<typeof locateHeader>>; buffered: RawRow[] }> {
  const head: RawRow[] = [];
  while (head.length < HEADER_SEARCH_ROWS) {
    const row = await next();
    if (!row) break;
    head.push(row);
  }
  if (head.length === 0) throw new ImportFileError('empty-file', messages.empty);
  const located = locateHeader(head.map((r) => r.cells));
  if (!located) throw new ImportFileError('no-header-row', messages.noHeader);
  const buffered = head.slice(located.dataIndex);
  if (buffered.length === 0) {
    const more = await next();
    if (!more) throw new ImportFileError('no-data-rows', messages.noData);
    buffered.push(more);
  }
  return { head, located, buffered };
}

const TAG_LABEL = /^(tag|tag ?name|tagname|point|point ?name|signal|item)\s*:?$/i;
const looksLikeHeaderRow = (cells: string[]): boolean => {
  const named = cells.map((c) => c.trim()).filter(Boolean);
  return named.length >= 2 && !named.some((c) => looksNumeric(c) || looksLikeDateTime(c));
};

export const looksLikeDateTime = (cell: string): boolean => /^\d{1,4}[-/.]\d{1,2}[-/.]\d{1,4}/.test(cell.trim());

/** The lines above a located header, their cells joined (export notes, the query's range), at most 10. */
export const titleLinesOf = (head: RawRow[], headerIndex: number): string[] =>
  head
    .slice(0, headerIndex)
    .map((r) =>
      r.cells
        .map((c) => c.trim())
        .filter(Boolean)
        .join(' ')
        .slice(0, 200),
    )
    .filter(Boolean)
    .slice(0, 10);

/** Builds a table from its first data rows and a stream of further runs of rows. */
export function tableFrom(
  kind: RawTable['kind'],
  located: { headers: string[]; units: string[]; titleLines: string[] },
  headerLine: number,
  firstRows: RawRow[],
  chunks: AsyncIterable<RawRow[]>,
  close: () => Promise<void>,
): RawTable {
  async function* rows(): AsyncGenerator<RawRow> {
    for await (const chunk of chunks) yield* chunk;
  }
  const { headers, units, titleLines } = located;
  return { kind, headers, units, titleLines, headerLine, sampleRows: firstRows.slice(0, SAMPLE_ROWS).map((r) => r.cells), rows: rows(), chunks, close };
}
