/**
 * The `schedule` calculation as one pure function: the CLI, the calculation API, cleaning cases on the server and
 * the case page's what-ifs in the browser all run this, so every one of them gives the same figures for the same
 * input. Least-cost cleaning calendar over a horizon, the baseline, the business case, and optionally the
 * sensitivity and Monte Carlo (ENGINEERING.md §6–7). Contract in README.md, "Decision commands".
 */
import { calcScheduleInput, type CalcScheduleInput, type CalcScheduleOutput } from '../../../schemas/calc-schedule.js';
import { TYPICAL_CLEANING_METHODS, type CleaningMethod } from '../../../schemas/cleaning-method.js';
import { daysBetween } from '../../calendar/plant-date.js';
import { toCents } from '../economics/cash-flow-metrics.js';
import type { UncertaintyRanges } from '../uncertainty/schedule-uncertainty.js';
import { runScheduleCase, type ScheduleCaseSpec, type ScheduledCleaning } from './schedule-case.js';
import type { CostTotals } from './schedule-pricing.js';

const r6 = (x: number) => Number(x.toFixed(6));
const optional6 = (x: number | null) => (x === null ? null : r6(x));

function resolveMethods(list: CalcScheduleInput['methods']): CleaningMethod[] {
  return list.map((m) => {
    if (typeof m !== 'string') return m;
    const found = TYPICAL_CLEANING_METHODS.find((t) => t.id === m);
    if (!found)
      throw new Error(
        `methods: "${m}" is not in the typical library (${TYPICAL_CLEANING_METHODS.map((t) => t.id).join(', ')}); give the method in full instead`,
      );
    return found;
  });
}

export function toSpec(v: CalcScheduleInput): ScheduleCaseSpec {
  const methods = resolveMethods(v.methods);
  const c = v.unit.condenser;
  const { interpolation, ...drivers } = v.drivers;
  const baseline =
    v.baseline.kind === 'fixed'
      ? { kind: 'fixed' as const, cleanings: v.baseline.cleanings.map((b) => ({ startDay: daysBetween(v.startDate, b.date), methodId: b.methodId })) }
      : v.baseline;
  return {
    startDate: v.startDate,
    horizonDays: v.horizonDays,
    drivers,
    interpolation,
    penalty: c
      ? {
          kind: 'models',
          unit: {
            geometry: {
              surfaceM2: c.surfaceM2,
              tubeCount: c.tubeCount,
              passes: c.passes,
              tubeOdMm: c.tubeOdMm,
              tubeBwg: c.tubeBwg,
              tubeMaterial: c.tubeMaterial,
            },
            cwFlowM3s: c.cwFlowM3s,
            designDutyMw: c.designDutyMw,
            pluggedTubes: c.pluggedTubes,
            ratingMw: v.unit.ratingMw,
            heatRateBtuKwh: v.unit.heatRateBtuKwh,
            co2KgPerMmbtu: v.unit.co2KgPerMmbtu,
            capacityLimitedShare: v.unit.capacityLimitedShare,
            ...(v.unit.curve ? { curve: v.unit.curve } : {}),
          },
        }
      : { kind: 'direct', curve: v.directPenalty!.points, monthlyFactors: v.directPenalty!.monthlyFactors },
    economics: {
      ratingMw: v.unit.ratingMw,
      heatRateBtuKwh: v.unit.heatRateBtuKwh,
      co2KgPerMmbtu: v.unit.co2KgPerMmbtu,
      activeTubes: v.unit.activeTubes ?? (c ? c.tubeCount - c.pluggedTubes : 0),
    },
    fouling: v.fouling,
    initial: v.initial,
    methods,
    plannedOutages: v.plannedOutages,
    windows: v.windows,
    methodWindows: v.methodWindows,
    minSpacingDays: v.minSpacingDays,
    discountRate: v.discountRate,
    referenceCleanliness: v.referenceCleanliness,
    baseline,
    upfrontCost: v.upfrontCost,
    ...(v.uncertainty
      ? { uncertainty: { trials: v.uncertainty.trials, seed: v.uncertainty.seed, ranges: v.uncertainty.ranges as Partial<UncertaintyRanges> | undefined } }
      : {}),
  };
}

const totalsOut = (t: CostTotals) => ({
  foulingCost: toCents(t.foulingCost),
  cleaningCost: toCents(t.cleaningCost),
  downtimeCost: toCents(t.downtimeCost),
  total: toCents(t.total),
});

const cleaningOut = (c: ScheduledCleaning) => ({
  date: c.date,
  endDate: c.endDate,
  methodId: c.methodId,
  methodName: c.methodName,
  cleaningCost: toCents(c.cleaningCost),
  downtimeCost: toCents(c.downtimeCost),
  foulingCostDuring: toCents(c.foulingCostDuring),
  daysInPlannedOutage: c.daysInPlannedOutage,
  cleanlinessBefore: r6(c.cleanlinessBefore),
  cleanlinessAfter: r6(c.cleanlinessAfter),
  typicalValues: c.typicalValues,
  cautions: c.cautions,
});

/** Runs a checked input (see `calcScheduleInput`); throws with a readable message when the case cannot be built. */
export function runScheduleCommand(v: CalcScheduleInput): CalcScheduleOutput {
  const r = runScheduleCase(toSpec(v));
  const bc = r.businessCase;
  return {
    referenceCleanliness: r.referenceCleanliness,
    cleanings: r.cleanings.map(cleaningOut),
    totals: totalsOut(r.totals),
    discountedTotals: totalsOut(r.discountedTotals),
    yearly: r.yearly.map(totalsOut),
    baseline: {
      cleanings: r.baseline.cleanings.map(cleaningOut),
      totals: totalsOut(r.baseline.totals),
      discountedTotals: totalsOut(r.baseline.discountedTotals),
      ruleBreaks: r.baseline.ruleBreaks,
    },
    businessCase: {
      cashflows: bc.cashflows.map(toCents),
      foulingSavings: bc.foulingSavings.map(toCents),
      extraCleaningCosts: bc.extraCleaningCosts.map(toCents),
      npv: toCents(bc.npv),
      irr: bc.irr === null ? null : Number(bc.irr.toDecimalPlaces(10).toString()),
      ...(bc.irrReason ? { irrReason: bc.irrReason } : {}),
      paybackYears: optional6(bc.paybackYears),
      discountedPaybackYears: optional6(bc.discountedPaybackYears),
      benefitCostRatio: bc.benefitCostRatio === null ? null : Number(bc.benefitCostRatio.toDecimalPlaces(6).toString()),
      ...(bc.benefitCostReason ? { benefitCostReason: bc.benefitCostReason } : {}),
    },
    ...(r.sensitivity
      ? {
          sensitivity: {
            baseNpv: toCents(r.sensitivity.baseNpv),
            bars: r.sensitivity.bars.map((b) => ({ ...b, npvAtLow: toCents(b.npvAtLow), npvAtHigh: toCents(b.npvAtHigh), swing: toCents(b.swing) })),
          },
        }
      : {}),
    ...(r.monteCarlo
      ? {
          monteCarlo: {
            trials: r.monteCarlo.trials,
            seed: r.monteCarlo.seed,
            p10Npv: toCents(r.monteCarlo.p10Npv),
            p50Npv: toCents(r.monteCarlo.p50Npv),
            p90Npv: toCents(r.monteCarlo.p90Npv),
            meanNpv: toCents(r.monteCarlo.meanNpv),
            probabilityNpvPositive: r.monteCarlo.probabilityNpvPositive,
            histogram: r.monteCarlo.histogram.map((b) => ({ from: toCents(b.from), to: toCents(b.to), count: b.count })),
          },
        }
      : {}),
    ...(v.includeDaily
      ? {
          daily: r.daily.map((d) => ({
            date: d.date,
            cleanliness: r6(d.cleanliness),
            foulingCost: toCents(d.foulingCost),
            cleaningCost: toCents(d.cleaningCost),
          })),
        }
      : {}),
    warnings: r.warnings,
  };
}

/** Checks raw JSON with the input schema first (zod errors name the field). */
export const runScheduleFromJson = (input: unknown): CalcScheduleOutput => runScheduleCommand(calcScheduleInput.parse(input));
