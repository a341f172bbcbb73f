import { describe, expect, it } from 'vitest';
import { fitFoulingTrend, MINIMUM_TREND_POINTS, MINIMUM_TREND_SPAN_DAYS, type CleanlinessDay } from '@shared/domain/decision/fouling/fouling-trend.js';
import { cleanlinessAfter, type FoulingModel } from '@shared/domain/decision/fouling/fouling-models.js';
import { mulberry32 } from '@shared/domain/decision/uncertainty/seeded-random.js';

/** Synthetic daily cleanliness from a known model, with seeded uniform noise of ± noise. */
function synthetic(model: FoulingModel, cf0: number, days: number[], noise: number, seed = 11): CleanlinessDay[] {
  const random = mulberry32(seed);
  return days.map((day) => ({ day, cleanliness: cleanlinessAfter(model, cf0, day) + noise * (2 * random() - 1) }));
}

const range = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, i) => from + i);

describe('fouling trend fit', () => {
  it('recovers an asymptotic (Kern–Seaton) trend and prefers it by AIC', () => {
    const truth: FoulingModel = { model: 'asymptotic', maxIndex: 0.4, timeConstantDays: 30 };
    const r = fitFoulingTrend({ points: synthetic(truth, 0.9, range(0, 120), 0.002), cleanlinessAfterCleaning: 0.9 });
    expect(r.status).toBe('fitted');
    if (r.status !== 'fitted') return;
    expect(r.chosen.model.model).toBe('asymptotic');
    const m = r.chosen.model as Extract<FoulingModel, { model: 'asymptotic' }>;
    expect(m.maxIndex).toBeCloseTo(0.4, 1);
    expect(m.timeConstantDays / 30).toBeGreaterThan(0.9);
    expect(m.timeConstantDays / 30).toBeLessThan(1.1);
    expect(r.chosen.rSquared).toBeGreaterThan(0.99);
    // uniform noise of ±0.002 has a standard deviation of 0.002/√3
    expect(r.chosen.residualStdCleanliness).toBeLessThan(0.0015);
  });

  it('recovers a linear trend and does not pay extra parameters for it', () => {
    const truth: FoulingModel = { model: 'linear', ratePerDay: 0.004 };
    const r = fitFoulingTrend({ points: synthetic(truth, 0.88, range(0, 45), 0.001), cleanlinessAfterCleaning: 0.88 });
    if (r.status !== 'fitted') throw new Error('expected a fit');
    expect(r.chosen.model.model).toBe('linear');
    expect((r.chosen.model as Extract<FoulingModel, { model: 'linear' }>).ratePerDay).toBeCloseTo(0.004, 4);
  });

  it('recovers a falling-rate trend, and fits CF0 as an intercept when it is not given', () => {
    const truth: FoulingModel = { model: 'falling-rate', coefficient: 0.05, exponent: 0.5 };
    const r = fitFoulingTrend({ points: synthetic(truth, 0.92, range(1, 150), 0.001) });
    if (r.status !== 'fitted') throw new Error('expected a fit');
    expect(r.chosen.model.model).toBe('falling-rate');
    const m = r.chosen.model as Extract<FoulingModel, { model: 'falling-rate' }>;
    expect(m.exponent).toBeCloseTo(0.5, 1);
    expect(r.chosen.cleanlinessAfterCleaning).toBeCloseTo(0.92, 2);
  });

  it('drops a gross outlier and keeps the honest days', () => {
    const pts = synthetic({ model: 'asymptotic', maxIndex: 0.4, timeConstantDays: 30 }, 0.9, range(0, 90), 0.003);
    pts[40] = { day: 40, cleanliness: 0.3 };
    const r = fitFoulingTrend({ points: pts, cleanlinessAfterCleaning: 0.9 });
    if (r.status !== 'fitted') throw new Error('expected a fit');
    expect(r.outlierDays).toEqual([40]);
    expect(r.pointsUsed).toBe(90);
  });

  it('leaves flagged air in-leakage periods out of the fit', () => {
    const truth: FoulingModel = { model: 'linear', ratePerDay: 0.003 };
    const pts = synthetic(truth, 0.9, range(0, 60), 0.001).map((p) => (p.day >= 20 && p.day <= 30 ? { ...p, cleanliness: p.cleanliness - 0.15 } : p));
    const r = fitFoulingTrend({ points: pts, cleanlinessAfterCleaning: 0.9, excludedPeriods: [{ fromDay: 20, toDay: 30 }] });
    if (r.status !== 'fitted') throw new Error('expected a fit');
    expect(r.excludedDays).toEqual(range(20, 30));
    expect((r.chosen.model as Extract<FoulingModel, { model: 'linear' }>).ratePerDay).toBeCloseTo(0.003, 4);
  });

  it('copes with gaps in the days', () => {
    const days = [0, 1, 2, 9, 10, 11, 30, 31, 50, 51, 52, 80];
    const r = fitFoulingTrend({ points: synthetic({ model: 'linear', ratePerDay: 0.002 }, 0.9, days, 0.0005), cleanlinessAfterCleaning: 0.9 });
    expect(r.status).toBe('fitted');
  });

  it(`says "not enough data" and states the minimum (${MINIMUM_TREND_POINTS} points over ${MINIMUM_TREND_SPAN_DAYS} days)`, () => {
    const few = fitFoulingTrend({ points: synthetic({ model: 'linear', ratePerDay: 0.002 }, 0.9, range(0, 8), 0) });
    expect(few).toMatchObject({ status: 'not-enough-data', minimumPoints: 10, minimumSpanDays: 14, usablePoints: 9 });
    const short = fitFoulingTrend({ points: synthetic({ model: 'linear', ratePerDay: 0.002 }, 0.9, range(0, 12), 0) });
    expect(short).toMatchObject({ status: 'not-enough-data', spanDays: 12 });
    if (short.status === 'not-enough-data') expect(short.reason).toMatch(/at least 10 daily points over at least 14 days/);
  });

  it('the forecast band widens beyond the data and contains the central forecast', () => {
    const r = fitFoulingTrend({
      points: synthetic({ model: 'linear', ratePerDay: 0.003 }, 0.9, range(0, 40), 0.004),
      cleanlinessAfterCleaning: 0.9,
      forecastDays: 60,
    });
    if (r.status !== 'fitted') throw new Error('expected a fit');
    const at = (d: number) => r.forecast.find((f) => f.day === d)!;
    for (const d of [10, 40, 100]) {
      expect(at(d).low).toBeLessThan(at(d).cleanliness);
      expect(at(d).high).toBeGreaterThan(at(d).cleanliness);
    }
    // the band is built in the fit space 1/CF, where it must widen away from the data (in CF it is also scaled by CF²)
    const width = (d: number) => 1 / at(d).low - 1 / at(d).high;
    expect(width(100)).toBeGreaterThan(width(20));
    expect(r.forecast.at(-1)!.day).toBe(100);
  });

  it('gives the same answer every time (deterministic)', () => {
    const pts = synthetic({ model: 'asymptotic', maxIndex: 0.3, timeConstantDays: 50 }, 0.85, range(0, 70), 0.004);
    expect(fitFoulingTrend({ points: pts })).toEqual(fitFoulingTrend({ points: pts }));
  });
});

describe('fouling forecast band with few points', () => {
  it("is built with Student's t for n − k degrees of freedom: 1.812 for a 90 % band from 11 days of a one-parameter fit", () => {
    // 11 days, linear fouling with CF0 given: one parameter (the rate), so 10 degrees of freedom.
    const days = range(0, 10).map((i) => 2 * i);
    const r = fitFoulingTrend({
      points: synthetic({ model: 'linear', ratePerDay: 0.003 }, 0.9, days, 0.003, 5),
      cleanlinessAfterCleaning: 0.9,
      forecastDays: 30,
    });
    if (r.status !== 'fitted') throw new Error('expected a fit');
    expect(r.chosen.model.model).toBe('linear');
    expect(r.chosen.parameterCount).toBe(1);
    expect(r.pointsUsed).toBe(11);
    expect(r.bandProbability).toBe(0.9);
    // derived: in the fit space z = 1/CF the model is z = 1/CF0 + a·t, so s² = SSE/(n − 1) and the leverage of day d
    // is d²/Σt²; the half-width over √(s²(1 + leverage)) is the quantile used.
    const points = synthetic({ model: 'linear', ratePerDay: 0.003 }, 0.9, days, 0.003, 5);
    const at = (d: number) => r.forecast.find((f) => f.day === d)!;
    const sse = points.reduce((s, p) => s + (1 / p.cleanliness - 1 / at(p.day).cleanliness) ** 2, 0);
    const s2 = sse / (points.length - 1);
    const sumT2 = days.reduce((s, t) => s + t * t, 0);
    for (const d of [10, 20, 50]) {
      const half = 1 / at(d).low - 1 / at(d).cleanliness;
      // pub: NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.2: t(0.95, 10) = 1.812 (the normal quantile would be 1.645).
      expect(half / Math.sqrt(s2 * (1 + (d * d) / sumT2))).toBeCloseTo(1.812, 3);
    }
  });
});
