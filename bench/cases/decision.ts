/**
 * Decision-engine speed: a five-year daily schedule with four methods (building the per-day penalty tables from
 * the condenser and turbine models included), and 10,000 Monte Carlo trials of a one-year case. One core.
 */
import type { BenchRow } from '../run.js';
import { TYPICAL_CLEANING_METHODS } from '../../shared/schemas/cleaning-method.js';
import { assembleCase, type ScheduleCaseSpec } from '../../shared/domain/decision/schedule/schedule-case.js';
import { optimiseSchedule } from '../../shared/domain/decision/schedule/optimal-schedule.js';
import { monteCarlo, typicalRanges } from '../../shared/domain/decision/uncertainty/schedule-uncertainty.js';

function spec(horizonDays: number, methodIds: string[]): ScheduleCaseSpec {
  return {
    startDate: '2027-01-01',
    horizonDays,
    drivers: {
      cwInletC: { monthly: [8, 9, 12, 16, 20, 25, 28, 28, 24, 18, 12, 9] },
      loadFraction: { monthly: [0.85, 0.8, 0.75, 0.7, 0.8, 0.9, 0.95, 0.95, 0.85, 0.75, 0.8, 0.85] },
      fuelPricePerMmbtu: { monthly: [4, 4, 3.5, 3, 3, 3.2, 3.6, 3.6, 3.2, 3, 3.4, 4] },
      replacementPricePerMwh: { monthly: [60, 58, 50, 45, 48, 65, 85, 85, 60, 48, 52, 60] },
      co2PricePerTonne: 0,
    },
    penalty: {
      kind: 'models',
      unit: {
        geometry: { surfaceM2: 17_000, tubeCount: 18_000, passes: 2, tubeOdMm: 25.4, tubeBwg: 18, tubeMaterial: 'titanium' },
        cwFlowM3s: 15,
        designDutyMw: 480,
        pluggedTubes: 200,
        ratingMw: 300,
        heatRateBtuKwh: 9500,
        co2KgPerMmbtu: 93.28,
        capacityLimitedShare: 0.2,
      },
    },
    economics: { ratingMw: 300, heatRateBtuKwh: 9500, co2KgPerMmbtu: 93.28, activeTubes: 17_800 },
    fouling: { model: 'asymptotic', maxIndex: 0.9, timeConstantDays: 120 },
    initial: { daysSinceCleaning: 60, cleanlinessAfterCleaning: 0.9, foulingRateMultiplier: 1 },
    methods: TYPICAL_CLEANING_METHODS.filter((m) => methodIds.includes(m.id)),
    plannedOutages: [
      { from: '2027-04-05', to: '2027-04-25' },
      { from: '2028-10-02', to: '2028-10-22' },
      { from: '2030-04-01', to: '2030-04-28' },
    ],
    minSpacingDays: 30,
    discountRate: 0.08,
  };
}

/** Median wall time of `runs` calls (the machine is shared, so single runs are noisy). */
function medianMs(runs: number, f: () => unknown): number {
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    f();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[runs >> 1]!;
}

export default async (): Promise<BenchRow[]> => {
  const fourMethods = ['sponge-ball-campaign', 'hp-water-lancing', 'chemical-descaling', 'half-condenser-online'];
  // One warm-up run so the figure is the steady cost, as in the app's server process.
  optimiseSchedule(assembleCase(spec(365, fourMethods)).problem);
  const fiveYearMs = medianMs(5, () => optimiseSchedule(assembleCase(spec(1826, fourMethods)).problem));

  const one = assembleCase(spec(365, fourMethods));
  const proposed = optimiseSchedule(one.problem).cleanings;
  const compared = { problem: one.problem, proposed, baseline: [] };
  monteCarlo(compared, typicalRanges(0.08), 200, 7);
  const monteCarloMs = medianMs(3, () => monteCarlo(compared, typicalRanges(0.08), 10_000, 7));

  return [
    {
      name: 'decision: 5-year daily schedule, 4 methods (tables + DP, median of 5)',
      value: fiveYearMs,
      unit: 'ms',
      target: { value: 200, higherIsBetter: false },
    },
    { name: 'decision: 10,000 Monte Carlo trials, 1-year case (median of 3)', value: monteCarloMs, unit: 'ms', target: { value: 2000, higherIsBetter: false } },
  ];
};
