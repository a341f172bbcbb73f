import { describe, expect, it } from 'vitest';
import { thinDots, thinLine, type ScreenPoint } from '@frontend/features/health/components/thin-for-drawing';

/** x from 0 to `width` px with `n` points, y a wave with one spike: what a long hourly or multi-year daily series looks like on screen. */
function wave(n: number, width: number): ScreenPoint[] {
  return Array.from({ length: n }, (_, i) => [(i / (n - 1)) * width, 100 + 40 * Math.sin(i / 7) + (i === 777 ? 90 : 0)] as const);
}

describe('a line thinned to what the pixels can show', () => {
  it('draws at most four points per pixel column, keeping the first, last, lowest and highest of each', () => {
    const points = wave(8760, 500);
    const thin = thinLine(points);
    expect(thin.length).toBeLessThanOrEqual(4 * 501);
    expect(thin.length).toBeGreaterThan(500);
    const ys = (ps: (ScreenPoint | null)[]) => ps.filter((p): p is ScreenPoint => p !== null).map((p) => p[1]);
    expect(Math.max(...ys(thin))).toBe(Math.max(...ys(points)));
    expect(Math.min(...ys(thin))).toBe(Math.min(...ys(points)));
    expect(thin[0]).toEqual(points[0]);
    expect(thin.at(-1)).toEqual(points.at(-1));
    // still in drawing order
    const xs = thin.map((p) => p![0]);
    expect(xs).toEqual([...xs].sort((a, b) => a - b));
  });

  it('keeps every gap where it was, so a line never bridges days without data', () => {
    const points: (ScreenPoint | null)[] = wave(3000, 300);
    for (let i = 1200; i < 1400; i++) points[i] = null;
    const thin = thinLine(points);
    const gapAt = thin.indexOf(null);
    expect(gapAt).toBeGreaterThan(0);
    expect(thin.filter((p) => p === null)).toHaveLength(1);
    expect(thin[gapAt - 1]).toEqual(points[1199]);
    expect(thin[gapAt + 1]).toEqual(points[1400]);
  });

  it('leaves a line with fewer points than pixels as it is', () => {
    const points = wave(365, 520);
    expect(thinLine(points)).toEqual(points);
  });
});

describe('dots thinned to what the pixels can show', () => {
  it('draws one dot per pixel a dot falls on, keeping the spike', () => {
    const points = wave(8760, 500);
    const thin = thinDots(points);
    expect(thin.length).toBeLessThan(points.length);
    expect(thin.some((p) => p[1] === Math.max(...points.map((q) => q[1])))).toBe(true);
    const seen = new Set(thin.map((p) => `${Math.round(p[0])},${Math.round(p[1])}`));
    expect(seen.size).toBe(thin.length);
    // every pixel with a dot before still has one
    expect(new Set(points.map((p) => `${Math.round(p[0])},${Math.round(p[1])}`))).toEqual(seen);
  });

  it('skips days without a value', () => {
    expect(thinDots([[1, 2], null, [3, 4]])).toEqual([
      [1, 2],
      [3, 4],
    ]);
  });
});
