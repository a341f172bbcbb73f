import { describe, expect, it } from 'vitest';
import { monteCarlo, npvUnder, tornado, typicalRanges, type UncertaintyRanges } from '@shared/domain/decision/uncertainty/schedule-uncertainty.js';
import { mulberry32, triangularQuantile } from '@shared/domain/decision/uncertainty/seeded-random.js';
import { optimiseSchedule } from '@shared/domain/decision/schedule/optimal-schedule.js';
import { smallProblem } from './small-schedule-problem.js';

const problem = smallProblem({ yearIndex: new Int32Array(90).map((_, d) => Math.floor(d / 30)) }, 90);
const compared = { problem, proposed: optimiseSchedule(problem).cleanings, baseline: [] };
const fixed = (v: number) => ({ low: v, base: v, high: v });

describe('seeded random numbers and triangular sampling', () => {
  it('the same seed gives the same sequence; another seed another one', () => {
    const a = mulberry32(42);
    const b = mulberry32(42);
    const c = mulberry32(43);
    const sa = Array.from({ length: 5 }, a);
    expect(Array.from({ length: 5 }, b)).toEqual(sa);
    expect(Array.from({ length: 5 }, c)).not.toEqual(sa);
    for (const u of sa) expect(u >= 0 && u < 1).toBe(true);
  });
  it('triangular samples have the textbook mean (low + base + high)/3 and stay in range', () => {
    const r = mulberry32(5);
    let sum = 0;
    let min = Infinity;
    let max = -Infinity;
    const n = 200_000;
    for (let i = 0; i < n; i++) {
      const x = triangularQuantile(2, 3, 7, r());
      min = Math.min(min, x);
      max = Math.max(max, x);
      sum += x;
    }
    expect(min).toBeGreaterThanOrEqual(2);
    expect(max).toBeLessThanOrEqual(7);
    // mean of a triangular distribution [pub: any statistics handbook] = (a + b + c)/3 = 4
    expect(sum / n).toBeCloseTo(4, 2);
    // the CDF at the mode is (mode − low)/(high − low) = 0.2
    expect(triangularQuantile(2, 3, 7, 0.2)).toBeCloseTo(3, 12);
  });
});

describe('sensitivity and Monte Carlo of a chosen schedule', () => {
  it('the tornado ranks inputs by swing and its base NPV is the NPV at base values', () => {
    const ranges = typicalRanges(0.08);
    const t = tornado(compared, ranges);
    expect(t.bars).toHaveLength(6);
    for (let i = 1; i < t.bars.length; i++) expect(t.bars[i - 1]?.swing).toBeGreaterThanOrEqual(t.bars[i]!.swing);
    expect(t.baseNpv).toBeCloseTo(
      npvUnder(compared, { foulingRate: 1, fuelPrice: 1, replacementPrice: 1, cleaningCost: 1, recoveredCleanliness: 0, discountRate: 0.08 }),
      6,
    );
    // faster fouling makes cleaning worth more
    const fouling = t.bars.find((b) => b.input === 'foulingRate')!;
    expect(fouling.npvAtHigh).toBeGreaterThan(fouling.npvAtLow);
    // dearer cleaning makes it worth less
    const cleaning = t.bars.find((b) => b.input === 'cleaningCost')!;
    expect(cleaning.npvAtHigh).toBeLessThan(cleaning.npvAtLow);
  });

  it('is reproducible for a seed and differs for another seed', () => {
    const ranges = typicalRanges(0.08);
    const a = monteCarlo(compared, ranges, 5000, 99);
    expect(monteCarlo(compared, ranges, 5000, 99)).toEqual(a);
    expect(monteCarlo(compared, ranges, 5000, 100).p50Npv).not.toBe(a.p50Npv);
    expect(a.p10Npv).toBeLessThanOrEqual(a.p50Npv);
    expect(a.p50Npv).toBeLessThanOrEqual(a.p90Npv);
    expect(a.probabilityNpvPositive).toBeGreaterThanOrEqual(0);
    expect(a.probabilityNpvPositive).toBeLessThanOrEqual(1);
  });

  it('with every range collapsed to its base, all trials give the base NPV', () => {
    const ranges: UncertaintyRanges = {
      foulingRate: fixed(1),
      fuelPrice: fixed(1),
      replacementPrice: fixed(1),
      cleaningCost: fixed(1),
      recoveredCleanliness: fixed(0),
      discountRate: fixed(0.08),
    };
    const base = tornado(compared, ranges).baseNpv;
    const mc = monteCarlo(compared, ranges, 1000, 3);
    expect(mc.p10Npv).toBeCloseTo(base, 6);
    expect(mc.p90Npv).toBeCloseTo(base, 6);
    expect(mc.probabilityNpvPositive).toBe(base > 0 ? 1 : 0);
  });

  it('re-prices the chosen schedule rather than re-optimising: an absurd cleaning cost makes the NPV negative', () => {
    const ranges = { ...typicalRanges(0.08), cleaningCost: fixed(1000) };
    const mc = monteCarlo(compared, ranges, 1000, 1);
    expect(compared.proposed.length).toBeGreaterThan(0);
    expect(mc.p90Npv).toBeLessThan(0);
    expect(mc.probabilityNpvPositive).toBe(0);
  });

  it('rejects ranges that are not ordered low ≤ base ≤ high', () => {
    expect(() => tornado(compared, { ...typicalRanges(0.08), fuelPrice: { low: 1.2, base: 1, high: 1.3 } })).toThrow(/low ≤ base ≤ high/);
  });
});
