/**
 * Storing the checked file's rows under the import's id, in batches, each streamed into the database with
 * LOAD DATA (repositories/sample-bulk-load.repository.ts) in a transaction that holds the job's lease, so a
 * worker that lost the job stores nothing more. Rows identical to stored ones are skipped; rows at a stored time
 * with other values are conflicts, counted and not stored. Readers see none of them until the import is complete
 * (repositories/sample.repository.ts leaves out rows of imports still checking or importing).
 *
 * A wide file in time order is read once (`checkAndStoreRows`): its rows are stored while the check goes on,
 * and a wrong file leaves its rows for the job's all-or-nothing clean-up. Any other file is checked first and
 * read again here (`storeRows`), sorted into time order on the way when it needs it.
 *
 * While the database stores one batch, the next is read and converted (the two run on different cores); a
 * batch is sorted against the stored rows only after the one before it is written. However the pass ends, it
 * waits for the batch in flight, so the all-or-nothing clean-up runs after the last write.
 */
import type { DataSource } from 'typeorm';
import { checkAndImportSamples, importSamples, type ImportCheck, type ImportSample, type ImportSummary } from '../../import/index.js';
import { DataImport } from '../../entities/data-import.entity.js';
import type { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import { withLease, type JobLease } from '../../jobs/job-queue.js';
import { loadSamples } from '../../repositories/sample-bulk-load.repository.js';
import { storedReadingsBetween, storedSpanBesides, type StoredReading } from '../../repositories/sample.repository.js';
import type { ImportProgress } from './import-progress.js';

/** Test hooks: throw after this many batches to prove a failure leaves nothing behind; look around after a batch is stored. */
export const importFaults = {
  failAfterBatches: null as number | null,
  afterBatchStored: null as ((importId: string) => Promise<void>) | null,
};

export interface SortedBatch {
  fresh: ImportSample[];
  skippedIdentical: number;
  conflicting: ImportSample[];
}

/** A missing value (null stored, NaN or absent in a row) equals only another missing value. */
const missing = (v: number | null | undefined) => v === null || v === undefined || Number.isNaN(v);
const sameValue = (a: number | null, b: number | null | undefined) =>
  missing(a) ? missing(b) : !missing(b) && Math.abs(a! - b!) <= 1e-9 * Math.max(1, Math.abs(a!));

/** Sorts a batch against the rows stored at the same times: new, identical (skipped) or conflicting. */
export function sortAgainstStored(samples: readonly ImportSample[], stored: readonly StoredReading[]): SortedBatch {
  const byTime = new Map(stored.map((e) => [new Date(e.ts).getTime(), e]));
  const sorted: SortedBatch = { fresh: [], skippedIdentical: 0, conflicting: [] };
  for (const s of samples) {
    const old = byTime.get(s.timestampUtc);
    if (!old) sorted.fresh.push(s);
    else if (
      sameValue(old.loadMw, s.loadMw) &&
      sameValue(old.backpressureKpa, s.backpressureKpa) &&
      sameValue(old.cwInletC, s.cwInletC) &&
      sameValue(old.cwOutletC, s.cwOutletC) &&
      sameValue(old.cwFlowM3s, s.cwFlowM3s)
    )
      sorted.skippedIdentical++;
    else sorted.conflicting.push(s);
  }
  return sorted;
}

export interface StoreInput {
  importId: string;
  storedPath: string;
  mapping: unknown;
  statusWords?: readonly string[];
  unit: GeneratingUnit;
  check: ImportCheck;
  progress: ImportProgress;
}

export interface StoredRows {
  summary: ImportSummary;
  stored: number;
  skippedIdentical: number;
  conflicting: number;
  /** the first 200 conflicting times */
  conflicts: { timestampUtc: string }[];
}

/** Progress is written at most this often (each report is two small transactions). */
const PROGRESS_EVERY_MS = 500;

type StoreSteps = Omit<StoreInput, 'storedPath' | 'mapping' | 'statusWords' | 'check'> & {
  /** rows expected in all, for the progress fraction */
  expectedRows: () => number;
  /** the words of the progress message */
  doing: string;
};

/** The batch writer shared by both passes: sorts each batch against the stored rows and loads the new ones in the background. */
function rowWriter(ds: DataSource, job: JobLease, { importId, unit, progress, expectedRows, doing }: StoreSteps) {
  const owner = { unitId: unit.id, importId, setupVersion: unit.setupVersion };
  const counts = { stored: 0, skippedIdentical: 0, conflicting: 0, conflicts: [] as { timestampUtc: string }[] };
  let batches = 0;
  let reportedAt = 0;
  /** the span of the unit's rows stored by other imports: a batch outside it has nothing to be sorted against */
  let span: Promise<{ first: number; last: number } | null> | null = null;
  /** the batch the database is storing now; its failure surfaces when it is awaited */
  let inFlight: Promise<void> = Promise.resolve();
  const storeInBackground = (fresh: ImportSample[]) => {
    inFlight = withLease(ds, job, (em) => loadSamples(em, owner, fresh)).then(async () => {
      counts.stored += fresh.length;
      await importFaults.afterBatchStored?.(importId);
    });
    inFlight.catch(() => {});
  };
  const onBatch = async (samples: ImportSample[]) => {
    await inFlight;
    if (importFaults.failAfterBatches !== null && batches >= importFaults.failAfterBatches) throw new Error('injected fault during import');
    if (batches++ === 0) await ds.getRepository(DataImport).update({ id: importId }, { status: 'importing' });
    span ??= storedSpanBesides(ds.manager, unit.id, importId);
    const stored = await span;
    const from = samples[0]!.timestampUtc;
    const to = samples[samples.length - 1]!.timestampUtc;
    const existing = stored && from <= stored.last && to >= stored.first ? await storedReadingsBetween(ds.manager, unit.id, new Date(from), new Date(to)) : [];
    const batch = sortAgainstStored(samples, existing);
    counts.skippedIdentical += batch.skippedIdentical;
    counts.conflicting += batch.conflicting.length;
    for (const s of batch.conflicting) if (counts.conflicts.length < 200) counts.conflicts.push({ timestampUtc: new Date(s.timestampUtc).toISOString() });
    if (batch.fresh.length) storeInBackground(batch.fresh);
    if (Date.now() - reportedAt >= PROGRESS_EVERY_MS) {
      reportedAt = Date.now();
      const done = counts.stored + counts.skippedIdentical + counts.conflicting;
      const expected = Math.max(1, expectedRows(), done);
      await progress(0.05 + (0.9 * done) / expected, `${doing} ${counts.stored.toLocaleString('en-US')} of ${expected.toLocaleString('en-US')} rows`);
    }
  };
  /** Waits for the batch in flight however the pass ended, then (when it ended well) gives the counts. */
  const settle = async <T>(pass: Promise<T>): Promise<T> => {
    let result: T;
    try {
      result = await pass;
    } finally {
      await inFlight.catch(() => {});
    }
    await inFlight;
    return result;
  };
  return { onBatch, settle, counts };
}

const steadinessOf = (unit: GeneratingUnit) => ({ ratingMw: unit.turbine?.ratingMw, minLoadFraction: unit.turbine?.minimumLoadFraction });

/** The second pass: the file was checked (and is right); its rows are read again and stored. */
export async function storeRows(ds: DataSource, job: JobLease, input: StoreInput): Promise<StoredRows> {
  const { importId, storedPath, mapping, statusWords, unit, check } = input;
  await ds.getRepository(DataImport).update({ id: importId }, { status: 'importing', notes: { assumptions: check.assumptions, warnings: check.warnings } });
  const writer = rowWriter(ds, job, { ...input, expectedRows: () => check.dataRows, doing: 'Stored' });
  const summary = await writer.settle(
    importSamples(storedPath, { mapping, statusWords, fileOrder: check.order, steadiness: steadinessOf(unit), onBatch: writer.onBatch }),
  );
  return { summary, ...writer.counts };
}

export interface CheckAndStoreInput extends Omit<StoreInput, 'check'> {
  /** the upload's size, for a guess of the rows to come */
  fileBytes: number;
}

/**
 * One pass over a wide file: checks every row and stores the checked rows while the times rise and no error was
 * met. `stored` is null when the rows were not all stored that way: the check failed (the caller rejects the import
 * and removes its rows) or the file is not in time order (the caller removes its rows and runs `storeRows`).
 */
export async function checkAndStoreRows(ds: DataSource, job: JobLease, input: CheckAndStoreInput): Promise<{ check: ImportCheck; stored: StoredRows | null }> {
  const { storedPath, mapping, statusWords, unit, fileBytes } = input;
  let rowsSeen = 0;
  const writer = rowWriter(ds, job, {
    ...input,
    // about 60 bytes a row in a historian export; corrected as the rows come
    expectedRows: () => Math.max(rowsSeen, Math.round(fileBytes / 60)),
    doing: 'Checked and stored',
  });
  const onBatch = async (samples: ImportSample[]) => {
    rowsSeen += samples.length;
    await writer.onBatch(samples);
  };
  const { check, summary } = await writer.settle(checkAndImportSamples(storedPath, { mapping, statusWords, steadiness: steadinessOf(unit), onBatch }));
  return { check, stored: summary ? { summary, ...writer.counts } : null };
}
