/**
 * Tall historian files (one row per tag per time: tag name, timestamp, value and often a quality) and files of one
 * tag each, put on one time grid and written as a wide file so the rest of the import reads them like any other.
 *
 * Reading keeps, per mapped tag, four compact typed arrays (time, value, marker, line): 8 tags × 525,600 samples
 * is about 90 MB, whatever order the file is in (by tag then time, or by time). Each tag's samples are put in time
 * order in place (an index sort of typed arrays), then every grid time takes each tag's value by the chosen rule:
 *  - nearest: the sample nearest the grid time, if within the tolerance (a tie takes the earlier sample);
 *  - interpolate: the sample at the grid time, else a straight line between the samples either side of it when both
 *    lie within the tolerance;
 *  - interval-mean: the mean of the samples in the interval ending at the grid time, (g − grid, g].
 * A marked sample (status word or a quality not good) used by the rule makes the value marked; for the mean, any
 * marked sample in the interval does. A grid time without a value of every required tag is left out and counted
 * under the first tag it lacks. Every wrong cell (a bad time, other text in a value, the same tag twice at one
 * time) is listed by row and column, as for wide files, and nothing is written then.
 */
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdtemp, rm, stat } from 'node:fs/promises';
import { once } from 'node:events';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { DEFAULT_STATUS_WORDS, statusWordKey } from '@shared/schemas/historian-status.js';
import { IMPORT_QUANTITIES, REQUIRED_QUANTITIES, type ImportMapping, type ImportQuantity } from '@shared/schemas/import-mapping.js';
import { ImportFileError, RowErrorList } from './import-errors.js';
import { openTable } from './open-table.js';
import { lineTooLong } from './read-csv.js';
import type { RawTable } from './raw-table.js';
import { TimestampParser } from './timestamp-parsing.js';

/** One tag's samples, growable. */
export class TagSeries {
  times = new Float64Array(4096);
  values = new Float64Array(4096);
  /** 0 = a reading; k > 0 = marked by markers[k − 1] */
  markers = new Uint16Array(4096);
  lines = new Uint32Array(4096);
  n = 0;
  sorted = true;

  constructor(readonly tag: string) {}

  push(t: number, value: number, marker: number, line: number): void {
    if (this.n === this.times.length) this.grow();
    if (this.n > 0 && t < this.times[this.n - 1]!) this.sorted = false;
    this.times[this.n] = t;
    this.values[this.n] = value;
    this.markers[this.n] = marker;
    this.lines[this.n++] = line;
  }

  /** Makes room for `size` samples at once (a guess from the file's size), so the arrays are not grown step by step. */
  reserve(size: number): void {
    if (size > this.times.length) this.grow(Math.min(size, 1 << 26));
  }

  /** Grows by half (not double): a year of 1-min samples then needs 531,441 places, not 1,048,576. */
  private grow(to?: number): void {
    const size = to ?? Math.ceil(this.n * 1.5);
    const times = new Float64Array(size);
    times.set(this.times);
    const values = new Float64Array(size);
    values.set(this.values);
    const markers = new Uint16Array(size);
    markers.set(this.markers);
    const lines = new Uint32Array(size);
    lines.set(this.lines);
    [this.times, this.values, this.markers, this.lines] = [times, values, markers, lines];
  }

  /** Puts the samples in time order (a stable index sort; lines break ties so a repeat is reported at its later line). */
  sort(): void {
    if (this.sorted) return;
    const order = new Uint32Array(this.n);
    for (let i = 0; i < this.n; i++) order[i] = i;
    const { times, lines } = this;
    order.sort((a, b) => times[a]! - times[b]! || lines[a]! - lines[b]!);
    const reorder = <A extends Float64Array | Uint16Array | Uint32Array>(src: A, make: (n: number) => A): A => {
      const out = make(this.n);
      for (let i = 0; i < this.n; i++) out[i] = src[order[i]!]!;
      return out;
    };
    this.times = reorder(this.times, (n) => new Float64Array(n));
    this.values = reorder(this.values, (n) => new Float64Array(n));
    this.markers = reorder(this.markers, (n) => new Uint16Array(n));
    this.lines = reorder(this.lines, (n) => new Uint32Array(n));
    this.sorted = true;
  }
}

export interface AlignmentSettings {
  gridMinutes: number;
  rule: 'nearest' | 'interpolate' | 'interval-mean';
  toleranceMinutes: number;
}

/** The value of one tag at grid time g: a number, a marker (k > 0) or missing. */
export interface Aligned {
  value: number;
  marker: number;
  found: boolean;
}

/**
 * Walks one sorted series along increasing grid times: `at(g)` answers the rule's value at g. The cursor only moves
 * forward, so a whole grid costs one pass over the series.
 */
export class SeriesCursor {
  private p = 0; // first sample with time > g − window, kept moving forward
  constructor(
    private readonly s: TagSeries,
    private readonly settings: AlignmentSettings,
  ) {}

  at(g: number, out: Aligned): void {
    const { times, values, markers, n } = this.s;
    const step = this.settings.gridMinutes * 60_000;
    const tol = this.settings.toleranceMinutes * 60_000;
    out.found = false;
    out.marker = 0;
    out.value = Number.NaN;
    if (this.settings.rule === 'interval-mean') {
      while (this.p < n && times[this.p]! <= g - step) this.p++;
      let sum = 0;
      let count = 0;
      let marker = 0;
      for (let i = this.p; i < n && times[i]! <= g; i++) {
        if (markers[i]! > 0) marker ||= markers[i]!;
        else {
          sum += values[i]!;
          count++;
        }
      }
      if (marker > 0) [out.found, out.marker] = [true, marker];
      else if (count > 0) [out.found, out.value] = [true, sum / count];
      return;
    }
    // the last sample at or before g is p − 1 … found by moving p to the first sample after g
    while (this.p < n && times[this.p]! <= g) this.p++;
    const before = this.p - 1;
    const after = this.p;
    const dBefore = before >= 0 ? g - times[before]! : Infinity;
    const dAfter = after < n ? times[after]! - g : Infinity;
    if (this.settings.rule === 'nearest' || dBefore === 0) {
      const k = dBefore <= dAfter ? before : after;
      const d = Math.min(dBefore, dAfter);
      if (d > tol || k < 0 || k >= n) return;
      out.found = true;
      if (markers[k]! > 0) out.marker = markers[k]!;
      else out.value = values[k]!;
      return;
    }
    // interpolate: both neighbours within the tolerance
    if (dBefore > tol || dAfter > tol) return;
    out.found = true;
    const mb = markers[before]!;
    const ma = markers[after]!;
    if (mb > 0 || ma > 0) {
      out.marker = mb || ma;
      return;
    }
    const t0 = times[before]!;
    const t1 = times[after]!;
    out.value = values[before]! + ((values[after]! - values[before]!) * (g - t0)) / (t1 - t0);
  }
}

export interface AlignmentSummary {
  gridMinutes: number;
  rule: AlignmentSettings['rule'];
  toleranceMinutes: number;
  /** Grid times between the first and last sample of the required tags. */
  gridTimes: number;
  /** Grid times written (every required tag had a value or a marker). */
  aligned: number;
  /** Grid times left out, by the first required tag that had no value within the rule. */
  leftOutByTag: Record<string, number>;
  /** Samples read per mapped tag. */
  samplesByTag: Record<string, number>;
  /** Tags in the file that the mapping does not use (the first 50). */
  unmappedTags: string[];
  /** Rows whose value cell was empty (no sample). */
  emptyValues: number;
  /** Sum and count of the values written per tag (markers left out), for the unit plausibility hints. */
  written?: Record<string, { sum: number; count: number }>;
  firstUtc?: number;
  lastUtc?: number;
}

export interface TallCheck {
  ok: boolean;
  errors: RowErrorList;
  dataRows: number;
  summary: AlignmentSummary | null;
  /** The aligned wide file and how to read it (when ok). */
  wide?: { path: string; mapping: ImportMapping; statusWords: string[]; dispose: () => Promise<void> };
}

const NUMBER_DOT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const NUMBER_COMMA = /^[+-]?(\d+(,\d*)?|,\d+)([eE][+-]?\d+)?$/;
const MAX_QUALITY_MARKERS = 100;

/** The wide mapping an aligned file is read with: the same tags as columns, grid times as ISO 8601 UTC. */
function wideMappingOf(mapping: ImportMapping): ImportMapping {
  const { tall: _tall, quality: _quality, sheet: _sheet, ...rest } = mapping;
  // means over the grid interval are averages over it, unless the file's own interval is stated
  const averagingMinutes = mapping.averagingMinutes ?? (mapping.tall?.rule === 'interval-mean' ? mapping.tall.gridMinutes : undefined);
  return {
    ...rest,
    ...(averagingMinutes !== undefined ? { averagingMinutes } : {}),
    decimalSeparator: '.',
    timestamp: { column: mapping.timestamp.column, format: 'iso-8601-offset', repeatedHour: 'by-file-order' },
  };
}

/** Required tags: those mapped to a quantity every row needs (a barometer only for vacuum without a fixed one). */
function requiredQuantities(mapping: ImportMapping): ImportQuantity[] {
  const c = mapping.columns;
  const out: ImportQuantity[] = [];
  for (const q of IMPORT_QUANTITIES) {
    if (!c[q]) continue;
    if ((REQUIRED_QUANTITIES as readonly string[]).includes(q) || q === 'condenserVacuum') out.push(q);
    else if (q === 'barometer' && c.condenserVacuum && !mapping.fixedBarometer) out.push(q);
  }
  return out;
}

/** Source of tag samples: a tall table (tag, time, value, quality) or one file per tag. */
export interface SampleSource {
  /** Reads every sample into the series of mapped tags; wrong cells go to `errors`. Returns the data rows read. */
  read(
    series: Map<string, TagSeries>,
    parseTime: TimestampParser,
    readValue: (raw: string, quality: string | null) => { value: number; marker: number } | null | 'empty',
    errors: RowErrorList,
    unmapped: Set<string>,
  ): Promise<number>;
}

/** A tall table read in one pass. */
export function tallTableSource(filePath: string, mapping: ImportMapping, sheet?: string): SampleSource {
  const tall = mapping.tall!;
  return {
    async read(series, parseTime, readValue, errors, unmapped) {
      const table = await openTable(filePath, sheet !== undefined ? { sheet } : {});
      try {
        const col = (name: string) => {
          const at = table.headers.indexOf(name);
          if (at < 0) throw new ImportFileError('column-not-found', `mapped column "${name}" not found in the file's header`);
          return at;
        };
        const ti = col(mapping.timestamp.column);
        const gi = col(tall.tagColumn);
        const vi = col(tall.valueColumn);
        const qi = mapping.quality ? col(mapping.quality.column) : -1;
        const width = Math.max(ti, gi, vi, qi) + 1;
        let rows = 0;
        let lastText = '';
        let lastTime = Number.NaN;
        /** One row: its line, its first `count` cells (all of them when fewer than `width`). */
        const onRow = (line: number, cells: string[], count: number) => {
          rows++;
          if (count < width) {
            errors.add(line, table.headers[count] ?? '', '', `the row has ${count} columns; the header has ${table.headers.length}`);
            return;
          }
          const tag = cells[gi]!.trim();
          const s = series.get(tag);
          if (!s) {
            if (unmapped.size < 50 && tag !== '') unmapped.add(tag);
            return;
          }
          const tsText = cells[ti]!;
          // a file in time order repeats each time once per tag: read it once
          const t = tsText === lastText ? lastTime : parseTime.parse(tsText);
          if (Number.isNaN(t)) {
            errors.add(line, mapping.timestamp.column, tsText, `bad timestamp: ${parseTime.error}`);
            return;
          }
          [lastText, lastTime] = [tsText, t];
          const v = readValue(cells[vi]!, qi >= 0 ? cells[qi]! : null);
          if (v === 'empty') return;
          if (v === null) {
            errors.add(line, tall.valueColumn, cells[vi]!, `not a number${mapping.decimalSeparator === ',' ? ' (decimal comma expected)' : ''}`);
            return;
          }
          s.push(t, v.value, v.marker, line);
        };
        if (table.plain) {
          // a plain CSV file is scanned line by line here: no row arrays, only the cells the mapping reads
          const { plain, headerLine, sampleRows } = table;
          await table.close();
          // room for each mapped tag's share of the rows the file's size suggests (at most the whole file's rows in all)
          const lineBytes =
            sampleRows.reduce((n, r) => n + r.join(plain.delimiter).length + (plain.ends === 'crlf' ? 2 : 1), 0) / Math.max(1, sampleRows.length);
          const rowsGuess = (await stat(filePath)).size / Math.max(8, lineBytes);
          for (const s of series.values()) s.reserve(Math.ceil((rowsGuess / series.size) * 1.02));
          await scanPlainRows(filePath, plain, headerLine, width, onRow);
        } else for await (const chunk of table.chunks) for (const row of chunk) onRow(row.line, row.cells, row.cells.length);
        return rows;
      } finally {
        await table.close();
      }
    },
  };
}

/**
 * The data rows of a plain CSV file (read-csv.ts `plainLineEnds`) after its header line, as the CSV reader gives
 * them — empty lines skipped but counted, cells as they are, a line too long refused — but only the first `width`
 * cells of each, into one reused array.
 */
async function scanPlainRows(
  filePath: string,
  plain: NonNullable<RawTable['plain']>,
  headerLine: number,
  width: number,
  onRow: (line: number, cells: string[], count: number) => void,
): Promise<void> {
  const { delimiter, maxLine } = plain;
  const cut = plain.ends === 'crlf' ? 1 : 0;
  const cells: string[] = new Array<string>(width).fill('');
  const split = (text: string, start: number, stop: number) => {
    let k = 0;
    for (let p = start; k < width;) {
      const q = text.indexOf(delimiter, p);
      if (q < 0 || q >= stop) {
        cells[k++] = text.slice(p, stop);
        break;
      }
      cells[k++] = text.slice(p, q);
      p = q + delimiter.length;
    }
    return k;
  };
  const input = createReadStream(filePath, { encoding: plain.encoding, highWaterMark: 256 * 1024 });
  let rest = '';
  let line = 0;
  try {
    for await (const piece of input as AsyncIterable<string>) {
      const text = rest + piece;
      let start = 0;
      for (let end = text.indexOf('\n'); end >= 0; start = end + 1, end = text.indexOf('\n', start)) {
        line++;
        const stop = end - cut;
        if (line <= headerLine || stop === start) continue;
        if (stop - start > maxLine) throw lineTooLong(line, maxLine);
        onRow(line, cells, split(text, start, stop));
      }
      rest = text.slice(start);
      if (rest.length > maxLine + 1) throw lineTooLong(line + 1, maxLine);
    }
    if (rest.length > 0 && ++line > headerLine) {
      if (rest.length > maxLine) throw lineTooLong(line, maxLine);
      onRow(line, cells, split(rest, 0, rest.length));
    }
  } catch (e) {
    if (e instanceof ImportFileError) throw e;
    throw new ImportFileError('unreadable-file', 'the file could not be read to its end: upload it again', undefined, e);
  } finally {
    input.destroy();
  }
}

/**
 * Checks a tall file (or a set of one-tag files) and, when every cell is right, aligns it to the grid and writes the
 * wide file the rest of the import reads. Nothing is written for a wrong file.
 */
export async function alignTallSamples(
  source: SampleSource,
  mapping: ImportMapping,
  options: { statusWords?: readonly string[]; maxErrors?: number; tempDir?: string; emptyValues?: 'skip' } = {},
): Promise<TallCheck> {
  const tall = mapping.tall!;
  const settings: AlignmentSettings = { gridMinutes: tall.gridMinutes, rule: tall.rule, toleranceMinutes: tall.toleranceMinutes };
  const errors = new RowErrorList(options.maxErrors);
  const tagOf = new Map<ImportQuantity, string>();
  const series = new Map<string, TagSeries>();
  for (const q of IMPORT_QUANTITIES) {
    const ref = mapping.columns[q];
    if (!ref) continue;
    tagOf.set(q, ref.column);
    series.set(ref.column, new TagSeries(ref.column));
  }
  // markers: status words (as the list spells them), then quality values met
  const markers: string[] = [];
  const markerIndex = new Map<string, number>();
  for (const w of options.statusWords ?? DEFAULT_STATUS_WORDS) {
    const key = statusWordKey(w);
    if (!markerIndex.has(key)) {
      markers.push(w);
      markerIndex.set(key, markers.length);
    }
  }
  const statusWordCount = markers.length;
  const good = new Set((mapping.quality?.goodValues ?? []).map(statusWordKey));
  const qualityMarker = (raw: string): number => {
    const text = raw.trim() === '' ? '(empty)' : raw.trim().slice(0, 40);
    const named = markers.length - statusWordCount;
    const label = named < MAX_QUALITY_MARKERS ? `quality ${text}` : 'quality (other values)';
    const key = statusWordKey(label);
    const known = markerIndex.get(key);
    if (known !== undefined) return known;
    markers.push(label);
    markerIndex.set(key, markers.length);
    return markers.length;
  };
  const comma = mapping.decimalSeparator === ',';
  const numberPattern = comma ? NUMBER_COMMA : NUMBER_DOT;
  let emptyValues = 0;
  const readValue = (raw: string, quality: string | null): { value: number; marker: number } | null | 'empty' => {
    const text = raw.trim();
    const qMarker = quality !== null && !good.has(statusWordKey(quality)) ? qualityMarker(quality) : 0;
    if (text === '') {
      if (qMarker > 0) return { value: Number.NaN, marker: qMarker };
      emptyValues++;
      return 'empty';
    }
    if (numberPattern.test(text)) return { value: Number(comma ? text.replace(',', '.') : text), marker: qMarker };
    const m = markerIndex.get(statusWordKey(text));
    if (m !== undefined && m <= statusWordCount) return { value: Number.NaN, marker: qMarker || m };
    return null;
  };
  const unmapped = new Set<string>();
  const dataRows = await source.read(series, new TimestampParser(mapping.timestamp), readValue, errors, unmapped);

  // the same tag twice at one time is a wrong file, as a repeated time is in a wide file
  for (const s of series.values()) {
    s.sort();
    for (let i = 1; i < s.n; i++) {
      if (s.times[i] === s.times[i - 1]) {
        errors.add(
          s.lines[i]!,
          mapping.timestamp.column,
          new Date(s.times[i]!).toISOString(),
          `tag "${s.tag}" has a second value at the same time as line ${s.lines[i - 1]}`,
        );
      }
    }
  }
  const required = requiredQuantities(mapping).map((q) => tagOf.get(q)!);
  const samplesByTag = Object.fromEntries([...series.values()].map((s) => [s.tag, s.n]));
  const summary: AlignmentSummary = {
    ...settings,
    gridTimes: 0,
    aligned: 0,
    leftOutByTag: {},
    samplesByTag,
    unmappedTags: [...unmapped],
    emptyValues,
  };
  for (const tag of required) {
    if (series.get(tag)!.n === 0) errors.add(0, tall.tagColumn, tag, `the file has no value of tag "${tag}", which is mapped to a quantity every time needs`);
  }
  if (errors.total > 0) return { ok: false, errors, dataRows, summary };

  const step = settings.gridMinutes * 60_000;
  let from = Infinity;
  let to = -Infinity;
  for (const tag of required) {
    const s = series.get(tag)!;
    from = Math.min(from, s.times[0]!);
    to = Math.max(to, s.times[s.n - 1]!);
  }
  // the first grid time a rule can answer: the mean needs a whole interval after the first sample
  const first = Math.ceil(from / step) * step;
  const last = Math.floor(to / step) * step + (settings.rule === 'interval-mean' ? step : 0);

  const dir = await mkdtemp(path.join(options.tempDir ?? tmpdir(), 'cleancase-aligned-'));
  const alignedPath = path.join(dir, 'aligned.csv');
  const dispose = () => rm(dir, { recursive: true, force: true });
  try {
    const tags = [...series.keys()];
    const cursors = tags.map((t) => new SeriesCursor(series.get(t)!, settings));
    const isRequired = tags.map((t) => required.includes(t));
    const out = createWriteStream(alignedPath, { encoding: 'utf8' });
    const header = [mapping.timestamp.column, ...tags].map((h) => (/[",\r\n]/.test(h) ? `"${h.replace(/"/g, '""')}"` : h)).join(',');
    let buffer = `${header}\n`;
    const cell: Aligned = { value: 0, marker: 0, found: false };
    const markerCells = markers.map((m) => (/[",\r\n]/.test(m) ? `"${m.replace(/"/g, '""')}"` : m));
    const cells: string[] = new Array(tags.length);
    const sums = new Float64Array(tags.length);
    const counts = new Float64Array(tags.length);
    const values = new Float64Array(tags.length);
    for (let g = first; g <= last; g += step) {
      summary.gridTimes++;
      let missing: string | null = null;
      for (let k = 0; k < tags.length; k++) {
        cursors[k]!.at(g, cell);
        if (!cell.found) {
          if (isRequired[k] && missing === null) missing = tags[k]!;
          cells[k] = '';
          values[k] = Number.NaN;
        } else {
          cells[k] = cell.marker > 0 ? markerCells[cell.marker - 1]! : String(cell.value);
          values[k] = cell.marker > 0 ? Number.NaN : cell.value;
        }
      }
      if (missing !== null) {
        summary.leftOutByTag[missing] = (summary.leftOutByTag[missing] ?? 0) + 1;
        continue;
      }
      summary.aligned++;
      summary.firstUtc ??= g;
      summary.lastUtc = g;
      for (let k = 0; k < tags.length; k++) {
        if (!Number.isNaN(values[k]!)) {
          sums[k]! += values[k]!;
          counts[k]!++;
        }
      }
      buffer += `${new Date(g).toISOString()},${cells.join(',')}\n`;
      if (buffer.length > 1 << 20) {
        if (!out.write(buffer)) await once(out, 'drain');
        buffer = '';
      }
    }
    out.end(buffer);
    await once(out, 'finish');
    summary.written = Object.fromEntries(tags.map((t, k) => [t, { sum: sums[k]!, count: counts[k]! }]));
    if (summary.aligned === 0) {
      await dispose();
      throw new ImportFileError(
        'no-data-rows',
        `no grid time has a value of every required tag within the rule: widen the tolerance or choose another grid (${settings.gridMinutes} min, ${settings.rule})`,
      );
    }
    return { ok: true, errors, dataRows, summary, wide: { path: alignedPath, mapping: wideMappingOf(mapping), statusWords: markers, dispose } };
  } catch (e) {
    await dispose();
    throw e;
  }
}
