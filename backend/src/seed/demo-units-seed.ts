/**
 * Demo plants and units with several years of hourly data, brought in through the same import pipeline a
 * user's file takes (upload record → mapping → check → store → recompute). The history ends the day before the
 * plant's today, so the demo looks current whenever it is seeded. Prices are DEMO VALUES.
 */
import { mkdtemp, rm, stat } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import { CO2_KG_PER_MMBTU } from '@shared/domain/turbine/index.js';
import type { CondenserSetup, EconomicsSetup, TurbineSetup } from '@shared/schemas/unit-setup.js';
import { ClientGroup } from '../entities/client-group.entity.js';
import { DataImport } from '../entities/data-import.entity.js';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import { Plant } from '../entities/plant.entity.js';
import { UnitEvent } from '../entities/unit-event.entity.js';
import { JOB_HANDLERS } from '../jobs/job-handlers.js';
import { drainJobs } from '../jobs/job-worker.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { methodsOf } from '../services/cleaning-method.service.js';
import { startImport } from '../services/import.service.js';
import { designBackpressureKpa, dutyAtLoadMw, writeDemoFileSets, type DemoFileSet } from './demo-data/index.js';

/** DEMO VALUES: fuel and power prices of the fictional scenario. */
const DEMO_PRICES = {
  'sub-bituminous-coal': { fuelPricePerMmbtu: 2.1 },
  'bituminous-coal': { fuelPricePerMmbtu: 2.9 },
  'natural-gas': { fuelPricePerMmbtu: 3.6 },
} as const;

function setupOf(set: DemoFileSet): { condenser: CondenserSetup; turbine: TurbineSetup; economics: EconomicsSetup } {
  const u = set.data.unit;
  const rating = u.turbine.ratingMw;
  return {
    condenser: {
      shells: 1,
      passes: u.geometry.passes,
      tubeCount: u.geometry.tubeCount,
      tubeOdMm: u.geometry.tubeOdMm,
      tubeBwg: u.geometry.tubeBwg,
      tubeMaterial: u.geometry.tubeMaterial,
      tubeLengthM: u.tubeEffectiveLengthM,
      surfaceM2: u.geometry.surfaceM2,
      pluggedTubes: u.pluggedTubes,
      designCwFlowM3s: u.design.cwFlowM3s,
      designCwInletC: u.design.cwInletC,
      designDutyMw: dutyAtLoadMw(u, rating),
      designBackpressureKpa: Math.round(designBackpressureKpa(u) * 100) / 100,
      designCleanliness: u.design.cleanliness,
      designPluggedTubes: u.pluggedTubes,
      referenceCleanliness: u.fouling.cleanCf,
    },
    turbine: {
      ratingMw: rating,
      designHeatRateBtuKwh: u.turbine.designHeatRateBtuKwh,
      heatBalanceDuty: [0.3, 0.5, 0.75, 1].map((f) => ({ loadFraction: f, dutyMw: Math.round(dutyAtLoadMw(u, f * rating) * 10) / 10 })),
      correctionCurve: null,
      minimumLoadFraction: 0.4,
    },
    economics: {
      fuel: u.turbine.fuel,
      co2KgPerMmbtu: CO2_KG_PER_MMBTU[u.turbine.fuel],
      fuelPricePerMmbtu: DEMO_PRICES[u.turbine.fuel].fuelPricePerMmbtu,
      replacementPricePerMwh: 52,
      capacityLimitedShare: 0.15,
      co2PricePerTonne: 0,
      discountRate: 0.08,
      currency: 'USD',
    },
  };
}

/** When the demo is made: a fixed day for every plant (tests), or each plant's own today at `now` (the clock by default). */
export interface DemoDay {
  today?: string;
  now?: Date;
  /** Only these demo units (by key); all of them by default. */
  units?: string[];
}

export async function seedDemoUnits(ds: DataSource, log: (line: string) => void, day: DemoDay = {}): Promise<void> {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'cleancase-demo-'));
  try {
    log('Generating the demo historian files (hourly, the three years up to yesterday)…');
    const sets = await writeDemoFileSets(dir, { xlsx: false, today: day.today, now: day.now, units: day.units });
    for (const set of sets) {
      const organisation = await ds.getRepository(Organisation).findOneByOrFail({ name: set.plant.organisation });
      const admin = await ds.getRepository(Membership).findOneByOrFail({ organisationId: organisation.id, role: 'admin' });
      const scope: TenantScope = { organisationId: organisation.id, userId: admin.userId, role: 'admin', clientGroupIds: null };
      const group = set.plant.client ? await ds.getRepository(ClientGroup).findOneByOrFail({ organisationId: organisation.id, name: set.plant.client }) : null;
      let plant = await ds.getRepository(Plant).findOneBy({ organisationId: organisation.id, name: set.plant.name });
      plant ??= await ds
        .getRepository(Plant)
        .save({ organisationId: organisation.id, clientGroupId: group?.id ?? null, name: set.plant.name, timeZone: set.plant.timeZone });
      const unit = await ds
        .getRepository(GeneratingUnit)
        .save({ organisationId: organisation.id, plantId: plant.id, name: set.data.unit.name, savedMapping: null, ...setupOf(set) });
      // Each demo cleaning is one of the library's methods at the library's cost for this condenser's tubes in service.
      const library = await methodsOf(ds.manager, organisation.id);
      for (const c of set.data.cleanings) {
        const method = library.find((m) => m.id === c.method);
        if (!method) throw new Error(`demo cleaning method "${c.method}" is not in the organisation's library`);
        const activeTubes = set.data.unit.geometry.tubeCount - set.data.unit.pluggedTubes;
        await ds.getRepository(UnitEvent).save({
          organisationId: organisation.id,
          unitId: unit.id,
          kind: 'cleaning',
          startDate: c.date,
          endDate: c.date,
          methodId: method.id,
          cost: (method.fixedCost + method.costPerTube * activeTubes).toFixed(2),
          cleanlinessBefore: Math.round(c.cfBefore * 1000) / 1000,
          cleanlinessAfter: c.cfAfter,
          pluggedTubesAfter: null,
          notes: `${method.name} (demo)`,
          createdByUserId: admin.userId,
        });
      }
      for (const o of set.data.outages) {
        await ds.getRepository(UnitEvent).save({
          organisationId: organisation.id,
          unitId: unit.id,
          kind: 'outage',
          startDate: o.start,
          endDate: o.end,
          methodId: null,
          cost: null,
          cleanlinessBefore: null,
          cleanlinessAfter: null,
          pluggedTubesAfter: null,
          notes: `${o.kind} outage (demo)`,
          createdByUserId: admin.userId,
        });
      }
      await ds.getRepository(UnitEvent).save({
        organisationId: organisation.id,
        unitId: unit.id,
        kind: 'air-leak-repair',
        startDate: set.data.airLeak.end,
        endDate: null,
        methodId: null,
        cost: '12000.00',
        cleanlinessBefore: null,
        cleanlinessAfter: null,
        pluggedTubesAfter: null,
        notes: 'Expansion-joint leak found and sealed (demo)',
        createdByUserId: admin.userId,
      });
      const imp = await ds.getRepository(DataImport).save({
        organisationId: organisation.id,
        unitId: unit.id,
        uploadedByUserId: admin.userId,
        fileName: path.basename(set.csvPath),
        fileBytes: (await stat(set.csvPath)).size,
        fileKind: 'csv',
        status: 'mapping',
        mapping: set.csvMapping,
        counts: null,
        errors: null,
        errorCount: 0,
        notes: null,
        progress: 0,
        message: null,
        storedPath: set.csvPath,
        firstTimestamp: null,
        lastTimestamp: null,
        finishedAt: null,
      });
      await startImport(ds, scope, imp.id, set.csvMapping);
      log(`Importing ${set.plant.name} ${set.data.unit.name} (${set.data.hours.length.toLocaleString('en-US')} hourly rows)…`);
      await drainJobs(ds, JOB_HANDLERS);
    }
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
