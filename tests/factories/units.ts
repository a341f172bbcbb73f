/**
 * Test plants and units. The setup values are invented for tests (a plausible mid-size unit), not plant data.
 */
import { randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { DataImport } from '../../backend/src/entities/data-import.entity.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { Plant } from '../../backend/src/entities/plant.entity.js';
import { UnitEvent } from '../../backend/src/entities/unit-event.entity.js';
import type { CondenserSetup, EconomicsSetup, TurbineSetup } from '../../shared/schemas/unit-setup.js';

export const TEST_CONDENSER: CondenserSetup = {
  shells: 1,
  passes: 2,
  tubeCount: 18000,
  tubeOdMm: 25.4,
  tubeBwg: 22,
  tubeMaterial: 'titanium',
  tubeLengthM: 11.8,
  surfaceM2: 16950,
  pluggedTubes: 120,
  designCwFlowM3s: 15,
  designCwInletC: 20,
  designDutyMw: 520,
  designBackpressureKpa: 6.8,
  designCleanliness: 0.9,
  designPluggedTubes: 0,
  referenceCleanliness: null,
};

export const TEST_TURBINE: TurbineSetup = {
  ratingMw: 340,
  designHeatRateBtuKwh: 9400,
  heatBalanceDuty: [
    { loadFraction: 0.4, dutyMw: 230 },
    { loadFraction: 1, dutyMw: 520 },
  ],
  correctionCurve: null,
  minimumLoadFraction: 0.4,
};

export const TEST_ECONOMICS: EconomicsSetup = {
  fuel: 'bituminous-coal',
  co2KgPerMmbtu: 93.28,
  fuelPricePerMmbtu: 2.8,
  replacementPricePerMwh: 55,
  capacityLimitedShare: 0.2,
  co2PricePerTonne: 0,
  discountRate: 0.08,
  currency: 'USD',
};

const suffix = () => randomBytes(3).toString('hex');

export async function createPlant(ds: DataSource, organisationId: string, clientGroupId: string | null = null): Promise<Plant> {
  return ds.getRepository(Plant).save({ organisationId, clientGroupId, name: `Plant ${suffix()}`, timeZone: 'America/Chicago' });
}

export async function createUnit(ds: DataSource, plant: Plant, withSetup = true): Promise<GeneratingUnit> {
  return ds.getRepository(GeneratingUnit).save({
    organisationId: plant.organisationId,
    plantId: plant.id,
    name: `Unit ${suffix()}`,
    condenser: withSetup ? TEST_CONDENSER : null,
    turbine: withSetup ? TEST_TURBINE : null,
    economics: withSetup ? TEST_ECONOMICS : null,
    savedMapping: null,
  });
}

export async function createEvent(ds: DataSource, unit: GeneratingUnit): Promise<UnitEvent> {
  return ds.getRepository(UnitEvent).save({
    organisationId: unit.organisationId,
    unitId: unit.id,
    kind: 'other',
    startDate: '2026-01-05',
    endDate: null,
    methodId: null,
    cost: null,
    cleanlinessBefore: null,
    cleanlinessAfter: null,
    pluggedTubesAfter: null,
    notes: 'test',
    createdByUserId: null,
  });
}

/** An import record waiting for its mapping (no file behind it). */
export async function createPendingImport(ds: DataSource, unit: GeneratingUnit): Promise<DataImport> {
  return ds.getRepository(DataImport).save({
    organisationId: unit.organisationId,
    unitId: unit.id,
    uploadedByUserId: null,
    fileName: 'history.csv',
    fileBytes: 10,
    fileKind: 'csv',
    status: 'mapping',
    mapping: {},
    counts: null,
    errors: [{ row: 3, column: 'BP', value: "'=1+2", message: 'not a number' }],
    errorCount: 1,
    notes: null,
    progress: 0,
    message: null,
    storedPath: null,
    firstTimestamp: null,
    lastTimestamp: null,
    finishedAt: null,
  });
}
