/**
 * One sample's analysis (ENGINEERING.md §3–4): fouling cost against the reference cleanliness through the
 * turbine curve, the unexplained part against the model at the trend cleanliness, the telescoping deviation
 * breakdown, and the cost basis blend.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { backpressureAtCleanlinessKpa } from '@shared/domain/condenser/index.js';
import { analyseSample, blendedCostPerHour, buildUnitModel, designPointKpa, type UnitModel } from '@shared/domain/monitoring/index.js';
import { PointRejectedError } from '@shared/domain/validity/index.js';
import type { CorrectionCurve } from '@shared/domain/turbine/index.js';
import { MODEL, SETUP, sampleAt } from './monitoring-fixture.js';

const PLUGGED = SETUP.condenser.pluggedTubes;

/** Model backpressure P(t1, Q_vol, duty, Np, CF) of the sample's own state (ENGINEERING.md §3). */
function modelKpa(model: UnitModel, s: { cwInletC: number; cwFlowM3s: number }, dutyMw: number, pluggedTubes: number, cleanliness: number): number {
  return backpressureAtCleanlinessKpa({
    geometry: model.geometry,
    heiTables: model.heiTables,
    cwInletC: s.cwInletC,
    cwFlowM3s: s.cwFlowM3s,
    dutyMw,
    pluggedTubes,
    cleanliness,
  });
}

/** A straight-line heat-rate curve, 1 % per kPa, zero at 5 kPa (collinear points: PCHIP reproduces a line exactly). */
const ONE_PCT_PER_KPA: CorrectionCurve = {
  basis: 'heat-rate',
  label: 'test line',
  isGeneric: false,
  curves: [{ loadFraction: 1, points: [1, 5, 20, 40].map((p) => ({ backpressureKpa: p, changePct: p - 5 })) }],
};

function modelWith(changes: {
  curve?: CorrectionCurve;
  economics?: Partial<typeof SETUP.economics>;
  turbine?: Partial<typeof SETUP.turbine>;
  referenceCleanliness?: number | null;
}): UnitModel {
  return buildUnitModel({
    condenser: {
      ...SETUP.condenser,
      referenceCleanliness: changes.referenceCleanliness === undefined ? SETUP.condenser.referenceCleanliness : changes.referenceCleanliness,
    },
    turbine: { ...SETUP.turbine, ...changes.turbine, correctionCurve: changes.curve ?? null },
    economics: { ...SETUP.economics, ...changes.economics },
  });
}

describe('fouling cost of a sample', () => {
  it('is nothing when the trend cleanliness is the reference cleanliness, whatever the measured cleanliness', () => {
    for (const measured of [0.62, 0.78, 0.9]) {
      const a = analyseSample(MODEL, sampleAt(MODEL, { cleanliness: measured }), PLUGGED, MODEL.referenceCleanliness);
      // derived (§4): fouling cost = penalty between P(trend CF) and P(reference CF) under the same state.
      expect(a.foulingCostPerHour).toBeCloseTo(0, 9);
    }
  });

  it('is measured against the reference cleanliness, while the fouling part of the breakdown is measured against the design cleanliness', () => {
    const model = modelWith({ referenceCleanliness: 0.85 });
    const a = analyseSample(model, sampleAt(model, { cleanliness: 0.8 }), PLUGGED, 0.85);
    // derived (§4): the reference is the CF the preferred cleaning reaches; §3 breakdown S4 → S5 starts from the design CF 0.9.
    expect(a.foulingCostPerHour).toBeCloseTo(0, 9);
    expect(a.foulingKpa).toBeGreaterThan(0.05);
  });

  it('rises as the trend cleanliness falls, by more for each further step (the model and the curve are both convex)', () => {
    const s = sampleAt(MODEL, { cleanliness: 0.7 });
    const costs = [0.9, 0.85, 0.8, 0.75, 0.7, 0.65, 0.6, 0.55].map((cf) => analyseSample(MODEL, s, PLUGGED, cf).foulingCostPerHour);
    for (let i = 1; i < costs.length; i++) expect(costs[i]).toBeGreaterThan(costs[i - 1]!);
    // derived: Ts = t1 + r/(1 − e^(−NTU)) with NTU ∝ CF rises ever faster as CF falls, psat is convex in T, and
    // the generic curve's slope grows with pressure (common practice: larger %/inHg at higher backpressure).
    for (let i = 2; i < costs.length; i++) expect(costs[i]! - costs[i - 1]!).toBeGreaterThan(costs[i - 1]! - costs[i - 2]!);
  });

  it('with a straight-line turbine curve equals the §4 fuel formula applied to the backpressure difference, so it is linear in kPa and not in cleanliness', () => {
    const model = modelWith({ curve: ONE_PCT_PER_KPA, economics: { capacityLimitedShare: 0, co2PricePerTonne: 0 } });
    const s = sampleAt(model, { cleanliness: 0.75, loadFraction: 0.9 });
    const dutyMw = analyseSample(model, s, PLUGGED).dutyMw;
    const perCf: number[] = [];
    for (const trend of [0.85, 0.75, 0.65, 0.55]) {
      const a = analyseSample(model, s, PLUGGED, trend);
      const dKpa = modelKpa(model, s, dutyMw, PLUGGED, trend) - modelKpa(model, s, dutyMw, PLUGGED, model.referenceCleanliness);
      // derived (§4): extra fuel = P·1000·HR·ΔHR%/100/10⁶ MMBtu/h × price, with ΔHR% = 1 %/kPa × ΔkPa on this curve.
      const expected = ((s.loadMw * 1000 * model.heatRateBtuKwh * (dKpa * 1)) / 100 / 1e6) * SETUP.economics.fuelPricePerMmbtu;
      expect(a.foulingCostPerHour).toBeCloseTo(expected, 9);
      perCf.push(a.foulingCostPerHour / (model.referenceCleanliness - trend));
    }
    // Cost per unit of lost cleanliness grows as the cleanliness falls: the cost is not linear in CF.
    for (let i = 1; i < perCf.length; i++) expect(perCf[i]).toBeGreaterThan(perCf[i - 1]! * 1.05);
  });
});

describe('unexplained part of a sample', () => {
  it('is about zero when the trend cleanliness is the measured cleanliness (or no trend is given)', () => {
    const s = sampleAt(MODEL, { cleanliness: 0.74, cwInletC: 27, loadFraction: 0.7 });
    const measuredCf = analyseSample(MODEL, s, PLUGGED).cleanliness;
    expect(measuredCf).toBeCloseTo(0.74, 9);
    for (const a of [analyseSample(MODEL, s, PLUGGED), analyseSample(MODEL, s, PLUGGED, measuredCf)]) {
      // derived (§3): unexplained = p_measured − P(S5) and P at the measured CF returns the measured p.
      expect(a.unexplainedKpa).toBeCloseTo(0, 9);
      expect(a.unexplainedCostPerHour).toBeCloseTo(0, 6);
    }
  });

  it('is the measured backpressure less the model at the trend cleanliness, positive when the condenser does worse than its trend', () => {
    // An air-bound condenser: measured as if CF were 0.70 while the fouling trend says 0.78.
    const s = sampleAt(MODEL, { cleanliness: 0.7 });
    const a = analyseSample(MODEL, s, PLUGGED, 0.78);
    // derived (§3): unexplained = p_measured − P(S5), S5 = today's t1, flow, duty, plugging and the trend CF.
    expect(a.unexplainedKpa).toBeCloseTo(s.backpressureKpa - modelKpa(MODEL, s, a.dutyMw, PLUGGED, 0.78), 9);
    expect(a.unexplainedKpa).toBeGreaterThan(0.2);
    expect(a.unexplainedCostPerHour).toBeGreaterThan(0);
  });
});

describe('deviation breakdown of a sample', () => {
  const designModelKpa = modelKpa(
    MODEL,
    { cwInletC: SETUP.condenser.designCwInletC, cwFlowM3s: SETUP.condenser.designCwFlowM3s },
    SETUP.condenser.designDutyMw,
    SETUP.condenser.designPluggedTubes,
    SETUP.condenser.designCleanliness,
  );

  it('adds up, with the model offset, to the measured backpressure less the datasheet design backpressure', () => {
    fc.assert(
      fc.property(
        fc.record({
          cleanliness: fc.double({ min: 0.5, max: 1, noNaN: true }),
          trend: fc.double({ min: 0.5, max: 1, noNaN: true }),
          loadFraction: fc.double({ min: 0.45, max: 1, noNaN: true }),
          cwInletC: fc.double({ min: 8, max: 32, noNaN: true }),
          // up to 16 m³/s: with 1,500 tubes plugged the tube velocity stays below the 4.5 m/s plausibility band
          cwFlowM3s: fc.double({ min: 11, max: 16, noNaN: true }),
          pluggedTubes: fc.integer({ min: 0, max: 1500 }),
          dutyRatio: fc.double({ min: 0.95, max: 1.05, noNaN: true }),
        }),
        (c) => {
          const s = sampleAt(MODEL, c);
          const a = analyseSample(MODEL, s, c.pluggedTubes, c.trend);
          const parts = a.cwInletKpa + a.cwFlowKpa + a.loadKpa + a.pluggingKpa + a.foulingKpa + a.unexplainedKpa;
          // derived (§3): the lines run datasheet → design model → S0 … S5 → measured, so they telescope.
          expect(parts + (designModelKpa - SETUP.condenser.designBackpressureKpa)).toBeCloseTo(s.backpressureKpa - SETUP.condenser.designBackpressureKpa, 9);
          expect(a.excessBackpressureKpa).toBeCloseTo(s.backpressureKpa - a.expectedBackpressureKpa, 12);
        },
      ),
      { numRuns: 200, seed: 20240601 },
    );
  });

  it('gives no CW inlet, CW flow or plugging part when those are at design, and a negative load part at part load', () => {
    const s = sampleAt(MODEL, {
      cleanliness: 0.8,
      cwInletC: SETUP.condenser.designCwInletC,
      cwFlowM3s: SETUP.condenser.designCwFlowM3s,
      pluggedTubes: 0,
      loadFraction: 0.7,
    });
    const a = analyseSample(MODEL, s, 0, 0.8);
    expect(a.cwInletKpa).toBeCloseTo(0, 12);
    expect(a.cwFlowKpa).toBeCloseTo(0, 12);
    expect(a.pluggingKpa).toBeCloseTo(0, 12);
    // derived: less duty at the same CW gives a smaller rise and approach, so a lower backpressure.
    expect(a.loadKpa).toBeLessThan(-0.3);
    // derived: CF 0.8 below the design 0.9 raises the backpressure.
    expect(a.foulingKpa).toBeGreaterThan(0);
  });
});

describe('blended cost per hour', () => {
  // ENGINEERING.md §4 worked check: 500 MW, 9,500 Btu/kWh, $3/MMBtu.
  const worked = modelWith({
    turbine: { ratingMw: 500, designHeatRateBtuKwh: 9500 },
    economics: { fuelPricePerMmbtu: 3, co2PricePerTonne: 0, replacementPricePerMwh: 40, capacityLimitedShare: 0 },
  });
  const onePct = { heatRatePenaltyPct: 1, outputPenaltyPct: 1 / 1.01 };

  it('at a capacity-limited share of 0 is the fuel basis: 1 % heat rate at 500 MW costs $142.5/h', () => {
    // derived from §4: 500·1000·9500·1 %/10⁶ = 47.5 MMBtu/h × $3 = $142.5/h.
    expect(blendedCostPerHour(worked, 1, onePct)).toBeCloseTo(142.5, 9);
    // §4 annual check [derived]: at 80 % capacity factor, 1 % heat rate = $998,640/yr.
    expect(blendedCostPerHour(worked, 0.8, onePct) * 8760).toBeCloseTo(998_640, 6);
  });

  it('at a share of 0 adds CO2 on the extra fuel', () => {
    const withCo2 = { ...worked, economics: { ...worked.economics, co2PricePerTonne: 25, co2KgPerMmbtu: 93.28 } };
    // derived from §4: 47.5 MMBtu/h × 93.28 kg/MMBtu = 4.4308 t/h × $25/t = $110.77/h on top of the fuel.
    expect(blendedCostPerHour(withCo2, 1, onePct)).toBeCloseTo(142.5 + 110.77, 9);
  });

  it('at a share of 1 is the capacity basis, and in between the weighted mix', () => {
    const capacity = { ...worked, economics: { ...worked.economics, capacityLimitedShare: 1 } };
    // derived from §4: P·ΔkW%/100 × replacement price = 500 MW × (1/1.01) % × $40/MWh = $198.0198/h.
    const capacityCost = (500 * (1 / 1.01) * 40) / 100;
    expect(blendedCostPerHour(capacity, 1, onePct)).toBeCloseTo(capacityCost, 9);
    const mix = { ...worked, economics: { ...worked.economics, capacityLimitedShare: 0.3 } };
    expect(blendedCostPerHour(mix, 1, onePct)).toBeCloseTo(0.7 * 142.5 + 0.3 * capacityCost, 9);
  });
});

describe('plausibility of a sample', () => {
  const reasonOf = (run: () => unknown) => {
    try {
      run();
    } catch (err) {
      return err instanceof PointRejectedError ? err.reason : `not a rejection: ${String(err)}`;
    }
    return 'accepted';
  };

  it('leaves out a sample whose cleanliness is above 1.3 or below 0.2, with its reason', () => {
    expect(reasonOf(() => analyseSample(MODEL, sampleAt(MODEL, { cleanliness: 1.45 }), PLUGGED))).toBe('implausible-cleanliness');
    expect(reasonOf(() => analyseSample(MODEL, sampleAt(MODEL, { cleanliness: 0.15 }), PLUGGED))).toBe('implausible-cleanliness');
    expect(reasonOf(() => analyseSample(MODEL, sampleAt(MODEL, { cleanliness: 1.2 }), PLUGGED))).toBe('accepted');
  });

  it('keeps a unit on one CW pump of two (about 1.5 m/s in the tubes) and leaves out a flow giving over 4.5 m/s', () => {
    // derived: the fixture's flow area is (18,000 − 120)/2 tubes × π/4 × (23.98 mm)², about 4.04 m².
    expect(reasonOf(() => analyseSample(MODEL, sampleAt(MODEL, { cleanliness: 0.85, cwFlowM3s: 6, loadFraction: 0.6 }), PLUGGED))).toBe('accepted');
    expect(reasonOf(() => analyseSample(MODEL, sampleAt(MODEL, { cleanliness: 0.85, cwFlowM3s: 19 }), PLUGGED))).toBe('implausible-velocity');
  });

  it('leaves out every sample of a setup whose design point the model puts above 50 kPa (design duty of another unit)', () => {
    const broken = buildUnitModel({ ...SETUP, condenser: { ...SETUP.condenser, designDutyMw: 5000 } });
    expect(() => designPointKpa(broken)).toThrow(/design point at full load .* outside 0\.7–50 kPa/);
    expect(reasonOf(() => analyseSample(broken, sampleAt(MODEL, { cleanliness: 0.85 }), PLUGGED))).toBe('expected-out-of-range');
    expect(designPointKpa(MODEL)).toBeGreaterThan(3);
  });
});
