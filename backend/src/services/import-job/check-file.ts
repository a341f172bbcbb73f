/**
 * Step 1 of the import job: check the whole file before anything is stored. A run that takes over from a
 * worker that died first removes what the earlier run stored. A file with any error is rejected as a whole,
 * every error listed by row and column.
 */
import type { DataSource } from 'typeorm';
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
  await withLease(ds, job, (em) => deleteSamplesOfImport(em, importId));
  await progress(0.02, 'Checking every row');
  return checkAnyShape(storedPath, { mapping, statusWords });
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

export async function rejectImport(ds: DataSource, job: JobLease, importId: string, check: ImportCheck): Promise<void> {
  await withLease(ds, job, (em) => em.getRepository(DataImport).update({ id: importId }, rejection(check)));
}
