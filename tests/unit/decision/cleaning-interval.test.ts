import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { averageCostPerDay, costVersusInterval, optimalInterval, type CleaningCycle } from '@shared/domain/decision/interval/cleaning-interval.js';

const rate = (c: CleaningCycle, t: number) =>
  c.penalty.model === 'linear'
    ? c.penalty.slopePerDay2 * t
    : c.penalty.model === 'asymptotic'
      ? c.penalty.maxPerDay * (1 - Math.exp(-t / c.penalty.timeConstantDays))
      : NaN;

describe('optimal interval of a repeating cleaning cycle', () => {
  it('at the optimum the fouling cost rate equals the average cost, and nearby intervals cost more (any linear case)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1_000, max: 1_000_000 }),
        fc.integer({ min: 0, max: 200_000 }),
        fc.integer({ min: 0, max: 20 }),
        fc.double({ min: 1, max: 500, noNaN: true }),
        (C, D, tau, k) => {
          const c: CleaningCycle = { cleaningCost: C, downtimeCost: D, downtimeDays: tau, penalty: { model: 'linear', slopePerDay2: k } };
          const r = optimalInterval(c);
          const t = r.optimalIntervalDays!;
          expect(rate(c, t) / r.averageCostPerDay).toBeCloseTo(1, 9);
          expect(averageCostPerDay(c, t * 0.97)).toBeGreaterThan(r.averageCostPerDay);
          expect(averageCostPerDay(c, t * 1.03)).toBeGreaterThan(r.averageCostPerDay);
        },
      ),
      { numRuns: 200, seed: 1 },
    );
  });

  it('the same invariant holds for any asymptotic case that has a finite optimum', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1_000, max: 500_000 }),
        fc.integer({ min: 0, max: 20 }),
        fc.integer({ min: 100, max: 20_000 }),
        fc.integer({ min: 5, max: 400 }),
        (C, tau, pInf, theta) => {
          fc.pre(C < pInf * (theta + tau) * 0.99);
          const c: CleaningCycle = {
            cleaningCost: C,
            downtimeCost: 0,
            downtimeDays: tau,
            penalty: { model: 'asymptotic', maxPerDay: pInf, timeConstantDays: theta },
          };
          const r = optimalInterval(c);
          expect(r.optimalIntervalDays).not.toBeNull();
          expect(rate(c, r.optimalIntervalDays!) / r.averageCostPerDay).toBeCloseTo(1, 6);
          expect(r.averageCostPerDay).toBeLessThan(pInf);
        },
      ),
      { numRuns: 200, seed: 2 },
    );
  });

  it('a tabulated daily cost reproduces the closed-form optimum to within a fraction of a day', () => {
    const costPerDay = Array.from({ length: 600 }, (_, t) => 3000 * (1 - Math.exp(-t / 60)));
    const r = optimalInterval({ cleaningCost: 150_000, downtimeCost: 0, downtimeDays: 0, penalty: { model: 'tabulated', costPerDay } });
    expect(Math.abs(r.optimalIntervalDays! - 194.11)).toBeLessThan(0.1);
    const none = optimalInterval({ cleaningCost: 250_000, downtimeCost: 0, downtimeDays: 0, penalty: { model: 'tabulated', costPerDay } });
    expect(none.optimalIntervalDays).toBeNull();
    expect(none.averageCostPerDay).toBe(costPerDay[599]); // the table holds its last value beyond its end
  });

  it('gives the cost-against-interval curve with its lowest point at the optimum', () => {
    const c: CleaningCycle = { cleaningCost: 150_000, downtimeCost: 0, downtimeDays: 0, penalty: { model: 'linear', slopePerDay2: 50 } };
    const curve = costVersusInterval(c, 200);
    expect(curve).toHaveLength(200);
    const lowest = curve.reduce((a, b) => (b.averageCostPerDay < a.averageCostPerDay ? b : a));
    expect(lowest.intervalDays).toBe(77);
  });

  it('refuses a cleaning that costs nothing and takes no time', () => {
    expect(() => optimalInterval({ cleaningCost: 0, downtimeCost: 0, downtimeDays: 0, penalty: { model: 'linear', slopePerDay2: 1 } })).toThrow(
      /no optimal interval/,
    );
  });
});
