/**
 * A what-if on the case page: the computation the page's worker runs after an edit (shared/domain, the same
 * `runScheduleCommand` as the server), on a case shaped like a demo prefill: two years, monthly CW inlet and load,
 * the five typical methods, one planned outage, 5,000 Monte Carlo trials. The quick figures (no uncertainty)
 * must be on screen within 300 ms; the Monte Carlo may follow within 2 s. Median of five after one warm-up,
 * one core, as a warmed worker runs it.
 */
import type { BenchRow } from '../run.js';
import { TYPICAL_CLEANING_METHODS } from '../../shared/schemas/cleaning-method.js';
import type { CalcScheduleInput } from '../../shared/schemas/calc-schedule.js';
import { computeAll, computeFigures } from '../../frontend/src/features/cases/what-if/what-if-compute.js';

const inputs = (fuelPrice: number) =>
  ({
    startDate: '2026-01-02',
    horizonDays: 730,
    drivers: {
      cwInletC: { monthly: [7, 8, 11, 15, 20, 25, 28, 28, 24, 18, 12, 8] },
      loadFraction: { monthly: [0.86, 0.84, 0.8, 0.76, 0.8, 0.9, 0.95, 0.95, 0.86, 0.78, 0.82, 0.86] },
      fuelPricePerMmbtu: fuelPrice,
      replacementPricePerMwh: 52,
      co2PricePerTonne: 0,
    },
    unit: {
      ratingMw: 620,
      heatRateBtuKwh: 9650,
      co2KgPerMmbtu: 97.17,
      condenser: {
        surfaceM2: 30_000,
        tubeCount: 28_000,
        passes: 2,
        tubeOdMm: 25.4,
        tubeBwg: 22,
        tubeMaterial: 'titanium',
        pluggedTubes: 300,
        cwFlowM3s: 22,
        designDutyMw: 900,
      },
    },
    fouling: { model: 'asymptotic', maxIndex: 0.6, timeConstantDays: 158 },
    initial: { daysSinceCleaning: 592, cleanlinessAfterCleaning: 0.93 },
    methods: TYPICAL_CLEANING_METHODS.map((m) => m.id),
    plannedOutages: [{ from: '2026-04-06', to: '2026-04-26' }],
    discountRate: 0.08,
    uncertainty: { trials: 5000, seed: 1 },
  }) as unknown as CalcScheduleInput;

function medianMs(f: (run: number) => unknown): number {
  f(0);
  const times: number[] = [];
  for (let run = 1; run <= 5; run++) {
    const t0 = performance.now();
    f(run);
    times.push(performance.now() - t0);
  }
  return times.sort((a, b) => a - b)[2]!;
}

export default async (): Promise<BenchRow[]> => [
  {
    name: 'case what-if: figures after an edit (schedule, business case, daily path; browser worker), median',
    value: medianMs((run) => computeFigures(inputs(4 + run / 10))),
    unit: 'ms',
    target: { value: 300, higherIsBetter: false },
  },
  {
    name: 'case what-if: with sensitivity and 5,000 Monte Carlo trials, median',
    value: medianMs((run) => computeAll(inputs(4 + run / 10))),
    unit: 'ms',
    target: { value: 2000, higherIsBetter: false },
  },
];
