/** Runs queued jobs: an interval loop in each app process, or drained on demand (tests, seed). */
import { hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { BackgroundJob } from '../entities/background-job.entity.js';
import type { Logger } from '../logger.js';
import { isDatabaseUnreachable } from '../database-errors.js';
import { claimNextJob, finishJob, jobsOfDeadLocalWorkers, LostJobLockError, releaseJob, renewLease, settleAbandonedJob, STALE_MINUTES } from './job-queue.js';

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

/** What a job records when the database stopped answering while it ran (an import adds it to "stored nothing: …"). */
export const DATABASE_STOPPED = 'the database stopped answering while it ran';
/** What a job records when the process running it ended without finishing it (killed or crashed). */
export const PROCESS_STOPPED = 'the app process stopped while it ran (it was ended or crashed)';
/** How often a worker looks for jobs of dead processes on its host (also at its start). */
const DEAD_WORKER_CHECK_MS = 60_000;

/** The job a worker is running, if any, and jobs it could not finish because the database was unreachable. */
interface Holding {
  job: BackgroundJob | null;
  unsettled: { job: BackgroundJob; reason: string }[];
}

function pidAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    // EPERM: it exists, under another user.
    return (err as { code?: string }).code === 'EPERM';
  }
}

async function runOne(
  ds: DataSource,
  handlers: Record<string, JobHandler>,
  id: string,
  logger?: Logger,
  holding: Holding = { job: null, unsettled: [] },
): Promise<boolean> {
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
    } else if (isDatabaseUnreachable(err)) {
      // Its own clean-up could not reach the database either: settled (failed and cleaned up, or queued again) now or, while the database is still away, by a later pass.
      logger?.warn({ err, jobId: job.id, kind: job.kind }, 'job stopped: the database is unreachable');
      await settleAbandonedJob(ds, job, DATABASE_STOPPED, handler?.giveUp).catch(() => holding.unsettled.push({ job, reason: DATABASE_STOPPED }));
    } else {
      logger?.error({ err, jobId: job.id, kind: job.kind }, 'job failed');
      const message = err instanceof Error ? err.message : String(err);
      await finishJob(ds, job, { ok: false, message }).catch((finishErr: unknown) => {
        if (!isDatabaseUnreachable(finishErr)) throw finishErr;
        holding.unsettled.push({ job, reason: message });
      });
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

/** Settles what this worker could not (the database was away); each stays listed until the database takes it. */
async function settleUnsettled(ds: DataSource, handlers: Record<string, JobHandler>, holding: Holding, logger: Logger): Promise<void> {
  while (holding.unsettled.length > 0) {
    const { job, reason } = holding.unsettled[0]!;
    await settleAbandonedJob(ds, job, reason, handlers[job.kind]?.giveUp);
    holding.unsettled.shift();
    logger.info({ jobId: job.id, kind: job.kind }, 'job left by a database outage settled');
  }
}

/** Settles the jobs of processes on this host that died holding them (on a restart, say), without waiting out their lease. */
async function settleJobsOfDeadProcesses(ds: DataSource, handlers: Record<string, JobHandler>, logger: Logger): Promise<void> {
  for (const job of await jobsOfDeadLocalWorkers(ds, hostname(), pidAlive)) {
    if (await settleAbandonedJob(ds, job, PROCESS_STOPPED, handlers[job.kind]?.giveUp)) {
      logger.warn({ jobId: job.id, kind: job.kind, worker: job.lockedBy }, 'job of a process that stopped while running it settled');
    }
  }
}

export function startJobWorker(ds: DataSource, handlers: Record<string, JobHandler>, logger: Logger, pollMs = 1000): JobWorker {
  const id = workerId();
  const holding: Holding = { job: null, unsettled: [] };
  let stopped = false;
  let running: Promise<void> = Promise.resolve();
  let nextDeadCheck = 0;
  const tick = async () => {
    await settleUnsettled(ds, handlers, holding, logger);
    if (Date.now() >= nextDeadCheck) {
      await settleJobsOfDeadProcesses(ds, handlers, logger);
      nextDeadCheck = Date.now() + DEAD_WORKER_CHECK_MS;
    }
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
