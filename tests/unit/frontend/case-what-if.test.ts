import { describe, expect, it } from 'vitest';
import { calculateCase } from '@backend/services/cases/calculate-case.js';
import { calcScheduleInput, type CalcScheduleInput } from '@shared/schemas/calc-schedule.js';
import { answer, computeFigures } from '@frontend/features/cases/what-if/what-if-compute';
import { intervalCurve } from '@frontend/features/cases/components/interval-curve';

// A fixed case (our own fictional unit): what a case's `inputs` hold after the server's prefill.
const inputs = {
  startDate: '2027-01-01',
  horizonDays: 730,
  drivers: {
    cwInletC: { monthly: [8, 9, 12, 16, 20, 25, 28, 28, 24, 18, 12, 9] },
    loadFraction: 0.85,
    fuelPricePerMmbtu: 3.5,
    replacementPricePerMwh: 60,
  },
  unit: {
    ratingMw: 300,
    heatRateBtuKwh: 9500,
    condenser: { surfaceM2: 17000, tubeCount: 18000, passes: 2, tubeOdMm: 25.4, tubeBwg: 22, tubeMaterial: 'titanium', cwFlowM3s: 15, designDutyMw: 480 },
  },
  fouling: { model: 'linear', ratePerDay: 0.004 },
  initial: { daysSinceCleaning: 30, cleanlinessAfterCleaning: 0.9 },
  methods: ['hp-water-lancing', 'half-condenser-online'],
  plannedOutages: [{ from: '2027-04-05', to: '2027-04-25' }],
  minSpacingDays: 30,
  discountRate: 0.08,
  baseline: { kind: 'next-planned-outage', methodId: 'hp-water-lancing' },
  uncertainty: { trials: 1000, seed: 7 },
} as unknown as CalcScheduleInput;

const server = () => calculateCase(calcScheduleInput.parse(inputs), 400, 'The case cannot be computed');

describe("the case page's what-if computation", () => {
  it('when the browser recomputes a case, its NPV and first cleaning equal the figures the server stores for the same inputs', () => {
    const stored = server();
    const quick = computeFigures(inputs);
    expect(stored.cleanings.length).toBeGreaterThan(0);
    expect(quick.businessCase.npv).toBe(stored.businessCase.npv);
    expect(quick.cleanings[0]).toEqual(stored.cleanings[0]);
    // the quick pass leaves out only the uncertainty
    expect(quick.monteCarlo).toBeUndefined();
    expect(quick.daily).toEqual(stored.daily);
  });

  it('when the uncertainty pass finishes, the whole answer is the server’s, Monte Carlo percentiles included', () => {
    const full = answer({ id: 1, pass: 'uncertainty', inputs });
    expect(full.ok).toBe(true);
    if (!full.ok) return;
    expect(full.results).toEqual(server());
    expect(full.results.monteCarlo?.p50Npv).toBe(server().monteCarlo?.p50Npv);
  });

  it('when the fuel price doubles, the what-if NPV changes', () => {
    const dearer = { ...inputs, drivers: { ...inputs.drivers, fuelPricePerMmbtu: 7 } };
    expect(computeFigures(dearer).businessCase.npv).not.toBe(computeFigures(inputs).businessCase.npv);
  });

  it('inputs the server would refuse answer why, in place of figures', () => {
    const bad = answer({ id: 2, pass: 'figures', inputs: { ...inputs, discountRate: -2 } });
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    expect(bad.message).toMatch(/discountRate/);
  });

  it('the cost-against-interval curve is lowest at the least-cost interval it reports', () => {
    const curve = intervalCurve(server(), inputs);
    expect(curve.ok).toBe(true);
    if (!curve.ok || curve.optimum.optimalIntervalDays === null) return;
    const lowest = curve.points.reduce((a, b) => (b.averageCostPerDay < a.averageCostPerDay ? b : a));
    // whole-day (or two-day) steps of the curve around the refined optimum
    expect(Math.abs(lowest.intervalDays - curve.optimum.optimalIntervalDays)).toBeLessThanOrEqual(2);
    expect(lowest.averageCostPerDay).toBeGreaterThanOrEqual(curve.optimum.averageCostPerDay - 1e-6);
  });
});
