/** Progress of a running import, reported on its job and shown on the import itself. */
import type { DataSource } from 'typeorm';
import { DataImport } from '../../entities/data-import.entity.js';
import { reportProgress, type JobLease } from '../../jobs/job-queue.js';

export type ImportProgress = (fraction: number, message: string) => Promise<void>;

export function importProgress(ds: DataSource, job: JobLease, importId: string): ImportProgress {
  return async (fraction, message) => {
    await reportProgress(ds, job, fraction, message);
    await ds.getRepository(DataImport).update({ id: importId }, { progress: fraction, message });
  };
}
