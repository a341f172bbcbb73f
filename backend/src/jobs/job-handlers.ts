/** What each kind of background job does. */
import type { JobHandler } from './job-worker.js';
import { reportProgress } from './job-queue.js';
import { recomputeUnit } from '../services/derived/recompute-unit.js';
import { giveUpImport, runImportJob } from '../services/import-job/run-import-job.js';

const importJob: JobHandler = (ds, job) => runImportJob(ds, job, String(job.payload?.importId));
importJob.giveUp = (em, job) => giveUpImport(em, String(job.payload?.importId), job.message ?? 'the import stopped');

export const JOB_HANDLERS = {
  import: importJob,
  recompute: async (ds, job) => {
    await recomputeUnit(ds, job.unitId, (f, m) => reportProgress(ds, job, f, m));
  },
} satisfies Record<string, JobHandler>;
