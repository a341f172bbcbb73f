/**
 * The correction-curve chart draws the curve the costs use: the shared monotone cubic (PCHIP) through the
 * entered points, sampled densely and joined by straight segments, in the person's pressure unit.
 */
import { describe, expect, it } from 'vitest';
import { curveChangePct, GENERIC_CORRECTION_CURVE } from '@shared/domain/turbine/index.js';
import { inHgToKpa, kpaToInHg } from '@shared/units.js';
import { engineCurveLine } from '@frontend/features/units/components/correction-curve-line';

describe('correction-curve chart line', () => {
  it('lies on the curve the engine evaluates, at every sample, when drawn in inHgA', () => {
    for (const load of GENERIC_CORRECTION_CURVE.curves) {
      const entered = load.points.map((p) => ({ x: kpaToInHg(p.backpressureKpa), y: p.changePct }));
      const line = engineCurveLine(entered);
      expect(line.length).toBeGreaterThan(100);
      for (const s of line) {
        // derived: PCHIP is unchanged by a linear change of the x unit, so the line in inHgA is the engine's curve in kPa.
        expect(s.y, `${load.loadFraction} at ${s.x} inHgA`).toBeCloseTo(curveChangePct(GENERIC_CORRECTION_CURVE, load.loadFraction, inHgToKpa(s.x)), 9);
      }
    }
  });

  it('passes through every entered point, in order of pressure, and marks them', () => {
    const entered = [
      { x: 4, y: 3.1 },
      { x: 1.2, y: -0.9 },
      { x: 2, y: 0 },
      { x: 3, y: 1.45 },
    ];
    const line = engineCurveLine(entered);
    for (const p of entered) expect(line).toContainEqual({ x: p.x, y: p.y, entered: true });
    expect(line.filter((s) => s.entered)).toHaveLength(4);
    for (let k = 1; k < line.length; k++) expect(line[k]?.x).toBeGreaterThan(line[k - 1]!.x);
    expect(line[0]?.x).toBe(1.2);
    expect(line.at(-1)!.x).toBe(4);
  });

  it('does not overshoot between points as a smoothing spline would: monotone data give a monotone line', () => {
    const entered = [
      { x: 1, y: 0 },
      { x: 1.1, y: 0 },
      { x: 1.2, y: 5 },
      { x: 3, y: 5.2 },
    ];
    const line = engineCurveLine(entered);
    for (let k = 1; k < line.length; k++) expect(line[k]?.y).toBeGreaterThanOrEqual(line[k - 1]!.y - 1e-12);
    expect(Math.max(...line.map((s) => s.y))).toBeCloseTo(5.2, 12);
  });

  it('joins points it cannot interpolate (two at the same pressure) by straight segments, as entered', () => {
    const entered = [
      { x: 1, y: 0 },
      { x: 2, y: 1 },
      { x: 2, y: 1.5 },
    ];
    expect(engineCurveLine(entered)).toEqual(entered.map((p) => ({ ...p, entered: true })));
  });
});
