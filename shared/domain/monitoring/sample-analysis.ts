/**
 * Everything the product stores for one valid data point (ENGINEERING.md §3–4): cleanliness, TTD,
 * expected backpressure at the reference cleanliness, the deviation breakdown by cause, and the cost per
 * hour of fouling (trend CF against the reference CF, under the point's own CW and duty) and of the
 * unexplained part (measured against the model at the trend CF), each through the turbine curve.
 */
import {
  analyseCondenserPoint,
  backpressureAtCleanlinessKpa,
  deviationBreakdown,
  expectedWithinBounds,
  type CondenserPointResult,
} from '../condenser/index.js';
import { PointRejectedError } from '../validity/rejection-reasons.js';
import { liquidDensityKgM3 } from '../steam/index.js';
import { penaltyBetween, penaltyCostPerHour } from '../turbine/index.js';
import type { UnitModel } from './unit-model.js';

export interface SampleSi {
  loadMw: number;
  backpressureKpa: number;
  cwInletC: number;
  cwOutletC: number;
  cwFlowM3s: number;
}

export interface SampleAnalysis {
  cleanliness: number;
  ttdK: number;
  dutyMw: number;
  expectedBackpressureKpa: number;
  excessBackpressureKpa: number;
  cwInletKpa: number;
  cwFlowKpa: number;
  /** load term plus the measured-duty term */
  loadKpa: number;
  pluggingKpa: number;
  foulingKpa: number;
  unexplainedKpa: number;
  /** heat-rate penalty of the measured backpressure over the expected one at the reference cleanliness, % */
  heatRatePenaltyPct: number;
  foulingCostPerHour: number;
  unexplainedCostPerHour: number;
}

/** Cost per hour of a heat-rate/output penalty, split between the fuel and capacity bases by the capacity-limited share. */
export function blendedCostPerHour(model: UnitModel, loadFraction: number, penalty: { heatRatePenaltyPct: number; outputPenaltyPct: number }): number {
  const e = model.economics;
  const c = penaltyCostPerHour({
    ratingMw: model.ratingMw,
    loadFraction,
    heatRateBtuKwh: model.heatRateBtuKwh,
    heatRatePenaltyPct: penalty.heatRatePenaltyPct,
    outputPenaltyPct: penalty.outputPenaltyPct,
    fuelPricePerMmbtu: e.fuelPricePerMmbtu,
    co2PricePerTonne: e.co2PricePerTonne,
    co2KgPerMmbtu: e.co2KgPerMmbtu,
    replacementPricePerMwh: e.replacementPricePerMwh,
  });
  return (1 - e.capacityLimitedShare) * (c.fuelCostPerHour + c.co2CostPerHour) + e.capacityLimitedShare * c.capacityCostPerHour;
}

/** A model step that a setup outside physical ranges can push past the steam tables: the point is left out with its reason. */
function modelled<T>(step: () => T): T {
  try {
    return step();
  } catch (err) {
    if (err instanceof RangeError && !(err instanceof PointRejectedError))
      throw new PointRejectedError('expected-out-of-range', `the model cannot reproduce this point with the unit's setup: ${err.message}`);
    throw err;
  }
}

/**
 * The model's backpressure at the unit's design point (full-load duty, design CW and cleanliness), refused with
 * PointRejectedError when outside the range a condenser may read: the whole setup is then in doubt, and every
 * point's breakdown would book the gap as its load term.
 */
export function designPointKpa(model: UnitModel): number {
  const d = model.design;
  return expectedWithinBounds(
    () =>
      backpressureAtCleanlinessKpa({
        geometry: model.geometry,
        heiTables: model.heiTables,
        cwInletC: d.cwInletC,
        cwFlowM3s: d.cwMassFlowKgS / liquidDensityKgM3(d.cwInletC),
        dutyMw: d.dutyMw,
        pluggedTubes: d.pluggedTubes,
        cleanliness: d.cleanliness,
      }),
    d.cleanliness,
    'the design point at full load',
  );
}

/**
 * The point's condenser analysis for monitoring: a result outside its plausibility band (cleanliness, tube
 * velocity) rejects the point with its reason, so it stays out of trends and daily medians.
 */
export function plausibleCondenserPoint(model: UnitModel, s: Omit<SampleSi, 'loadMw'>, pluggedTubes: number): CondenserPointResult {
  const point = analyseCondenserPoint({
    backpressureKpa: s.backpressureKpa,
    cwInletC: s.cwInletC,
    cwOutletC: s.cwOutletC,
    cwFlowM3s: s.cwFlowM3s,
    pluggedTubes,
    geometry: model.geometry,
    referenceCleanliness: model.referenceCleanliness,
    heiTables: model.heiTables,
  });
  const [first] = point.implausible;
  if (first) throw new PointRejectedError(first.reason, first.message);
  return point;
}

/**
 * @param trendCleanliness the fitted fouling-trend CF for the point's day; without one the measured CF is used
 * @param pluggedTubes plugged tubes at the point's time (from the event timeline)
 */
export function analyseSample(model: UnitModel, s: SampleSi, pluggedTubes: number, trendCleanliness?: number): SampleAnalysis {
  const point = plausibleCondenserPoint(model, s, pluggedTubes);
  const loadFraction = s.loadMw / model.ratingMw;
  const trend = trendCleanliness ?? point.cleanliness;
  const state = { cwInletC: s.cwInletC, cwMassFlowKgS: point.cwMassFlowKgS, dutyMw: point.dutyMw, pluggedTubes };
  const breakdown = modelled(() =>
    deviationBreakdown({
      geometry: model.geometry,
      heiTables: model.heiTables,
      design: model.design,
      heatBalanceDutyMw: model.heatBalanceDutyMw(loadFraction),
      measured: { ...state, cleanliness: point.cleanliness, backpressureKpa: s.backpressureKpa },
      trendCleanliness: trend,
    }),
  );
  // Every model state must be one a condenser can be in; a setup that puts the design point at hundreds of kPa
  // (a design duty entered for another unit, say) would otherwise book it as the load term of every point.
  expectedWithinBounds(() => breakdown.designFullLoadModelKpa, model.design.cleanliness, 'the design point at full load');
  for (const st of breakdown.states) expectedWithinBounds(() => st.backpressureKpa, st.cleanliness, `state ${st.name} of the breakdown`);
  const line = (cause: string) => breakdown.lines.find((l) => l.cause === cause)?.deltaKpa ?? 0;

  const modelAt = (cleanliness: number) =>
    backpressureAtCleanlinessKpa({
      geometry: model.geometry,
      heiTables: model.heiTables,
      cwInletC: s.cwInletC,
      cwFlowM3s: s.cwFlowM3s,
      dutyMw: point.dutyMw,
      pluggedTubes,
      cleanliness,
    });
  const atTrend = expectedWithinBounds(() => modelAt(trend), trend);
  const atReference = point.expectedBackpressureKpa;
  const foulingPenalty = penaltyBetween(model.curve, loadFraction, atTrend, atReference);
  const unexplainedPenalty = penaltyBetween(model.curve, loadFraction, s.backpressureKpa, atTrend);
  const totalPenalty = penaltyBetween(model.curve, loadFraction, s.backpressureKpa, atReference);

  return {
    cleanliness: point.cleanliness,
    ttdK: point.ttdK,
    dutyMw: point.dutyMw,
    expectedBackpressureKpa: atReference,
    excessBackpressureKpa: s.backpressureKpa - atReference,
    cwInletKpa: line('cw-inlet-temperature'),
    cwFlowKpa: line('cw-flow'),
    loadKpa: line('load') + line('duty'),
    pluggingKpa: line('plugged-tubes'),
    foulingKpa: line('fouling'),
    unexplainedKpa: line('unexplained'),
    heatRatePenaltyPct: totalPenalty.heatRatePenaltyPct,
    foulingCostPerHour: blendedCostPerHour(model, loadFraction, foulingPenalty),
    unexplainedCostPerHour: blendedCostPerHour(model, loadFraction, unexplainedPenalty),
  };
}
