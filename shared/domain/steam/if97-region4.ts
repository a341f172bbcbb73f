/**
 * IAPWS-IF97 region 4: the saturation line, both directions (IAPWS R7-97(2012), eqs. 30 and 31).
 * Valid from 273.15 K to the critical point 647.096 K (0.000611213 MPa to 22.064 MPa).
 */
import { outOfRange, requireFinite } from './range-error.js';

const N1 = 0.11670521452767e4;
const N2 = -0.72421316703206e6;
const N3 = -0.17073846940092e2;
const N4 = 0.1202082470247e5;
const N5 = -0.32325550322333e7;
const N6 = 0.1491510861353e2;
const N7 = -0.48232657361591e4;
const N8 = 0.40511340542057e6;
const N9 = -0.23855557567849;
const N10 = 0.65017534844798e3;

export const REGION4_T_MIN_K = 273.15;
export const CRITICAL_TEMPERATURE_K = 647.096;
export const CRITICAL_PRESSURE_MPA = 22.064;
/** psat(273.15 K), the lower end of region 4 in pressure. */
export const REGION4_P_MIN_MPA = 0.000611212677;

/** Saturation pressure in MPa at temperature tK (no range check; callers check). */
export function psatMpaUnchecked(tK: number): number {
  const theta = tK + N9 / (tK - N10);
  const a = theta * theta + N1 * theta + N2;
  const b = N3 * theta * theta + N4 * theta + N5;
  const c = N6 * theta * theta + N7 * theta + N8;
  const x = (2 * c) / (-b + Math.sqrt(b * b - 4 * a * c));
  const x2 = x * x;
  return x2 * x2;
}

/** Saturation temperature in K at pressure pMpa (no range check; callers check). */
export function tsatKUnchecked(pMpa: number): number {
  const beta = Math.sqrt(Math.sqrt(pMpa));
  const e = beta * beta + N3 * beta + N6;
  const f = N1 * beta * beta + N4 * beta + N7;
  const g = N2 * beta * beta + N5 * beta + N8;
  const d = (2 * g) / (-f - Math.sqrt(f * f - 4 * e * g));
  const s = N10 + d;
  return (s - Math.sqrt(s * s - 4 * (N9 + N10 * d))) / 2;
}

export function saturationPressureMpa(tK: number): number {
  requireFinite('saturation temperature (K)', tK);
  if (tK < REGION4_T_MIN_K || tK > CRITICAL_TEMPERATURE_K) {
    throw outOfRange('saturation temperature', tK, '273.15 K to 647.096 K');
  }
  return psatMpaUnchecked(tK);
}

export function saturationTemperatureK(pMpa: number): number {
  requireFinite('saturation pressure (MPa)', pMpa);
  // Small tolerance at the lower end so psat(273.15 K) round-trips.
  if (pMpa < REGION4_P_MIN_MPA * (1 - 1e-9) || pMpa > CRITICAL_PRESSURE_MPA) {
    throw outOfRange('saturation pressure', pMpa, '0.000611213 MPa to 22.064 MPa');
  }
  return tsatKUnchecked(pMpa);
}

/** Saturation pressure, kPa, at a temperature in °C (0 °C to 373.946 °C). */
export function saturationPressureKpa(tempC: number): number {
  requireFinite('temperatureC', tempC);
  const tK = tempC + 273.15;
  if (tK < REGION4_T_MIN_K || tK > CRITICAL_TEMPERATURE_K) {
    throw outOfRange('temperatureC', tempC, '0 °C to 373.946 °C for saturation');
  }
  return psatMpaUnchecked(tK) * 1000;
}

/** Saturation temperature, °C, at a pressure in kPa (0.611213 kPa to 22,064 kPa). */
export function saturationTemperatureC(pressureKpa: number): number {
  // Inline check kept cheap: this sits on hot paths.
  if (!(pressureKpa >= REGION4_P_MIN_MPA * 1000 * (1 - 1e-9) && pressureKpa <= CRITICAL_PRESSURE_MPA * 1000)) {
    if (!Number.isFinite(pressureKpa)) throw new RangeError(`pressureKpa must be a finite number, got ${pressureKpa}`);
    throw outOfRange('pressureKpa', pressureKpa, '0.611213 kPa to 22064 kPa for saturation');
  }
  return tsatKUnchecked(pressureKpa / 1000) - 273.15;
}
