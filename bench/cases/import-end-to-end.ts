/**
 * A year of 1-minute data (525,600 rows) through the whole import job into a throwaway MariaDB: check, store
 * in 5,000-row batches, recompute every derived value and the daily figures. Reports wall time and the peak
 * growth of this process's resident set (the file is streamed, never held in memory).
 */
import { mkdtemp, rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
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
import { MAPPING, writeYearCsv } from './import.js';

/** Bench setup values (invented, plausible for a ~500 MW unit). */
const CONDENSER = {
  shells: 1, passes: 2, tubeCount: 22000, tubeOdMm: 25.4, tubeBwg: 22, tubeMaterial: 'titanium' as const, tubeLengthM: 13.7, surfaceM2: 24050,
  pluggedTubes: 100, designCwFlowM3s: 15.8, designCwInletC: 21, designDutyMw: 560, designBackpressureKpa: 7.5, designCleanliness: 0.9, designPluggedTubes: 0, referenceCleanliness: null,
};
const TURBINE = { ratingMw: 500, designHeatRateBtuKwh: 9600, heatBalanceDuty: [{ loadFraction: 0.4, dutyMw: 240 }, { loadFraction: 1, dutyMw: 560 }], correctionCurve: null, minimumLoadFraction: 0.4 };
const ECONOMICS = { fuel: 'bituminous-coal', co2KgPerMmbtu: 93.28, fuelPricePerMmbtu: 2.5, replacementPricePerMwh: 50, capacityLimitedShare: 0.2, co2PricePerTonne: 0, discountRate: 0.08, currency: 'USD' };

export default async function importEndToEnd(): Promise<BenchRow[]> {
  const dir = await mkdtemp(path.join(tmpdir(), 'cleancase-bench-e2e-'));
  const db = await startMariaDb({ dataDir: path.join(dir, 'db'), port: await freePort(), database: 'bench', user: 'bench', password: 'bench-password' });
  const ds = buildDataSource({ host: db.host, port: db.port, database: 'bench', user: 'bench', password: 'bench-password' });
  try {
    await ds.initialize();
    await ds.runMigrations({ transaction: 'each' });
    const org = await ds.getRepository(Organisation).save({ name: 'Bench Generating', kind: 'utility', plan: 'trial', subscriptionStatus: 'trialing', trialEndsAt: null });
    const plant = await ds.getRepository(Plant).save({ organisationId: org.id, clientGroupId: null, name: 'Bench Plant', timeZone: 'America/Chicago' });
    const unit = await ds.getRepository(GeneratingUnit).save({ organisationId: org.id, plantId: plant.id, name: 'Unit B', condenser: CONDENSER, turbine: TURBINE, economics: ECONOMICS, savedMapping: null } as Partial<GeneratingUnit>);
    const csv = path.join(dir, 'year.csv');
    await writeYearCsv(csv);
    const bytes = (await stat(csv)).size;
    const imp = await ds.getRepository(DataImport).save({
      organisationId: org.id, unitId: unit.id, uploadedByUserId: null, fileName: 'year.csv', fileBytes: bytes, fileKind: 'csv', status: 'checking', mapping: MAPPING,
      counts: null, errors: null, errorCount: 0, notes: null, progress: 0, message: null, storedPath: csv, firstTimestamp: null, lastTimestamp: null, finishedAt: null,
    });
    global.gc?.();
    const base = process.memoryUsage().rss;
    let peak = base;
    const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 50);
    const t0 = performance.now();
    await enqueueJob(ds.manager, { organisationId: org.id, unitId: unit.id, kind: 'import', payload: { importId: imp.id } });
    // the import job, then the recompute it queues
    await drainJobs(ds, JOB_HANDLERS);
    const seconds = (performance.now() - t0) / 1000;
    clearInterval(timer);
    const done = await ds.getRepository(DataImport).findOneByOrFail({ id: imp.id });
    const stored = Number((done.counts as { stored?: number } | null)?.stored ?? 0);
    if (done.status !== 'complete' || stored !== 525_600) throw new Error(`bench import ended ${done.status} with ${stored} rows: ${done.message}`);
    return [
      { name: 'import job, 1-min year (525,600 rows): check + store + recompute', value: seconds, unit: 's' },
      { name: 'import job, rows per second end to end', value: 525_600 / seconds, unit: 'rows/s' },
      { name: 'import job, peak RSS growth', value: (peak - base) / 1e6, unit: 'MB' },
    ];
  } finally {
    if (ds.isInitialized) await ds.destroy();
    await db.stop();
    await rm(dir, { recursive: true, force: true });
  }
}
