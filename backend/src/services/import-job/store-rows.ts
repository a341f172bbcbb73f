/**
 * Step 2 of the import job: store the checked file's rows under the import's id, in batches, each streamed
 * into the database with LOAD DATA (repositories/sample-bulk-load.repository.ts) in a transaction that holds
 * the job's lease, so a worker that lost the job stores nothing more. Rows identical to stored ones are
 * skipped; rows at a stored time with other values are conflicts, counted and not stored.
 *
 * While the database stores one batch, the next is read and converted (the two run on different cores); a
 * batch is sorted against the stored rows only after the one before it is written. However the pass ends, it
 * waits for the batch in flight, so the all-or-nothing clean-up runs after the last write.
 */
import type { DataSource } from 'typeorm';
import { importSamples, type ImportCheck, type ImportSample, type ImportSummary } from '../../import/index.js';
import { DataImport } from '../../entities/data-import.entity.js';
import type { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import { withLease, type JobLease } from '../../jobs/job-queue.js';
import { loadSamples } from '../../repositories/sample-bulk-load.repository.js';
import { storedReadingsBetween, type StoredReading } from '../../repositories/sample.repository.js';
import type { ImportProgress } from './import-progress.js';

/** Test hook: throw after this many batches to prove a failure leaves nothing behind. */
export const importFaults = { failAfterBatches: null as number | null };

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

export async function storeRows(
  ds: DataSource,
  job: JobLease,
  { importId, storedPath, mapping, statusWords, unit, check, progress }: StoreInput,
): Promise<StoredRows> {
  await ds.getRepository(DataImport).update({ id: importId }, { status: 'importing', notes: { assumptions: check.assumptions, warnings: check.warnings } });
  const owner = { unitId: unit.id, importId, setupVersion: unit.setupVersion };
  let stored = 0;
  let skippedIdentical = 0;
  let conflicting = 0;
  const conflicts: { timestampUtc: string }[] = [];
  let batches = 0;
  let reportedAt = 0;
  /** the batch the database is storing now; its failure surfaces when it is awaited */
  let inFlight: Promise<void> = Promise.resolve();
  const storeInBackground = (fresh: ImportSample[]) => {
    inFlight = withLease(ds, job, (em) => loadSamples(em, owner, fresh)).then(() => {
      stored += fresh.length;
    });
    inFlight.catch(() => {});
  };
  const onBatch = async (samples: ImportSample[]) => {
    await inFlight;
    if (importFaults.failAfterBatches !== null && batches >= importFaults.failAfterBatches) throw new Error('injected fault during import');
    batches++;
    const existing = await storedReadingsBetween(ds.manager, unit.id, new Date(samples[0]!.timestampUtc), new Date(samples[samples.length - 1]!.timestampUtc));
    const batch = sortAgainstStored(samples, existing);
    skippedIdentical += batch.skippedIdentical;
    conflicting += batch.conflicting.length;
    for (const s of batch.conflicting) if (conflicts.length < 200) conflicts.push({ timestampUtc: new Date(s.timestampUtc).toISOString() });
    if (batch.fresh.length) storeInBackground(batch.fresh);
    if (Date.now() - reportedAt >= PROGRESS_EVERY_MS) {
      reportedAt = Date.now();
      const done = stored + skippedIdentical + conflicting;
      await progress(
        0.05 + (0.9 * done) / Math.max(1, check.dataRows),
        `Stored ${stored.toLocaleString('en-US')} of ${check.dataRows.toLocaleString('en-US')} rows`,
      );
    }
  };
  let summary: ImportSummary;
  try {
    summary = await importSamples(storedPath, {
      mapping,
      statusWords,
      fileOrder: check.order,
      steadiness: { ratingMw: unit.turbine?.ratingMw, minLoadFraction: unit.turbine?.minimumLoadFraction },
      onBatch,
    });
  } finally {
    await inFlight.catch(() => {});
  }
  await inFlight;
  return { summary, stored, skippedIdentical, conflicting, conflicts };
}
