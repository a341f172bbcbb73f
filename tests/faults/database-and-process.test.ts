/**
 * Two faults in the middle of a long import, each on a real app process and a private MariaDB of this file
 * (the shared test database is never stopped):
 *  - the database stops: the import ends failed with a clear message and none of its rows, data routes answer
 *    503 in our words while it is down, and the app carries on by itself once it is back;
 *  - the app process is killed (SIGKILL): on the next start the import ends failed, saying the process
 *    stopped, with none of its rows.
 */
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildDataSource } from '../../backend/src/data-source.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { createTenant, CSRF, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv } from '../helpers/historian-files.js';
import { signedInCookie, startAppProcess, startPrivateDatabase, stopAppProcess, until, type AppProcess, type PrivateDatabase } from './app-process.js';

/** Hourly rows of the long import: long enough that the fault lands while its rows are being stored. */
const IMPORT_HOURS = 15 * 8760;

let db: PrivateDatabase;
let ds: DataSource;
let tenant: TenantFixture;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;
let history: string;
let app: AppProcess | undefined;

const rowsOfImport = async (importId: string) => Number((await ds.query('SELECT COUNT(*) AS n FROM performance_sample WHERE importId = ?', [importId]))[0].n);
const importRow = async (importId: string) =>
  ((await ds.query('SELECT status, message FROM data_import WHERE id = ?', [importId])) as { status: string; message: string | null }[])[0];

/** Uploads the long history and starts its import; resolves once some of its rows are stored (the fault's moment). */
async function startLongImport(p: AppProcess, cookie: string, unit: GeneratingUnit): Promise<string> {
  const up = await request(p.url).post(`/api/units/${unit.id}/uploads`).set('Cookie', cookie).set(CSRF).attach('file', history);
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  const importId: string = up.body.import.id;
  await request(p.url).post(`/api/imports/${importId}/start`).set('Cookie', cookie).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
  await until(
    'some rows of the import stored',
    async () => ({ rows: await rowsOfImport(importId), status: (await importRow(importId))?.status }),
    (v) => v.rows > 0 || (v.status !== 'checking' && v.status !== 'importing'),
    120_000,
  );
  const now = await importRow(importId);
  expect(now?.status, 'the import finished before the fault could land: make IMPORT_HOURS larger').toBe('importing');
  return importId;
}

describe('faults in the middle of an import', { timeout: 300_000 }, () => {
  beforeAll(async () => {
    db = await startPrivateDatabase('import');
    ds = buildDataSource(db.connection);
    await ds.initialize();
    await ds.runMigrations({ transaction: 'each' });
    tenant = await createTenant(ds, 'faults');
    tmp = await makeTempDir();
    const rows = physicalHistory({ startUtc: Date.UTC(2005, 0, 1), hours: IMPORT_HOURS, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    history = await writeHistorianCsv(tmp.file('fifteen-years.csv'), rows);
  }, 180_000);

  afterAll(async () => {
    await stopAppProcess(app);
    await ds?.destroy().catch(() => undefined);
    await db?.remove();
    await tmp?.cleanup();
  }, 120_000);

  it('the database stops mid-import: 503 while it is down, then the import is failed with none of its rows and the app works again', async () => {
    app = await startAppProcess(db.connection, tmp.file('uploads'));
    const cookie = await signedInCookie(app.url, tenant.users.analyst.email);
    const unit = await createUnit(ds, await createPlant(ds, tenant.organisation.id));
    const importId = await startLongImport(app, cookie, unit);

    await db.stop();
    for (const path of ['/api/plants', `/api/units/${unit.id}`, `/api/imports/${importId}`]) {
      const res = await request(app.url).get(path).set('Cookie', cookie);
      expect(res.status, `${path}: ${JSON.stringify(res.body)}`).toBe(503);
      expect(res.body.error).toMatch(/database/i);
      expect(res.body.error).not.toMatch(/ECONNREFUSED|errno|connect /);
      expect(res.headers['retry-after']).toBeDefined();
    }
    expect(app.child.exitCode, app.output()).toBeNull();

    await db.start();
    // No restart of the app: it reconnects by itself, and the import ends failed with nothing of it stored.
    const ended = await until(
      'the import as the app shows it once the database is back',
      async () => (await request(app!.url).get(`/api/imports/${importId}`).set('Cookie', cookie)).body as { status: string; message: string | null },
      (imp) => imp.status === 'failed',
      60_000,
    );
    expect(ended.message).toMatch(/stored nothing/);
    expect(ended.message).toMatch(/database/i);
    expect(await rowsOfImport(importId)).toBe(0);
    expect((await request(app.url).get('/api/plants').set('Cookie', cookie)).status).toBe(200);
    // The unit takes a new import again: the failed one holds nothing back.
    const again = await request(app.url)
      .post(`/api/units/${unit.id}/uploads`)
      .set('Cookie', cookie)
      .set(CSRF)
      .attach(
        'file',
        await writeHistorianCsv(
          tmp.file('two-days.csv'),
          physicalHistory({ startUtc: Date.UTC(2024, 0, 1), hours: 48, condenser: TEST_CONDENSER, turbine: TEST_TURBINE }),
        ),
      );
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    await stopAppProcess(app);
  });

  it('the app process is killed mid-import: on the next start the import is failed, saying the process stopped, with none of its rows', async () => {
    app = await startAppProcess(db.connection, tmp.file('uploads'));
    const cookie = await signedInCookie(app.url, tenant.users.analyst.email);
    const unit = await createUnit(ds, await createPlant(ds, tenant.organisation.id));
    const importId = await startLongImport(app, cookie, unit);

    await stopAppProcess(app, 'SIGKILL');
    expect(app.child.signalCode).toBe('SIGKILL');
    expect(await rowsOfImport(importId)).toBeGreaterThan(0);

    app = await startAppProcess(db.connection, tmp.file('uploads'));
    const ended = await until(
      'the import after the restart',
      async () => (await importRow(importId))!,
      (imp) => imp.status === 'failed',
      60_000,
    );
    expect(ended.message).toMatch(/stored nothing/);
    expect(ended.message).toMatch(/process stopped/i);
    expect(await rowsOfImport(importId)).toBe(0);
    const [job] = (await ds.query(`SELECT status FROM background_job WHERE kind = 'import' AND JSON_VALUE(payload, '$.importId') = ?`, [importId])) as {
      status: string;
    }[];
    expect(job?.status).toBe('failed');
  });
});
