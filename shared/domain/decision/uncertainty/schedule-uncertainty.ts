/**
 * Sensitivity (tornado) and seeded Monte Carlo of a chosen schedule's NPV against its baseline. Each case
 * re-prices the same two schedules under changed inputs; nothing is re-optimised. Inputs vary independently,
 * each on a triangular distribution built from its low / base / high values. Trial NPVs are computed in double
 * precision (far finer than a cent at these magnitudes); the business case itself is in decimal.js.
 */
import type { PlannedCleaning, PricingScenario, ScheduleProblem } from '../schedule/schedule-problem.js';
import { compileSchedulePricer, type SchedulePricer } from '../schedule/fast-repricing.js';
import { quantileSorted } from '../../statistics.js';
import { mulberry32, triangularQuantile } from './seeded-random.js';

export const UNCERTAIN_INPUTS = ['foulingRate', 'fuelPrice', 'replacementPrice', 'cleaningCost', 'recoveredCleanliness', 'discountRate'] as const;
export type UncertainInput = (typeof UNCERTAIN_INPUTS)[number];

export interface LowBaseHigh {
  low: number;
  base: number;
  high: number;
}

/**
 * foulingRate, fuelPrice, replacementPrice and cleaningCost are multipliers (base normally 1);
 * recoveredCleanliness is a shift added to every method's recovered cleanliness (base normally 0);
 * discountRate is the rate itself.
 */
export type UncertaintyRanges = Record<UncertainInput, LowBaseHigh>;

/** Spreads of common practice (typical order of magnitude, not from a source); replace with the plant's own. */
export function typicalRanges(discountRate: number): UncertaintyRanges {
  return {
    foulingRate: { low: 0.7, base: 1, high: 1.4 },
    fuelPrice: { low: 0.8, base: 1, high: 1.3 },
    replacementPrice: { low: 0.7, base: 1, high: 1.5 },
    cleaningCost: { low: 0.85, base: 1, high: 1.3 },
    recoveredCleanliness: { low: -0.05, base: 0, high: 0.02 },
    discountRate: { low: Math.max(0, discountRate - 0.03), base: discountRate, high: discountRate + 0.03 },
  };
}

export interface ComparedSchedules {
  problem: ScheduleProblem;
  proposed: readonly PlannedCleaning[];
  baseline: readonly PlannedCleaning[];
  upfrontCost?: number;
}

type InputValues = Record<UncertainInput, number>;

function scenarioOf(v: InputValues): PricingScenario {
  return {
    foulingRateScale: v.foulingRate,
    prices: { fuel: v.fuelPrice, co2: 1, replacement: v.replacementPrice },
    cleaningCostScale: v.cleaningCost,
    recoveredCleanlinessShift: v.recoveredCleanliness,
    discountRate: v.discountRate,
  };
}

interface PreparedComparison {
  proposed: SchedulePricer;
  baseline: SchedulePricer;
  upfrontCost: number;
}

function prepare(c: ComparedSchedules): PreparedComparison {
  return { proposed: compileSchedulePricer(c.problem, c.proposed), baseline: compileSchedulePricer(c.problem, c.baseline), upfrontCost: c.upfrontCost ?? 0 };
}

/** NPV of the proposal against the baseline under one set of inputs (yearly cash flows, year-end discounting). */
function npvPrepared(p: PreparedComparison, v: InputValues): number {
  const scenario = scenarioOf(v);
  const proposed = p.proposed.yearlyTotals(scenario);
  const baseline = p.baseline.yearlyTotals(scenario);
  let value = -p.upfrontCost;
  let factor = 1;
  for (let y = 0; y < proposed.length; y++) {
    factor /= 1 + v.discountRate;
    value += (baseline[y]! - proposed[y]!) * factor;
  }
  return value;
}

export function npvUnder(c: ComparedSchedules, v: InputValues): number {
  return npvPrepared(prepare(c), v);
}

function baseValues(r: UncertaintyRanges): InputValues {
  return Object.fromEntries(UNCERTAIN_INPUTS.map((k) => [k, r[k].base])) as InputValues;
}

function checkRanges(r: UncertaintyRanges): void {
  for (const k of UNCERTAIN_INPUTS) {
    const { low, base, high } = r[k];
    if (!(low <= base && base <= high)) throw new Error(`${k}: low ≤ base ≤ high is required`);
  }
  if (!(r.discountRate.low > -1)) throw new Error('discountRate: the low value must be above −1');
}

export interface TornadoBar {
  input: UncertainInput;
  low: number;
  high: number;
  npvAtLow: number;
  npvAtHigh: number;
  /** |npvAtHigh − npvAtLow| */
  swing: number;
}

export interface Tornado {
  baseNpv: number;
  /** widest swing first */
  bars: TornadoBar[];
}

export function tornado(c: ComparedSchedules, ranges: UncertaintyRanges): Tornado {
  checkRanges(ranges);
  const base = baseValues(ranges);
  const prepared = prepare(c);
  const bars = UNCERTAIN_INPUTS.map((input) => {
    const npvAtLow = npvPrepared(prepared, { ...base, [input]: ranges[input].low });
    const npvAtHigh = npvPrepared(prepared, { ...base, [input]: ranges[input].high });
    return { input, low: ranges[input].low, high: ranges[input].high, npvAtLow, npvAtHigh, swing: Math.abs(npvAtHigh - npvAtLow) };
  });
  bars.sort((a, b) => b.swing - a.swing || UNCERTAIN_INPUTS.indexOf(a.input) - UNCERTAIN_INPUTS.indexOf(b.input));
  return { baseNpv: npvPrepared(prepared, base), bars };
}

export interface MonteCarloSummary {
  trials: number;
  seed: number;
  p10Npv: number;
  p50Npv: number;
  p90Npv: number;
  meanNpv: number;
  probabilityNpvPositive: number;
  /** the trials' NPVs in equal-width bins from the lowest to the highest, for the distribution chart */
  histogram: { from: number; to: number; count: number }[];
}

const HISTOGRAM_BINS = 24;

function histogramOf(sorted: Float64Array): MonteCarloSummary['histogram'] {
  const lo = sorted[0]!;
  const hi = sorted[sorted.length - 1]!;
  if (!(hi > lo)) return [{ from: lo, to: hi, count: sorted.length }];
  const width = (hi - lo) / HISTOGRAM_BINS;
  const bins = Array.from({ length: HISTOGRAM_BINS }, (_, i) => ({ from: lo + i * width, to: i === HISTOGRAM_BINS - 1 ? hi : lo + (i + 1) * width, count: 0 }));
  for (const v of sorted) bins[Math.min(HISTOGRAM_BINS - 1, Math.floor((v - lo) / width))]!.count++;
  return bins;
}

/** Seeded Monte Carlo: the same seed, ranges and schedules give the same figures. */
export function monteCarlo(c: ComparedSchedules, ranges: UncertaintyRanges, trials: number, seed: number): MonteCarloSummary {
  checkRanges(ranges);
  if (!(Number.isInteger(trials) && trials >= 1)) throw new Error('trials must be a whole number, at least 1');
  const prepared = prepare(c);
  const random = mulberry32(seed);
  const results = new Float64Array(trials);
  let positive = 0;
  let sum = 0;
  for (let t = 0; t < trials; t++) {
    const v = {} as InputValues;
    for (const k of UNCERTAIN_INPUTS) v[k] = triangularQuantile(ranges[k].low, ranges[k].base, ranges[k].high, random());
    const value = npvPrepared(prepared, v);
    results[t] = value;
    sum += value;
    if (value > 0) positive++;
  }
  results.sort();
  return {
    trials,
    seed,
    p10Npv: quantileSorted(results, 0.1),
    p50Npv: quantileSorted(results, 0.5),
    p90Npv: quantileSorted(results, 0.9),
    meanNpv: sum / trials,
    probabilityNpvPositive: positive / trials,
    histogram: histogramOf(results),
  };
}
