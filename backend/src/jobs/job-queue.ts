/**
 * Background jobs in MariaDB. Any number of workers (in any number of app processes) claim jobs with
 * SELECT … FOR UPDATE SKIP LOCKED; a unit never has two jobs running at once; a job whose worker died is
 * taken over after STALE_MINUTES.
 */
import type { DataSource, EntityManager } from 'typeorm';
import { BackgroundJob, type JobKind } from '../entities/background-job.entity.js';

export const STALE_MINUTES = 15;

export async function enqueueJob(em: EntityManager, job: { organisationId: string; unitId: string; kind: JobKind; payload?: Record<string, unknown> }): Promise<BackgroundJob> {
  return em.getRepository(BackgroundJob).save({ ...job, payload: job.payload ?? null, status: 'queued', progress: 0, message: null, lockedBy: null, lockedAt: null, attempts: 0, finishedAt: null });
}

/** Queues a recompute of the unit's derived data unless one is already waiting. */
export async function enqueueRecompute(em: EntityManager, organisationId: string, unitId: string, reason: string): Promise<void> {
  const waiting = await em.getRepository(BackgroundJob).existsBy({ unitId, kind: 'recompute', status: 'queued' });
  if (!waiting) await enqueueJob(em, { organisationId, unitId, kind: 'recompute', payload: { reason } });
}

export async function claimNextJob(ds: DataSource, workerId: string): Promise<BackgroundJob | null> {
  return ds.transaction(async (em) => {
    const rows: { id: string }[] = await em.query(
      `SELECT j.id FROM background_job j
        WHERE (j.status = 'queued' OR (j.status = 'running' AND j.lockedAt < NOW(3) - INTERVAL ${STALE_MINUTES} MINUTE))
          AND NOT EXISTS (SELECT 1 FROM background_job r WHERE r.unitId = j.unitId AND r.status = 'running' AND r.id <> j.id
                          AND r.lockedAt >= NOW(3) - INTERVAL ${STALE_MINUTES} MINUTE)
        ORDER BY j.createdAt ASC LIMIT 1 FOR UPDATE SKIP LOCKED`,
    );
    if (rows.length === 0) return null;
    await em.query(`UPDATE background_job SET status = 'running', lockedBy = ?, lockedAt = NOW(3), attempts = attempts + 1 WHERE id = ?`, [workerId, rows[0].id]);
    return em.getRepository(BackgroundJob).findOneByOrFail({ id: rows[0].id });
  });
}

export async function reportProgress(ds: DataSource, jobId: string, progress: number, message?: string): Promise<void> {
  await ds.getRepository(BackgroundJob).update({ id: jobId }, { progress: Math.max(0, Math.min(1, progress)), lockedAt: new Date(), ...(message !== undefined && { message }) });
}

export async function finishJob(ds: DataSource, jobId: string, outcome: { ok: true } | { ok: false; message: string }): Promise<void> {
  await ds.getRepository(BackgroundJob).update(
    { id: jobId },
    { status: outcome.ok ? 'done' : 'failed', progress: outcome.ok ? 1 : undefined, message: outcome.ok ? null : outcome.message.slice(0, 500), finishedAt: new Date(), lockedBy: null },
  );
}
