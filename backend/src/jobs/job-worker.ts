/** Runs queued jobs: an interval loop in each app process, or drained on demand (tests, seed). */
import { hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { BackgroundJob } from '../entities/background-job.entity.js';
import type { Logger } from '../logger.js';
import { claimNextJob, finishJob, LostJobLockError, releaseJob, renewLease, STALE_MINUTES } from './job-queue.js';

export interface JobHandler {
  (ds: DataSource, job: BackgroundJob): Promise<void>;
  /** Cleans up after a job given up because its workers kept dying (runs in the giving-up transaction). */
  giveUp?: (em: EntityManager, job: BackgroundJob) => Promise<void>;
}

export interface JobWorker {
  /**
   * Claims nothing more and waits up to `graceMs` for the running job; a job still running then is handed
   * back (queued again) so the next start or another process takes it at once.
   */
  stop: (graceMs?: number) => Promise<void>;
}

/** A running job's lock is renewed this often, so a long step without progress reports is not taken over. */
const HEARTBEAT_MS = Math.min(60_000, (STALE_MINUTES * 60_000) / 5);

const workerId = () => `${hostname()}:${process.pid}:${randomBytes(3).toString('hex')}`;

/** The job a worker is running, if any. */
interface Holding {
  job: BackgroundJob | null;
}

async function runOne(ds: DataSource, handlers: Record<string, JobHandler>, id: string, logger?: Logger, holding: Holding = { job: null }): Promise<boolean> {
  const job = await claimNextJob(ds, id, { onGiveUp: (em, j) => handlers[j.kind]?.giveUp?.(em, j) ?? Promise.resolve() });
  if (!job) return false;
  holding.job = job;
  const handler = handlers[job.kind];
  const heartbeat = setInterval(() => {
    renewLease(ds, job).catch((err) => logger?.warn({ err, jobId: job.id }, 'job lock not renewed'));
  }, HEARTBEAT_MS);
  heartbeat.unref();
  try {
    if (!handler) throw new Error(`no handler for job kind ${job.kind}`);
    await handler(ds, job);
    if (!(await finishJob(ds, job, { ok: true }))) logger?.warn({ jobId: job.id, kind: job.kind }, 'job finished after another worker took it over');
  } catch (err) {
    if (err instanceof LostJobLockError) {
      logger?.warn({ jobId: job.id, kind: job.kind }, 'job taken over by another worker: stopped');
    } else {
      logger?.error({ err, jobId: job.id, kind: job.kind }, 'job failed');
      await finishJob(ds, job, { ok: false, message: err instanceof Error ? err.message : String(err) });
    }
  } finally {
    clearInterval(heartbeat);
    holding.job = null;
  }
  return true;
}

/** Runs jobs until none can be claimed (returns how many ran). */
export async function drainJobs(ds: DataSource, handlers: Record<string, JobHandler>, logger?: Logger): Promise<number> {
  const id = workerId();
  let count = 0;
  while (await runOne(ds, handlers, id, logger)) count++;
  return count;
}

export function startJobWorker(ds: DataSource, handlers: Record<string, JobHandler>, logger: Logger, pollMs = 1000): JobWorker {
  const id = workerId();
  const holding: Holding = { job: null };
  let stopped = false;
  let running: Promise<void> = Promise.resolve();
  const tick = async () => {
    while (!stopped && (await runOne(ds, handlers, id, logger, holding)));
  };
  const timer = setInterval(() => {
    running = running.then(tick).catch((err) => logger.error({ err }, 'job worker tick failed'));
  }, pollMs);
  return {
    stop: async (graceMs = 3_000) => {
      stopped = true;
      clearInterval(timer);
      let grace: NodeJS.Timeout | undefined;
      const done = await Promise.race([running.then(() => true), new Promise<false>((resolve) => (grace = setTimeout(() => resolve(false), graceMs)))]);
      clearTimeout(grace);
      const job = holding.job;
      if (!done && job && (await releaseJob(ds, job))) logger.info({ jobId: job.id, kind: job.kind }, 'job handed back for the next start');
    },
  };
}
