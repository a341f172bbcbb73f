/** Runs queued jobs: an interval loop in each app process, or drained on demand (tests, seed). */
import { hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { BackgroundJob } from '../entities/background-job.entity.js';
import type { Logger } from '../logger.js';
import { claimNextJob, finishJob } from './job-queue.js';

export type JobHandler = (ds: DataSource, job: BackgroundJob) => Promise<void>;

export interface JobWorker {
  stop: () => Promise<void>;
}

const workerId = () => `${hostname()}:${process.pid}:${randomBytes(3).toString('hex')}`;

async function runOne(ds: DataSource, handlers: Record<string, JobHandler>, id: string, logger?: Logger): Promise<boolean> {
  const job = await claimNextJob(ds, id);
  if (!job) return false;
  const handler = handlers[job.kind];
  try {
    if (!handler) throw new Error(`no handler for job kind ${job.kind}`);
    await handler(ds, job);
    await finishJob(ds, job.id, { ok: true });
  } catch (err) {
    logger?.error({ err, jobId: job.id, kind: job.kind }, 'job failed');
    await finishJob(ds, job.id, { ok: false, message: err instanceof Error ? err.message : String(err) });
  }
  return true;
}

/** Runs jobs until none is queued (returns how many ran). */
export async function drainJobs(ds: DataSource, handlers: Record<string, JobHandler>, logger?: Logger): Promise<number> {
  const id = workerId();
  let count = 0;
  while (await runOne(ds, handlers, id, logger)) count++;
  return count;
}

export function startJobWorker(ds: DataSource, handlers: Record<string, JobHandler>, logger: Logger, pollMs = 1000): JobWorker {
  const id = workerId();
  let stopped = false;
  let running: Promise<void> = Promise.resolve();
  const tick = async () => {
    while (!stopped && (await runOne(ds, handlers, id, logger)));
  };
  const timer = setInterval(() => {
    running = running.then(tick).catch((err) => logger.error({ err }, 'job worker tick failed'));
  }, pollMs);
  return {
    stop: async () => {
      stopped = true;
      clearInterval(timer);
      await running;
    },
  };
}
