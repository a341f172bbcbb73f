/**
 * Two app processes, each with its own job worker, on one MariaDB — what a load balancer in front of two
 * Cleancase processes does. Real OS processes (backend/src/server.ts), not two apps in one process, so nothing
 * held in a process's memory can make the checks pass. Uploads sit on a folder both processes share.
 */
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { enqueueJob } from '../../backend/src/jobs/job-queue.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { startAppProcess, stopAppProcess, until, type AppProcess } from '../faults/app-process.js';
import { createTenant, CSRF, TEST_PASSWORD, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';
import { makeTempDir, physicalHistory, writeHistorianCsv } from '../helpers/historian-files.js';
import { migratedDataSource } from '../helpers/test-database.js';
import { TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';

/** Failed sign-ins per account before it is locked (backend/src/http/rate-limits.ts, RULES.signInAccount). */
const ACCOUNT_FAILURES = 10;

/** The session cookie a sign-in sets, as a Cookie header. */
async function signIn(url: string, email: string, password = TEST_PASSWORD): Promise<request.Response> {
  return request(url).post('/api/session').set(CSRF).send({ email, password });
}
const cookieOf = (res: request.Response): string => {
  const header = res.headers['set-cookie'] as unknown as string[] | undefined;
  const cookies = (header ?? []).map((c) => c.split(';')[0]);
  if (cookies.length === 0) throw new Error(`no cookie in the answer: ${res.status} ${JSON.stringify(res.body)}`);
  return cookies.join('; ');
};

describe('two app processes and two job workers on one MariaDB', { timeout: 180_000 }, () => {
  let ds: DataSource;
  let tenant: TenantFixture;
  let a: AppProcess | undefined;
  let b: AppProcess | undefined;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;

  beforeAll(async () => {
    const made = await migratedDataSource('two');
    ds = made.dataSource;
    tenant = await createTenant(ds, 'two-processes');
    tmp = await makeTempDir();
    [a, b] = await Promise.all([startAppProcess(made.connection, tmp.file('uploads')), startAppProcess(made.connection, tmp.file('uploads'))]);
  }, 150_000);

  afterAll(async () => {
    await Promise.all([stopAppProcess(a), stopAppProcess(b)]);
    await ds?.destroy();
    await tmp?.cleanup();
  });

  it('a session made on one process is valid on the other, and signing out on the other ends it', async () => {
    const signedIn = await signIn(a!.url, tenant.users.analyst.email);
    expect(signedIn.status, JSON.stringify(signedIn.body)).toBe(200);
    const cookie = cookieOf(signedIn);
    const onB = await request(b!.url).get('/api/session').set('Cookie', cookie).expect(200);
    expect(onB.body.user?.email).toBe(tenant.users.analyst.email);
    await request(b!.url).delete('/api/session').set('Cookie', cookie).set(CSRF).expect(204);
    const onA = await request(a!.url).get('/api/session').set('Cookie', cookie).expect(200);
    expect(onA.body.user ?? null).toBeNull();
  });

  it('failed sign-ins for one account count across both processes', async () => {
    const victim = tenant.users.viewer.email;
    for (let i = 0; i < ACCOUNT_FAILURES; i++) {
      const res = await signIn(i % 2 === 0 ? a!.url : b!.url, victim, 'not the password at all');
      expect(res.status).toBe(401);
    }
    // Five failures on each process: alone neither reached the limit, together they did.
    expect((await signIn(a!.url, victim)).status).toBe(429);
    expect((await signIn(b!.url, victim)).status).toBe(429);
  });

  it('each queued job runs exactly once, whichever worker claims it', async () => {
    const plant = await createPlant(ds, tenant.organisation.id);
    const units: GeneratingUnit[] = [];
    for (let i = 0; i < 6; i++) units.push(await createUnit(ds, plant));
    await ds.transaction(async (em) => {
      for (const u of units)
        await enqueueJob(em, { organisationId: tenant.organisation.id, unitId: u.id, kind: 'recompute', payload: { reason: 'two-process test' } });
    });
    const ids = units.map((u) => u.id);
    const jobs = await until(
      'the recompute jobs of six units',
      () => ds.query<{ unitId: string; status: string; attempts: number }[]>(`SELECT unitId, status, attempts FROM background_job WHERE unitId IN (?)`, [ids]),
      (rows) => rows.length === 6 && rows.every((r) => r.status === 'done' || r.status === 'failed'),
      90_000,
    );
    expect(jobs.map((j) => [j.status, j.attempts])).toEqual(Array.from({ length: 6 }, () => ['done', 1]));
  });

  it('an import started on one process shows its progress and its result on the other', async () => {
    const plant = await createPlant(ds, tenant.organisation.id);
    const unit = await createUnit(ds, plant);
    const rows = physicalHistory({ startUtc: Date.UTC(2024, 5, 1), hours: 24 * 60, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    const file = await writeHistorianCsv(tmp.file('two-months.csv'), rows);
    const cookie = cookieOf(await signIn(a!.url, tenant.users.analyst.email));
    const up = await request(a!.url).post(`/api/units/${unit.id}/uploads`).set('Cookie', cookie).set(CSRF).attach('file', file);
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const importId: string = up.body.import.id;
    await request(a!.url).post(`/api/imports/${importId}/start`).set('Cookie', cookie).set(CSRF).send({ mapping: up.body.proposedMapping }).expect(202);
    const last = await until(
      'the import as the other process shows it',
      async () => {
        const res = await request(b!.url).get(`/api/imports/${importId}`).set('Cookie', cookie);
        expect(res.status).toBe(200);
        return res.body as { status: string; progress: number; counts: { stored?: number } | null };
      },
      (imp) => imp.status === 'complete' || imp.status === 'failed',
    );
    expect(last.status).toBe('complete');
    expect(last.counts?.stored).toBe(rows.length);
    const counted = await ds.query<{ n: string }[]>('SELECT COUNT(*) AS n FROM performance_sample WHERE unitId = ?', [unit.id]);
    expect(Number(counted[0]?.n)).toBe(rows.length);
    // The import's own recompute ran once as well.
    const recompute = await until(
      'the recompute the import queued',
      () => ds.query<{ status: string; attempts: number }[]>(`SELECT status, attempts FROM background_job WHERE unitId = ? AND kind = 'recompute'`, [unit.id]),
      (r) => r.length === 1 && r[0]!.status !== 'queued' && r[0]!.status !== 'running',
    );
    expect(recompute).toEqual([{ status: 'done', attempts: 1 }]);
  });
});
