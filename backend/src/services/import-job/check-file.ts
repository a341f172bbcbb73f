/**
 * Step 1 of the import job: check the whole file. A run that takes over from a worker that died first removes
 * what the earlier run stored. A file with any error is rejected as a whole, every error listed by row and
 * column, and nothing of it stays (a wide file in time order is stored while it is checked: see store-rows.ts).
 */
import type { DataSource } from 'typeorm';
import { importMappingSchema } from '@shared/schemas/import-mapping.js';
import type { ImportCheck } from '../../import/index.js';
import { checkAnyShape, type PreparedFile } from '../../import/prepare-file.js';
import { DataImport } from '../../entities/data-import.entity.js';
import { withLease, type JobLease } from '../../jobs/job-queue.js';
import { deleteSamplesOfImport } from '../../repositories/sample.repository.js';
import type { ImportProgress } from './import-progress.js';

export interface CheckInput {
  importId: string;
  storedPath: string;
  mapping: unknown;
  /** Historian status words of the organisation (defaults and its own). */
  statusWords?: readonly string[];
  progress: ImportProgress;
}

/** The check, and (when it passed) the file the store reads: the upload, or the wide file a tall one was aligned to. */
export async function checkFile(
  ds: DataSource,
  job: JobLease,
  { importId, storedPath, mapping, statusWords, progress }: CheckInput,
): Promise<{ check: ImportCheck; prepared: PreparedFile | null }> {
  await startAfresh(ds, job, importId);
  await progress(0.02, 'Checking every row');
  return checkAnyShape(storedPath, { mapping, statusWords });
}

/** Removes what an earlier run of the import stored (a worker that died, a pass that had to start again). */
export async function startAfresh(ds: DataSource, job: JobLease, importId: string): Promise<void> {
  await withLease(ds, job, (em) => deleteSamplesOfImport(em, importId));
}

/** Whether the mapping is one of a tall file (one row per tag and time): its check aligns it to a wide file first. */
export function isTallMapping(mapping: unknown): boolean {
  const parsed = importMappingSchema.safeParse(mapping);
  return parsed.success && !!parsed.data.tall;
}

/** What the import records when its file is rejected. */
// JSON columns as plain objects (the entity declares them loosely).
export type RejectionRecord = Pick<DataImport, 'status' | 'errorCount' | 'notes' | 'progress' | 'message' | 'finishedAt' | 'storedPath'> & {
  errors: object;
  counts: object;
};

export function rejection(check: ImportCheck, now = new Date()): RejectionRecord {
  const errors = check.fileError ? [{ row: check.fileError.line ?? 0, column: '', value: '', message: check.fileError.message }] : check.errors;
  const problems = check.errors.length + check.errorsNotListed;
  return {
    status: 'rejected',
    errors,
    errorCount: check.fileError ? 1 : problems,
    notes: { assumptions: check.assumptions, warnings: check.warnings },
    progress: 1,
    message: check.fileError ? check.fileError.message : `The file was not imported: ${problems.toLocaleString('en-US')} problems to fix`,
    counts: { rowsRead: check.dataRows },
    finishedAt: now,
    storedPath: null,
  };
}

/** Records the rejection and removes, in the same transaction, any row stored before the errors were met. */
export async function rejectImport(ds: DataSource, job: JobLease, importId: string, check: ImportCheck): Promise<void> {
  await withLease(ds, job, async (em) => {
    await deleteSamplesOfImport(em, importId);
    await em.getRepository(DataImport).update({ id: importId }, rejection(check));
  });
}
