import { z } from 'zod';

/** Background work on a unit: an import's rows or a recompute of its derived data. */
export const JOB_KINDS = ['import', 'recompute'] as const;
export type JobKind = (typeof JOB_KINDS)[number];
export const JOB_STATUSES = ['queued', 'running', 'done', 'failed'] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];

export const jobView = z
  .object({
    id: z.string(),
    kind: z.enum(JOB_KINDS),
    status: z.enum(JOB_STATUSES),
    /** 0 to 1 */
    progress: z.number(),
    message: z.string().nullable(),
    createdAt: z.iso.datetime(),
    finishedAt: z.iso.datetime().nullable(),
  })
  .strict();
export type JobView = z.infer<typeof jobView>;
