/**
 * Streaming CSV reader (csv-parse): the file is read in chunks, never held whole. Detects the encoding
 * (UTF-8, else Windows Latin-1), the delimiter (comma, semicolon, tab or bar, by the most consistent
 * count over the first lines) and the header row. File-level problems throw ImportFileError.
 */
import { createReadStream } from 'node:fs';
import { open, stat } from 'node:fs/promises';
import { CsvError, parse, type Info } from 'csv-parse';
import { ImportFileError } from './import-errors.js';
import { CHUNK_ROWS, HEADER_SEARCH_ROWS, MAX_LINE_CHARS, readHeaderBlock, tableFrom, titleLinesOf, type RawRow, type RawTable } from './raw-table.js';

const HEAD_BYTES = 64 * 1024;
const DELIMITERS = [',', ';', '\t', '|'] as const;

export interface CsvReadOptions {
  /** Override the detected delimiter. */
  delimiter?: string;
  maxLineChars?: number;
}

/** Reads the first bytes and decides whether this is text we can read, and in which encoding. */
async function inspectHead(filePath: string): Promise<{ encoding: 'utf8' | 'latin1'; text: string; wholeFile: boolean }> {
  const { size } = await stat(filePath);
  if (size === 0) throw new ImportFileError('empty-file', 'the file is empty (0 bytes)');
  const fh = await open(filePath, 'r');
  try {
    const buf = Buffer.alloc(Math.min(HEAD_BYTES, size));
    const { bytesRead } = await fh.read(buf, 0, buf.length, 0);
    const head = buf.subarray(0, bytesRead);
    if (head[0] === 0x50 && head[1] === 0x4b && head[2] === 0x03 && head[3] === 0x04) {
      throw new ImportFileError('not-text', 'this is a ZIP/XLSX file, not CSV text: upload it as an .xlsx file');
    }
    if ((head[0] === 0xff && head[1] === 0xfe) || (head[0] === 0xfe && head[1] === 0xff)) {
      throw new ImportFileError('unsupported-encoding', 'the file is UTF-16 text: save it as "CSV UTF-8" and upload again');
    }
    let control = 0;
    for (const b of head) {
      if (b === 0) throw new ImportFileError('not-text', 'the file contains binary data (NUL bytes), not CSV text');
      if (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d) control++;
    }
    if (control > head.length * 0.01) throw new ImportFileError('not-text', 'the file contains binary data, not CSV text');
    const wholeFile = bytesRead === size;
    // a multi-byte character may be cut at the end of the head: ignore the last 3 bytes when checking
    const checked = wholeFile ? head : head.subarray(0, Math.max(0, head.length - 3));
    let encoding: 'utf8' | 'latin1' = 'utf8';
    try {
      new TextDecoder('utf-8', { fatal: true }).decode(checked);
    } catch {
      encoding = 'latin1';
    }
    const text = head.toString(encoding).replace(/^\uFEFF/, '');
    if (wholeFile && text.trim() === '') throw new ImportFileError('empty-file', 'the file holds no text (only blank lines or spaces)');
    return { encoding, text, wholeFile };
  } finally {
    await fh.close();
  }
}

/** Delimiter whose count per line is the same on most of the first lines (quotes respected). */
export function detectDelimiter(text: string, wholeFile: boolean): string {
  const lines = text.split(/\r\n|\n|\r/);
  if (!wholeFile) lines.pop();
  const sample = lines.filter((l) => l.trim() !== '').slice(0, 30);
  let best: string = ',';
  let bestScore = 0;
  for (const d of DELIMITERS) {
    const counts = sample.map((line) => {
      let n = 0;
      let quoted = false;
      for (const ch of line) {
        if (ch === '"') quoted = !quoted;
        else if (ch === d && !quoted) n++;
      }
      return n;
    });
    const freq = new Map<number, number>();
    for (const c of counts) if (c > 0) freq.set(c, (freq.get(c) ?? 0) + 1);
    let score = 0;
    for (const [count, lines_] of freq) score = Math.max(score, lines_ * 1000 + count);
    if (score > bestScore) [best, bestScore] = [d, score];
  }
  return best;
}

const lineTooLong = (line: number, max: number) =>
  new ImportFileError('line-too-long', `line ${line} is longer than ${max.toLocaleString('en-US')} characters: is this the right file and delimiter?`, line);

export async function openCsvTable(filePath: string, options: CsvReadOptions = {}): Promise<RawTable> {
  const maxLine = options.maxLineChars ?? MAX_LINE_CHARS;
  const { encoding, text, wholeFile } = await inspectHead(filePath);
  const delimiter = options.delimiter ?? detectDelimiter(text, wholeFile);
  const input = createReadStream(filePath, { encoding, highWaterMark: 256 * 1024 });
  const parser = parse({
    delimiter,
    bom: true,
    relax_column_count: true,
    skip_empty_lines: true,
    // a quote inside an unquoted cell is kept as text; an unclosed quoted cell is still an error
    relax_quotes: true,
    max_record_size: maxLine,
    info: true,
  });
  input.on('error', (e) => parser.destroy(e));
  input.pipe(parser);
  // rows are taken from the parser in synchronous runs (read() until it is empty), not one promise per row
  let ended = false;
  let failure: unknown = null;
  let wake: (() => void) | null = null;
  const rouse = () => {
    const w = wake;
    wake = null;
    w?.();
  };
  parser.on('readable', rouse);
  parser.on('end', () => {
    ended = true;
    rouse();
  });
  parser.on('error', (e) => {
    failure = e;
    rouse();
  });

  /** Line of the last row handed out: a quote that never closes opened on the line after it. */
  let lastLine = 0;
  const translate = (e: unknown): Error => {
    if (e instanceof ImportFileError) return e;
    const err = e as Error & { code?: unknown; lines?: unknown };
    const line = typeof err.lines === 'number' ? err.lines : undefined;
    if (err.code === 'CSV_MAX_RECORD_SIZE') return lineTooLong(line ?? 0, maxLine);
    if (err.code === 'CSV_QUOTE_NOT_CLOSED') {
      return new ImportFileError('malformed-csv', `a quote opened on line ${lastLine + 1} is never closed: check the quotes on that line`, lastLine + 1, e);
    }
    if (e instanceof CsvError) {
      const where = line ?? lastLine + 1;
      return new ImportFileError('malformed-csv', `the CSV cannot be read at line ${where}: its quotes or delimiters do not form a table`, where, e);
    }
    return new ImportFileError('unreadable-file', 'the file could not be read to its end: upload it again', undefined, e);
  };
  /** The next run of rows (up to `max`), or null at the end of the file. */
  const nextChunk = async (max: number): Promise<RawRow[] | null> => {
    for (;;) {
      if (failure) throw translate(failure);
      const out: RawRow[] = [];
      let item: { record: string[]; info: Info } | null;
      while (out.length < max && (item = parser.read() as { record: string[]; info: Info } | null) !== null) {
        const cells = item.record;
        let chars = cells.length - 1;
        for (const c of cells) chars += c.length;
        if (chars > maxLine) throw lineTooLong(item.info.lines, maxLine);
        out.push({ line: item.info.lines, cells });
        lastLine = item.info.lines;
      }
      if (out.length > 0) return out;
      if (failure) throw translate(failure);
      if (ended) return null;
      await new Promise<void>((resolve) => {
        wake = resolve;
      });
    }
  };
  const next = async (): Promise<RawRow | null> => (await nextChunk(1))?.[0] ?? null;
  const close = async () => {
    input.destroy();
    parser.destroy();
  };

  try {
    const { head, located, buffered } = await readHeaderBlock(next, {
      empty: 'the file holds no text (only blank lines or spaces)',
      noHeader: `no header row found in the first ${HEADER_SEARCH_ROWS} lines: the file must name its columns`,
      noData: 'the file has a header but no data rows',
    });
    async function* chunks(): AsyncGenerator<RawRow[]> {
      try {
        yield buffered;
        for (let chunk = await nextChunk(CHUNK_ROWS); chunk; chunk = await nextChunk(CHUNK_ROWS)) yield chunk;
      } finally {
        await close();
      }
    }
    return tableFrom('csv', { ...located, titleLines: titleLinesOf(head, located.headerIndex) }, head[located.dataIndex - 1]!.line, buffered, chunks(), close);
  } catch (e) {
    await close();
    throw e;
  }
}
