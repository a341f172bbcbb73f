/**
 * The recommended next cleaning: the decision engine's least-cost calendar over the coming year, from the
 * day after the last data or the plant's today, whichever is later, with the unit's own fouling trend (latest
 * cleaning cycle), its seasonal CW temperature and load (monthly means of its history), its prices, the planned
 * outages on its timeline and the cleaning-method library. Stored with the unit's analysis; the health view
 * shows its first cleaning, the plan's dates, and the best plan with methods used while the unit runs beside
 * the best with outage methods.
 */
import { addDays, daysBetween } from '@shared/domain/calendar/plant-date.js';
import { monthlyProfilesFromHistory } from '@shared/domain/decision/drivers/seasonal-drivers.js';
import type { FoulingModel } from '@shared/domain/decision/fouling/fouling-models.js';
import { runScheduleCase, type ScheduleCaseResult, type ScheduledCleaning } from '@shared/domain/decision/schedule/schedule-case.js';
import type { UnitModel } from '@shared/domain/monitoring/index.js';
import { TYPICAL_CLEANING_METHODS, type CleaningMethod } from '@shared/schemas/cleaning-method.js';
import type { UnitSetupSi } from '@shared/domain/monitoring/index.js';

/** A cleaning of the plan as the health view lists it. */
export interface OutlookCleaning {
  date: string;
  endDate: string;
  methodId: string;
  methodName: string;
  unitDuringCleaning: CleaningMethod['unitDuringCleaning'];
}

/** The best plan with only one kind of method: cleaned while running (on line or under a derate), or in an outage. */
export interface OutlookOption {
  kind: 'while-running' | 'in-an-outage';
  status: 'planned' | 'none-needed' | 'no-method';
  first?: OutlookCleaning;
  cleaningsInHorizon: number;
  savingsVersusNoCleaning: number;
}

export interface CleaningOutlook {
  status: 'planned' | 'none-needed' | 'not-available';
  reason?: string;
  planFrom?: string;
  /** the last day of data the plan was built on */
  dataTo?: string;
  horizonDays?: number;
  next?: {
    date: string;
    endDate: string;
    methodId: string;
    methodName: string;
    cleanlinessBefore: number;
    cleanlinessAfter: number;
    cleaningCost: number;
    downtimeCost: number;
    typicalValues: boolean;
  };
  /** every cleaning of the plan over the horizon */
  plan?: OutlookCleaning[];
  /** the same question answered with only on-line methods and with only outage methods */
  options?: OutlookOption[];
  cleaningsInHorizon?: number;
  savingsVersusNoCleaning?: number;
  methodsBasis: string;
}

export interface OutlookInput {
  model: UnitModel;
  setup: UnitSetupSi;
  lastDay: string;
  /** the plant's today: a plan never starts in the past, however old the data */
  today: string;
  /** the latest cleaning cycle's fitted trend */
  cycle: { startDay: string; model: FoulingModel; cleanlinessAfterCleaning: number } | null;
  history: { date: string; cwInletC: number; loadFraction: number }[];
  plannedOutages: { from: string; to: string }[];
  methods?: readonly CleaningMethod[];
}

const HORIZON_DAYS = 365;

const whileRunning = (m: CleaningMethod) => m.unitDuringCleaning !== 'outage';

function describe(c: ScheduledCleaning, methods: readonly CleaningMethod[]): OutlookCleaning {
  const method = methods.find((m) => m.id === c.methodId);
  return { date: c.date, endDate: c.endDate, methodId: c.methodId, methodName: c.methodName, unitDuringCleaning: method?.unitDuringCleaning ?? 'outage' };
}

const savingsOf = (r: ScheduleCaseResult) => Math.round((r.baseline.discountedTotals.total - r.discountedTotals.total) * 100) / 100;

export function cleaningOutlook(input: OutlookInput): CleaningOutlook {
  const methods = [...(input.methods ?? TYPICAL_CLEANING_METHODS)];
  const methodsBasis = !input.methods
    ? 'typical cleaning methods (typical values, edit them to your own)'
    : methods.some((m) => m.typical)
      ? 'the organisation’s cleaning methods (some still at typical values)'
      : 'the organisation’s cleaning methods';
  if (!input.cycle)
    return {
      status: 'not-available',
      reason: 'No fouling trend yet: at least 10 days of valid data over 14 days since the last cleaning are needed',
      methodsBasis,
    };
  if (input.history.length < 28) return { status: 'not-available', reason: 'Less than four weeks of history to build the seasonal profile', methodsBasis };
  const dayAfterData = addDays(input.lastDay, 1);
  const planFrom = input.today > dayAfterData ? input.today : dayAfterData;
  const profiles = monthlyProfilesFromHistory(input.history);
  const c = input.setup.condenser;
  const e = input.setup.economics;
  const cycle = input.cycle;
  const planWith = (chosen: CleaningMethod[]) =>
    runScheduleCase({
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
      economics: {
        ratingMw: input.model.ratingMw,
        heatRateBtuKwh: input.model.heatRateBtuKwh,
        co2KgPerMmbtu: e.co2KgPerMmbtu,
        activeTubes: c.tubeCount - c.pluggedTubes,
      },
      fouling: cycle.model,
      initial: {
        daysSinceCleaning: Math.max(0, daysBetween(cycle.startDay, planFrom)),
        cleanlinessAfterCleaning: cycle.cleanlinessAfterCleaning,
        foulingRateMultiplier: 1,
      },
      methods: chosen,
      plannedOutages: input.plannedOutages.filter((o) => o.to >= planFrom),
      discountRate: e.discountRate,
      referenceCleanliness: input.model.referenceCleanliness,
      baseline: { kind: 'never' },
    });
  const option = (kind: OutlookOption['kind']): OutlookOption => {
    const chosen = methods.filter((m) => whileRunning(m) === (kind === 'while-running'));
    if (chosen.length === 0) return { kind, status: 'no-method', cleaningsInHorizon: 0, savingsVersusNoCleaning: 0 };
    const r = planWith(chosen);
    const first = r.cleanings[0];
    return first
      ? { kind, status: 'planned', first: describe(first, chosen), cleaningsInHorizon: r.cleanings.length, savingsVersusNoCleaning: savingsOf(r) }
      : { kind, status: 'none-needed', cleaningsInHorizon: 0, savingsVersusNoCleaning: 0 };
  };
  try {
    const result = planWith(methods);
    const options = [option('while-running'), option('in-an-outage')];
    const first = result.cleanings[0];
    const common = { planFrom, dataTo: input.lastDay, horizonDays: HORIZON_DAYS, options, methodsBasis };
    if (!first)
      return {
        status: 'none-needed',
        reason: 'Within the coming year no cleaning pays for itself',
        ...common,
        plan: [],
        cleaningsInHorizon: 0,
        savingsVersusNoCleaning: 0,
      };
    return {
      status: 'planned',
      ...common,
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
      plan: result.cleanings.map((x) => describe(x, methods)),
      cleaningsInHorizon: result.cleanings.length,
      savingsVersusNoCleaning: savingsOf(result),
    };
  } catch (err) {
    return { status: 'not-available', reason: err instanceof Error ? err.message : String(err), methodsBasis };
  }
}
