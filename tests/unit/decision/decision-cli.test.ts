import { describe, expect, it } from 'vitest';
import { runCalc } from '@backend/cli/run-calc.js';
import foulingFit from '@backend/cli/commands/fouling-fit.js';
import schedule from '@backend/cli/commands/schedule.js';
import { calcScheduleOutput } from '@shared/schemas/calc-schedule.js';
import interval from '@backend/cli/commands/interval.js';
import cashflow from '@backend/cli/commands/cashflow.js';
import { TYPICAL_CLEANING_METHODS } from '@shared/schemas/cleaning-method.js';

const scheduleInput = {
  startDate: '2027-01-01',
  horizonDays: 365,
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
};

describe('decision commands of the calculation CLI', () => {
  it('interval and cashflow answer an array of inputs with one result each, errors in place', () => {
    const out = runCalc(
      interval,
      JSON.stringify([{ cleaningCost: 150000, downtimeCost: 0, downtimeDays: 0, penalty: { model: 'linear', slopePerDay2: 50 } }, { cleaningCost: 1 }]),
    );
    expect(out.failed).toBe(true);
    const parsed = JSON.parse(out.output);
    expect(parsed[0]).toEqual({ optimalIntervalDays: 77.459667, averageCostPerDay: 3872.98 });
    expect(parsed[1].error).toMatch(/downtimeCost/);
    expect(() => cashflow.run({ rate: 0.1, cashflows: [-1, 2], extra: true })).toThrow();
  });

  it('cashflow: a first year that costs money after a zero at t = 0 pays back when the cumulative flow turns for good', () => {
    // [derived] cumulative 0, −100, −40, +20 → 2 + 40/60 years (ENGINEERING.md §7)
    expect(cashflow.run({ rate: 0, cashflows: [0, -100, 60, 60] })).toMatchObject({ paybackYears: 2.666667, discountedPaybackYears: 2.666667 });
    expect(cashflow.run({ rate: 0.05, cashflows: [10, -20] })).toMatchObject({ paybackYears: null, discountedPaybackYears: null });
  });

  it('fouling-fit fits, forecasts and reports the chosen model', () => {
    const points = Array.from({ length: 40 }, (_, day) => ({ day, cleanliness: 1 / (1 / 0.9 + 0.003 * day) }));
    const out = foulingFit.run({ points, cleanlinessAfterCleaning: 0.9, uCleanWm2K: 3500, forecastDays: 20 }) as {
      status: string;
      chosen: { model: string; parameters: Record<string, number>; foulingResistance: Record<string, number> };
      forecast: { day: number }[];
    };
    expect(out.status).toBe('fitted');
    expect(out.chosen.model).toBe('linear');
    expect(out.chosen.parameters.ratePerDay).toBeCloseTo(0.003, 8);
    // Rf rate = y rate / U_clean [derived]
    expect(out.chosen.foulingResistance.rfRateM2KWPerDay).toBeCloseTo(0.003 / 3500, 12);
    expect(out.forecast).toHaveLength(60);
  });

  it('fouling-fit answers "not enough data" as a result, not an error', () => {
    const out = runCalc(
      foulingFit,
      JSON.stringify({
        points: [
          { day: 0, cleanliness: 0.9 },
          { day: 1, cleanliness: 0.89 },
        ],
      }),
    );
    expect(out.failed).toBe(false);
    expect(JSON.parse(out.output)).toMatchObject({ status: 'not-enough-data', minimumPoints: 10, minimumSpanDays: 14 });
  });

  it('schedule returns cleanings with dates and cautions, a baseline and a business case consistent with it', () => {
    const out = schedule.run({ ...scheduleInput, includeDaily: true }) as {
      cleanings: { date: string; methodId: string; cautions: string[]; cleaningCost: number }[];
      discountedTotals: { total: number };
      baseline: { discountedTotals: { total: number }; cleanings: { date: string }[] };
      businessCase: { npv: number; cashflows: number[] };
      daily: { date: string }[];
      warnings: string[];
    };
    expect(out.cleanings.length).toBeGreaterThan(0);
    for (const c of out.cleanings) expect(c.date).toMatch(/^2027-\d{2}-\d{2}$/);
    expect(out.cleanings[0]?.cautions[0]).toMatch(/local codes/);
    expect(out.baseline.cleanings[0]?.date).toBe('2027-04-05');
    expect(out.daily).toHaveLength(365);
    expect(out.daily[364]?.date).toBe('2027-12-31');
    // the optimiser never does worse than the baseline, and the NPV is the difference of discounted totals
    expect(out.discountedTotals.total).toBeLessThanOrEqual(out.baseline.discountedTotals.total + 0.01);
    expect(Math.abs(out.businessCase.npv - (out.baseline.discountedTotals.total - out.discountedTotals.total))).toBeLessThanOrEqual(0.02);
    expect(out.warnings.some((w) => /generic exhaust-pressure correction curve/.test(w))).toBe(true);
    expect(out.warnings.some((w) => /typical values/.test(w))).toBe(true);
    // HP lancing with 18,000 tubes: $25,000 + $4 × 18,000 (typical values)
    const lancing = out.cleanings.find((c) => c.methodId === 'hp-water-lancing');
    if (lancing) expect(lancing.cleaningCost).toBe(97_000);
  });

  it('schedule: a cleaning’s downtime is what the unit would have made at that day’s load and cannot', () => {
    const baselineOf = (loadFraction: number) =>
      schedule.run({
        ...scheduleInput,
        drivers: { ...scheduleInput.drivers, loadFraction },
        includeDaily: false,
        baseline: {
          kind: 'fixed',
          cleanings: [
            { date: '2027-03-01', methodId: 'hp-water-lancing' },
            { date: '2027-09-01', methodId: 'half-condenser-online' },
          ],
        },
      }) as { baseline: { cleanings: { methodId: string; downtimeCost: number }[]; totals: { downtimeCost: number } } };
    // [derived] a lost MWh is worth 60 − 9.5 MMBtu/MWh × 3.5 = 26.75; both typical methods take 4 days
    const perMwh = 60 - 9.5 * 3.5;
    const at85 = baselineOf(0.85).baseline;
    // outage: load × rating × 24 h; derate 50 %: max(0, load − 0.5) × rating × 24 h
    expect(at85.cleanings[0]?.downtimeCost).toBeCloseTo(0.85 * 300 * 24 * 4 * perMwh, 2);
    expect(at85.cleanings[1]?.downtimeCost).toBeCloseTo((0.85 - 0.5) * 300 * 24 * 4 * perMwh, 2);
    expect(at85.totals.downtimeCost).toBeCloseTo((0.85 + 0.35) * 300 * 24 * 4 * perMwh, 2);
    // below the derated limit the derate cleaning loses nothing
    expect(baselineOf(0.45).baseline.cleanings[1]?.downtimeCost).toBe(0);
  });

  it('schedule: days without load stop the fouling clock and carry no fouling cost', () => {
    const load = Array.from({ length: 365 }, (_, d) => (d >= 150 && d < 160 ? 0 : 0.85));
    const noCleaning = { ...TYPICAL_CLEANING_METHODS.find((m) => m.id === 'hp-water-lancing')!, fixedCost: 1e9 };
    const out = schedule.run({
      ...scheduleInput,
      drivers: { ...scheduleInput.drivers, loadFraction: { daily: load } },
      methods: [noCleaning],
      plannedOutages: [],
      baseline: { kind: 'never' },
    }) as {
      cleanings: unknown[];
      daily: { cleanliness: number; foulingCost: number }[];
    };
    expect(out.cleanings).toEqual([]);
    for (let d = 150; d < 160; d++) {
      expect(out.daily[d]?.foulingCost).toBe(0);
      expect(out.daily[d + 1]?.cleanliness).toBe(out.daily[150]!.cleanliness);
    }
    expect(out.daily[149]?.cleanliness).toBeGreaterThan(out.daily[150]!.cleanliness);
    expect(out.daily[161]?.cleanliness).toBeLessThan(out.daily[160]!.cleanliness);
  });

  it('schedule with uncertainty is reproducible for a seed', () => {
    const input = { ...scheduleInput, includeDaily: false, uncertainty: { trials: 1000, seed: 5 } };
    const a = schedule.run(input) as { monteCarlo: unknown; sensitivity: { bars: unknown[] } };
    expect(schedule.run(input)).toEqual(a);
    expect(a.sensitivity.bars).toHaveLength(6);
  });

  it('schedule answers the declared output schema, and its Monte Carlo histogram counts every trial between the lowest and highest NPV', () => {
    const out = calcScheduleOutput.parse(schedule.run({ ...scheduleInput, includeDaily: true, uncertainty: { trials: 1000, seed: 5 } }));
    const mc = out.monteCarlo!;
    expect(mc.histogram.reduce((n, b) => n + b.count, 0)).toBe(1000);
    expect(mc.histogram[0]?.from).toBeLessThanOrEqual(mc.p10Npv);
    expect(mc.histogram[mc.histogram.length - 1]?.to).toBeGreaterThanOrEqual(mc.p90Npv);
    for (let i = 1; i < mc.histogram.length; i++) expect(mc.histogram[i]?.from).toBeCloseTo(mc.histogram[i - 1]!.to, 1);
  });

  it('schedule accepts a simplified direct penalty curve, and refuses both models at once', () => {
    const { condenser: _condenser, ...unit } = scheduleInput.unit;
    const direct = {
      ...scheduleInput,
      unit: { ...unit, activeTubes: 10_000 },
      directPenalty: {
        points: [
          { cleanliness: 0.5, costPerDay: 20_000 },
          { cleanliness: 0.92, costPerDay: 0 },
        ],
      },
      includeDaily: false,
    };
    const out = schedule.run(direct) as { cleanings: unknown[]; warnings: string[] };
    expect(out.warnings.some((w) => /simplified direct penalty/.test(w))).toBe(true);
    expect(() => schedule.run({ ...direct, unit: scheduleInput.unit })).toThrow(/either unit.condenser/);
  });

  it('schedule names an unknown library method', () => {
    expect(() => schedule.run({ ...scheduleInput, methods: ['pressure-washer-9000'] })).toThrow(/not in the typical library/);
  });
});
