import { describe, expect, it } from 'vitest';
import { analyseCondenserPoint, backpressureAtCleanlinessKpa, deviationBreakdown, type DeviationBreakdownInput } from '@shared/domain/condenser/index.js';
import { GENERIC_CORRECTION_CURVE, heatRateChangePct } from '@shared/domain/turbine/index.js';
import { liquidDensityKgM3 } from '@shared/domain/steam/index.js';
import { DESIGN, GEOMETRY } from './condenser-fixture.js';

const designMass = liquidDensityKgM3(DESIGN.cwInletC) * DESIGN.cwFlowM3s;

// Today: warmer water, less flow, part load, some plugging, fouled, and a backpressure a little
// above what the model says (as air in-leakage would show).
const measuredPoint = { backpressureKpa: 10.4, cwInletC: 29, cwOutletC: 38.2, cwFlowM3s: 13.5, pluggedTubes: 900 };
const today = analyseCondenserPoint({ ...measuredPoint, geometry: GEOMETRY, referenceCleanliness: 0.85 });

const input: DeviationBreakdownInput = {
  geometry: GEOMETRY,
  design: {
    cwInletC: DESIGN.cwInletC,
    cwMassFlowKgS: designMass,
    dutyMw: DESIGN.dutyMw,
    pluggedTubes: 0,
    cleanliness: DESIGN.cleanliness,
    backpressureKpa: 6.7,
  },
  heatBalanceDutyMw: 540,
  measured: {
    cwInletC: measuredPoint.cwInletC,
    cwMassFlowKgS: today.cwMassFlowKgS,
    dutyMw: today.dutyMw,
    pluggedTubes: measuredPoint.pluggedTubes,
    cleanliness: today.cleanliness,
    backpressureKpa: measuredPoint.backpressureKpa,
  },
  trendCleanliness: 0.62,
  turbine: { curve: GENERIC_CORRECTION_CURVE, loadFraction: 0.85 },
};

describe('deviation breakdown', () => {
  const b = deviationBreakdown(input);

  it('has the load term, the model offset, S0..S5 parts and the unexplained part in the fixed order', () => {
    expect(b.lines.map((l) => l.cause)).toEqual(['model-offset', 'load', 'cw-inlet-temperature', 'cw-flow', 'duty', 'plugged-tubes', 'fouling', 'unexplained']);
    expect(b.states.map((s) => s.name)).toEqual(['S0', 'S1', 'S2', 'S3', 'S4', 'S5']);
  });

  it('parts add up to measured minus datasheet design exactly', () => {
    const sum = b.lines.reduce((acc, l) => acc + l.deltaKpa, 0);
    expect(Math.abs(sum - (10.4 - 6.7))).toBeLessThan(1e-12);
    expect(b.totalKpa).toBeCloseTo(3.7, 12);
  });

  it('builds each state by replacing one factor of the previous one', () => {
    const [s0, s1, s2, s3, s4, s5] = b.states;
    expect(s0).toMatchObject({ cwInletC: DESIGN.cwInletC, cwMassFlowKgS: designMass, dutyMw: 540, pluggedTubes: 0, cleanliness: 0.85 });
    expect(s1?.cwInletC).toBe(29);
    expect(s2?.cwMassFlowKgS).toBe(today.cwMassFlowKgS);
    expect(s3?.dutyMw).toBe(today.dutyMw);
    expect(s4?.pluggedTubes).toBe(900);
    expect(s5?.cleanliness).toBe(0.62);
    expect(b.cleanlinessSource).toBe('fouling-trend');
  });

  it('each part is the model difference between neighbouring states', () => {
    const p = b.states.map((s) => s.backpressureKpa);
    expect(b.lines[2]?.deltaKpa).toBe(p[1]! - p[0]!);
    expect(b.lines[6]?.deltaKpa).toBe(p[5]! - p[4]!);
    expect(b.lines[7]?.deltaKpa).toBe(10.4 - p[5]!);
    const designModel = backpressureAtCleanlinessKpa({ geometry: GEOMETRY, ...DESIGN });
    expect(b.lines[0]?.deltaKpa).toBeCloseTo(designModel - 6.7, 9);
    expect(b.lines[1]?.deltaKpa).toBeCloseTo(p[0]! - designModel, 9);
  });

  it('warmer water, less flow, plugging and fouling all raise backpressure; lower load lowers it', () => {
    const d = Object.fromEntries(b.lines.map((l) => [l.cause, l.deltaKpa]));
    expect(d.load).toBeLessThan(0);
    expect(d['cw-inlet-temperature']).toBeGreaterThan(0);
    expect(d['cw-flow']).toBeGreaterThan(0);
    expect(d['plugged-tubes']).toBeGreaterThan(0);
    expect(d.fouling).toBeGreaterThan(0);
  });

  it('without a fouling trend it uses the measured CF, and the unexplained part vanishes', () => {
    const noTrend = deviationBreakdown({ ...input, trendCleanliness: undefined });
    expect(noTrend.cleanlinessSource).toBe('measured');
    expect(noTrend.states[5]?.cleanliness).toBe(today.cleanliness);
    // the measured CF reproduces the measured point through the model [derived]
    expect(Math.abs(noTrend.lines[7]!.deltaKpa)).toBeLessThan(1e-9);
  });

  it('costs causes by running each state through the turbine curve; heat-rate parts telescope', () => {
    const hr = (p: number) => heatRateChangePct(GENERIC_CORRECTION_CURVE, 0.85, p);
    const sum = b.lines.reduce((acc, l) => acc + (l.heatRatePct ?? Number.NaN), 0);
    expect(sum).toBeCloseTo(hr(10.4) - hr(6.7), 12);
    const p = b.states.map((s) => s.backpressureKpa);
    expect(b.lines[6]?.heatRatePct).toBeCloseTo(hr(p[5]!) - hr(p[4]!), 12);
  });
});
