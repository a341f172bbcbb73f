/** Runs queued jobs: an interval loop in each app process, or drained on demand (tests, seed). */
import { hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { BackgroundJob } from '../entities/background-job.entity.js';
import type { Logger } from '../logger.js';
import { claimNextJob, finishJob, LostJobLockError, renewLease, STALE_MINUTES } from './job-queue.js';

export interface JobHandler {
  (ds: DataSource, job: BackgroundJob): Promise<void>;
  /** Cleans up after a job given up because its workers kept dying (runs in the giving-up transaction). */
  giveUp?: (em: EntityManager, job: BackgroundJob) => Promise<void>;
}

export interface JobWorker {
  stop: () => Promise<void>;
}

/** A running job's lock is renewed this often, so a long step without progress reports is not taken over. */
const HEARTBEAT_MS = Math.min(60_000, (STALE_MINUTES * 60_000) / 5);

const workerId = () => `${hostname()}:${process.pid}:${randomBytes(3).toString('hex')}`;

async function runOne(ds: DataSource, handlers: Record<string, JobHandler>, id: string, logger?: Logger): Promise<boolean> {
  const job = await claimNextJob(ds, id, { onGiveUp: (em, j) => handlers[j.kind]?.giveUp?.(em, j) ?? Promise.resolve() });
  if (!job) return false;
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
