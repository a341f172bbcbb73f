/**
 * The 50-unit bench tenant: a consultancy with two client groups, ten plants of five units, ten years of hourly
 * data per unit (~4.4 M samples) and their daily figures and stored analysis. Built once by bulk-loading
 * generated rows (LOAD DATA LOCAL INFILE, as the import's store does) and kept under .data/bench with its own
 * MariaDB data folder; later runs start that MariaDB and reuse it (delete the folder to build it again).
 *
 * The rows are generated, not measured: a seasonal CW inlet temperature, a daily load swing, and fouling that
 * falls from 0.90 over a 180-day cleaning cycle; each row carries the derived values the recompute would store
 * (cleanliness, expected and excess backpressure, deviation parts, fouling cost), and the daily figures are the
 * medians, means and sums of exactly those rows, so samples, daily figures and the health view agree. Plants keep
 * UTC days. The fouling trend, forecast band, cleaning outlook and figures now are then drawn by the product's
 * own recompute steps from the stored daily figures. All names and values are invented.
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { Readable } from 'node:stream';
import type { DataSource } from 'typeorm';
import { buildUnitModel, type UnitSetupSi } from '../../shared/domain/monitoring/index.js';
import { buildDataSource } from '../../backend/src/data-source.js';
import { hashPassword } from '../../backend/src/auth/password.js';
import { ClientGroup } from '../../backend/src/entities/client-group.entity.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { Membership } from '../../backend/src/entities/membership.entity.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import { Plant } from '../../backend/src/entities/plant.entity.js';
import { UnitEvent } from '../../backend/src/entities/unit-event.entity.js';
import { User } from '../../backend/src/entities/user.entity.js';
import type { DailyAggregateRow } from '../../backend/src/repositories/daily-aggregate-row.js';
import { dailyFiguresOfUnit, replaceDailyAggregates } from '../../backend/src/repositories/daily-aggregate.repository.js';
import { currentFigures } from '../../backend/src/services/derived/current-figures.js';
import { forecastBand } from '../../backend/src/services/derived/forecast-band.js';
import { cycleSummary, fitCycles } from '../../backend/src/services/derived/fouling-cycles.js';
import { cleaningMarks } from '../../backend/src/services/derived/unit-context.js';
import { planCleaningOutlook, storeUnitAnalysis, unitAnalysis } from '../../backend/src/services/derived/unit-analysis.js';
import { freePort } from '../../scripts/lib/free-port.js';
import { startMariaDb, type MariaDbInstance } from '../../scripts/lib/mariadb.js';

export const BENCH_TENANT_DIR = path.resolve(import.meta.dirname, '../../.data/bench/api-tenant-v1');
const READY_FILE = path.join(BENCH_TENANT_DIR, 'ready.json');
const DB = { database: 'bench', user: 'bench', password: 'bench-password-2026' };

export const PLANTS = 10;
export const UNITS_PER_PLANT = 5;
export const YEARS = 10;
const DAYS = Math.round(YEARS * 365.25);
const CYCLE_DAYS = 180;
const DAY_MS = 86_400_000;

export interface BenchTenant {
  email: string;
  password: string;
  unitIds: string[];
  firstDay: string;
  lastDay: string;
  samples: number;
  buildSeconds: number;
}

export interface OpenBenchTenant {
  tenant: BenchTenant;
  db: MariaDbInstance;
  ds: DataSource;
  /** whether this run built the tenant (false: reused from .data/bench) */
  built: boolean;
  close: () => Promise<void>;
}

/** Invented, plausible for a ~500 MW unit (as the import bench's unit). */
const SETUP = {
  condenser: {
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
  },
  turbine: {
    ratingMw: 500,
    designHeatRateBtuKwh: 9600,
    heatBalanceDuty: [
      { loadFraction: 0.4, dutyMw: 240 },
      { loadFraction: 1, dutyMw: 560 },
    ],
    correctionCurve: null,
    minimumLoadFraction: 0.4,
  },
  economics: {
    fuel: 'bituminous-coal',
    co2KgPerMmbtu: 93.28,
    fuelPricePerMmbtu: 2.5,
    replacementPricePerMwh: 50,
    capacityLimitedShare: 0.2,
    co2PricePerTonne: 0,
    discountRate: 0.08,
    currency: 'USD',
  },
};

const DERIVED_COLUMNS = [
  'unitId',
  'importId',
  'timestampUtc',
  'loadMw',
  'backpressureKpa',
  'cwInletC',
  'cwOutletC',
  'cwFlowM3s',
  'flowAssumed',
  'validity',
  'setupVersion',
  'cleanliness',
  'ttdK',
  'dutyMw',
  'expectedBackpressureKpa',
  'excessBackpressureKpa',
  'foulingKpa',
  'cwInletKpa',
  'cwFlowKpa',
  'loadKpa',
  'pluggingKpa',
  'unexplainedKpa',
  'heatRatePenaltyPct',
  'foulingCostPerHour',
  'unexplainedCostPerHour',
] as const;
const LOAD_SQL = `LOAD DATA LOCAL INFILE 'bench.tsv' INTO TABLE performance_sample CHARACTER SET utf8mb4
  FIELDS TERMINATED BY '\\t' LINES TERMINATED BY '\\n' (${DERIVED_COLUMNS.join(', ')})`;

const dayText = (ms: number) => new Date(ms).toISOString().slice(0, 10);
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};
const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
const f = (v: number) => v.toFixed(5);

/** A unit's generated history: the load lines in chunks, with its daily figures gathered on the way. */
function* unitLines(unitIndex: number, unitId: string, startMs: number, daily: DailyAggregateRow[], leakDays: Set<string>): Generator<Buffer> {
  let seed = 7919 * (unitIndex + 1);
  const noise = () => {
    seed = (Math.imul(seed, 1103515245) + 12345) >>> 0;
    return seed / 4294967296 - 0.5;
  };
  const importId = `00000000-0000-4000-8000-${String(unitIndex).padStart(12, '0')}`;
  const offset = (unitIndex * 37) % CYCLE_DAYS;
  for (let d = 0; d < DAYS; d++) {
    const day = dayText(startMs + d * DAY_MS);
    const hours = {
      cf: [] as number[],
      ttd: [] as number[],
      bp: [] as number[],
      exp: [] as number[],
      exc: [] as number[],
      cw: [] as number[],
      load: [] as number[],
    };
    const parts = { cwInletKpa: [] as number[], loadKpa: [] as number[], hr: [] as number[], duty: [] as number[] };
    let cost = 0;
    let lines = '';
    const sinceCleaning = (d + offset) % CYCLE_DAYS;
    const trend = 1 / (1 / 0.9 + 0.0009 * sinceCleaning);
    for (let h = 0; h < 24; h++) {
      const ts = startMs + (d * 24 + h) * 3_600_000;
      const seasonal = Math.cos((2 * Math.PI * (d + unitIndex * 7)) / 365.25);
      const cwIn = 17 - 7 * seasonal + 0.5 * Math.sin((2 * Math.PI * h) / 24) + 0.2 * noise();
      const loadFraction = 0.78 + 0.15 * Math.sin((2 * Math.PI * (h - 6)) / 24) + 0.01 * noise();
      const cf = trend + 0.006 * noise();
      const expected = 3.2 + 0.22 * (cwIn - 10) + 1.6 * loadFraction;
      const excess = 5.5 * (0.9 / cf - 1);
      const bp = expected + excess;
      const cwOut = cwIn + 10 * loadFraction;
      const ttd = 3 + 4 * (0.9 / cf - 1) + 2 * loadFraction;
      const duty = 560 * loadFraction;
      const cwInletKpa = 0.22 * (cwIn - 21);
      const loadKpa = 1.6 * (loadFraction - 1);
      const hr = 0.9 * excess;
      const costPerHour = 55 * excess;
      lines += `${unitId}\t${importId}\t${new Date(ts).toISOString().slice(0, 19).replace('T', ' ')}\t${f(500 * loadFraction)}\t${f(bp)}\t${f(cwIn)}\t${f(cwOut)}\t15.8\t0\tok\t1\t${f(cf)}\t${f(ttd)}\t${f(duty)}\t${f(expected)}\t${f(excess)}\t${f(excess)}\t${f(cwInletKpa)}\t0\t${f(loadKpa)}\t0.02\t0\t${f(hr)}\t${f(costPerHour)}\t0\n`;
      // the daily figures read the values as stored (5 decimals)
      const r = (v: number) => Number(f(v));
      hours.cf.push(r(cf));
      hours.ttd.push(r(ttd));
      hours.bp.push(r(bp));
      hours.exp.push(r(expected));
      hours.exc.push(r(excess));
      hours.cw.push(r(cwIn));
      hours.load.push(r(500 * loadFraction));
      parts.cwInletKpa.push(r(cwInletKpa));
      parts.loadKpa.push(r(loadKpa));
      parts.hr.push(r(hr));
      parts.duty.push(r(duty));
      cost += r(costPerHour);
    }
    const meanLoad = mean(hours.load);
    daily.push({
      unitId,
      day,
      pointsUsed: 24,
      pointsDropped: 0,
      droppedByReason: '{}',
      medianCleanliness: median(hours.cf),
      medianTtdK: median(hours.ttd),
      trendCleanliness: trend,
      meanSubcoolingK: null,
      meanDissolvedOxygenPpb: null,
      meanAirRemovalKgS: null,
      airLeakSuspected: leakDays.has(day),
      meanDutyMw: mean(parts.duty),
      heatBalanceDutyMw: (560 * meanLoad) / 500,
      stuckSensors: null,
      meanBackpressureKpa: mean(hours.bp),
      meanExpectedBackpressureKpa: mean(hours.exp),
      meanExcessBackpressureKpa: mean(hours.exc),
      meanCwInletC: mean(hours.cw),
      meanLoadMw: meanLoad,
      meanHeatRatePenaltyPct: mean(parts.hr),
      foulingKpa: mean(hours.exc),
      cwInletKpa: mean(parts.cwInletKpa),
      cwFlowKpa: 0,
      loadKpa: mean(parts.loadKpa),
      pluggingKpa: 0.02,
      unexplainedKpa: 0,
      foulingCost: cost,
      unexplainedCost: 0,
    });
    yield Buffer.from(lines, 'utf8');
  }
}

interface RawConnection {
  query(options: { sql: string; infileStreamFactory: () => Readable }, callback: (err: Error | null, result: { affectedRows: number }) => void): void;
}

async function loadUnit(ds: DataSource, lines: () => Readable): Promise<number> {
  const runner = ds.createQueryRunner();
  await runner.connect();
  try {
    await runner.startTransaction();
    const connection = (runner as unknown as { databaseConnection: RawConnection }).databaseConnection;
    const result = await new Promise<{ affectedRows: number }>((resolve, reject) =>
      connection.query({ sql: LOAD_SQL, infileStreamFactory: lines }, (err, r) => (err ? reject(err) : resolve(r))),
    );
    await runner.commitTransaction();
    return result.affectedRows;
  } finally {
    await runner.release();
  }
}

async function build(ds: DataSource, log: (line: string) => void): Promise<BenchTenant> {
  const t0 = performance.now();
  const lastMs = Date.UTC(new Date().getUTCFullYear(), new Date().getUTCMonth(), new Date().getUTCDate()) - DAY_MS;
  const startMs = lastMs - (DAYS - 1) * DAY_MS;
  const org = await ds.getRepository(Organisation).save({
    name: 'Larkspur Condenser Consulting (bench)',
    kind: 'consultancy',
    plan: 'consultancy',
    subscriptionStatus: 'active',
    trialEndsAt: null,
  });
  const groups = [
    await ds.getRepository(ClientGroup).save({ organisationId: org.id, name: 'Estuary Power Holdings' }),
    await ds.getRepository(ClientGroup).save({ organisationId: org.id, name: 'Upland Municipal Energy' }),
  ];
  const email = 'bench.consultant@example.test';
  const password = 'bench-tenant-password-2026';
  const user = await ds
    .getRepository(User)
    .save({ email, name: 'Bench Consultant', passwordHash: await hashPassword(password), unitPreference: 'us', emailProvenAt: new Date() });
  await ds.getRepository(Membership).save({ organisationId: org.id, userId: user.id, role: 'analyst', clientGroupIds: null });
  const unitIds: string[] = [];
  let samples = 0;
  for (let p = 0; p < PLANTS; p++) {
    const plant = await ds.getRepository(Plant).save({
      organisationId: org.id,
      clientGroupId: groups[p % 2]!.id,
      name: `Bench Plant ${String(p + 1).padStart(2, '0')}`,
      timeZone: 'UTC',
    });
    for (let u = 0; u < UNITS_PER_PLANT; u++) {
      const index = p * UNITS_PER_PLANT + u;
      const unit = await ds
        .getRepository(GeneratingUnit)
        .save({ organisationId: org.id, plantId: plant.id, name: `Unit ${u + 1}`, savedMapping: null, ...SETUP });
      unitIds.push(unit.id);
      // cleanings at the start of each 180-day cycle, back to 0.90
      const offset = (index * 37) % CYCLE_DAYS;
      for (let d = (CYCLE_DAYS - offset) % CYCLE_DAYS; d < DAYS; d += CYCLE_DAYS) {
        if (d === 0) continue;
        const date = dayText(startMs + d * DAY_MS);
        await ds.getRepository(UnitEvent).save({
          organisationId: org.id,
          unitId: unit.id,
          kind: 'cleaning',
          startDate: date,
          endDate: date,
          methodId: null,
          cost: '85000.00',
          cleanlinessBefore: null,
          cleanlinessAfter: 0.9,
          pluggedTubesAfter: null,
          notes: 'Bench cleaning (generated)',
          createdByUserId: user.id,
        });
      }
      // one unit in ten shows air in-leakage on its last three days (a condition on the portfolio)
      const leakDays = new Set(index % 10 === 3 ? [0, 1, 2].map((k) => dayText(lastMs - k * DAY_MS)) : []);
      const daily: DailyAggregateRow[] = [];
      const t1 = performance.now();
      samples += await loadUnit(ds, () => Readable.from(unitLines(index, unit.id, startMs, daily, leakDays)));
      const t2 = performance.now();
      await replaceDailyAggregates(ds.manager, unit.id, daily);
      const t3 = performance.now();
      await analyse(ds, org.id, unit.id, dayText(lastMs));
      const seconds = (a: number, b: number) => ((b - a) / 1000).toFixed(1);
      log(
        `bench tenant: unit ${index + 1} of ${PLANTS * UNITS_PER_PLANT} (${samples.toLocaleString('en-US')} samples; load ${seconds(t1, t2)} s, daily figures ${seconds(t2, t3)} s, analysis ${seconds(t3, performance.now())} s)`,
      );
    }
  }
  return { email, password, unitIds, firstDay: dayText(startMs), lastDay: dayText(lastMs), samples, buildSeconds: (performance.now() - t0) / 1000 };
}

/** The stored analysis, drawn by the recompute's own steps from the stored daily figures (the last 400 days for the trend). */
async function analyse(ds: DataSource, organisationId: string, unitId: string, lastDay: string): Promise<void> {
  const unit = await ds.getRepository(GeneratingUnit).findOneByOrFail({ id: unitId });
  const events = await ds.getRepository(UnitEvent).find({ where: { unitId }, order: { startDate: 'ASC', createdAt: 'ASC' } });
  const days = await dailyFiguresOfUnit(ds.manager, unitId);
  const recent = new Map(days.slice(-400).map((d) => [d.day, d.medianCleanliness!] as const));
  const leak = new Set(days.filter((d) => d.airLeakSuspected).map((d) => d.day));
  const cycles = fitCycles(recent, cleaningMarks(events), leak);
  const setup = { condenser: unit.condenser, turbine: unit.turbine, economics: unit.economics } as UnitSetupSi;
  const model = buildUnitModel(setup);
  const outlook = await planCleaningOutlook(ds, { organisationId, unitId, model, setup, lastDay, today: dayText(Date.now()), cycles, plannedOutages: [] });
  const forecast = forecastBand(days, cycles.map(cycleSummary).at(-1));
  const current = currentFigures(
    days,
    events.filter((e) => e.kind === 'cleaning'),
  );
  await storeUnitAnalysis(ds, unitId, unitAnalysis({ setupVersion: unit.setupVersion, lastDay, cycles, airLeakPeriods: [], outlook, forecast, current }));
}

/** Starts the bench tenant's MariaDB (building the tenant first when it is not there yet) and connects. */
export async function openBenchTenant(log: (line: string) => void = console.log): Promise<OpenBenchTenant> {
  const ready = existsSync(READY_FILE);
  mkdirSync(BENCH_TENANT_DIR, { recursive: true });
  const db = await startMariaDb({ dataDir: path.join(BENCH_TENANT_DIR, 'mariadb'), port: await freePort(), ...DB });
  const ds = buildDataSource({ host: db.host, port: db.port, ...DB });
  const close = async () => {
    if (ds.isInitialized) await ds.destroy();
    await db.stop();
  };
  try {
    await ds.initialize();
    await ds.runMigrations({ transaction: 'each' });
    if (ready) return { tenant: JSON.parse(readFileSync(READY_FILE, 'utf8')) as BenchTenant, db, ds, built: false, close };
    if ((await ds.getRepository(Organisation).count()) > 0)
      throw new Error(`${BENCH_TENANT_DIR} holds a half-built bench tenant: delete the folder and run again`);
    log('bench tenant: building 50 units × 10 years of hourly data (once; kept under .data/bench)…');
    const tenant = await build(ds, log);
    writeFileSync(READY_FILE, `${JSON.stringify(tenant, null, 2)}\n`);
    return { tenant, db, ds, built: true, close };
  } catch (err) {
    await close();
    throw err;
  }
}
