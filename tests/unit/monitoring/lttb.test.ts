/**
 * Largest-Triangle-Three-Buckets downsampling [pub: S. Steinarsson, "Downsampling Time Series for Visual
 * Representation", University of Iceland, 2013]: first and last points kept, one point per bucket, the
 * point spanning the largest triangle, so an isolated peak survives.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lttb, lttbKeepingGaps } from '@shared/domain/monitoring/index.js';

interface P {
  t: number;
  v: number;
}
const X = (p: P) => p.t;
const Y = (p: P) => p.v;
const line = (n: number, v: (i: number) => number): P[] => Array.from({ length: n }, (_, i) => ({ t: 1000 * i, v: v(i) }));

describe('LTTB downsampling', () => {
  it('returns exactly the threshold count, first and last kept, in time order, every point taken from the input', () => {
    fc.assert(
      fc.property(
        fc
          .array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 4, maxLength: 400 })
          .chain((ys) => fc.tuple(fc.constant(ys), fc.integer({ min: 3, max: ys.length - 1 }))),
        ([ys, threshold]) => {
          const points = ys.map((v, i) => ({ t: 60_000 * i, v }));
          const out = lttb(points, threshold, X, Y);
          expect(out).toHaveLength(threshold);
          expect(out[0]).toBe(points[0]);
          expect(out.at(-1)).toBe(points.at(-1));
          const at = out.map((p) => points.indexOf(p));
          expect(at.every((i) => i >= 0)).toBe(true);
          for (let k = 1; k < at.length; k++) expect(at[k]).toBeGreaterThan(at[k - 1]!);
        },
      ),
      { numRuns: 300, seed: 2013 },
    );
  });

  it('keeps an isolated spike in a flat series (the largest triangle of its bucket)', () => {
    for (const spikeAt of [1, 17, 537, 998]) {
      const points = line(1000, (i) => (i === spikeAt ? 25 : 5));
      const out = lttb(points, 50, X, Y);
      expect(out).toContain(points[spikeAt]);
      expect(out).toHaveLength(50);
    }
  });

  it('keeps a one-point peak and a one-point dip on a smooth sine', () => {
    const points = line(5000, (i) => Math.sin(i / 200) + (i === 3210 ? 4 : 0) - (i === 4321 ? 4 : 0));
    const out = lttb(points, 2000, X, Y);
    expect(out).toContain(points[3210]);
    expect(out).toContain(points[4321]);
    expect(Math.max(...out.map(Y))).toBe(Math.max(...points.map(Y)));
    expect(Math.min(...out.map(Y))).toBe(Math.min(...points.map(Y)));
  });

  it('returns the input unchanged (a copy) at or below the threshold, and when the threshold is under 3', () => {
    const points = line(40, (i) => i * i);
    for (const threshold of [40, 41, 2000, 2, 0]) {
      const out = lttb(points, threshold, X, Y);
      expect(out).toEqual(points);
      expect(out).not.toBe(points);
    }
  });
});

describe('LTTB downsampling of a series with missing values', () => {
  interface Q {
    t: number;
    v: number | null;
  }
  const QX = (p: Q) => p.t;
  const QY = (p: Q) => p.v;
  /** A sine of 10,000 hours around 0.8 (never near 0), with the hours `missing` picks left empty. */
  const series = (missing: (i: number) => boolean): Q[] =>
    Array.from({ length: 10_000 }, (_, i) => ({ t: 3_600_000 * i, v: missing(i) ? null : 0.8 + 0.05 * Math.sin(i / 300) }));

  it('with 2 % of the hours missing here and there, scores none of them as 0 and keeps no empty point (not 10 % of the output)', () => {
    const points = series((i) => i % 50 === 7);
    const out = lttbKeepingGaps(points, 2000, QX, QY);
    expect(out).toHaveLength(2000);
    expect(out.filter((p) => p.v === null)).toHaveLength(0);
    expect(Math.min(...out.map((p) => p.v!))).toBeGreaterThan(0.74);
    for (let k = 1; k < out.length; k++) expect(out[k]?.t).toBeGreaterThan(out[k - 1]!.t);
  });

  it('keeps a gap longer than a bucket as one empty point inside it, so the chart breaks the line there', () => {
    // A 300-hour outage (each of the 2,000 output points stands for 5 hours).
    const points = series((i) => i >= 4000 && i < 4300);
    const out = lttbKeepingGaps(points, 2000, QX, QY);
    expect(out).toHaveLength(2000);
    const empty = out.filter((p) => p.v === null);
    expect(empty).toHaveLength(1);
    expect(empty[0]).toBe(points[4000]);
    expect(out.every((p) => p.v === null || p.v > 0.74)).toBe(true);
    // Points on both sides of the gap are kept up to its edges.
    expect(out).toContain(points[3999]);
    expect(out).toContain(points[4300]);
  });

  it('returns the input unchanged at or below the threshold, empty points included', () => {
    const points = series((i) => i % 3 === 0).slice(0, 100);
    expect(lttbKeepingGaps(points, 100, QX, QY)).toEqual(points);
  });

  it('stays within the threshold even when gaps alternate with single values', () => {
    const points = series((i) => Math.floor(i / 10) % 2 === 1);
    const out = lttbKeepingGaps(points, 300, QX, QY);
    expect(out.length).toBeLessThanOrEqual(300);
    expect(out.length).toBeGreaterThan(250);
    for (let k = 1; k < out.length; k++) expect(out[k]?.t).toBeGreaterThan(out[k - 1]!.t);
  });
});
