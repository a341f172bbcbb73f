/**
 * The import's bulk load (LOAD DATA LOCAL INFILE from a generated stream): values stored exactly as sent, a
 * load that cannot store every row fails as a whole, a fault after several loaded chunks leaves no row, and
 * re-imports spanning several chunks are sorted into stored, identical and conflicting rows.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import type { ImportSample } from '../../backend/src/import/index.js';
import { loadSamples } from '../../backend/src/repositories/sample-bulk-load.repository.js';
import { importFaults } from '../../backend/src/services/import-job/store-rows.js';
import { createTenant, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPendingImport, createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { makeTempDir, physicalHistory, writeHistorianCsv } from '../helpers/historian-files.js';

const START_UTC = Date.UTC(2023, 0, 2, 0, 0);

const sample = (timestampUtc: number, extra: Partial<ImportSample> = {}): ImportSample => ({
  line: 2,
  timestampUtc,
  loadMw: 480.5,
  backpressureKpa: 8.1,
  cwInletC: 21.3,
  cwOutletC: 31.2,
  cwFlowM3s: 15.2,
  flowAssumed: false,
  validity: 'ok',
  ...extra,
});

describe('the import’s bulk load', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let tenant: TenantFixture;
  let analyst: TestAgent;

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    tenant = await createTenant(t.dataSource, 'bulk-loader');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
  });
  afterAll(async () => {
    importFaults.failAfterBatches = null;
    await t?.close();
    await tmp?.cleanup();
  });

  const newUnit = async () => createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
  const countOf = async (sql: string, params: unknown[]) => Number((await t.dataSource.query(sql, params))[0].n);

  async function importFile(unitId: string, filePath: string) {
    const up = await analyst.post(`/api/units/${unitId}/uploads`).set(CSRF).attach('file', filePath);
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: up.body.proposedMapping }).expect(202);
    await drainJobs(t.dataSource, JOB_HANDLERS);
    return (await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body;
  }

  it('stores every value exactly as sent: awkward doubles, absent optional readings as NULL, the validity reason and the flags', async () => {
    const unit = await newUnit();
    const imp = await createPendingImport(t.dataSource, unit);
    const awkward = sample(START_UTC + 123, {
      loadMw: 0.1 + 0.2,
      backpressureKpa: 1e-7,
      cwInletC: -0.000123456789012345,
      cwOutletC: 123456.78901234567,
      cwFlowM3s: 15.199999999999999,
      flowAssumed: true,
      hotwellC: 40.00000000000001,
      barometerKpa: 101.325,
      validity: 'unsteady-load',
    });
    await t.dataSource.transaction((em) => loadSamples(em, { unitId: unit.id, importId: imp.id, setupVersion: 7 }, [awkward]));
    const [row] = await t.dataSource.query(
      `SELECT timestampUtc AS ts, loadMw, backpressureKpa, cwInletC, cwOutletC, cwFlowM3s, flowAssumed, hotwellC, dissolvedOxygenPpb, airRemovalKgS, barometerKpa,
              cwDifferentialPressureKpa, condensateFlowKgS, validity, setupVersion, importId FROM performance_sample WHERE unitId = ?`,
      [unit.id],
    );
    expect(new Date(row.ts).getTime()).toBe(START_UTC + 123);
    expect([row.loadMw, row.backpressureKpa, row.cwInletC, row.cwOutletC, row.cwFlowM3s]).toEqual([
      awkward.loadMw,
      awkward.backpressureKpa,
      awkward.cwInletC,
      awkward.cwOutletC,
      awkward.cwFlowM3s,
    ]);
    expect([Number(row.flowAssumed), row.hotwellC, row.barometerKpa]).toEqual([1, awkward.hotwellC, 101.325]);
    expect([row.dissolvedOxygenPpb, row.airRemovalKgS, row.cwDifferentialPressureKpa, row.condensateFlowKgS]).toEqual([null, null, null, null]);
    expect([row.validity, row.setupVersion, row.importId]).toEqual(['unsteady-load', 7, imp.id]);
  });

  it('a load meeting a row already stored at the same time stores none of its rows and says how many it could not store', async () => {
    const unit = await newUnit();
    const first = await createPendingImport(t.dataSource, unit);
    const second = await createPendingImport(t.dataSource, unit);
    await t.dataSource.transaction((em) => loadSamples(em, { unitId: unit.id, importId: first.id, setupVersion: 1 }, [sample(START_UTC + 3_600_000)]));
    // LOAD DATA LOCAL turns a duplicate key into a warning and goes on; the load must not pass for complete.
    const racing = [sample(START_UTC), sample(START_UTC + 3_600_000, { loadMw: 300 }), sample(START_UTC + 7_200_000)];
    await expect(t.dataSource.transaction((em) => loadSamples(em, { unitId: unit.id, importId: second.id, setupVersion: 1 }, racing))).rejects.toThrow(
      /stored 2 of 3 rows.*Duplicate entry/,
    );
    expect(await countOf('SELECT COUNT(*) AS n FROM performance_sample WHERE importId = ?', [second.id])).toBe(0);
    expect(await countOf('SELECT COUNT(*) AS n FROM performance_sample WHERE unitId = ? AND loadMw = 480.5', [unit.id])).toBe(1);
  });

  it('a fault after three loaded chunks of a four-chunk file leaves none of its rows, and the same file then imports whole', async () => {
    const unit = await newUnit();
    const rows = physicalHistory({ startUtc: START_UTC, hours: 16_500, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    const file = await writeHistorianCsv(tmp.file('four-chunks.csv'), rows);
    const maxIdBefore = await countOf('SELECT COALESCE(MAX(id), 0) AS n FROM performance_sample', []);
    importFaults.failAfterBatches = 3;
    let failed;
    try {
      failed = await importFile(unit.id, file);
    } finally {
      importFaults.failAfterBatches = null;
    }
    expect(failed.status).toBe('failed');
    expect(failed.message).toMatch(/stored nothing.*injected fault/);
    expect(await countOf('SELECT COUNT(*) AS n FROM performance_sample WHERE importId = ? OR unitId = ?', [failed.id, unit.id])).toBe(0);

    const ok = await importFile(unit.id, file);
    expect(ok.status).toBe('complete');
    expect(ok.counts).toMatchObject({ rowsRead: 16_500, stored: 16_500, skippedIdentical: 0, conflicting: 0 });
    // The failed run's three chunks (15,000 rows) were written, then removed: their ids are not handed out again.
    expect(await countOf('SELECT MIN(id) AS n FROM performance_sample WHERE importId = ?', [ok.id])).toBeGreaterThan(maxIdBefore + 15_000);
  });

  it('a re-import overlapping stored rows across several chunks stores the new rows, skips the identical ones and counts the conflict', async () => {
    const unit = await newUnit();
    const rows = physicalHistory({ startUtc: START_UTC, hours: 9_000, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    const first = await importFile(unit.id, await writeHistorianCsv(tmp.file('overlap-1.csv'), rows.slice(0, 6_000)));
    expect(first.counts).toMatchObject({ stored: 6_000 });

    const again = await importFile(unit.id, await writeHistorianCsv(tmp.file('overlap-0.csv'), rows.slice(0, 6_000)));
    expect(again.counts).toMatchObject({ rowsRead: 6_000, stored: 0, skippedIdentical: 6_000, conflicting: 0 });

    const later = rows.slice(3_000).map((r) => ({ cells: [...r.cells] }));
    later[1_000]!.cells[2] = (Number(later[1_000]!.cells[2]) + 0.1).toFixed(6);
    const third = await importFile(unit.id, await writeHistorianCsv(tmp.file('overlap-2.csv'), later));
    expect(third.status).toBe('complete');
    expect(third.counts).toMatchObject({
      rowsRead: 6_000,
      stored: 3_000,
      skippedIdentical: 2_999,
      conflicting: 1,
      conflicts: [{ timestampUtc: new Date(rows[4_000]!.timestampUtc).toISOString() }],
    });
    expect(await countOf('SELECT COUNT(*) AS n FROM performance_sample WHERE unitId = ?', [unit.id])).toBe(9_000);
    expect(await countOf('SELECT COUNT(*) AS n FROM performance_sample WHERE unitId = ? AND importId = ?', [unit.id, third.id])).toBe(3_000);
  });
});
