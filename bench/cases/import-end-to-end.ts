/**
 * A year of 1-minute data (525,600 rows) through the whole import job into a throwaway MariaDB: check, store,
 * recompute every derived value and the daily figures. Reports wall time and the peak growth of this process's
 * resident set (the file is streamed, never held in memory; the app's server process is this process).
 *
 * The reference is the database's own speed, measured in the same run: the same 525,600 rows, already
 * converted, streamed with one `LOAD DATA LOCAL INFILE` into the same table under a fresh unit (then deleted).
 * The two ratios divide that reference time by the import's: 1 would be the database's speed.
 */
import { once } from 'node:events';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdtemp, rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import type { BenchRow } from '../run.js';
import { buildDataSource } from '../../backend/src/data-source.js';
import { DataImport } from '../../backend/src/entities/data-import.entity.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import { Plant } from '../../backend/src/entities/plant.entity.js';
import { enqueueJob } from '../../backend/src/jobs/job-queue.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { freePort } from '../../scripts/lib/free-port.js';
import { startMariaDb } from '../../scripts/lib/mariadb.js';
import { checkImportFile, importSamples } from '../../backend/src/import/index.js';
import { loadLines, sampleLine } from '../../backend/src/repositories/sample-bulk-load.repository.js';
import { MAPPING, writeYearCsv } from './import.js';

const ROWS = 525_600;

/** Bench setup values (invented, plausible for a ~500 MW unit). */
const CONDENSER = {
  shells: 1,
  passes: 2,
  tubeCount: 22000,
  tubeOdMm: 25.4,
  tubeBwg: 22,
  tubeMaterial: 'titanium' as const,
  tubeLengthM: 13.7,
  surfaceM2: 24050,
  pluggedTubes: 100,
  designCwFlowM3s: 15.8,
  designCwInletC: 21,
  designDutyMw: 560,
  designBackpressureKpa: 7.5,
  designCleanliness: 0.9,
  designPluggedTubes: 0,
  referenceCleanliness: null,
};
const TURBINE = {
  ratingMw: 500,
  designHeatRateBtuKwh: 9600,
  heatBalanceDuty: [
    { loadFraction: 0.4, dutyMw: 240 },
    { loadFraction: 1, dutyMw: 560 },
  ],
  correctionCurve: null,
  minimumLoadFraction: 0.4,
};
const ECONOMICS = {
  fuel: 'bituminous-coal',
  co2KgPerMmbtu: 93.28,
  fuelPricePerMmbtu: 2.5,
  replacementPricePerMwh: 50,
  capacityLimitedShare: 0.2,
  co2PricePerTonne: 0,
  discountRate: 0.08,
  currency: 'USD',
};

/** The year's rows as the store would write them, to a tab-separated file for the reference load. */
async function writeLoadFile(csv: string, tsv: string, owner: { unitId: string; importId: string; setupVersion: number }): Promise<number> {
  const check = await checkImportFile(csv, { mapping: MAPPING });
  const out = createWriteStream(tsv);
  let rows = 0;
  await importSamples(csv, {
    mapping: MAPPING,
    fileOrder: check.order,
    steadiness: { ratingMw: TURBINE.ratingMw, minLoadFraction: TURBINE.minimumLoadFraction },
    onBatch: async (batch) => {
      rows += batch.length;
      if (!out.write(batch.map((s) => sampleLine(owner, s)).join(''))) await once(out, 'drain');
    },
  });
  out.end();
  await once(out, 'finish');
  return rows;
}

/** Seconds for one LOAD DATA LOCAL INFILE of the file, in one transaction; the rows are deleted afterwards. */
async function referenceLoadSeconds(ds: DataSource, tsv: string, unitId: string): Promise<number> {
  const runner = ds.createQueryRunner();
  await runner.connect();
  try {
    const t0 = performance.now();
    await runner.startTransaction();
    const result = await loadLines(runner.manager, () => createReadStream(tsv));
    await runner.commitTransaction();
    const seconds = (performance.now() - t0) / 1000;
    if (result.affectedRows !== ROWS) throw new Error(`reference load stored ${result.affectedRows} rows`);
    await runner.query('DELETE FROM performance_sample WHERE unitId = ?', [unitId]);
    return seconds;
  } finally {
    await runner.release();
  }
}

export default async function importEndToEnd(): Promise<BenchRow[]> {
  const dir = await mkdtemp(path.join(tmpdir(), 'cleancase-bench-e2e-'));
  const db = await startMariaDb({ dataDir: path.join(dir, 'db'), port: await freePort(), database: 'bench', user: 'bench', password: 'bench-password' });
  const ds = buildDataSource({ host: db.host, port: db.port, database: 'bench', user: 'bench', password: 'bench-password' });
  try {
    await ds.initialize();
    await ds.runMigrations({ transaction: 'each' });
    const org = await ds
      .getRepository(Organisation)
      .save({ name: 'Bench Generating', kind: 'utility', plan: 'trial', subscriptionStatus: 'trialing', trialEndsAt: null });
    const plant = await ds.getRepository(Plant).save({ organisationId: org.id, clientGroupId: null, name: 'Bench Plant', timeZone: 'America/Chicago' });
    const unit = await ds.getRepository(GeneratingUnit).save({
      organisationId: org.id,
      plantId: plant.id,
      name: 'Unit B',
      condenser: CONDENSER,
      turbine: TURBINE,
      economics: ECONOMICS,
      savedMapping: null,
    } as Partial<GeneratingUnit>);
    const csv = path.join(dir, 'year.csv');
    await writeYearCsv(csv);
    const bytes = (await stat(csv)).size;

    const refUnit = await ds.getRepository(GeneratingUnit).save({
      organisationId: org.id,
      plantId: plant.id,
      name: 'Unit R',
      condenser: CONDENSER,
      turbine: TURBINE,
      economics: ECONOMICS,
      savedMapping: null,
    } as Partial<GeneratingUnit>);
    const tsv = path.join(dir, 'year.tsv');
    if ((await writeLoadFile(csv, tsv, { unitId: refUnit.id, importId: '00000000-0000-4000-8000-000000000000', setupVersion: refUnit.setupVersion })) !== ROWS)
      throw new Error('reference file is short');
    const loadSeconds = await referenceLoadSeconds(ds, tsv, refUnit.id);
    await rm(tsv);

    const imp = await ds.getRepository(DataImport).save({
      organisationId: org.id,
      unitId: unit.id,
      uploadedByUserId: null,
      fileName: 'year.csv',
      fileBytes: bytes,
      fileKind: 'csv',
      status: 'checking',
      mapping: MAPPING,
      counts: null,
      errors: null,
      errorCount: 0,
      notes: null,
      progress: 0,
      message: null,
      storedPath: csv,
      firstTimestamp: null,
      lastTimestamp: null,
      finishedAt: null,
    });
    global.gc?.();
    const base = process.memoryUsage().rss;
    let peak = base;
    const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 50);
    const t0 = performance.now();
    let storedAt = Number.NaN;
    const handlers = {
      ...JOB_HANDLERS,
      import: async (...args: Parameters<typeof JOB_HANDLERS.import>) => {
        await JOB_HANDLERS.import(...args);
        storedAt = performance.now();
      },
    };
    await enqueueJob(ds.manager, { organisationId: org.id, unitId: unit.id, kind: 'import', payload: { importId: imp.id } });
    // the import job, then the recompute it queues (until the daily figures are written)
    await drainJobs(ds, handlers);
    const seconds = (performance.now() - t0) / 1000;
    const storeSeconds = (storedAt - t0) / 1000;
    clearInterval(timer);
    const done = await ds.getRepository(DataImport).findOneByOrFail({ id: imp.id });
    const stored = Number((done.counts as { stored?: number } | null)?.stored ?? 0);
    if (done.status !== 'complete' || stored !== ROWS) throw new Error(`bench import ended ${done.status} with ${stored} rows: ${done.message}`);
    const [{ days }] = await ds.query('SELECT COUNT(*) AS days FROM daily_aggregate WHERE unitId = ?', [unit.id]);
    if (Number(days) < 365) throw new Error(`the recompute wrote ${days} daily figures`);
    return [
      { name: 'LOAD DATA LOCAL INFILE, same 525,600 rows (reference)', value: ROWS / loadSeconds, unit: 'rows/s' },
      { name: 'import job, check + store', value: ROWS / storeSeconds, unit: 'rows/s' },
      { name: 'import check+store vs LOAD DATA (ratio)', value: loadSeconds / storeSeconds, unit: 'ratio', target: { value: 0.5, higherIsBetter: true } },
      { name: 'import job, 1-min year (525,600 rows): check + store + recompute', value: seconds, unit: 's' },
      { name: 'import job, rows per second end to end', value: ROWS / seconds, unit: 'rows/s' },
      { name: 'import whole job vs LOAD DATA (ratio)', value: loadSeconds / seconds, unit: 'ratio', target: { value: 0.25, higherIsBetter: true } },
      { name: 'import job, server peak RSS growth', value: (peak - base) / 1e6, unit: 'MB', target: { value: 300, higherIsBetter: false } },
    ];
  } finally {
    if (ds.isInitialized) await ds.destroy();
    await db.stop();
    await rm(dir, { recursive: true, force: true });
  }
}
