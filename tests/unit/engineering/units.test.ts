import { describe, expect, it } from 'vitest';
import {
  absoluteKpaFromVacuumInHg,
  btuHft2FToWm2K,
  btuKwhToKjKwh,
  bwgWallMm,
  cToF,
  DISPLAY_PRESETS,
  fToC,
  gpmToM3s,
  inHgToKpa,
  kpaToInHg,
  m3hToM3s,
  mbarToKpa,
  psiToKpa,
  type QuantityKind,
} from '@shared/units.js';

describe('unit conversions (NIST SP 811 factors)', () => {
  it('converts inHg at 0 °C, psi and mbar to kPa', () => {
    expect(inHgToKpa(1)).toBe(3.386389);
    expect(kpaToInHg(3.386389)).toBeCloseTo(1, 15);
    expect(psiToKpa(1)).toBe(6.894757);
    expect(mbarToKpa(85)).toBeCloseTo(8.5, 12);
  });

  it('takes absolute pressure as barometer minus vacuum', () => {
    expect(absoluteKpaFromVacuumInHg(29.92, 27.92)).toBeCloseTo(2 * 3.386389, 12);
  });

  it('converts temperatures', () => {
    expect(fToC(212)).toBeCloseTo(100, 12);
    expect(cToF(-40)).toBeCloseTo(-40, 12);
  });

  it('converts flows: 1 US gal = 3.785411784 L', () => {
    expect(gpmToM3s(1)).toBeCloseTo(0.003785411784 / 60, 15);
    expect(gpmToM3s(250_000)).toBeCloseTo(15.7725491, 7);
    expect(m3hToM3s(3600)).toBe(1);
  });

  it('converts heat rate and heat-transfer coefficient', () => {
    expect(btuKwhToKjKwh(9500)).toBeCloseTo(10023.032, 6);
    expect(btuHft2FToWm2K(1)).toBe(5.678263);
  });

  it('gives BWG wall thickness [pub, Birmingham wire gauge] and rejects unknown gauges', () => {
    expect(bwgWallMm(18)).toBeCloseTo(0.049 * 25.4, 12);
    expect(bwgWallMm(22)).toBeCloseTo(0.028 * 25.4, 12);
    expect(() => bwgWallMm(30)).toThrow(/BWG 30/);
  });

  it('display presets round-trip every quantity kind', () => {
    for (const preset of [DISPLAY_PRESETS.us, DISPLAY_PRESETS.si]) {
      for (const kind of Object.keys(preset) as QuantityKind[]) {
        const u = preset[kind];
        expect(u.fromSi(u.toSi(12.345))).toBeCloseTo(12.345, 9);
        expect(u.label.length).toBeGreaterThan(0);
      }
    }
    expect(DISPLAY_PRESETS.us.pressure.label).toBe('inHgA');
    expect(DISPLAY_PRESETS.us.temperature.fromSi(100)).toBeCloseTo(212, 12);
    expect(DISPLAY_PRESETS.si.flow.toSi(3600)).toBe(1);
  });
});
