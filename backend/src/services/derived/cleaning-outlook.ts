/**
 * The recommended next cleaning: the decision engine's least-cost calendar over the coming year, from the
 * day after the last data, with the unit's own fouling trend (latest cleaning cycle), its seasonal CW
 * temperature and load (monthly means of its history), its prices, the planned outages on its timeline and
 * the cleaning-method library. Stored with the unit's analysis; the health view shows its first cleaning.
 */
import { addDays, daysBetween } from '@shared/domain/calendar/plant-date.js';
import { monthlyProfilesFromHistory } from '@shared/domain/decision/drivers/seasonal-drivers.js';
import type { FoulingModel } from '@shared/domain/decision/fouling/fouling-models.js';
import { runScheduleCase } from '@shared/domain/decision/schedule/schedule-case.js';
import type { UnitModel } from '@shared/domain/monitoring/index.js';
import { TYPICAL_CLEANING_METHODS, type CleaningMethod } from '@shared/schemas/cleaning-method.js';
import type { UnitSetupSi } from '@shared/domain/monitoring/index.js';

export interface CleaningOutlook {
  status: 'planned' | 'none-needed' | 'not-available';
  reason?: string;
  planFrom?: string;
  horizonDays?: number;
  next?: { date: string; endDate: string; methodId: string; methodName: string; cleanlinessBefore: number; cleanlinessAfter: number; cleaningCost: number; downtimeCost: number; typicalValues: boolean };
  cleaningsInHorizon?: number;
  savingsVersusNoCleaning?: number;
  methodsBasis: string;
}

export interface OutlookInput {
  model: UnitModel;
  setup: UnitSetupSi;
  lastDay: string;
  /** the latest cleaning cycle's fitted trend */
  cycle: { startDay: string; model: FoulingModel; cleanlinessAfterCleaning: number } | null;
  history: { date: string; cwInletC: number; loadFraction: number }[];
  plannedOutages: { from: string; to: string }[];
  methods?: readonly CleaningMethod[];
}

const HORIZON_DAYS = 365;

export function cleaningOutlook(input: OutlookInput): CleaningOutlook {
  const methods = [...(input.methods ?? TYPICAL_CLEANING_METHODS)];
  const methodsBasis = !input.methods
    ? 'typical cleaning methods (typical values, edit them to your own)'
    : methods.some((m) => m.typical)
      ? 'the organisation’s cleaning methods (some still at typical values)'
      : 'the organisation’s cleaning methods';
  if (!input.cycle) return { status: 'not-available', reason: 'No fouling trend yet: at least 10 days of valid data over 14 days since the last cleaning are needed', methodsBasis };
  if (input.history.length < 28) return { status: 'not-available', reason: 'Less than four weeks of history to build the seasonal profile', methodsBasis };
  const planFrom = addDays(input.lastDay, 1);
  const profiles = monthlyProfilesFromHistory(input.history);
  const c = input.setup.condenser;
  const e = input.setup.economics;
  try {
    const result = runScheduleCase({
      startDate: planFrom,
      horizonDays: HORIZON_DAYS,
      drivers: {
        cwInletC: { monthly: profiles.cwInletC },
        loadFraction: { monthly: profiles.loadFraction },
        fuelPricePerMmbtu: e.fuelPricePerMmbtu,
        replacementPricePerMwh: e.replacementPricePerMwh,
        co2PricePerTonne: e.co2PricePerTonne,
      },
      penalty: {
        kind: 'models',
        unit: {
          geometry: input.model.geometry,
          cwFlowM3s: c.designCwFlowM3s,
          designDutyMw: c.designDutyMw,
          pluggedTubes: c.pluggedTubes,
          ratingMw: input.model.ratingMw,
          heatRateBtuKwh: input.model.heatRateBtuKwh,
          co2KgPerMmbtu: e.co2KgPerMmbtu,
          capacityLimitedShare: e.capacityLimitedShare,
          curve: input.model.curve,
          heiTables: input.model.heiTables,
        },
      },
      economics: { ratingMw: input.model.ratingMw, heatRateBtuKwh: input.model.heatRateBtuKwh, co2KgPerMmbtu: e.co2KgPerMmbtu, activeTubes: c.tubeCount - c.pluggedTubes },
      fouling: input.cycle.model,
      initial: { daysSinceCleaning: Math.max(0, daysBetween(input.cycle.startDay, planFrom)), cleanlinessAfterCleaning: input.cycle.cleanlinessAfterCleaning, foulingRateMultiplier: 1 },
      methods,
      plannedOutages: input.plannedOutages.filter((o) => o.to >= planFrom),
      discountRate: e.discountRate,
      referenceCleanliness: input.model.referenceCleanliness,
      baseline: { kind: 'never' },
    });
    const first = result.cleanings[0];
    const savings = result.baseline.discountedTotals.total - result.discountedTotals.total;
    if (!first) return { status: 'none-needed', reason: 'Within the coming year no cleaning pays for itself', planFrom, horizonDays: HORIZON_DAYS, cleaningsInHorizon: 0, savingsVersusNoCleaning: 0, methodsBasis };
    return {
      status: 'planned',
      planFrom,
      horizonDays: HORIZON_DAYS,
      next: {
        date: first.date,
        endDate: first.endDate,
        methodId: first.methodId,
        methodName: first.methodName,
        cleanlinessBefore: first.cleanlinessBefore,
        cleanlinessAfter: first.cleanlinessAfter,
        cleaningCost: first.cleaningCost,
        downtimeCost: first.downtimeCost,
        typicalValues: first.typicalValues,
      },
      cleaningsInHorizon: result.cleanings.length,
      savingsVersusNoCleaning: Math.round(savings * 100) / 100,
      methodsBasis,
    };
  } catch (err) {
    return { status: 'not-available', reason: err instanceof Error ? err.message : String(err), methodsBasis };
  }
}
