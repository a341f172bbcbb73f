/** Condenser saturation table in inHgA / °F [derived from IF97 region 4, conventional inHg at 0 °C], ENGINEERING.md §2. */
import { describe, expect, it } from 'vitest';
import { saturationPressureKpa, saturationTemperatureC } from '@shared/domain/steam/index.js';
import { cToF, fToC, inHgToKpa, kpaToInHg } from '@shared/units.js';

describe('condenser saturation table (inHgA, °F)', () => {
  it.each([
    [1.0, 79.005],
    [1.5, 91.682],
    [2.0, 101.098],
    [3.0, 115.01],
    [4.0, 125.37],
  ])('%s inHgA condenses at %s °F', (inHgA, degF) => {
    expect(Math.abs(cToF(saturationTemperatureC(inHgToKpa(inHgA))) - degF)).toBeLessThanOrEqual(0.0005);
  });

  it.each([
    [100, 1.9351],
    [120, 3.4509],
  ])('%s °F condenses at %s inHgA', (degF, inHgA) => {
    expect(Math.abs(kpaToInHg(saturationPressureKpa(fToC(degF))) - inHgA)).toBeLessThanOrEqual(0.00005);
  });

  it('the inHg reference temperature matters: at 60 °F, 2 inHgA condenses about 0.09 °F lower (ENGINEERING.md §1)', () => {
    const at0C = cToF(saturationTemperatureC(2 * 3.386389));
    const at60F = cToF(saturationTemperatureC(2 * 3.37685));
    expect(at60F - at0C).toBeCloseTo(-0.09, 1);
  });
});
