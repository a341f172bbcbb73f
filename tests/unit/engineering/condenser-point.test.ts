import { describe, expect, it } from 'vitest';
import {
  analyseCondenserPoint,
  backpressureAtCleanlinessKpa,
  cleanCoefficientWm2K,
  correctedBackpressureKpa,
  cwRiseK,
  DEFAULT_HEI_TABLES,
  materialFactor,
  reconcileDuty,
  rescaleCleanCoefficientWm2K,
  tubeConstantC,
  tubeVelocityMs,
  activeSurfaceM2,
  type HeiTables,
} from '@shared/domain/condenser/index.js';
import { PointRejectedError } from '@shared/domain/validity/index.js';
import { liquidDensityKgM3, region1, saturationTemperatureC } from '@shared/domain/steam/index.js';
import { cToF, deltaKToF, fToC, inToMm, kpaToInHg, msToFts, wm2KToBtuHft2F } from '@shared/units.js';
import { DESIGN, GEOMETRY } from './condenser-fixture.js';

/** A measured point made from the model itself: design conditions at a chosen CF. */
function pointAt(cleanliness: number, overrides: Partial<typeof DESIGN> = {}) {
  const s = { ...DESIGN, ...overrides };
  const p = backpressureAtCleanlinessKpa({ geometry: GEOMETRY, ...s, cleanliness });
  const rise = cwRiseK(s.cwInletC, liquidDensityKgM3(s.cwInletC) * s.cwFlowM3s, s.dutyMw);
  return { backpressureKpa: p, cwInletC: s.cwInletC, cwOutletC: s.cwInletC + rise, cwFlowM3s: s.cwFlowM3s, pluggedTubes: s.pluggedTubes };
}

describe('condenser point: temperatures and LMTD', () => {
  const r = analyseCondenserPoint({
    backpressureKpa: 6.5,
    cwInletC: 22,
    cwOutletC: 31,
    cwFlowM3s: 15,
    pluggedTubes: 0,
    geometry: GEOMETRY,
    referenceCleanliness: 0.85,
  });

  it('computes rise, ITD, TTD from the saturation temperature at the backpressure', () => {
    const ts = saturationTemperatureC(6.5);
    expect(r.saturationC).toBe(ts);
    expect(r.riseK).toBeCloseTo(9, 12);
    expect(r.itdK).toBeCloseTo(ts - 22, 12);
    expect(r.ttdK).toBeCloseTo(ts - 31, 12);
  });

  it('LMTD is the closed form (t2 − t1)/ln(ITD/TTD) and lies between TTD and ITD', () => {
    expect(r.lmtdK).toBeCloseTo(9 / Math.log(r.itdK / r.ttdK), 12);
    expect(r.lmtdK).toBeGreaterThan(r.ttdK);
    expect(r.lmtdK).toBeLessThan(r.itdK);
  });

  it('U·A_eff·LMTD returns the duty', () => {
    expect((r.uWm2K * r.activeSurfaceM2 * r.lmtdK) / 1e6).toBeCloseTo(r.dutyMw, 9);
  });

  it('duty matches the CW enthalpy rise from IF97 (energy balance, first law [derived])', () => {
    // Independent path: W·(h(t2) − h(t1)) with region 1 enthalpies at 101.325 kPa; the
    // cp-at-mean-temperature form agrees to well under 0.01 %.
    const w = (1 / region1(22 + 273.15, 0.101325).vM3Kg) * 15;
    const q = (w * (region1(31 + 273.15, 0.101325).hKjKg - region1(22 + 273.15, 0.101325).hKjKg)) / 1000;
    expect(Math.abs(r.dutyMw / q - 1)).toBeLessThan(1e-4);
  });
});

describe('expected backpressure by ε-NTU against the measured point (LMTD consistency)', () => {
  it('at a reference cleanliness equal to the measured CF it returns the measured backpressure', () => {
    for (const input of [
      { backpressureKpa: 6.5, cwInletC: 22, cwOutletC: 31, cwFlowM3s: 15, pluggedTubes: 0 },
      { backpressureKpa: 11, cwInletC: 30, cwOutletC: 41.5, cwFlowM3s: 12, pluggedTubes: 1500 },
      { backpressureKpa: 3.2, cwInletC: 8, cwOutletC: 18, cwFlowM3s: 14, pluggedTubes: 40 },
    ]) {
      const first = analyseCondenserPoint({ ...input, geometry: GEOMETRY, referenceCleanliness: 0.85 });
      const again = analyseCondenserPoint({ ...input, geometry: GEOMETRY, referenceCleanliness: first.cleanliness });
      expect(Math.abs(again.expectedBackpressureKpa / input.backpressureKpa - 1)).toBeLessThan(1e-10);
    }
  });

  it('a point made by the model at CF 0.7 is read back as CF 0.7', () => {
    const r = analyseCondenserPoint({ ...pointAt(0.7), geometry: GEOMETRY, referenceCleanliness: 0.85 });
    expect(r.cleanliness).toBeCloseTo(0.7, 10);
  });

  it('a cleaner reference gives a lower expected backpressure than the measured one', () => {
    const point = pointAt(0.6);
    const r = analyseCondenserPoint({ ...point, geometry: GEOMETRY, referenceCleanliness: 0.85 });
    expect(r.expectedBackpressureKpa).toBeLessThan(point.backpressureKpa - 0.5);
  });

  it('with a user clean coefficient, CF = U/U* and the expected backpressure uses U*', () => {
    const input = { backpressureKpa: 6.5, cwInletC: 22, cwOutletC: 31, cwFlowM3s: 15, pluggedTubes: 0, geometry: GEOMETRY };
    const hei = analyseCondenserPoint({ ...input, referenceCleanliness: 0.85 });
    const user = analyseCondenserPoint({ ...input, referenceCleanliness: 0.85, uCleanWm2K: 3500 });
    expect(user.uCleanWm2K).toBe(3500);
    expect(user.cleanliness).toBeCloseTo(hei.uWm2K / 3500, 12);
    expect(user.uCleanBasis).toMatch(/user-supplied/);
    const same = analyseCondenserPoint({ ...input, referenceCleanliness: user.cleanliness, uCleanWm2K: 3500 });
    expect(same.expectedBackpressureKpa).toBeCloseTo(6.5, 9);
  });
});

describe('HEI clean coefficient', () => {
  it('reproduces the hand calculation C·√V·Fw·Fm for 1 in titanium 22 BWG at 7 ft/s and 70 °F', () => {
    // C(1 in) = 263 [from memory], Fw(70 °F) = 1.00 [from memory], Fm(Ti 22) = 0.81 [older HEI]
    const u = cleanCoefficientWm2K(GEOMETRY, fToC(70), 7 * 0.3048);
    expect(wm2KToBtuHft2F(u.value)).toBeCloseTo(263 * Math.sqrt(7) * 1.0 * 0.81, 9);
    expect(u.basis).toBe(DEFAULT_HEI_TABLES.basis);
    expect(u.warnings).toEqual([]);
  });

  it('picks C by OD band, split at the midpoints between standard sizes', () => {
    expect(tubeConstantC(DEFAULT_HEI_TABLES, inToMm(0.75))).toBe(267);
    expect(tubeConstantC(DEFAULT_HEI_TABLES, inToMm(0.875))).toBe(263);
    expect(tubeConstantC(DEFAULT_HEI_TABLES, inToMm(1))).toBe(263);
    expect(tubeConstantC(DEFAULT_HEI_TABLES, inToMm(1.25))).toBe(259);
    expect(tubeConstantC(DEFAULT_HEI_TABLES, inToMm(1.5))).toBe(255);
    expect(tubeConstantC(DEFAULT_HEI_TABLES, inToMm(1.75))).toBe(251);
    expect(tubeConstantC(DEFAULT_HEI_TABLES, inToMm(2))).toBe(247);
  });

  it('interpolates Fw linearly and clamps outside the table with a warning', () => {
    const at75 = cleanCoefficientWm2K(GEOMETRY, fToC(75), 2);
    const at70 = cleanCoefficientWm2K(GEOMETRY, fToC(70), 2);
    expect(at75.value / at70.value).toBeCloseTo(1.025, 12);
    const cold = cleanCoefficientWm2K(GEOMETRY, fToC(35), 2);
    expect(cold.value / at70.value).toBeCloseTo(0.67, 12);
    expect(cold.warnings[0]).toMatch(/outside the Fw table/);
  });

  it('interpolates Fm linearly in wall thickness between listed gauges and rejects gauges outside them', () => {
    expect(materialFactor(DEFAULT_HEI_TABLES, 'admiralty', 18)).toBe(1.0);
    // BWG 19 wall 0.042 in lies between 18 (0.049) and 20 (0.035): halfway
    expect(materialFactor(DEFAULT_HEI_TABLES, 'admiralty', 19)).toBeCloseTo(1.01, 12);
    expect(() => materialFactor(DEFAULT_HEI_TABLES, 'titanium', 24)).toThrow(/BWG 24 is outside the listed gauges for titanium \(BWG 18 to 22\)/);
  });

  it('uses edited tables when given and records their basis on the result', () => {
    const tables: HeiTables = { ...DEFAULT_HEI_TABLES, basis: 'site tables 2024', tubeConstant: [{ odBelowMm: null, c: 256 }] };
    const r = analyseCondenserPoint({
      backpressureKpa: 6.5,
      cwInletC: 22,
      cwOutletC: 31,
      cwFlowM3s: 15,
      pluggedTubes: 0,
      geometry: GEOMETRY,
      referenceCleanliness: 0.85,
      heiTables: tables,
    });
    expect(r.uCleanBasis).toBe('site tables 2024');
    const base = cleanCoefficientWm2K(GEOMETRY, 22, r.velocityMs);
    expect(r.uCleanWm2K / base.value).toBeCloseTo(256 / 263, 12);
  });

  it('moves a user clean coefficient to other conditions by √(V/V*)·Fw(t1)/Fw(t1*)', () => {
    const u = rescaleCleanCoefficientWm2K(3000, { velocityMs: 2, cwInletC: fToC(70) }, { velocityMs: 2.5, cwInletC: fToC(90) });
    expect(u).toBeCloseTo(3000 * Math.sqrt(2.5 / 2) * (1.09 / 1.0), 9);
  });
});

describe('plugged tubes', () => {
  it('with total flow held, U_clean·A_eff scales as √(1 − f) [derived]', () => {
    const ua = (plugged: number) => cleanCoefficientWm2K(GEOMETRY, 20, tubeVelocityMs(GEOMETRY, 15, plugged)).value * activeSurfaceM2(GEOMETRY, plugged);
    for (const plugged of [312, 3120, 9360]) {
      const f = plugged / GEOMETRY.tubeCount;
      expect(ua(plugged) / ua(0)).toBeCloseTo(Math.sqrt(1 - f), 12);
    }
  });

  it('plugging raises expected backpressure, and the point reports the effect', () => {
    const r = analyseCondenserPoint({ ...pointAt(0.8, { pluggedTubes: 3120 }), geometry: GEOMETRY, referenceCleanliness: 0.8 });
    expect(r.pluggedTubesEffectKpa).toBeGreaterThan(0);
    expect(r.pluggedFraction).toBeCloseTo(0.1, 12);
    const unplugged = backpressureAtCleanlinessKpa({ geometry: GEOMETRY, ...DESIGN, cleanliness: r.cleanliness });
    expect(r.pluggedTubesEffectKpa).toBeCloseTo(pointAt(0.8, { pluggedTubes: 3120 }).backpressureKpa - unplugged, 9);
  });
});

describe('correction to design conditions', () => {
  it('holds the measured CF: a point taken at other conditions corrects back to the model at design conditions', () => {
    const offDesign = pointAt(0.72, { cwInletC: 30, cwFlowM3s: 13, dutyMw: 560 });
    const r = analyseCondenserPoint({ ...offDesign, geometry: GEOMETRY, referenceCleanliness: 0.85 });
    const corrected = correctedBackpressureKpa(r, GEOMETRY, DESIGN);
    const direct = backpressureAtCleanlinessKpa({ geometry: GEOMETRY, ...DESIGN, cleanliness: 0.72 });
    expect(corrected).toBeCloseTo(direct, 9);
  });
});

describe('trade checks [common practice]', () => {
  it('at the same load and CW flow, fouling shows as rising Ts and TTD at an unchanged rise', () => {
    const clean = analyseCondenserPoint({ ...pointAt(0.9), geometry: GEOMETRY, referenceCleanliness: 0.85 });
    const fouled = analyseCondenserPoint({ ...pointAt(0.55), geometry: GEOMETRY, referenceCleanliness: 0.85 });
    expect(fouled.riseK).toBeCloseTo(clean.riseK, 12);
    expect(fouled.saturationC).toBeGreaterThan(clean.saturationC + 2);
    expect(fouled.ttdK).toBeGreaterThan(clean.ttdK + 2);
  });

  it('a typical design point has TTD 5–10 °F, tube velocity 6–8 ft/s and backpressure 1.5–3.5 inHgA', () => {
    const r = analyseCondenserPoint({ ...pointAt(0.85), geometry: GEOMETRY, referenceCleanliness: 0.85 });
    expect(deltaKToF(r.ttdK)).toBeGreaterThan(5);
    expect(deltaKToF(r.ttdK)).toBeLessThan(10);
    expect(msToFts(r.velocityMs)).toBeGreaterThan(6);
    expect(msToFts(r.velocityMs)).toBeLessThan(8);
    expect(kpaToInHg(pointAt(0.85).backpressureKpa)).toBeGreaterThan(1.5);
    expect(kpaToInHg(pointAt(0.85).backpressureKpa)).toBeLessThan(3.5);
  });

  it('outlet water in the upper 90s °F at 100 °F condensing (a TTD of a few °F) reads as a very clean condenser', () => {
    const r = analyseCondenserPoint({
      backpressureKpa: 6.545,
      cwInletC: fToC(80),
      cwOutletC: fToC(97),
      cwFlowM3s: 15,
      pluggedTubes: 0,
      geometry: GEOMETRY,
      referenceCleanliness: 0.85,
    });
    expect(cToF(r.saturationC)).toBeCloseTo(100, 0);
    expect(r.cleanliness).toBeGreaterThan(0.95);
  });

  it('a TTD below 1 K gets an instrument warning', () => {
    const r = analyseCondenserPoint({
      backpressureKpa: 5.0,
      cwInletC: 20,
      cwOutletC: 32.4,
      cwFlowM3s: 15,
      pluggedTubes: 0,
      geometry: GEOMETRY,
      referenceCleanliness: 0.85,
    });
    expect(r.ttdK).toBeLessThan(1);
    expect(r.warnings.some((w) => /instrument/.test(w))).toBe(true);
  });
});

describe('rejected points', () => {
  const base = { backpressureKpa: 6.5, cwFlowM3s: 15, pluggedTubes: 0, geometry: GEOMETRY, referenceCleanliness: 0.85 };

  it('rejects an outlet not above the inlet with the code rise-not-positive', () => {
    const run = () => analyseCondenserPoint({ ...base, cwInletC: 25, cwOutletC: 25 });
    expect(run).toThrow(PointRejectedError);
    try {
      run();
    } catch (e) {
      expect((e as PointRejectedError).reason).toBe('rise-not-positive');
    }
  });

  it('rejects an outlet at or above saturation with the code ttd-not-positive', () => {
    try {
      analyseCondenserPoint({ ...base, cwInletC: 25, cwOutletC: 40 });
      expect.unreachable();
    } catch (e) {
      expect((e as PointRejectedError).reason).toBe('ttd-not-positive');
      expect((e as Error).message).toMatch(/saturation temperature/);
    }
  });

  it('rejects plugged tubes beyond the tube count and a gauge outside the material table', () => {
    expect(() => analyseCondenserPoint({ ...base, cwInletC: 20, cwOutletC: 30, pluggedTubes: 31200 })).toThrow(/pluggedTubes/);
    expect(() => analyseCondenserPoint({ ...base, cwInletC: 20, cwOutletC: 30, geometry: { ...GEOMETRY, tubeBwg: 14 } })).toThrow(
      /BWG 14 is outside the listed gauges/,
    );
  });
});

describe('CW-side duty against heat-balance duty', () => {
  it('flags a gap over 5 % and not one under it', () => {
    expect(reconcileDuty(560, 600).flagged).toBe(true);
    expect(reconcileDuty(580, 600).flagged).toBe(false);
    expect(reconcileDuty(560, 600).gapFraction).toBeCloseTo(-40 / 600, 12);
    expect(reconcileDuty(560, 600).message).toMatch(/flow metering/);
  });
});

describe('edited HEI tables', () => {
  it('are checked, with a clear error for a table out of order', () => {
    const bad: HeiTables = {
      ...DEFAULT_HEI_TABLES,
      inletTemperatureFactor: [
        { inletC: 20, factor: 1 },
        { inletC: 10, factor: 0.9 },
      ],
    };
    expect(() => backpressureAtCleanlinessKpa({ geometry: { ...GEOMETRY }, ...DESIGN, heiTables: bad })).toThrow(/Fw rows must be in increasing order/);
  });
});
