/**
 * Background jobs in MariaDB. Any number of workers (in any number of app processes) claim jobs; a unit never
 * has two jobs running at once, because every claim locks the unit's row (SELECT … FOR UPDATE) for its
 * transaction and only then looks, in committed data, for a running job of that unit. A job whose worker
 * died is taken over after STALE_MINUTES; one that never finished in MAX_ATTEMPTS runs is given up. Only the
 * worker holding a job's lock reports progress on it or finishes it: a worker that lost its lock stops.
 */
import type { DataSource, EntityManager } from 'typeorm';
import { BackgroundJob, type JobKind } from '../entities/background-job.entity.js';

export const STALE_MINUTES = 15;
/** Runs a job may start without finishing (its worker died each time) before it is given up. */
export const MAX_ATTEMPTS = 3;

/** The part of a claimed job that proves who holds it. */
export type JobLease = Pick<BackgroundJob, 'id' | 'lockedBy'>;

/** Thrown to a worker whose job was taken over by another (its lock went stale): it must stop. */
export class LostJobLockError extends Error {
  constructor(jobId: string) {
    super(`job ${jobId} was taken over by another worker`);
    this.name = 'LostJobLockError';
  }
}

/** Undoes what a job left half-done, in the transaction that gives it up. */
export type GiveUpHook = (em: EntityManager, job: BackgroundJob) => Promise<void>;

const STALE = `NOW(3) - INTERVAL ${STALE_MINUTES} MINUTE`;
/** A job a worker may start: waiting, or running under a stale lock with attempts left. */
const RUNNABLE = `status = 'queued' OR (status = 'running' AND lockedAt < ${STALE} AND attempts < ${MAX_ATTEMPTS})`;

export async function enqueueJob(
  em: EntityManager,
  job: { organisationId: string; unitId: string; kind: JobKind; payload?: Record<string, unknown> },
): Promise<BackgroundJob> {
  return em.getRepository(BackgroundJob).save({
    ...job,
    payload: job.payload ?? null,
    status: 'queued',
    progress: 0,
    message: null,
    lockedBy: null,
    lockedAt: null,
    attempts: 0,
    finishedAt: null,
  });
}

/** Queues a recompute of the unit's derived data unless one is already waiting. */
export async function enqueueRecompute(em: EntityManager, organisationId: string, unitId: string, reason: string): Promise<void> {
  const waiting = await em.getRepository(BackgroundJob).existsBy({ unitId, kind: 'recompute', status: 'queued' });
  if (!waiting) await enqueueJob(em, { organisationId, unitId, kind: 'recompute', payload: { reason } });
}

/**
 * Claims the oldest runnable job of a unit with no job running (queued, or running with a stale lock), marks
 * it running for this worker and returns it; null when there is none. Jobs that ran MAX_ATTEMPTS times
 * without finishing are given up first.
 */
export async function claimNextJob(ds: DataSource, workerId: string, options: { onGiveUp?: GiveUpHook } = {}): Promise<BackgroundJob | null> {
  await giveUpExhaustedJobs(ds, options.onGiveUp);
  // READ COMMITTED: each plain read below sees every claim committed before it, not a snapshot.
  return ds.transaction('READ COMMITTED', async (em) => {
    // Units with work waiting and (as far as this read shows) none running; checked again under the unit's lock.
    const units: { unitId: string }[] = await em.query(
      `SELECT j.unitId FROM background_job j
        WHERE (${RUNNABLE})
          AND NOT EXISTS (SELECT 1 FROM background_job r WHERE r.unitId = j.unitId AND r.status = 'running' AND r.lockedAt >= ${STALE})
        GROUP BY j.unitId ORDER BY MIN(j.createdAt) ASC LIMIT 20`,
    );
    for (const { unitId } of units) {
      // Another claim holding this unit is skipped, not waited for; it holds the row until it commits.
      const locked: unknown[] = await em.query('SELECT id FROM generating_unit WHERE id = ? FOR UPDATE SKIP LOCKED', [unitId]);
      if (locked.length === 0) {
        const exists: unknown[] = await em.query('SELECT id FROM generating_unit WHERE id = ?', [unitId]);
        if (exists.length === 0) await failJobsOfMissingUnit(em, unitId);
        continue;
      }
      const busy: unknown[] = await em.query(`SELECT id FROM background_job WHERE unitId = ? AND status = 'running' AND lockedAt >= ${STALE} LIMIT 1`, [
        unitId,
      ]);
      if (busy.length > 0) continue;
      // No SKIP LOCKED here: a locking scan elsewhere may hold the row for an instant. The unit's lock already
      // keeps other claims off; the UPDATE waits for the row and checks it is still runnable.
      const next: { id: string }[] = await em.query(`SELECT id FROM background_job WHERE unitId = ? AND (${RUNNABLE}) ORDER BY createdAt ASC LIMIT 1`, [
        unitId,
      ]);
      const [oldest] = next;
      if (!oldest) continue;
      const claimed = await em.query(
        `UPDATE background_job SET status = 'running', lockedBy = ?, lockedAt = NOW(3), attempts = attempts + 1 WHERE id = ? AND (${RUNNABLE})`,
        [workerId, oldest.id],
      );
      if (affectedRows(claimed) === 0) continue;
      return em.getRepository(BackgroundJob).findOneByOrFail({ id: oldest.id });
    }
    return null;
  });
}

async function failJobsOfMissingUnit(em: EntityManager, unitId: string): Promise<void> {
  await em.query(
    `UPDATE background_job SET status = 'failed', message = 'The unit no longer exists', finishedAt = ?, lockedBy = NULL
      WHERE unitId = ? AND (status = 'queued' OR (status = 'running' AND lockedAt < ${STALE}))`,
    [new Date(), unitId],
  );
}

/** Ends failed every job whose lock went stale after its last allowed run, each in its own transaction. */
async function giveUpExhaustedJobs(ds: DataSource, onGiveUp?: GiveUpHook): Promise<void> {
  for (;;) {
    const gaveUp = await ds.transaction('READ COMMITTED', async (em) => {
      const rows: { id: string }[] = await em.query(
        `SELECT id FROM background_job WHERE status = 'running' AND lockedAt < ${STALE} AND attempts >= ${MAX_ATTEMPTS}
          ORDER BY createdAt ASC LIMIT 1 FOR UPDATE SKIP LOCKED`,
      );
      const [stale] = rows;
      if (!stale) return false;
      const job = await em.getRepository(BackgroundJob).findOneByOrFail({ id: stale.id });
      const lastStep = job.message ? ` (last step: ${job.message})` : '';
      const message = `Stopped after ${job.attempts} attempts that did not finish${lastStep}`.slice(0, 500);
      await em.query(`UPDATE background_job SET status = 'failed', message = ?, finishedAt = ?, lockedBy = NULL WHERE id = ?`, [message, new Date(), job.id]);
      await onGiveUp?.(em, { ...job, status: 'failed', message, lockedBy: null });
      return true;
    });
    if (!gaveUp) return;
  }
}

/** Progress of a running job; also renews its lock. Throws LostJobLockError when another worker holds it now. */
export async function reportProgress(ds: DataSource | EntityManager, lease: JobLease, progress: number, message?: string): Promise<void> {
  const fraction = Math.max(0, Math.min(1, Number.isFinite(progress) ? progress : 0));
  const result = await ds.query(
    `UPDATE background_job SET progress = ?, lockedAt = NOW(3)${message !== undefined ? ', message = ?' : ''} WHERE id = ? AND lockedBy = ? AND status = 'running'`,
    message !== undefined ? [fraction, message.slice(0, 500), lease.id, lease.lockedBy] : [fraction, lease.id, lease.lockedBy],
  );
  if (affectedRows(result) === 0) throw new LostJobLockError(lease.id);
}

/** Renews the lock of a job still held by this worker; false when it was taken over. */
export async function renewLease(ds: DataSource, lease: JobLease): Promise<boolean> {
  const result = await ds.query(`UPDATE background_job SET lockedAt = NOW(3) WHERE id = ? AND lockedBy = ? AND status = 'running'`, [lease.id, lease.lockedBy]);
  return affectedRows(result) > 0;
}

/**
 * Runs `work` in a transaction that holds the job's row, so no other worker can take the job over while it
 * writes; throws LostJobLockError (and writes nothing) when the job is no longer this worker's.
 */
export async function withLease<T>(ds: DataSource, lease: JobLease, work: (em: EntityManager) => Promise<T>): Promise<T> {
  return ds.transaction(async (em) => {
    const held: unknown[] = await em.query(`SELECT id FROM background_job WHERE id = ? AND lockedBy = ? AND status = 'running' FOR UPDATE`, [
      lease.id,
      lease.lockedBy,
    ]);
    if (held.length === 0) throw new LostJobLockError(lease.id);
    await em.query('UPDATE background_job SET lockedAt = NOW(3) WHERE id = ?', [lease.id]);
    return work(em);
  });
}

/**
 * Hands a job this worker holds back to the queue (its app is stopping): queued again at once, the attempt
 * not counted, so a stop is not taken for a crash. What it wrote is cleaned up by the next run; a write it
 * still tries is refused (LostJobLockError). False when the job is no longer this worker's.
 */
export async function releaseJob(ds: DataSource, lease: JobLease): Promise<boolean> {
  const result = await ds.query(
    `UPDATE background_job SET status = 'queued', lockedBy = NULL, lockedAt = NULL, attempts = GREATEST(attempts - 1, 0), message = 'Waiting to start again (the app stopped while it ran)'
      WHERE id = ? AND lockedBy = ? AND status = 'running'`,
    [lease.id, lease.lockedBy],
  );
  return affectedRows(result) > 0;
}

/** Ends a job held by this worker; false (and nothing written) when another worker holds it now. */
export async function finishJob(ds: DataSource, lease: JobLease, outcome: { ok: true } | { ok: false; message: string }): Promise<boolean> {
  const result = outcome.ok
    ? await ds.query(
        `UPDATE background_job SET status = 'done', progress = 1, message = NULL, finishedAt = ?, lockedBy = NULL WHERE id = ? AND lockedBy = ? AND status = 'running'`,
        [new Date(), lease.id, lease.lockedBy],
      )
    : await ds.query(
        `UPDATE background_job SET status = 'failed', message = ?, finishedAt = ?, lockedBy = NULL WHERE id = ? AND lockedBy = ? AND status = 'running'`,
        [outcome.message.slice(0, 500), new Date(), lease.id, lease.lockedBy],
      );
  return affectedRows(result) > 0;
}

/**
 * Settles a job its worker could not finish: the failure could not be written (the database was unreachable), or
 * the worker's process is gone. A job kind with a clean-up (`onGiveUp`) ends failed with `reason` and is cleaned up
 * in the same transaction; any other kind is queued again (running it again is harmless). False, and nothing
 * written, when the job is no longer held under `job.lockedBy`.
 */
export async function settleAbandonedJob(ds: DataSource, job: BackgroundJob, reason: string, onGiveUp?: GiveUpHook): Promise<boolean> {
  return ds.transaction(async (em) => {
    const held: unknown[] = await em.query(`SELECT id FROM background_job WHERE id = ? AND lockedBy = ? AND status = 'running' FOR UPDATE`, [
      job.id,
      job.lockedBy,
    ]);
    if (held.length === 0) return false;
    const message = reason.slice(0, 500);
    if (!onGiveUp) {
      await em.query(`UPDATE background_job SET status = 'queued', lockedBy = NULL, lockedAt = NULL, message = ? WHERE id = ?`, [
        `Waiting to start again (${reason})`.slice(0, 500),
        job.id,
      ]);
      return true;
    }
    await em.query(`UPDATE background_job SET status = 'failed', message = ?, finishedAt = ?, lockedBy = NULL WHERE id = ?`, [message, new Date(), job.id]);
    await onGiveUp(em, { ...job, status: 'failed', message, lockedBy: null });
    return true;
  });
}

/** The process id in a worker id (`host:pid:suffix`, see job-worker.ts) when the worker ran on `host`; null otherwise. */
export function localWorkerPid(lockedBy: string | null, host: string): number | null {
  if (!lockedBy?.startsWith(`${host}:`)) return null;
  const pid = Number(lockedBy.slice(host.length + 1).split(':')[0]);
  return Number.isInteger(pid) && pid > 0 ? pid : null;
}

/**
 * Running jobs whose worker was a process on this host that no longer exists (killed or crashed): no heartbeat
 * will come, so they need not wait STALE_MINUTES. Processes sharing a host name share its process ids (one
 * machine or container); a worker on another host is left to the lease.
 */
export async function jobsOfDeadLocalWorkers(ds: DataSource, host: string, isAlive: (pid: number) => boolean): Promise<BackgroundJob[]> {
  const running = await ds.getRepository(BackgroundJob).findBy({ status: 'running' });
  return running.filter((job) => {
    const pid = localWorkerPid(job.lockedBy, host);
    return pid !== null && !isAlive(pid);
  });
}

/** Rows changed by an UPDATE through TypeORM's MariaDB driver (an OkPacket, or [rows, OkPacket]). */
function affectedRows(result: unknown): number {
  const packet = Array.isArray(result) ? (result[1] ?? result[0]) : result;
  return typeof packet === 'object' && packet !== null && 'affectedRows' in packet ? Number((packet as { affectedRows: number }).affectedRows) : 0;
}
