/**
 * Step 8 of the recompute: the cleaning outlook from the unit's stored daily history and its cleaning-method
 * library, stored with the fouling cycles and the air in-leakage periods as the unit's analysis.
 */
import type { DataSource } from 'typeorm';
import type { AirLeakPeriod, UnitModel, UnitSetupSi } from '@shared/domain/monitoring/index.js';
import type { StoredCurrentFigures, StoredForecast } from '@shared/schemas/unit-analysis.js';
import { operatingDaysOfUnit } from '../../repositories/daily-aggregate.repository.js';
import { methodsOf } from '../cleaning-method.service.js';
import { cleaningOutlook, type CleaningOutlook } from './cleaning-outlook.js';
import { cycleSummary, type CycleTrend } from './fouling-cycles.js';

export interface OutlookStepInput {
  organisationId: string;
  unitId: string;
  model: UnitModel;
  setup: UnitSetupSi;
  /** the last day with plausible data, or null when there is none */
  lastDay: string | null;
  /** the plant's today */
  today: string;
  cycles: CycleTrend[];
  plannedOutages: { from: string; to: string }[];
}

export async function planCleaningOutlook(ds: DataSource, input: OutlookStepInput): Promise<CleaningOutlook | null> {
  if (!input.lastDay) return null;
  const lastCycle = input.cycles.at(-1);
  const lastFit = lastCycle?.result.status === 'fitted' ? lastCycle.result.chosen : null;
  const history = await operatingDaysOfUnit(ds.manager, input.unitId);
  const libraryMethods = await methodsOf(ds.manager, input.organisationId);
  return cleaningOutlook({
    model: input.model,
    setup: input.setup,
    lastDay: input.lastDay,
    today: input.today,
    cycle: lastCycle && lastFit ? { startDay: lastCycle.startDay, model: lastFit.model, cleanlinessAfterCleaning: lastFit.cleanlinessAfterCleaning } : null,
    history: history.map((h) => ({ date: h.day, cwInletC: h.cwInletC, loadFraction: h.loadMw / input.model.ratingMw })),
    plannedOutages: input.plannedOutages,
    methods: libraryMethods.length ? libraryMethods : undefined,
  });
}

export interface UnitAnalysis {
  computedAt: string;
  setupVersion: number;
  lastDay: string | null;
  cycles: ReturnType<typeof cycleSummary>[];
  airLeakPeriods: AirLeakPeriod[];
  outlook: CleaningOutlook | null;
  /** the latest cycle's forecast band, drawn from the stored daily figures (forecast-band.ts) */
  forecast: StoredForecast | null;
  /** the unit's figures now, for the portfolio (current-figures.ts) */
  current: StoredCurrentFigures | null;
}

export function unitAnalysis(
  input: {
    setupVersion: number;
    lastDay: string | null;
    cycles: CycleTrend[];
    airLeakPeriods: AirLeakPeriod[];
    outlook: CleaningOutlook | null;
    forecast?: StoredForecast | null;
    current?: StoredCurrentFigures | null;
  },
  now = new Date(),
): UnitAnalysis {
  return {
    computedAt: now.toISOString(),
    setupVersion: input.setupVersion,
    lastDay: input.lastDay,
    cycles: input.cycles.map(cycleSummary),
    airLeakPeriods: input.airLeakPeriods,
    outlook: input.outlook,
    forecast: input.forecast ?? null,
    current: input.current ?? null,
  };
}

/** Stores the unit's analysis and raises its data version in the same statement; null clears it (no setup, nothing to analyse). */
export async function storeUnitAnalysis(ds: DataSource, unitId: string, analysis: UnitAnalysis | null): Promise<void> {
  await ds.query('UPDATE generating_unit SET analysis = ?, dataVersion = dataVersion + 1 WHERE id = ?', [
    analysis === null ? null : JSON.stringify(analysis),
    unitId,
  ]);
}
