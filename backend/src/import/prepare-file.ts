/**
 * The file an import's check and store read: a wide file as uploaded, or — for a tall file — the wide file its
 * tags make on the chosen time grid (import/tall-alignment.ts), written only when every cell of the tall file is
 * right. The check of either is the same (`checkImportFile`), so the all-or-nothing rule holds for every shape.
 */
import { importMappingSchema, type ImportMapping } from '@shared/schemas/import-mapping.js';
import { ImportFileError } from './import-errors.js';
import { checkImportFile, unitWarnings, type ImportCheck } from './parse-rows.js';
import { cwFlowToM3s, pressureToKpa, temperatureToC } from './quantity-conversion.js';
import { F, RECORD_FIELDS, compileMapping } from './row-conversion.js';
import { isTagFilesFolder, tagFilesSource } from './per-tag-files.js';
import { alignTallSamples, tallTableSource, type AlignmentSummary, type SampleSource } from './tall-alignment.js';

export interface PreparedFile {
  path: string;
  mapping: unknown;
  statusWords?: readonly string[];
  alignment: AlignmentSummary | null;
  dispose(): Promise<void>;
}

export interface PrepareOptions {
  mapping: unknown;
  statusWords?: readonly string[];
  maxErrors?: number;
  tempDir?: string;
  /** One file per tag: the samples come from these files instead of the stored upload. */
  source?: SampleSource;
}

const emptyCheck = (): ImportCheck => ({
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
});

/** How an aligned import was made, in words for the import's notes. */
export function describeAlignment(a: AlignmentSummary): string[] {
  const rule =
    a.rule === 'nearest'
      ? `the sample nearest each grid time within ${a.toleranceMinutes} min`
      : a.rule === 'interpolate'
        ? `a straight line between the samples either side of each grid time, both within ${a.toleranceMinutes} min`
        : `the mean of the samples in the ${a.gridMinutes}-min interval ending at each grid time`;
  const out = [`values of ${Object.keys(a.samplesByTag).length} tags put on a ${a.gridMinutes}-min grid by ${rule}`];
  const left = Object.entries(a.leftOutByTag);
  if (left.length) {
    const total = left.reduce((n, [, k]) => n + k, 0);
    out.push(
      `${total.toLocaleString('en-US')} of ${a.gridTimes.toLocaleString('en-US')} grid times left out for want of a value: ${left.map(([tag, k]) => `${tag} ${k.toLocaleString('en-US')}`).join(', ')}`,
    );
  }
  if (a.unmappedTags.length) out.push(`tags not mapped, not imported: ${a.unmappedTags.slice(0, 10).join(', ')}${a.unmappedTags.length > 10 ? ' …' : ''}`);
  if (a.emptyValues) out.push(`${a.emptyValues.toLocaleString('en-US')} rows with an empty value read as no sample`);
  return out;
}

/** Checks the file in whatever shape the mapping says; `prepared` (when the check passed) is what the store reads. */
export async function checkAnyShape(storedPath: string, options: PrepareOptions): Promise<{ check: ImportCheck; prepared: PreparedFile | null }> {
  const parsed = importMappingSchema.safeParse(options.mapping);
  if (parsed.success && !parsed.data.tall && (await isTagFilesFolder(storedPath))) {
    const message = 'files of one tag each are mapped tag by tag on a time grid: choose the grid and map the tags';
    return { check: { ...emptyCheck(), fileError: { code: 'bad-mapping', message } }, prepared: null };
  }
  if (!parsed.success || !parsed.data.tall) {
    const check = await checkImportFile(storedPath, { mapping: options.mapping, statusWords: options.statusWords, maxErrors: options.maxErrors });
    const prepared = check.ok
      ? { path: storedPath, mapping: options.mapping, statusWords: options.statusWords, alignment: null, dispose: async () => {} }
      : null;
    return { check, prepared };
  }
  const mapping = parsed.data;
  let tall;
  try {
    const source =
      options.source ?? ((await isTagFilesFolder(storedPath)) ? tagFilesSource(storedPath, mapping) : tallTableSource(storedPath, mapping, mapping.sheet));
    tall = await alignTallSamples(source, mapping, options);
  } catch (e) {
    if (!(e instanceof ImportFileError)) throw e;
    return { check: { ...emptyCheck(), fileError: { code: e.code, message: e.message, ...(e.line !== undefined ? { line: e.line } : {}) } }, prepared: null };
  }
  if (!tall.ok || !tall.wide) {
    const check = { ...emptyCheck(), dataRows: tall.dataRows, errors: tall.errors.errors, errorsNotListed: tall.errors.notListed };
    return { check, prepared: null };
  }
  const wide = tall.wide;
  const a = tall.summary!;
  // The aligned file is ours and holds only grid times, numbers and status words: its check is known without reading it
  // again (the time order, the span, how values are read and the unit hints from the means written).
  const headers = [mapping.timestamp.column, ...Object.keys(a.samplesByTag)];
  const check: ImportCheck = {
    ...emptyCheck(),
    ok: true,
    kind: 'csv',
    headers,
    dataRows: a.aligned,
    firstTimestampUtc: a.firstUtc ?? null,
    lastTimestampUtc: a.lastUtc ?? null,
    order: 'ascending',
    assumptions: [...describeAlignment(a), ...compileMapping(wide.mapping, headers).assumptions],
    warnings: unitWarningsOfMeans(wide.mapping, a.written ?? {}),
  };
  const { written: _w, firstUtc: _f, lastUtc: _l, ...alignment } = a;
  return { check, prepared: { path: wide.path, mapping: wide.mapping, statusWords: wide.statusWords, alignment, dispose: wide.dispose } };
}

/** The unit hints of the wide check, from the mean of each tag's values written (conversions are affine, so the mean converts). */
function unitWarningsOfMeans(mapping: ImportMapping, written: Record<string, { sum: number; count: number }>): string[] {
  const sums = new Float64Array(RECORD_FIELDS);
  const counts = new Float64Array(RECORD_FIELDS);
  const c = mapping.columns;
  const put = (field: number, ref: { column: string } | undefined, convert: (mean: number) => number) => {
    const w = ref ? written[ref.column] : undefined;
    if (!w || w.count === 0) return;
    sums[field] = convert(w.sum / w.count);
    counts[field] = 1;
  };
  put(F.cwInletC, c.cwInletTemperature, (v) => temperatureToC(v, c.cwInletTemperature!.unit));
  put(F.cwOutletC, c.cwOutletTemperature, (v) => temperatureToC(v, c.cwOutletTemperature!.unit));
  put(F.backpressureKpa, c.backpressure, (v) => pressureToKpa(v, c.backpressure!.unit));
  put(F.cwFlowM3s, c.cwFlow, (v) => cwFlowToM3s(v, c.cwFlow!.unit, 20));
  return unitWarnings(sums, counts);
}
