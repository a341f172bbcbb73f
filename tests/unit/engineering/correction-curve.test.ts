import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  buildMonotoneCubic,
  evaluateMonotoneCubic,
  GENERIC_CORRECTION_CURVE,
  curveExtrapolationWarning,
  heatRateChangePct,
  penaltyBetween,
  lostGenerationValuePerMwh,
  CO2_KG_PER_MMBTU,
  type CorrectionCurve,
} from '@shared/domain/turbine/index.js';
import { inHgToKpa } from '@shared/units.js';

const TWO_LOADS: CorrectionCurve = {
  basis: 'heat-rate',
  label: 'test curve',
  isGeneric: false,
  curves: [
    {
      loadFraction: 0.5,
      points: [
        { backpressureKpa: 3, changePct: -1 },
        { backpressureKpa: 6, changePct: 0 },
        { backpressureKpa: 12, changePct: 4 },
      ],
    },
    {
      loadFraction: 1.0,
      points: [
        { backpressureKpa: 4, changePct: -0.5 },
        { backpressureKpa: 6, changePct: 0 },
        { backpressureKpa: 12, changePct: 2 },
      ],
    },
  ],
};

describe('monotone cubic (PCHIP)', () => {
  it('passes through the points', () => {
    const c = buildMonotoneCubic([1, 2, 4, 7], [0, 1, 1.5, 5]);
    expect(evaluateMonotoneCubic(c, 2)).toBeCloseTo(1, 14);
    expect(evaluateMonotoneCubic(c, 4)).toBeCloseTo(1.5, 14);
  });

  it('reproduces a straight line exactly', () => {
    const c = buildMonotoneCubic([1, 2, 4, 7], [3, 5, 9, 15]);
    for (const x of [1.3, 2.9, 5.5]) expect(evaluateMonotoneCubic(c, x)).toBeCloseTo(1 + 2 * x, 12);
  });

  it('keeps monotone data monotone, with no overshoot between points (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: 0.01, max: 5, noNaN: true }), fc.double({ min: 0, max: 3, noNaN: true })), { minLength: 2, maxLength: 8 }),
        (steps) => {
          const xs: number[] = [];
          const ys: number[] = [];
          let x = 1;
          let y = -2;
          for (const [dx, dy] of steps) {
            x += dx;
            y += dy;
            xs.push(x);
            ys.push(y);
          }
          const c = buildMonotoneCubic(xs, ys);
          let prev = -Infinity;
          for (let k = 0; k <= 100; k++) {
            const xx = xs[0]! + ((xs[xs.length - 1]! - xs[0]!) * k) / 100;
            const v = evaluateMonotoneCubic(c, xx);
            expect(v).toBeGreaterThanOrEqual(prev - 1e-12);
            expect(v).toBeLessThanOrEqual(ys[ys.length - 1]! + 1e-12);
            prev = v;
          }
        },
      ),
      { numRuns: 100 },
    );
  });

  it('rejects unsorted points with a clear error', () => {
    expect(() => buildMonotoneCubic([1, 1, 2], [0, 1, 2])).toThrow(/strictly increasing/);
  });
});

describe('exhaust-pressure correction curve', () => {
  it('warns past the last point of the curve actually read: at exactly an inner load only that load’s curve counts', () => {
    const three: CorrectionCurve = {
      basis: 'heat-rate',
      label: 'three loads',
      isGeneric: false,
      curves: [
        {
          loadFraction: 0.5,
          points: [
            { backpressureKpa: 4, changePct: -1 },
            { backpressureKpa: 7, changePct: 0 },
            { backpressureKpa: 10, changePct: 3 },
          ],
        },
        {
          loadFraction: 0.75,
          points: [
            { backpressureKpa: 4, changePct: -1 },
            { backpressureKpa: 8, changePct: 0 },
            { backpressureKpa: 20, changePct: 8 },
          ],
        },
        {
          loadFraction: 1,
          points: [
            { backpressureKpa: 4, changePct: -1 },
            { backpressureKpa: 8, changePct: 0 },
            { backpressureKpa: 20, changePct: 7 },
          ],
        },
      ],
    };
    expect(curveExtrapolationWarning(three, 0.75, 15)).toBeUndefined();
    expect(curveExtrapolationWarning(three, 0.75, 21)).toMatch(/20 kPa at load 0.75/);
    expect(curveExtrapolationWarning(three, 0.6, 15)).toMatch(/10 kPa/);
  });

  it('is flat below the choke point (the first point of each load curve)', () => {
    expect(heatRateChangePct(TWO_LOADS, 1, 2)).toBe(-0.5);
    expect(heatRateChangePct(TWO_LOADS, 1, 3.9)).toBe(-0.5);
  });

  it('is linear in load fraction between load curves', () => {
    const a = heatRateChangePct(TWO_LOADS, 0.5, 9);
    const b = heatRateChangePct(TWO_LOADS, 1, 9);
    expect(heatRateChangePct(TWO_LOADS, 0.75, 9)).toBeCloseTo((a + b) / 2, 12);
    expect(heatRateChangePct(TWO_LOADS, 0.6, 9)).toBeCloseTo(0.8 * a + 0.2 * b, 12);
  });

  it('uses the nearest load curve outside the listed loads', () => {
    expect(heatRateChangePct(TWO_LOADS, 0.3, 9)).toBe(heatRateChangePct(TWO_LOADS, 0.5, 9));
  });

  it('penalty between two backpressures is the difference of the curve readings', () => {
    const p = penaltyBetween(TWO_LOADS, 1, 12, 6);
    expect(p.heatRatePenaltyPct).toBeCloseTo(2, 12);
    // firing held: ΔkW% = −ΔHR%/(1 + ΔHR%/100) [derived]
    expect(p.outputPenaltyPct).toBeCloseTo(2 / 1.02, 12);
  });

  it('an output-basis curve gives the heat-rate penalty by the inverse relation', () => {
    const outputCurve: CorrectionCurve = {
      ...TWO_LOADS,
      basis: 'output',
      curves: [
        {
          loadFraction: 1,
          points: [
            { backpressureKpa: 4, changePct: 0 },
            { backpressureKpa: 12, changePct: -3 },
          ],
        },
      ],
    };
    const p = penaltyBetween(outputCurve, 1, 12, 4);
    expect(p.outputPenaltyPct).toBeCloseTo(3, 12);
    expect(p.heatRatePenaltyPct).toBeCloseTo(3 / 0.97, 12);
  });

  it('below the choke point a lower backpressure brings no gain', () => {
    expect(penaltyBetween(TWO_LOADS, 1, 2, 3).heatRatePenaltyPct).toBe(0);
  });
});

describe('generic default curve [common practice]', () => {
  it('is labelled as generic, to be replaced by the maker’s curve', () => {
    expect(GENERIC_CORRECTION_CURVE.isGeneric).toBe(true);
    expect(GENERIC_CORRECTION_CURVE.label).toBe("generic — replace with the turbine maker's curve");
  });

  it('costs about 1–2 % heat rate per inHg above design at full load', () => {
    for (const [a, b] of [
      [2, 3],
      [2.5, 3.5],
      [3, 4],
    ] as const) {
      const perInHg = penaltyBetween(GENERIC_CORRECTION_CURVE, 1, inHgToKpa(b), inHgToKpa(a)).heatRatePenaltyPct / (b - a);
      expect(perInHg).toBeGreaterThanOrEqual(1);
      expect(perInHg).toBeLessThanOrEqual(2);
    }
  });

  it('costs more per inHg at part load than at full load', () => {
    const full = penaltyBetween(GENERIC_CORRECTION_CURVE, 1, inHgToKpa(3.5), inHgToKpa(2.5)).heatRatePenaltyPct;
    const half = penaltyBetween(GENERIC_CORRECTION_CURVE, 0.5, inHgToKpa(3.5), inHgToKpa(2.5)).heatRatePenaltyPct;
    expect(half).toBeGreaterThan(full);
  });

  it('chokes near 1.0–1.5 inHgA at full load, lower at part load', () => {
    expect(penaltyBetween(GENERIC_CORRECTION_CURVE, 1, inHgToKpa(1.0), inHgToKpa(1.2)).heatRatePenaltyPct).toBe(0);
    expect(penaltyBetween(GENERIC_CORRECTION_CURVE, 0.5, inHgToKpa(1.0), inHgToKpa(1.2)).heatRatePenaltyPct).toBeLessThan(0);
  });

  it('never falls as backpressure rises, at any load (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.3, max: 1.1, noNaN: true }),
        fc.double({ min: 1, max: 25, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        (load, p, dp) => {
          expect(heatRateChangePct(GENERIC_CORRECTION_CURVE, load, p + dp)).toBeGreaterThanOrEqual(
            heatRateChangePct(GENERIC_CORRECTION_CURVE, load, p) - 1e-12,
          );
        },
      ),
    );
  });
});

describe('outage value and emission factors', () => {
  it('a lost MWh is worth the replacement price less the unit’s own fuel and CO2 cost', () => {
    // 9.5 MMBtu/MWh × ($3 + 0.05306 t × $20)
    const v = lostGenerationValuePerMwh({ replacementPricePerMwh: 80, heatRateBtuKwh: 9500, fuelPricePerMmbtu: 3, co2KgPerMmbtu: 53.06, co2PricePerTonne: 20 });
    expect(v).toBeCloseTo(80 - 9.5 * (3 + 0.05306 * 20), 9);
  });

  it('lists the EPA Table C-1 factors (from memory, verify)', () => {
    expect(CO2_KG_PER_MMBTU['natural-gas']).toBe(53.06);
    expect(CO2_KG_PER_MMBTU['bituminous-coal']).toBe(93.28);
    expect(CO2_KG_PER_MMBTU['sub-bituminous-coal']).toBe(97.17);
    expect(CO2_KG_PER_MMBTU.lignite).toBe(97.72);
    expect(CO2_KG_PER_MMBTU['distillate-oil-no2']).toBe(73.96);
  });
});
