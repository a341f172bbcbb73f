/**
 * IAPWS-IF97 verification values from the release, IAPWS R7-97(2012) (values as quoted in
 * ENGINEERING.md §2; values marked "extra" are further entries of the same tables, from memory).
 * Tables: 5 (region 1), 7 (backward T(p,h) region 1), 15 (region 2), 35 (psat), 36 (Tsat).
 */
import { describe, expect, it } from 'vitest';
import {
  region1,
  region1TemperatureFromPh,
  region2,
  saturationPressureMpa,
  saturationTemperatureK,
  saturationPressureKpa,
  saturationTemperatureC,
  saturatedLiquidEnthalpyKjKg,
} from '@shared/domain/steam/index.js';

// The release prints 9 significant digits; agreement to 1e-8 relative covers its rounding.
const close = (actual: number, expected: number, tol = 1e-8) => expect(Math.abs(actual / expected - 1)).toBeLessThanOrEqual(tol);

describe('IF97 region 4 (saturation line)', () => {
  it('gives the saturation pressures of IAPWS R7-97(2012) Table 35', () => {
    close(saturationPressureMpa(300), 0.353658941e-2);
    close(saturationPressureMpa(500), 0.263889776e1);
    close(saturationPressureMpa(600), 0.123443146e2);
  });

  it('gives the saturation temperatures of IAPWS R7-97(2012) Table 36', () => {
    close(saturationTemperatureK(0.1), 0.372755919e3);
    close(saturationTemperatureK(1), 0.453035632e3);
    close(saturationTemperatureK(10), 0.584149488e3);
  });

  it('round-trips T → p → T across the condenser range', () => {
    for (let t = 1; t <= 80; t += 0.37) expect(saturationTemperatureC(saturationPressureKpa(t))).toBeCloseTo(t, 9);
  });
});

describe('IF97 region 1 (liquid), IAPWS R7-97(2012) Table 5', () => {
  it('at 300 K, 3 MPa gives v, h, s, cp', () => {
    const r = region1(300, 3);
    close(r.vM3Kg, 0.100215168e-2);
    close(r.hKjKg, 0.115331273e3);
    close(r.sKjKgK, 0.392294792);
    close(r.cpKjKgK, 0.417301218e1);
  });

  it('at 300 K, 80 MPa gives h (and the extra v, s, cp entries)', () => {
    const r = region1(300, 80);
    close(r.hKjKg, 0.184142828e3);
    close(r.vM3Kg, 0.971180894e-3); // extra, from memory
    close(r.sKjKgK, 0.368563852); // extra, from memory
    close(r.cpKjKgK, 0.401008987e1); // extra, from memory
  });

  it('at 500 K, 3 MPa gives h (and the extra v, s, cp entries)', () => {
    const r = region1(500, 3);
    close(r.hKjKg, 0.975542239e3);
    close(r.vM3Kg, 0.1202418e-2); // extra, from memory
    close(r.sKjKgK, 0.258041912e1); // extra, from memory
    close(r.cpKjKgK, 0.465580682e1); // extra, from memory
  });
});

describe('IF97 region 1 backward T(p, h), IAPWS R7-97(2012) Table 7', () => {
  it('gives the tabulated temperatures', () => {
    close(region1TemperatureFromPh(3, 500), 0.391798509e3);
    close(region1TemperatureFromPh(80, 500), 0.378108626e3); // extra, from memory
    close(region1TemperatureFromPh(80, 1500), 0.611041229e3);
  });

  it('inverts the basic equation to within a few mK (the backward equation’s stated consistency)', () => {
    for (const [tK, pMpa] of [
      [290, 0.2],
      [320, 0.1],
      [400, 5],
      [550, 20],
    ] as const) {
      const h = region1(tK, pMpa).hKjKg;
      expect(Math.abs(region1TemperatureFromPh(pMpa, h) - tK)).toBeLessThan(0.025);
    }
  });
});

describe('IF97 region 2 (vapour), IAPWS R7-97(2012) Table 15', () => {
  it('at 300 K, 0.0035 MPa gives v, h, s (and the extra cp entry)', () => {
    const r = region2(300, 0.0035);
    close(r.vM3Kg, 0.394913866e2);
    close(r.hKjKg, 0.254991145e4);
    close(r.sKjKgK, 0.852238967e1);
    close(r.cpKjKgK, 0.191300162e1); // extra, from memory
  });

  it('at 700 K, 0.0035 MPa and 700 K, 30 MPa gives h (and the extra v, s entries)', () => {
    close(region2(700, 0.0035).hKjKg, 0.333568375e4);
    close(region2(700, 30).hKjKg, 0.263149474e4);
    close(region2(700, 0.0035).vM3Kg, 0.923015898e2); // extra, from memory
    close(region2(700, 30).vM3Kg, 0.542946619e-2); // extra, from memory
    close(region2(700, 30).sKjKgK, 0.517540298e1); // extra, from memory
  });
});

describe('IF97 ranges of validity', () => {
  it('rejects a temperature outside region 1 with a RangeError naming the quantity, value and range', () => {
    expect(() => region1(700, 30)).toThrow(RangeError);
    expect(() => region1(700, 30)).toThrow(/region 1 temperature.*700.*273\.15 K to 623\.15 K/);
  });

  it('rejects vapour-side states in region 1 and liquid-side states in region 2', () => {
    expect(() => region1(400, 0.1)).toThrow(/region 1 pressure/);
    expect(() => region2(300, 0.1)).toThrow(/region 2 pressure/);
  });

  it('rejects pressures outside the saturation line', () => {
    expect(() => saturationTemperatureC(0.5)).toThrow(/pressureKpa = 0\.5 .*0\.611213 kPa to 22064 kPa/);
    expect(() => saturationTemperatureC(23000)).toThrow(RangeError);
    expect(() => saturationPressureKpa(-1)).toThrow(/temperatureC = -1/);
    expect(() => saturationTemperatureC(Number.NaN)).toThrow(/finite/);
  });

  it('rejects an enthalpy that is not liquid in the backward equation', () => {
    expect(() => region1TemperatureFromPh(0.1, 2600)).toThrow(/region 1 enthalpy/);
  });

  it('gives saturated liquid enthalpy near 0 at the triple point and rejects region 3', () => {
    expect(Math.abs(saturatedLiquidEnthalpyKjKg(0.01))).toBeLessThan(0.05);
    expect(() => saturatedLiquidEnthalpyKjKg(360)).toThrow(/350 °C/);
  });
});
