import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { benefitCostRatio, discountedPaybackYears, irr, npv, paybackYears, toCents } from '@shared/domain/decision/economics/cash-flow-metrics.js';

describe('NPV', () => {
  it('discounts values[k] by (1 + r)^k with values[0] undiscounted at t = 0', () => {
    // closed form [derived]: −1000 + 600/1.1 + 600/1.21 = 41.3223…
    expect(npv(0.1, [-1000, 600, 600]).toNumber()).toBeCloseTo(-1000 + 600 / 1.1 + 600 / 1.21, 10);
  });
  it('rejects a rate of −100 % or below', () => {
    expect(() => npv(-1, [1, 2])).toThrow(/above −1/);
  });
});

describe('IRR', () => {
  it('when the flows change sign twice and two rates zero the NPV, no IRR is reported and the reason says so', () => {
    // −100 + 230x − 132x² has roots x = 1/1.1 and 1/1.2, i.e. 10 % and 20 % [derived]
    const r = irr([-100, 230, -132]);
    expect(r.irr).toBeNull();
    expect(r.reason).toMatch(/2 different rates/);
  });
  it('when the flows change sign twice but only one rate above −100 % zeroes the NPV, it is reported', () => {
    // [derived] 100·(x − 0.8)·(x² − x + 1) = −80 + 180x − 180x² + 100x³: three sign changes, but x² − x + 1 has
    // no real root, so x = 0.8 (r = 25 %) is the only one; Sturm's count must find exactly one.
    const flows = [-80, 180, -180, 100];
    const r = irr(flows);
    expect(r.irr?.toNumber()).toBeCloseTo(1 / 0.8 - 1, 12);
  });
  it('when the flows never change sign, there is no IRR', () => {
    expect(irr([100, 10, 10]).irr).toBeNull();
    expect(irr([-100, -10]).reason).toMatch(/never change sign/);
  });
  it('a reported IRR zeroes the NPV for any investment followed by positive returns (one sign change)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1_000_000 }),
        fc.array(fc.integer({ min: 0, max: 500_000 }), { minLength: 1, maxLength: 12 }),
        (invest, returns) => {
          fc.pre(returns.some((v) => v > 0));
          const flows = [-invest, ...returns];
          const r = irr(flows);
          expect(r.irr).not.toBeNull();
          expect(r.irr!.toNumber()).toBeGreaterThan(-1);
          expect(Math.abs(npv(r.irr!, flows).toNumber())).toBeLessThan(1e-6 * invest);
        },
      ),
      { numRuns: 60, seed: 20261201 },
    );
  });
});

describe('payback', () => {
  it('is 0 only when the cumulative flow is never negative', () => {
    expect(paybackYears([0, 10])).toBe(0);
    expect(discountedPaybackYears(0.1, [5, -1])).toBe(0);
  });
  it('when nothing is spent at t = 0 but the first year costs money, payback is when the cumulative flow turns for good', () => {
    // [derived] cumulative 0, −100, −40, +20: it crosses zero 40/60 into year 3 → 2 + 2/3 years (ENGINEERING.md §7)
    expect(paybackYears([0, -100, 60, 60])).toBeCloseTo(2 + 2 / 3, 12);
    // [derived] discounted at 10 %: 0, −90.909, −41.322, +3.757 → 2 + 41.322/45.079
    const expected = 2 + (100 / 1.1 - 60 / 1.21) / (60 / 1.331);
    expect(discountedPaybackYears(0.1, [0, -100, 60, 60])).toBeCloseTo(expected, 10);
  });
  it('when the cumulative flow turns positive and dips again, payback is the last crossing', () => {
    // [derived] cumulative −100, +100, −50, +50: negative again in year 2, for good from 2 + 50/100 years
    expect(paybackYears([-100, 200, -150, 100])).toBeCloseTo(2.5, 12);
  });
  it('when the cumulative flow starts positive and ends negative, there is no payback', () => {
    expect(paybackYears([10, -20])).toBeNull();
    expect(paybackYears([-100, 200, -150])).toBeNull();
    expect(discountedPaybackYears(0.1, [0, 50, -60])).toBeNull();
  });
  it('spreads each year evenly: −100 then 40 a year pays back at 2.5 years', () => {
    expect(paybackYears([-100, 40, 40, 40])).toBeCloseTo(2.5, 12);
  });
  it('discounted payback comes later than simple payback and uses discounted flows', () => {
    // [derived] discounted flows at 10 %: 36.36, 33.06, 30.05, 27.32 → cumulative −100 reaches 0 during year 4:
    // 3 + (100 − 36.3636 − 33.0579 − 30.0526)/27.3205
    const expected = 3 + (100 - 40 / 1.1 - 40 / 1.21 - 40 / 1.331) / (40 / 1.4641);
    expect(discountedPaybackYears(0.1, [-100, 40, 40, 40, 40])).toBeCloseTo(expected, 10);
    expect(paybackYears([-100, 40, 40, 40, 40])!).toBeLessThan(expected);
  });
  it('is null when the cumulative flow never reaches zero', () => {
    expect(paybackYears([-100, 10, 10])).toBeNull();
  });
});

describe('benefit–cost ratio and rounding', () => {
  it('is benefits over costs, and null when the costs are not positive', () => {
    expect(benefitCostRatio(150, 100)?.toNumber()).toBe(1.5);
    expect(benefitCostRatio(150, 0)).toBeNull();
  });
  it('rounds money half away from zero to cents', () => {
    expect(toCents('2.345')).toBe(2.35);
    expect(toCents('-2.345')).toBe(-2.35);
  });
});
