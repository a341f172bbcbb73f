/**
 * Fast liquid properties at 101.325 kPa for the hot paths (cooling water).
 * Over 0–60 °C a tabulated IF97 region 1 (step 0.25 K, local cubic through four nodes) stays within
 * 1e-6 relative of the full equation (the tests check it on a dense grid); from 60 °C to the boiling
 * point at 101.325 kPa the full equation is used; outside that, a RangeError.
 */
import { outOfRange } from './range-error.js';
import { region1Unchecked } from './if97-region1.js';
import { tsatKUnchecked } from './if97-region4.js';

export const COOLING_WATER_PRESSURE_MPA = 0.101325;
const TABLE_MIN_C = 0;
const TABLE_MAX_C = 60;
const STEP_K = 0.25;
const NODES = Math.round((TABLE_MAX_C - TABLE_MIN_C) / STEP_K) + 1;
const BOILING_C = tsatKUnchecked(COOLING_WATER_PRESSURE_MPA) - 273.15;

// One node beyond each end so the four-point stencil is always available inside the table.
const density = new Float64Array(NODES + 2);
const cp = new Float64Array(NODES + 2);
for (let k = 0; k < NODES + 2; k++) {
  // The node below 0 °C uses the region 1 equation slightly outside its range, only as a stencil point.
  const tK = 273.15 + TABLE_MIN_C + (k - 1) * STEP_K;
  const props = region1Unchecked(tK, COOLING_WATER_PRESSURE_MPA);
  density[k] = 1 / props.vM3Kg;
  cp[k] = props.cpKjKgK;
}

function interpolate(table: Float64Array, tempC: number): number {
  const x = (tempC - TABLE_MIN_C) / STEP_K;
  let i = Math.floor(x);
  if (i >= NODES - 1) i = NODES - 2;
  const u = x - i;
  // nodes i-1, i, i+1, i+2 sit at table indices i, i+1, i+2, i+3
  const y0 = table[i]!;
  const y1 = table[i + 1]!;
  const y2 = table[i + 2]!;
  const y3 = table[i + 3]!;
  const um1 = u - 1;
  const um2 = u - 2;
  const up1 = u + 1;
  return (-u * um1 * um2 * y0) / 6 + (up1 * um1 * um2 * y1) / 2 - (up1 * u * um2 * y2) / 2 + (up1 * u * um1 * y3) / 6;
}

function check(tempC: number): void {
  if (!(tempC >= TABLE_MIN_C && tempC <= BOILING_C)) {
    throw outOfRange('cooling-water temperature (°C)', tempC, `0 °C to ${BOILING_C.toFixed(2)} °C (liquid at 101.325 kPa)`);
  }
}

/** Density of liquid water at 101.325 kPa, kg/m³. */
export function liquidDensityKgM3(tempC: number): number {
  check(tempC);
  if (tempC <= TABLE_MAX_C) return interpolate(density, tempC);
  return 1 / region1Unchecked(tempC + 273.15, COOLING_WATER_PRESSURE_MPA).vM3Kg;
}

/** Isobaric heat capacity of liquid water at 101.325 kPa, kJ/(kg·K). */
export function liquidCpKjKgK(tempC: number): number {
  check(tempC);
  if (tempC <= TABLE_MAX_C) return interpolate(cp, tempC);
  return region1Unchecked(tempC + 273.15, COOLING_WATER_PRESSURE_MPA).cpKjKgK;
}
