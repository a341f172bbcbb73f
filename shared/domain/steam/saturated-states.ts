/** Saturated liquid and vapour enthalpies on the saturation line (IF97 regions 1 and 2 at psat(T)). */
import { outOfRange, requireFinite } from './range-error.js';
import { psatMpaUnchecked } from './if97-region4.js';
import { region1Unchecked } from './if97-region1.js';
import { region2Unchecked } from './if97-region2.js';

function checkTemp(tempC: number): number {
  requireFinite('temperatureC', tempC);
  // Above 350 °C the saturated states lie in IF97 region 3, which is not implemented.
  if (tempC < 0 || tempC > 350) throw outOfRange('temperatureC', tempC, '0 °C to 350 °C for saturated enthalpies');
  return tempC + 273.15;
}

/** hf, kJ/kg. */
export function saturatedLiquidEnthalpyKjKg(tempC: number): number {
  const tK = checkTemp(tempC);
  return region1Unchecked(tK, psatMpaUnchecked(tK)).hKjKg;
}

/** hg, kJ/kg. */
export function saturatedVapourEnthalpyKjKg(tempC: number): number {
  const tK = checkTemp(tempC);
  return region2Unchecked(tK, psatMpaUnchecked(tK)).hKjKg;
}
