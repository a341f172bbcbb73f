/**
 * Rows of a historian export → validated SI samples, in two passes over the file so a route can
 * refuse a wrong file before it writes anything:
 *
 * 1. `checkImportFile` reads every row, converts it and collects every "the file is wrong" error
 *    (bad number, missing required value, bad or duplicated timestamp, short row), capped at
 *    10,000 listed. It writes nothing. It also tells whether the file is in time order.
 * 2. `importSamples` (only after a clean check) reads the file again and hands converted samples to
 *    the caller's `onBatch` in batches, each with its validity from the engineering core
 *    (checkPointValidity): physics (rise, TTD, ranges) and steadiness (low load; load change within
 *    ±30 min above 2 % of rating). Steadiness needs each row's neighbours, so samples are released in
 *    time order through a sliding window. A file in ascending order (as the check reports) streams
 *    straight through; any other order is put right by an external merge sort on a temporary file.
 *
 * Memory: the check keeps 12 bytes per row (time and line, for finding duplicates anywhere in the
 * file); the import keeps one steadiness window, one batch and, for an unsorted file, one sort chunk.
 */
import { checkPointValidity, type RejectionReason, type ValidityContext } from '@shared/domain/validity/index.js';
import { DEFAULT_MAX_ROW_ERRORS, ImportFileError, RowErrorList, type ImportFileErrorCode, type RowError } from './import-errors.js';
import { openTable, type TableKind } from './open-table.js';
import { F, RECORD_FIELDS, RowConverter, compileMapping, type CompiledMapping } from './row-conversion.js';
import { RecordSorter } from './record-sorter.js';
import { SteadinessWindow } from './steadiness-window.js';
import type { RawTable } from './raw-table.js';

export type FileOrder = 'ascending' | 'descending' | 'unordered';

export interface ImportFileOptions {
  /** The column mapping (checked against the shared schema here). */
  mapping: unknown;
  /** Force the reader; by default the first bytes decide. */
  kind?: TableKind;
  /** Force the CSV delimiter; by default it is detected. */
  delimiter?: string;
  /** Historian status words that mark a missing value (default: DEFAULT_STATUS_WORDS; the organisation's add to them). */
  statusWords?: readonly string[];
}

export interface ImportCheck {
  /** True when the file can be imported: no file-level error and no row error. */
  ok: boolean;
  kind?: TableKind;
  fileError?: { code: ImportFileErrorCode; message: string; line?: number };
  headers: string[];
  errors: RowError[];
  /** Errors found beyond the listed ones. */
  errorsNotListed: number;
  dataRows: number;
  duplicateTimestamps: number;
  firstTimestampUtc: number | null;
  lastTimestampUtc: number | null;
  order: FileOrder;
  /** How values were read (design flow, barometer, time zone rules, unit bases). */
  assumptions: string[];
  /** Hints that a unit may be wrong (e.g. temperatures that look like °F mapped as °C); not errors. */
  warnings: string[];
}

/** Growable typed arrays of (time, line) for the duplicate search. */
class TimeIndex {
  times = new Float64Array(65_536);
  lines = new Uint32Array(65_536);
  n = 0;
  push(t: number, line: number): void {
    if (this.n === this.times.length) {
      const times = new Float64Array(this.n * 2);
      times.set(this.times);
      const lines = new Uint32Array(this.n * 2);
      lines.set(this.lines);
      [this.times, this.lines] = [times, lines];
    }
    this.times[this.n] = t;
    this.lines[this.n++] = line;
  }
}

/** Plausible SI means per quantity; a mean outside suggests the wrong unit was chosen [common practice, generous]. */
const PLAUSIBLE_MEAN: [field: number, label: string, min: number, max: number, hint: string][] = [
  [F.cwInletC, 'CW inlet temperature', -2, 45, 'is the unit °F rather than °C?'],
  [F.cwOutletC, 'CW outlet temperature', 0, 60, 'is the unit °F rather than °C?'],
  [F.backpressureKpa, 'backpressure', 1, 35, 'is the unit right (kPa, inHg, mbar, psi)?'],
  [F.cwFlowM3s, 'CW flow', 0.2, 150, 'is the unit right (gpm, m³/h, m³/s, kg/s)?'],
];

const MEAN_FIELDS = PLAUSIBLE_MEAN.map(([field]) => field);

export function unitWarnings(sums: Float64Array, counts: Float64Array): string[] {
  const out: string[] = [];
  for (const [field, label, min, max, hint] of PLAUSIBLE_MEAN) {
    if (counts[field] === 0) continue;
    const mean = sums[field]! / counts[field]!;
    if (mean < min || mean > max) out.push(`${label} averages ${mean.toPrecision(4)} in SI units, outside ${min} to ${max}: ${hint}`);
  }
  return out;
}

/** The sheet a mapping names, read before the mapping itself is checked (the table must be open to check it). */
const sheetOf = (mapping: unknown): string | undefined => {
  const sheet = (mapping as { sheet?: unknown } | null)?.sheet;
  return typeof sheet === 'string' && sheet.trim() !== '' ? sheet.trim() : undefined;
};

const asFileError = (e: ImportFileError) => ({ code: e.code, message: e.message, ...(e.line !== undefined ? { line: e.line } : {}) });

/** Pass 1: reads and converts every row, collects every error, writes nothing. */
export async function checkImportFile(filePath: string, options: ImportFileOptions & { maxErrors?: number }): Promise<ImportCheck> {
  return (await checkRows(filePath, options, null)).check;
}

export interface CheckedImport {
  check: ImportCheck;
  /** The samples' counts when every row went to `onBatch`; null when the file had errors or was not in ascending time order. */
  summary: ImportSummary | null;
}

/**
 * Both passes in one read, for a file in ascending time order: every row is checked as in `checkImportFile`, and
 * while no error has been met and the times rise, the checked rows are classified and handed to `onBatch` as in
 * `importSamples`. The caller learns from `summary` whether that went to the end; when it did not (a wrong file,
 * or one out of order) it removes what `onBatch` stored and, for a right file out of order, runs `importSamples`.
 */
export async function checkAndImportSamples(filePath: string, options: ImportSamplesOptions & { maxErrors?: number }): Promise<CheckedImport> {
  return checkRows(filePath, options, options);
}

async function checkRows(
  filePath: string,
  options: ImportFileOptions & { maxErrors?: number },
  stream: Pick<ImportSamplesOptions, 'steadiness' | 'onBatch' | 'batchSize'> | null,
): Promise<CheckedImport> {
  const result: ImportCheck = {
    ok: false,
    headers: [],
    errors: [],
    errorsNotListed: 0,
    dataRows: 0,
    duplicateTimestamps: 0,
    firstTimestampUtc: null,
    lastTimestampUtc: null,
    order: 'ascending',
    assumptions: [],
    warnings: [],
  };
  const errors = new RowErrorList(options.maxErrors ?? DEFAULT_MAX_ROW_ERRORS);
  let table: RawTable | undefined;
  let classifier: SampleClassifier | null = null;
  try {
    table = await openTable(filePath, { kind: options.kind, delimiter: options.delimiter, sheet: sheetOf(options.mapping) });
    result.kind = table.kind;
    result.headers = table.headers;
    const compiled = compileMapping(options.mapping, table.headers);
    result.assumptions = [...compiled.assumptions];
    const converter = new RowConverter(compiled, options.statusWords);
    classifier = stream ? new SampleClassifier(compiled, converter, stream, false) : null;
    const record = new Float64Array(RECORD_FIELDS);
    const index = new TimeIndex();
    const sums = new Float64Array(RECORD_FIELDS);
    const counts = new Float64Array(RECORD_FIELDS);
    let ascending = true;
    let descending = true;
    let prev = Number.NaN;
    for await (const chunk of table.chunks) {
      for (const row of chunk) {
        result.dataRows++;
        const good = converter.convert(row.cells, row.line, record, errors);
        const t = record[F.timestampUtc]!;
        if (!Number.isNaN(t)) {
          if (!Number.isNaN(prev)) {
            if (!(t > prev)) ascending = false;
            if (!(t < prev)) descending = false;
          }
          prev = t;
          index.push(t, row.line);
          if (result.firstTimestampUtc === null || t < result.firstTimestampUtc) result.firstTimestampUtc = t;
          if (result.lastTimestampUtc === null || t > result.lastTimestampUtc) result.lastTimestampUtc = t;
        }
        if (good && record[F.marker] === 0) {
          for (const f of MEAN_FIELDS) {
            sums[f]! += record[f]!;
            counts[f]!++;
          }
        }
        if (classifier) {
          // the first wrong row or step back in time ends the streaming; the check goes on to the end
          if (good && ascending && errors.total === 0) {
            classifier.summary.rowsRead++;
            classifier.push(record.slice());
          } else classifier = null;
        }
      }
      if (classifier?.ready) await classifier.drain();
    }
    result.order = ascending ? 'ascending' : descending && index.n > 1 ? 'descending' : 'unordered';
    if (!ascending && !descending) result.duplicateTimestamps = reportDuplicates(index, table.headers[compiled.timestampIndex]!, errors);
    result.warnings = unitWarnings(sums, counts);
  } catch (e) {
    if (!(e instanceof ImportFileError)) throw e;
    result.fileError = asFileError(e);
  } finally {
    await table?.close();
  }
  result.errors = errors.errors;
  result.errorsNotListed = errors.notListed;
  result.ok = !result.fileError && errors.total === 0;
  return { check: result, summary: result.ok && classifier ? await classifier.finish() : null };
}

/** Sorts (time, line) and reports each repeat of a time at its later line. */
function reportDuplicates(index: TimeIndex, column: string, errors: RowErrorList): number {
  const order = new Uint32Array(index.n);
  for (let i = 0; i < index.n; i++) order[i] = i;
  const { times, lines } = index;
  order.sort((a, b) => times[a]! - times[b]! || lines[a]! - lines[b]!);
  const found: { line: number; first: number; t: number }[] = [];
  for (let k = 1; k < order.length; k++) {
    const a = order[k - 1]!;
    const b = order[k]!;
    if (times[a] === times[b]) {
      let first = k - 1;
      while (first > 0 && times[order[first - 1]!] === times[b]) first--;
      found.push({ line: lines[b]!, first: lines[order[first]!]!, t: times[b]! });
    }
  }
  found.sort((x, y) => x.line - y.line);
  for (const d of found) errors.add(d.line, column, new Date(d.t).toISOString(), `duplicated timestamp: the same time as line ${d.first}`);
  return found.length;
}

export interface SteadinessSettings {
  /** Turbine rating; without it the low-load and steadiness checks are skipped (physics checks still run). */
  ratingMw?: number;
  minLoadFraction?: number;
  maxLoadChangeFraction?: number;
  windowMinutes?: number;
  ranges?: ValidityContext['ranges'];
}

export type SampleValidity = 'ok' | RejectionReason;

/** One imported row in SI units. Optional quantities are present only when the file has them. */
export interface ImportSample {
  line: number;
  timestampUtc: number;
  loadMw: number;
  backpressureKpa: number;
  cwInletC: number;
  cwOutletC: number;
  cwFlowM3s: number;
  flowAssumed: boolean;
  hotwellC?: number;
  dissolvedOxygenPpb?: number;
  airRemovalKgS?: number;
  barometerKpa?: number;
  cwDifferentialPressureKpa?: number;
  condensateFlowKgS?: number;
  validity: SampleValidity;
}

export interface ImportSummary {
  rowsRead: number;
  rowsOk: number;
  rowsByReason: Partial<Record<RejectionReason, number>>;
  /** Rows kept out as instrument-status, by the status word or quality value that marked them. */
  rowsByMarker: Record<string, number>;
  firstTimestampUtc: number | null;
  lastTimestampUtc: number | null;
  /** Duplicated times in the file (always 0 here: the check refuses such a file). */
  duplicateTimestamps: number;
  flowAssumedRows: number;
  sortedOnTheWay: boolean;
  assumptions: string[];
}

export interface ImportSamplesOptions extends ImportFileOptions {
  steadiness?: SteadinessSettings;
  /** Receives the samples in time order; awaited before the next batch is built. */
  onBatch: (samples: ImportSample[]) => void | Promise<void>;
  batchSize?: number;
  /** The order the check reported; 'ascending' streams straight through, anything else is sorted. */
  fileOrder?: FileOrder;
  /** Where the sort keeps its runs (default: the OS temp dir). */
  tempDir?: string;
  /** Rows sorted in memory at a time before a run goes to disk (default 65,536). */
  sortChunkRows?: number;
}

const OPTIONAL_FIELDS: [keyof ImportSample, number][] = [
  ['hotwellC', F.hotwellC],
  ['dissolvedOxygenPpb', F.dissolvedOxygenPpb],
  ['airRemovalKgS', F.airRemovalKgS],
  ['barometerKpa', F.barometerKpa],
  ['cwDifferentialPressureKpa', F.cwDifferentialPressureKpa],
  ['condensateFlowKgS', F.condensateFlowKgS],
];

/**
 * Classifies converted records arriving in ascending time order: the steadiness window judges each against its
 * neighbours (checkPointValidity) and the samples are gathered into batches for the caller, with the counts.
 */
class SampleClassifier {
  readonly summary: ImportSummary;
  private batch: ImportSample[] = [];
  private readonly pending: ImportSample[][] = [];
  private readonly window: SteadinessWindow;

  constructor(
    compiled: CompiledMapping,
    converter: RowConverter,
    private readonly options: Pick<ImportSamplesOptions, 'steadiness' | 'onBatch' | 'batchSize'>,
    sortedOnTheWay: boolean,
  ) {
    const s = options.steadiness ?? {};
    // averages over an interval: the load change is judged between neighbouring intervals, so the window spans one
    const averaging = compiled.mapping.averagingMinutes;
    const windowMinutes = s.windowMinutes ?? Math.max(30, averaging ?? 0);
    if (averaging !== undefined) {
      compiled.assumptions.push(
        `values are averages over ${averaging} min: the load's steadiness is judged within ±${windowMinutes} min${windowMinutes > 30 ? ' (the neighbouring intervals)' : ''}`,
      );
    }
    const batchSize = options.batchSize ?? 5000;
    const summary: ImportSummary = (this.summary = {
      rowsRead: 0,
      rowsOk: 0,
      rowsByReason: {},
      rowsByMarker: {},
      firstTimestampUtc: null,
      lastTimestampUtc: null,
      duplicateTimestamps: 0,
      flowAssumedRows: 0,
      sortedOnTheWay,
      assumptions: compiled.assumptions,
    });
    this.window = new SteadinessWindow(windowMinutes * 60_000, (r, minLoad, minT, maxLoad, maxT) => {
      const t = r[F.timestampUtc]!;
      const point = {
        backpressureKpa: r[F.backpressureKpa]!,
        cwInletC: r[F.cwInletC]!,
        cwOutletC: r[F.cwOutletC]!,
        cwFlowM3s: r[F.cwFlowM3s]!,
        loadMw: r[F.loadMw]!,
      };
      const marker = r[F.marker]!;
      // the historian's own verdict comes first: a marked value is no reading to judge steadiness or load by
      const verdict: { valid: true } | { valid: false; reason: RejectionReason } =
        marker > 0
          ? { valid: false, reason: 'instrument-status' }
          : checkPointValidity(point, {
              ratingMw: s.ratingMw,
              minLoadFraction: s.minLoadFraction,
              maxLoadChangeFraction: s.maxLoadChangeFraction,
              windowMinutes,
              ranges: s.ranges,
              neighbours: [
                { minutesFromPoint: (minT - t) / 60_000, loadMw: minLoad },
                { minutesFromPoint: (maxT - t) / 60_000, loadMw: maxLoad },
              ],
            });
      const sample: ImportSample = {
        line: r[F.line]!,
        timestampUtc: t,
        ...point,
        flowAssumed: compiled.flowAssumed,
        validity: verdict.valid ? 'ok' : verdict.reason,
      };
      for (const [key, field] of OPTIONAL_FIELDS) if (!Number.isNaN(r[field])) (sample as unknown as Record<string, number>)[key] = r[field]!;
      if (marker > 0) {
        const word = converter.markers[marker - 1] ?? 'status';
        summary.rowsByMarker[word] = (summary.rowsByMarker[word] ?? 0) + 1;
      }
      if (verdict.valid) summary.rowsOk++;
      else summary.rowsByReason[verdict.reason] = (summary.rowsByReason[verdict.reason] ?? 0) + 1;
      if (compiled.flowAssumed) summary.flowAssumedRows++;
      summary.firstTimestampUtc ??= t;
      summary.lastTimestampUtc = t;
      this.batch.push(sample);
      if (this.batch.length >= batchSize) {
        this.pending.push(this.batch);
        this.batch = [];
      }
    });
  }

  /** A record in strictly ascending time (the window keeps it: pass a record of its own). */
  push(record: Float64Array): void {
    this.window.push(record);
  }

  /** Whether a batch waits for the caller. */
  get ready(): boolean {
    return this.pending.length > 0;
  }

  /** Hands the batches made so far to the caller, in order. */
  async drain(): Promise<void> {
    while (this.pending.length > 0) await this.options.onBatch(this.pending.shift()!);
  }

  /** Releases the records still in the window and hands over the last batches. */
  async finish(): Promise<ImportSummary> {
    this.window.flush();
    if (this.batch.length > 0) this.pending.push(this.batch);
    this.batch = [];
    await this.drain();
    return this.summary;
  }
}

/**
 * Pass 2: streams converted, classified samples to `onBatch`. Throws ImportFileError when the file
 * turns out wrong after all (changed since the check, or checked with another mapping).
 */
export async function importSamples(filePath: string, options: ImportSamplesOptions): Promise<ImportSummary> {
  const table = await openTable(filePath, { kind: options.kind, delimiter: options.delimiter, sheet: sheetOf(options.mapping) });
  const sorter = options.fileOrder === 'ascending' ? null : new RecordSorter(options.tempDir, options.sortChunkRows);
  try {
    const compiled = compileMapping(options.mapping, table.headers);
    const converter = new RowConverter(compiled, options.statusWords);
    const classifier = new SampleClassifier(compiled, converter, options, sorter !== null);
    const errors = new RowErrorList(1);
    let lastTime = -Infinity;
    for await (const chunk of table.chunks)
      for (const row of chunk) {
        const record = new Float64Array(RECORD_FIELDS);
        if (!converter.convert(row.cells, row.line, record, errors)) {
          const e = errors.errors[0];
          const wrong = e ? `line ${e.row} is wrong (${e.message})` : `line ${row.line} is wrong`;
          throw new ImportFileError('file-changed', `${wrong}: check the file again before importing`, e?.row ?? row.line);
        }
        classifier.summary.rowsRead++;
        if (sorter) await sorter.add(record);
        else {
          if (!(record[F.timestampUtc]! > lastTime)) {
            throw new ImportFileError('file-changed', `line ${row.line} is not in ascending time order: check the file again before importing`, row.line);
          }
          lastTime = record[F.timestampUtc]!;
          classifier.push(record);
          if (classifier.ready) await classifier.drain();
        }
      }
    if (sorter) {
      let prev = Number.NaN;
      for await (const record of sorter.sorted()) {
        if (record[F.timestampUtc] === prev) {
          throw new ImportFileError('file-changed', `line ${record[F.line]} repeats a timestamp: check the file again before importing`, record[F.line]);
        }
        prev = record[F.timestampUtc]!;
        classifier.push(record);
        if (classifier.ready) await classifier.drain();
      }
    }
    return await classifier.finish();
  } finally {
    await table.close();
    await sorter?.dispose();
  }
}
