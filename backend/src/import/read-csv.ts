/**
 * Streaming CSV reader (csv-parse): the file is read in chunks, never held whole. Detects the encoding
 * (UTF-8, else Windows Latin-1), the delimiter (comma, semicolon, tab or bar, by the most consistent
 * count over the first lines) and the header row. File-level problems throw ImportFileError.
 */
import { isAscii } from 'node:buffer';
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
  /** false: always the CSV parser, even for a plain file (tests compare the two). */
  plainSplit?: boolean;
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

export const lineTooLong = (line: number, max: number) =>
  new ImportFileError('line-too-long', `line ${line} is longer than ${max.toLocaleString('en-US')} characters: is this the right file and delimiter?`, line);

/**
 * Whether the file is plain: no quote character anywhere, and its lines end all in LF or all in CR LF (no other CR).
 * Such a file reads the same by splitting lines and cells as by the CSV parser, several times faster (one pass of
 * the bytes first, at memory speed).
 */
export async function plainLineEnds(filePath: string): Promise<'lf' | 'crlf' | null> {
  return (await plainFile(filePath))?.ends ?? null;
}

/** plainLineEnds, and whether every byte is ASCII (then Latin-1 decoding gives the same text, faster than UTF-8). */
async function plainFile(filePath: string): Promise<{ ends: 'lf' | 'crlf'; ascii: boolean } | null> {
  const fh = await open(filePath, 'r');
  try {
    const buf = Buffer.alloc(1 << 20);
    let cr = false;
    let lf = false;
    let prev = -1;
    let crlfOnly = true;
    let ascii = true;
    for (let pos = 0; ;) {
      const { bytesRead } = await fh.read(buf, 0, buf.length, pos);
      if (bytesRead === 0) break;
      const b = bytesRead === buf.length ? buf : buf.subarray(0, bytesRead);
      if (b.includes(0x22)) return null;
      if (ascii && !isAscii(b)) ascii = false;
      const hasCr = b.includes(0x0d);
      if (!lf && b.includes(0x0a)) lf = true;
      if (hasCr || cr) {
        cr = true;
        // every CR followed by LF, every LF preceded by CR
        for (let i = 0; i < b.length; i++) {
          const c = b[i]!;
          if ((c === 0x0a && prev !== 0x0d) || (prev === 0x0d && c !== 0x0a)) crlfOnly = false;
          prev = c;
        }
        if (!crlfOnly) return null;
      } else prev = b[b.length - 1]!;
      pos += bytesRead;
    }
    if (prev === 0x0d) return null;
    const ends = cr ? (lf ? 'crlf' : null) : 'lf';
    return ends ? { ends, ascii } : null;
  } finally {
    await fh.close();
  }
}

/**
 * The rows of a plain file (see plainLineEnds) in runs, read as the CSV parser reads it with our options: the BOM
 * dropped, empty lines skipped but counted, cells split at the delimiter as they are, a line longer than `maxLine`
 * refused by its number.
 */
async function* plainRows(filePath: string, encoding: 'utf8' | 'latin1', delimiter: string, ends: 'lf' | 'crlf', maxLine: number): AsyncGenerator<RawRow[]> {
  const input = createReadStream(filePath, { encoding, highWaterMark: 256 * 1024 });
  const cut = ends === 'crlf' ? 1 : 0;
  let rest = '';
  let line = 0;
  let first = true;
  try {
    for await (const piece of input as AsyncIterable<string>) {
      let text = rest + piece;
      if (first) {
        if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
        first = false;
      }
      const out: RawRow[] = [];
      let start = 0;
      for (let end = text.indexOf('\n'); end >= 0; start = end + 1, end = text.indexOf('\n', start)) {
        line++;
        const length = end - start - cut;
        if (length === 0) continue;
        if (length > maxLine) throw lineTooLong(line, maxLine);
        out.push({ line, cells: text.slice(start, end - cut).split(delimiter) });
      }
      rest = text.slice(start);
      if (rest.length > maxLine + 1) throw lineTooLong(line + 1, maxLine);
      if (out.length > 0) yield out;
    }
    if (rest.length > 0) {
      line++;
      if (rest.length > maxLine) throw lineTooLong(line, maxLine);
      yield [{ line, cells: rest.split(delimiter) }];
    }
  } catch (e) {
    if (e instanceof ImportFileError) throw e;
    throw new ImportFileError('unreadable-file', 'the file could not be read to its end: upload it again', undefined, e);
  } finally {
    input.destroy();
  }
}

/** A plain file's table: the header block from its first rows, then the rest in runs of up to CHUNK_ROWS. */
async function openPlainTable(filePath: string, encoding: 'utf8' | 'latin1', delimiter: string, ends: 'lf' | 'crlf', maxLine: number): Promise<RawTable> {
  const source = plainRows(filePath, encoding, delimiter, ends, maxLine);
  let pending: RawRow[] = [];
  let at = 0;
  const nextChunk = async (max: number): Promise<RawRow[] | null> => {
    while (at >= pending.length) {
      const r = await source.next();
      if (r.done) return null;
      [pending, at] = [r.value, 0];
    }
    const out = at === 0 && pending.length <= max ? pending : pending.slice(at, at + max);
    at += out.length;
    return out;
  };
  const close = async () => {
    await source.return(undefined);
  };
  try {
    return { ...(await tableAfterHeader(nextChunk, close)), plain: { encoding, delimiter, ends, maxLine } };
  } catch (e) {
    await close();
    throw e;
  }
}

/**
 * The table of either reader once rows come in chunks: the header block found in the first rows, then those rows
 * and the rest in chunks; the reader is closed when the chunks end (or are left early).
 */
async function tableAfterHeader(nextChunk: (max: number) => Promise<RawRow[] | null>, close: () => Promise<void>): Promise<RawTable> {
  const { head, located, buffered } = await readHeaderBlock(async () => (await nextChunk(1))?.[0] ?? null, {
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
}

export async function openCsvTable(filePath: string, options: CsvReadOptions = {}): Promise<RawTable> {
  const maxLine = options.maxLineChars ?? MAX_LINE_CHARS;
  const { encoding, text, wholeFile } = await inspectHead(filePath);
  const delimiter = options.delimiter ?? detectDelimiter(text, wholeFile);
  const plain = options.plainSplit === false ? null : await plainFile(filePath);
  if (plain) return openPlainTable(filePath, plain.ascii ? 'latin1' : encoding, delimiter, plain.ends, maxLine);
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
  const close = async () => {
    input.destroy();
    parser.destroy();
  };

  try {
    return await tableAfterHeader(nextChunk, close);
  } catch (e) {
    await close();
    throw e;
  }
}
