/**
 * Cleaning cases written straight to the database (no imported history needed): a small hand-made input on
 * the test unit's setup, its results from the shared calculation. Values invented for tests.
 */
import type { DataSource } from 'typeorm';
import { ENGINE_VERSION } from '../../shared/domain/decision/schedule/engine-version.js';
import { runScheduleCommand } from '../../shared/domain/decision/schedule/schedule-command.js';
import { calcScheduleInput } from '../../shared/schemas/calc-schedule.js';
import type { CaseStatus } from '../../shared/schemas/cases.js';
import { CleaningCase } from '../../backend/src/entities/cleaning-case.entity.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { TEST_CONDENSER, TEST_ECONOMICS, TEST_TURBINE } from './units.js';

export const TEST_CASE_INPUTS = calcScheduleInput.parse({
  startDate: '2026-04-01',
  horizonDays: 365,
  drivers: {
    cwInletC: { monthly: [12, 12, 14, 17, 21, 25, 28, 28, 25, 21, 16, 13] },
    loadFraction: 0.85,
    fuelPricePerMmbtu: TEST_ECONOMICS.fuelPricePerMmbtu,
    replacementPricePerMwh: TEST_ECONOMICS.replacementPricePerMwh,
  },
  unit: {
    ratingMw: TEST_TURBINE.ratingMw,
    heatRateBtuKwh: TEST_TURBINE.designHeatRateBtuKwh,
    condenser: {
      surfaceM2: TEST_CONDENSER.surfaceM2,
      tubeCount: TEST_CONDENSER.tubeCount,
      passes: TEST_CONDENSER.passes,
      tubeOdMm: TEST_CONDENSER.tubeOdMm,
      tubeBwg: TEST_CONDENSER.tubeBwg,
      tubeMaterial: TEST_CONDENSER.tubeMaterial,
      pluggedTubes: TEST_CONDENSER.pluggedTubes,
      cwFlowM3s: TEST_CONDENSER.designCwFlowM3s,
      designDutyMw: TEST_CONDENSER.designDutyMw,
    },
  },
  fouling: { model: 'linear', ratePerDay: 0.0012 },
  initial: { daysSinceCleaning: 120, cleanlinessAfterCleaning: 0.9 },
  methods: ['hp-water-lancing', 'sponge-ball-campaign'],
  discountRate: TEST_ECONOMICS.discountRate,
  includeDaily: false,
});

let results: ReturnType<typeof runScheduleCommand> | undefined;

export async function createCaseRecord(
  ds: DataSource,
  unit: GeneratingUnit,
  authorId: string,
  status: CaseStatus = 'draft',
  title = 'Test case',
): Promise<CleaningCase> {
  results ??= JSON.parse(JSON.stringify(runScheduleCommand(TEST_CASE_INPUTS))) as ReturnType<typeof runScheduleCommand>;
  const now = new Date();
  const decided = status === 'approved' || status === 'returned';
  return ds.getRepository(CleaningCase).save({
    organisationId: unit.organisationId,
    unitId: unit.id,
    title,
    status,
    authorId,
    inputs: TEST_CASE_INPUTS,
    inputSources: { fouling: { source: 'entered', detail: 'typed in by the test' } },
    results,
    engineVersion: ENGINE_VERSION,
    currency: 'USD',
    lastDataDay: '2026-03-31',
    setupVersion: unit.setupVersion,
    copiedFromId: null,
    updatedAt: now,
    submittedAt: status === 'draft' ? null : now,
    decidedAt: decided ? now : null,
    archivedAt: status === 'archived' ? now : null,
    decidedById: null,
    returnReason: status === 'returned' ? 'test reason' : null,
  });
}
