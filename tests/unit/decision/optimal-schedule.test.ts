import { describe, expect, it } from 'vitest';
import { optimiseSchedule } from '@shared/domain/decision/schedule/optimal-schedule.js';
import { priceSchedule } from '@shared/domain/decision/schedule/schedule-pricing.js';
import { baseScenario, mayStart, type ScheduleMethod, type ScheduleProblem } from '@shared/domain/decision/schedule/schedule-problem.js';
import { tableFromCostCurve } from '@shared/domain/decision/schedule/penalty-cost-table.js';
import { mulberry32 } from '@shared/domain/decision/uncertainty/seeded-random.js';
import { bruteForceBest, smallProblem } from './small-schedule-problem.js';

function expectOptimal(problem: ScheduleProblem) {
  const dp = optimiseSchedule(problem);
  const brute = bruteForceBest(problem);
  expect(brute.count).toBeGreaterThan(50);
  expect(dp.objective).toBeCloseTo(brute.cost, 6);
  // the objective is exactly what pricing the returned schedule gives
  expect(priceSchedule(problem, dp.cleanings, baseScenario(problem)).discountedTotals.total).toBeCloseTo(dp.objective, 6);
  return { dp, brute };
}

/** A random small problem from a seed: costs, durations, fouling, outage and discounting all vary. */
function randomProblem(seed: number): ScheduleProblem {
  const r = mulberry32(seed);
  const days = 30;
  const between = (a: number, b: number) => a + (b - a) * r();
  const methods: ScheduleMethod[] = [
    {
      id: 'a',
      cleaningCost: between(2_000, 30_000),
      durationDays: 1 + Math.floor(r() * 3),
      unitDuringCleaning: 'outage',
      deratePct: 0,
      recoveredCleanliness: between(0.85, 0.95),
      foulingRateMultiplier: between(0.7, 1.3),
    },
    {
      id: 'b',
      cleaningCost: between(1_000, 15_000),
      durationDays: 1 + Math.floor(r() * 4),
      unitDuringCleaning: r() < 0.5 ? 'derate' : 'online',
      deratePct: 40,
      recoveredCleanliness: between(0.75, 0.9),
      foulingRateMultiplier: between(0.7, 1.3),
    },
  ];
  for (const m of methods) if (m.unitDuringCleaning !== 'derate') m.deratePct = 0;
  const outageStart = Math.floor(r() * 25);
  return smallProblem(
    {
      methods,
      table: tableFromCostCurve(
        days,
        [
          { cleanliness: 0.4, costPerDay: between(10_000, 40_000) },
          { cleanliness: 0.7, costPerDay: between(2_000, 8_000) },
          { cleanliness: 1.0, costPerDay: 0 },
        ],
        (d) => 1 + 0.6 * Math.sin(d / 4 + seed),
      ),
      plannedOutage: Uint8Array.from({ length: days }, (_, d) => (d >= outageStart && d < outageStart + 4 ? 1 : 0)),
      fouling:
        r() < 0.5
          ? { model: 'linear', ratePerDay: between(0.005, 0.03) }
          : { model: 'asymptotic', maxIndex: between(0.3, 1), timeConstantDays: between(5, 40) },
      initial: { daysSinceCleaning: Math.floor(between(0, 20)), cleanlinessAfterCleaning: between(0.8, 0.92), foulingRateMultiplier: 1 },
      minSpacingDays: 6 + Math.floor(r() * 5),
      discountRate: between(0, 0.2),
    },
    days,
  );
}

describe('least-cost cleaning calendar (dynamic programme)', () => {
  it('finds the same least cost as enumerating every feasible schedule (30 days, 2 methods)', () => {
    expectOptimal(smallProblem({ minSpacingDays: 8 }, 30));
  });

  it('matches brute force on random small cases of both method kinds', () => {
    for (const seed of [1, 2, 3, 4, 5, 6]) expectOptimal(randomProblem(seed));
  });

  it('matches brute force when the load varies and some days have no load (the fouling clock stops on them)', () => {
    for (const seed of [11, 12, 13, 14]) {
      const p = randomProblem(seed);
      const r = mulberry32(seed * 7);
      const load = Float64Array.from({ length: p.days }, () => (r() < 0.15 ? 0 : 0.3 + 0.7 * r()));
      expectOptimal({ ...p, lostGeneration: { ...p.lostGeneration, loadFraction: load } });
    }
  });

  it('a cleaning in a planned outage is not pushed to the outage’s last days: fouling waits while the unit is off line', () => {
    // only the outage method, expensive lost generation, an eight-day planned outage on days 20–27 (one discount year)
    const plannedOutage = Uint8Array.from({ length: 40 }, (_, d) => (d >= 20 && d <= 27 ? 1 : 0));
    const p = smallProblem(
      {
        methods: [smallProblem().methods[0]!],
        plannedOutage,
        yearIndex: new Int32Array(40),
        lostGeneration: { ...smallProblem().lostGeneration, ratingMw: 500, replacementPricePerMwh: new Float64Array(40).fill(200) },
        minSpacingDays: 8,
      },
      40,
    );
    // with the clock stopped, every start inside the outage leaves the same cleanliness on the first day back
    const totals = [20, 22, 24, 26].map((start) => priceSchedule(p, [{ startDay: start, methodId: 'outage-wash' }], baseScenario(p)).discountedTotals.total);
    for (const t of totals) expect(t).toBeCloseTo(totals[0]!, 6);
    const inOutage = optimiseSchedule(p).cleanings.filter((c) => c.startDay >= 20 && c.startDay <= 27);
    expect(inOutage).toHaveLength(1);
    // among equal choices the earliest is kept, so the rest of the outage stays free for the work
    expect(inOutage[0]?.startDay).toBe(20);
  });

  it('matches brute force when windows restrict when each method may run', () => {
    const p = smallProblem(
      {
        minSpacingDays: 7,
        windows: [
          { fromDay: 2, toDay: 16 },
          { fromDay: 19, toDay: 35 },
        ],
        methods: smallProblem().methods.map((m) => (m.id === 'derate-brush' ? { ...m, windows: [{ fromDay: 25, toDay: 39 }] } : m)),
      },
      40,
    );
    const { dp } = expectOptimal(p);
    for (const c of dp.cleanings)
      expect(
        mayStart(
          p,
          p.methods.find((m) => m.id === c.methodId)!,
          c.startDay,
        ),
      ).toBe(true);
  });

  it('still finds the optimum when cost does not rise with age (dominance pruning is switched off)', () => {
    // a negative fouling rate makes cleanliness improve with age, which breaks the pruning's premise
    expectOptimal(smallProblem({ minSpacingDays: 8, fouling: { model: 'falling-rate', coefficient: -0.02, exponent: 0.5 } }, 30));
  });

  it('keeps the minimum spacing between the starts of cleanings', () => {
    const p = smallProblem({ minSpacingDays: 12, fouling: { model: 'linear', ratePerDay: 0.05 } }, 60);
    const { cleanings } = optimiseSchedule(p);
    expect(cleanings.length).toBeGreaterThan(1);
    let last = -p.initial.daysSinceCleaning;
    for (const c of cleanings) {
      expect(c.startDay - last).toBeGreaterThanOrEqual(12);
      last = c.startDay;
    }
  });

  it('does not clean when cleaning costs more than all the fouling it could save', () => {
    const p = smallProblem({ methods: smallProblem().methods.map((m) => ({ ...m, cleaningCost: 1e9 })) }, 40);
    expect(optimiseSchedule(p).cleanings).toEqual([]);
  });

  it('moves an outage cleaning into a planned outage when that saves the downtime', () => {
    // only the outage method, cheap fouling, expensive lost generation: the outage days are the place
    const p = smallProblem(
      {
        methods: [smallProblem().methods[0]!],
        lostGeneration: {
          ratingMw: 500,
          loadFraction: new Float64Array(40).fill(1),
          replacementPricePerMwh: new Float64Array(40).fill(200),
          ownFuelCostPerMwh: new Float64Array(40).fill(20),
          ownCo2CostPerMwh: new Float64Array(40),
        },
        minSpacingDays: 8,
      },
      40,
    );
    const { cleanings } = optimiseSchedule(p);
    expect(cleanings.length).toBeGreaterThan(0);
    const priced = priceSchedule(p, cleanings, baseScenario(p));
    expect(priced.cleanings.every((c) => c.downtimeCost === 0 && c.daysInPlannedOutage === 2)).toBe(true);
  });
});
