/** What each kind of background job does. */
import type { JobHandler } from './job-worker.js';
import { reportProgress } from './job-queue.js';
import { recomputeUnit } from '../services/derived/recompute-unit.js';
import { runImportJob } from '../services/import.service.js';

export const JOB_HANDLERS: Record<string, JobHandler> = {
  import: (ds, job) => runImportJob(ds, job.id, String(job.payload?.importId)),
  recompute: async (ds, job) => {
    await recomputeUnit(ds, job.unitId, (f, m) => reportProgress(ds, job.id, f, m));
  },
};
