/**
 * Model results outside what a working condenser and turbine can show are refused or carry a warning,
 * instead of flowing silently into costs and trends (ENGINEERING.md §3–4).
 */
import { describe, expect, it } from 'vitest';
import { analyseCondenserPoint, PLAUSIBLE_CLEANLINESS, PLAUSIBLE_TUBE_VELOCITY_MS } from '@shared/domain/condenser/index.js';
import { curveChangePct, curveExtrapolationWarning, GENERIC_CORRECTION_CURVE, penaltyBetween } from '@shared/domain/turbine/index.js';
import { BACKPRESSURE_BOUNDS_KPA, PointRejectedError } from '@shared/domain/validity/index.js';
import { buildPenaltyTable } from '@shared/domain/decision/schedule/penalty-table-builder.js';
import type { DailyDrivers } from '@shared/domain/decision/drivers/seasonal-drivers.js';
import { GEOMETRY } from './condenser-fixture.js';

/** The point the calc CLI tests use: 1 in titanium tubes, 15 m³/s, 9 K rise. */
const POINT = {
  backpressureKpa: 6.5,
  cwInletC: 22,
  cwOutletC: 31,
  cwFlowM3s: 15,
  pluggedTubes: 0,
  geometry: GEOMETRY,
  referenceCleanliness: 0.85,
};

function rejection(run: () => unknown): PointRejectedError {
  try {
    run();
  } catch (err) {
    if (err instanceof PointRejectedError) return err;
    throw err;
  }
  throw new Error('the point was not rejected');
}

describe('plausibility of a condenser point', () => {
  it('names its bands and the measured-backpressure bounds the expected backpressure must keep to', () => {
    // common practice: physically possible operation, not design ranges (see plausibility.ts).
    expect(PLAUSIBLE_CLEANLINESS).toEqual({ min: 0.2, max: 1.3 });
    expect(PLAUSIBLE_TUBE_VELOCITY_MS).toEqual({ min: 0.3, max: 4.5 });
    expect(BACKPRESSURE_BOUNDS_KPA).toEqual({ min: 0.7, max: 50 });
  });

  it('gives an ordinary point no warning', () => {
    const r = analyseCondenserPoint(POINT);
    expect(r.warnings).toEqual([]);
    expect(r.implausible).toEqual([]);
  });

  it('refuses a clean coefficient of 300 W/(m²·K), whose expected backpressure (about 117 kPa) would be far above 50 kPa', () => {
    expect(() => analyseCondenserPoint({ ...POINT, uCleanWm2K: 500 })).not.toThrow();
    const err = rejection(() => analyseCondenserPoint({ ...POINT, uCleanWm2K: 300 }));
    expect(err.reason).toBe('expected-out-of-range');
    expect(err.message).toMatch(/expected backpressure .* outside 0\.7–50 kPa/);
  });

  it('warns when a clean coefficient of 500 W/(m²·K) gives cleanliness 3.77, and keeps the point out', () => {
    const r = analyseCondenserPoint({ ...POINT, uCleanWm2K: 500 });
    expect(r.cleanliness).toBeGreaterThan(3.7);
    expect(r.implausible.map((f) => f.reason)).toEqual(['implausible-cleanliness']);
  });

  it('warns when the cleanliness is above 1.3 (clean coefficient entered too low) and marks the point implausible', () => {
    const base = analyseCondenserPoint(POINT);
    // U_clean set so that CF = 1.4 while the expected backpressure stays inside its bounds.
    const r = analyseCondenserPoint({ ...POINT, uCleanWm2K: base.uWm2K / 1.4 });
    expect(r.cleanliness).toBeCloseTo(1.4, 9);
    expect(r.implausible.map((f) => f.reason)).toEqual(['implausible-cleanliness']);
    expect(r.warnings.join(' ')).toMatch(/cleanliness 1\.40 is outside 0\.2–1\.3/);
  });

  it('warns of a tube velocity of about 21 m/s at 150 m³/s, and keeps one CW pump of two (about 1.2 m/s) in', () => {
    const flood = analyseCondenserPoint({ ...POINT, cwFlowM3s: 150, cwOutletC: 22.9 });
    expect(flood.velocityMs).toBeGreaterThan(20);
    expect(flood.implausible.map((f) => f.reason)).toContain('implausible-velocity');
    expect(flood.warnings.join(' ')).toMatch(/tube velocity .* outside 0\.3–4\.5 m\/s/);

    // One pump of two: about 55 % of the flow, a larger rise, the same duty (common practice).
    const onePump = analyseCondenserPoint({ ...POINT, cwFlowM3s: 8.25, cwOutletC: 38.3, backpressureKpa: 9.5 });
    expect(onePump.velocityMs).toBeGreaterThan(1.1);
    expect(onePump.velocityMs).toBeLessThan(1.5);
    expect(onePump.implausible).toEqual([]);
  });
});

describe('plausibility of the turbine correction', () => {
  const curve = GENERIC_CORRECTION_CURVE;
  const lastKpa = Math.max(...curve.curves[2]!.points.map((p) => p.backpressureKpa));

  it('continues the curve straight past its last point with a warning, up to 50 kPa', () => {
    expect(curveExtrapolationWarning(curve, 1, lastKpa - 0.1)).toBeUndefined();
    expect(curveExtrapolationWarning(curve, 1, lastKpa + 5)).toMatch(/beyond the correction curve's last point/);
    expect(Number.isFinite(curveChangePct(curve, 1, 50))).toBe(true);
  });

  it('refuses to read the curve above 50 kPa instead of extrapolating without limit', () => {
    expect(() => curveChangePct(curve, 1, 4035)).toThrow(/4035 kPa is above 50 kPa/);
    expect(() => penaltyBetween(curve, 1, 423, 8)).toThrow(RangeError);
  });

  it('stops the penalty table of a setup with 5,000 MW design duty on a 340 MW unit instead of pricing hundreds of kPa', () => {
    const days = 3;
    const drivers: DailyDrivers = {
      startDate: '2026-01-01',
      dates: ['2026-01-01', '2026-01-02', '2026-01-03'],
      cwInletC: new Float64Array(days).fill(20),
      loadFraction: new Float64Array(days).fill(1),
      fuelPricePerMmbtu: new Float64Array(days).fill(3),
      replacementPricePerMwh: new Float64Array(days).fill(60),
      co2PricePerTonne: new Float64Array(days).fill(0),
    };
    const unit = { geometry: GEOMETRY, cwFlowM3s: 15, pluggedTubes: 0, ratingMw: 340, heatRateBtuKwh: 9400, co2KgPerMmbtu: 93.28, capacityLimitedShare: 0.2 };
    expect(() => buildPenaltyTable({ ...unit, designDutyMw: 500 }, drivers)).not.toThrow();
    expect(() => buildPenaltyTable({ ...unit, designDutyMw: 5000 }, drivers)).toThrow(/above 50 kPa/);
  });
});
