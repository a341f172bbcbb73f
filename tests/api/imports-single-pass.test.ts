/**
 * The import reads a wide file once: it checks every row and stores the checked rows as it goes. What that must not
 * change: a reader never sees rows of an import that is not complete, a wrong file ends with no row and the same
 * listed errors as the check alone, and a file out of time order is still stored whole and in order.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkImportFile } from '../../backend/src/import/index.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import { chartPointsOfUnit, lastSampleTimeOfUnit, sampleSpanOfUnit } from '../../backend/src/repositories/sample.repository.js';
import { importFaults } from '../../backend/src/services/import-job/store-rows.js';
import { createTenant, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { csvLines, makeTempDir, physicalHistory, US_MAPPING, writeCsvLines, writeHistorianCsv } from '../helpers/historian-files.js';

const START_UTC = Date.UTC(2023, 0, 2, 0, 0);

describe('the single pass of an import', { timeout: 120_000 }, () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let tenant: TenantFixture;
  let analyst: TestAgent;

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    tenant = await createTenant(t.dataSource, 'single-pass');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
  });
  afterAll(async () => {
    importFaults.afterBatchStored = null;
    await t?.close();
    await tmp?.cleanup();
  });

  const newUnit = async () => createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
  const countOf = async (sql: string, params: unknown[]) => Number((await t.dataSource.query(sql, params))[0].n);

  async function importFile(unitId: string, filePath: string) {
    const up = await analyst.post(`/api/units/${unitId}/uploads`).set(CSRF).attach('file', filePath);
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
    await drainJobs(t.dataSource, JOB_HANDLERS);
    return (await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body;
  }

  it('while an import stores its rows, no reader sees them: hourly points, the last sample, the span', async () => {
    const unit = await newUnit();
    const rows = physicalHistory({ startUtc: START_UTC, hours: 12_000, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    const file = await writeHistorianCsv(tmp.file('long.csv'), rows);
    const seen: { stored: number; points: number; last: string | null; span: number; api: number }[] = [];
    importFaults.afterBatchStored = async (importId) => {
      if (seen.length > 0) return;
      const em = t.dataSource.manager;
      const stored = await countOf('SELECT COUNT(*) AS n FROM performance_sample WHERE importId = ?', [importId]);
      const points = await chartPointsOfUnit(em, unit.id, ['backpressureKpa'], '2023-01-01 00:00:00', '2025-01-01 00:00:00');
      const api = await analyst.get(`/api/units/${unit.id}/samples?from=2023-01-01&to=2023-03-01&quantity=backpressure`).expect(200);
      seen.push({
        stored,
        points: points.length,
        last: await lastSampleTimeOfUnit(em, unit.id),
        span: (await sampleSpanOfUnit(em, unit.id)).count,
        api: api.body.total,
      });
    };
    let done;
    try {
      done = await importFile(unit.id, file);
    } finally {
      importFaults.afterBatchStored = null;
    }
    expect(done.status).toBe('complete');
    expect(seen).toHaveLength(1);
    // the moment was mid-import: some rows of it were in the table, none was shown
    expect(seen[0]!.stored).toBeGreaterThan(0);
    expect(seen[0]!.stored).toBeLessThan(12_000);
    expect(seen[0]).toMatchObject({ points: 0, last: null, span: 0, api: 0 });
    // once complete, every row shows
    expect((await sampleSpanOfUnit(t.dataSource.manager, unit.id)).count).toBe(12_000);
    const api = await analyst.get(`/api/units/${unit.id}/samples?from=2023-01-01&to=2023-03-01&quantity=backpressure`).expect(200);
    expect(api.body.total).toBeGreaterThan(1_000);
  });

  it('a file wrong only near its end stores no row and lists the same errors as the check alone', async () => {
    const unit = await newUnit();
    const rows = physicalHistory({ startUtc: START_UTC, hours: 12_000, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    const lines = csvLines(rows);
    // two bad cells after more than two batches of good rows
    lines[11_000] = lines[11_000]!.replace(/,[^,]*$/, ',lots');
    lines[11_500] = lines[11_500]!.replace(/^[^,]*/, '2023-13-45 25:00');
    const file = await writeCsvLines(tmp.file('late-errors.csv'), lines);
    const alone = await checkImportFile(file, { mapping: US_MAPPING });
    expect(alone.ok).toBe(false);
    expect(alone.errors.length).toBe(2);

    const stored: number[] = [];
    importFaults.afterBatchStored = async (importId) => {
      stored.push(await countOf('SELECT COUNT(*) AS n FROM performance_sample WHERE importId = ?', [importId]));
    };
    let done;
    try {
      done = await importFile(unit.id, file);
    } finally {
      importFaults.afterBatchStored = null;
    }
    expect(done.status).toBe('rejected');
    expect(done.errors).toEqual(alone.errors);
    expect(done.errorCount).toBe(2);
    expect(await countOf('SELECT COUNT(*) AS n FROM performance_sample WHERE importId = ? OR unitId = ?', [done.id, unit.id])).toBe(0);
    // rows were stored before the errors were met (the single pass), then removed as a whole
    expect(Math.max(0, ...stored)).toBeGreaterThan(0);
  });

  it('a file in falling time order is stored whole, in time order, with the same counts as the same rows rising', async () => {
    const rows = physicalHistory({ startUtc: START_UTC, hours: 7_000, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    const up = await importFile((await newUnit()).id, await writeHistorianCsv(tmp.file('rising.csv'), rows));
    const downUnit = await newUnit();
    const down = await importFile(downUnit.id, await writeHistorianCsv(tmp.file('falling.csv'), [...rows].reverse()));
    expect(down.status).toBe('complete');
    expect(down.counts).toMatchObject({ rowsRead: 7_000, stored: 7_000 });
    expect(down.counts.rowsByReason).toEqual(up.counts.rowsByReason);
    expect(down.counts.rowsOk).toBe(up.counts.rowsOk);
    expect(await countOf('SELECT COUNT(*) AS n FROM performance_sample WHERE unitId = ?', [downUnit.id])).toBe(7_000);
  });
});
