/**
 * The background-job queue with two workers on two separate connection pools (as two app processes would
 * have): one unit never has two jobs running, a job whose workers keep dying is given up, and a worker
 * whose job was taken over can neither report on it nor finish it.
 */
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildDataSource } from '../../backend/src/data-source.js';
import { BackgroundJob } from '../../backend/src/entities/background-job.entity.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { claimNextJob, enqueueJob, finishJob, LostJobLockError, MAX_ATTEMPTS, reportProgress, STALE_MINUTES } from '../../backend/src/jobs/job-queue.js';
import { drainJobs, startJobWorker, type JobHandler } from '../../backend/src/jobs/job-worker.js';
import { createLogger } from '../../backend/src/logger.js';
import { createTenant, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';
import { migratedDataSource } from '../helpers/test-database.js';

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

describe('background jobs with two workers', () => {
  let dsA: DataSource;
  let dsB: DataSource;
  let tenant: TenantFixture;

  beforeAll(async () => {
    const { dataSource, connection } = await migratedDataSource('jobs');
    dsA = dataSource;
    dsB = buildDataSource(connection);
    await dsB.initialize();
    tenant = await createTenant(dsA, 'jobs');
  });
  afterAll(async () => {
    await dsB?.destroy();
    await dsA?.destroy();
  });

  const newUnit = async (): Promise<GeneratingUnit> => createUnit(dsA, await createPlant(dsA, tenant.organisation.id));
  /** Queues `n` (at least one) jobs of the unit, oldest first. */
  const queue = async (unit: GeneratingUnit, n: number): Promise<[BackgroundJob, ...BackgroundJob[]]> => {
    const enqueue = (i: number) => enqueueJob(dsA.manager, { organisationId: unit.organisationId, unitId: unit.id, kind: 'recompute', payload: { n: i } });
    const jobs: [BackgroundJob, ...BackgroundJob[]] = [await enqueue(0)];
    for (let i = 1; i < n; i++) jobs.push(await enqueue(i));
    return jobs;
  };
  const jobsOf = (unit: GeneratingUnit) => dsA.getRepository(BackgroundJob).find({ where: { unitId: unit.id }, order: { createdAt: 'ASC' } });
  /** What a worker that died leaves behind once the stale time has passed. */
  const ageLock = (jobId: string) => dsA.query(`UPDATE background_job SET lockedAt = NOW(3) - INTERVAL ${STALE_MINUTES + 1} MINUTE WHERE id = ?`, [jobId]);

  it('when eight claims race across two connection pools on one unit’s queued jobs, exactly one job of that unit runs (another unit is not held up)', async () => {
    for (let round = 0; round < 5; round++) {
      const busy = await newUnit();
      const other = await newUnit();
      await queue(busy, 5);
      await queue(other, 1);
      const claims = await Promise.all(Array.from({ length: 8 }, (_, i) => claimNextJob(i % 2 === 0 ? dsA : dsB, `racer-${round}-${i}`)));
      const claimed = claims.filter((j): j is BackgroundJob => j !== null);
      expect(
        claimed.filter((j) => j.unitId === busy.id),
        `round ${round}`,
      ).toHaveLength(1);
      expect(
        claimed.filter((j) => j.unitId === other.id),
        `round ${round}`,
      ).toHaveLength(1);
      const running = (await jobsOf(busy)).filter((j) => j.status === 'running');
      expect(running).toHaveLength(1);
      // the oldest job of the unit goes first
      expect(running[0]?.payload).toEqual({ n: 0 });
    }
  });

  it('while another worker’s claim of a unit’s job is not yet committed, a second worker takes no job of that unit', async () => {
    const unit = await newUnit();
    const [first] = await queue(unit, 3);
    // Worker A is in the middle of its claim: the unit's row is held and the oldest job marked running, uncommitted.
    const a = dsA.createQueryRunner();
    await a.connect();
    try {
      await a.startTransaction();
      await a.query('SELECT id FROM generating_unit WHERE id = ? FOR UPDATE', [unit.id]);
      await a.query(`UPDATE background_job SET status = 'running', lockedBy = 'worker-a', lockedAt = NOW(3), attempts = 1 WHERE id = ?`, [first.id]);
      expect(await claimNextJob(dsB, 'worker-b')).toBeNull();
      await a.commitTransaction();
    } finally {
      await a.release();
    }
    // committed, A's running job still keeps B off the unit
    expect(await claimNextJob(dsB, 'worker-b')).toBeNull();
    expect((await jobsOf(unit)).map((j) => j.status)).toEqual(['running', 'queued', 'queued']);
  });

  it('units whose jobs are running, however many, do not hold up the queued job of a free unit', async () => {
    const busy: GeneratingUnit[] = [];
    for (let i = 0; i < 25; i++) busy.push(await newUnit());
    for (const u of busy) await queue(u, 2);
    for (let i = 0; i < busy.length; i++) expect(await claimNextJob(i % 2 ? dsA : dsB, `busy-${i}`)).not.toBeNull();
    const free = await newUnit();
    await queue(free, 1);
    expect((await claimNextJob(dsA, 'free'))?.unitId).toBe(free.id);
  });

  it('two workers draining two units’ queues never run two jobs of one unit at once, and finish them all', async () => {
    const units: [GeneratingUnit, GeneratingUnit] = [await newUnit(), await newUnit()];
    for (const u of units) await queue(u, 6);
    const runningNow = new Map<string, number>();
    const most = new Map<string, number>();
    const order: number[] = [];
    const handlers: Record<string, JobHandler> = {
      recompute: async (_ds, job) => {
        const now = (runningNow.get(job.unitId) ?? 0) + 1;
        runningNow.set(job.unitId, now);
        most.set(job.unitId, Math.max(most.get(job.unitId) ?? 0, now));
        if (job.unitId === units[0].id) order.push(Number(job.payload?.n));
        await sleep(25);
        runningNow.set(job.unitId, (runningNow.get(job.unitId) ?? 1) - 1);
      },
    };
    const logger = createLogger('silent');
    const workers = [startJobWorker(dsA, handlers, logger, 5), startJobWorker(dsB, handlers, logger, 5)];
    try {
      const deadline = Date.now() + 30_000;
      for (;;) {
        const [left] = await dsA.query(`SELECT COUNT(*) AS n FROM background_job WHERE unitId IN (?, ?) AND status <> 'done'`, [units[0].id, units[1].id]);
        if (Number(left.n) === 0) break;
        if (Date.now() > deadline) throw new Error(`${left.n} jobs still not done`);
        await sleep(20);
      }
    } finally {
      await Promise.all(workers.map((w) => w.stop()));
    }
    expect(most.get(units[0].id)).toBe(1);
    expect(most.get(units[1].id)).toBe(1);
    expect(order).toEqual([0, 1, 2, 3, 4, 5]);
  });

  it('a job whose worker dies is taken over after the stale time, and after three runs that never finished it ends failed with its last step in the message', async () => {
    const unit = await newUnit();
    const [job] = await queue(unit, 1);
    for (let attempt = 1; attempt <= MAX_ATTEMPTS; attempt++) {
      const claimed = await claimNextJob(attempt % 2 ? dsA : dsB, `doomed-${attempt}`);
      expect(claimed?.id).toBe(job.id);
      expect(claimed?.attempts).toBe(attempt);
      await reportProgress(dsA, claimed!, 0.4, 'Analysed 5,000 points');
      // while the dying worker's lock is fresh, nobody else takes the job
      expect(await claimNextJob(dsB, `bystander-${attempt}`)).toBeNull();
      await ageLock(job.id);
    }
    const givenUp: string[] = [];
    const handlers: Record<string, JobHandler> = {
      recompute: Object.assign(
        async () => {
          throw new Error('must not run a fourth time');
        },
        { giveUp: async (_em: unknown, j: BackgroundJob) => void givenUp.push(j.id) },
      ),
    };
    expect(await drainJobs(dsB, handlers)).toBe(0);
    const after = await dsA.getRepository(BackgroundJob).findOneByOrFail({ id: job.id });
    expect(after.status).toBe('failed');
    expect(after.attempts).toBe(MAX_ATTEMPTS);
    expect(after.lockedBy).toBeNull();
    expect(after.finishedAt).not.toBeNull();
    expect(after.message).toContain(`${MAX_ATTEMPTS} attempts`);
    expect(after.message).toContain('Analysed 5,000 points');
    expect(givenUp).toEqual([job.id]);
    // the unit is free again for new work
    await queue(unit, 1);
    expect((await claimNextJob(dsA, 'next'))?.unitId).toBe(unit.id);
  });

  it('a worker stopped while its job runs hands the job back: queued again without using up an attempt, and another worker takes it at once', async () => {
    const unit = await newUnit();
    const [job] = await queue(unit, 1);
    let started!: () => void;
    const startedA = new Promise<void>((resolve) => (started = resolve));
    let release!: () => void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    let lostLock: unknown = null;
    const slowA: Record<string, JobHandler> = {
      recompute: async (ds, j) => {
        started();
        await gate;
        await reportProgress(ds, j, 0.5, 'after the stop').catch((err) => {
          lostLock = err;
          throw err;
        });
      },
    };
    const worker = startJobWorker(dsA, slowA, createLogger('silent'), 5);
    await startedA;
    const stopped = await Promise.race([worker.stop(200).then(() => 'stopped'), sleep(5_000).then(() => 'still waiting')]);
    expect(stopped).toBe('stopped');
    expect(await dsA.getRepository(BackgroundJob).findOneByOrFail({ id: job.id })).toMatchObject({ status: 'queued', attempts: 0, lockedBy: null });

    expect(await drainJobs(dsB, { recompute: async () => {} })).toBe(1);
    release();
    await sleep(100);
    expect(lostLock).toBeInstanceOf(LostJobLockError);
    expect(await dsA.getRepository(BackgroundJob).findOneByOrFail({ id: job.id })).toMatchObject({ status: 'done', attempts: 1, lockedBy: null });
  });

  it('a worker whose job was taken over cannot report progress on it or finish it, and its late failure does not touch the job', async () => {
    const unit = await newUnit();
    const [job] = await queue(unit, 1);
    let started!: () => void;
    const startedA = new Promise<void>((resolve) => (started = resolve));
    let release!: () => void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    let lostLock: unknown = null;
    const slowA: Record<string, JobHandler> = {
      recompute: async (ds, j) => {
        started();
        await gate;
        try {
          await reportProgress(ds, j, 0.5, 'late step of the stale worker');
        } catch (err) {
          lostLock = err;
          throw err;
        }
        throw new Error('the stale worker failed late');
      },
    };
    const drainA = drainJobs(dsA, slowA);
    await startedA;
    const staleLease = await dsA.getRepository(BackgroundJob).findOneByOrFail({ id: job.id });
    await ageLock(job.id);

    const quickB: Record<string, JobHandler> = { recompute: async (ds, j) => reportProgress(ds, j, 0.9, 'worker B at work') };
    expect(await drainJobs(dsB, quickB)).toBe(1);
    release();
    await drainA;

    expect(lostLock).toBeInstanceOf(LostJobLockError);
    expect(await finishJob(dsA, staleLease, { ok: false, message: 'stale' })).toBe(false);
    const after = await dsA.getRepository(BackgroundJob).findOneByOrFail({ id: job.id });
    expect(after.status).toBe('done');
    expect(after.attempts).toBe(2);
    expect(after.progress).toBe(1);
    expect(after.message).toBeNull();
  });
});
