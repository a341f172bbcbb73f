/**
 * Cross-check against an independent implementation: Debian's python3-iapws (IAPWS-IF97), called once
 * with the whole grid. Relative error ≤ 1e-6 (ENGINEERING.md §2).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { queryPythonIapws, pythonIapwsAvailable, type IapwsQuery, type IapwsAnswer } from '../../helpers/python-iapws.js';
import { liquidCpKjKgK, liquidDensityKgM3, region1, region2, saturationPressureKpa, saturationTemperatureC } from '@shared/domain/steam/index.js';

const TOL = 1e-6;
const rel = (a: number, b: number) => Math.abs(a / b - 1);

const saturationPressuresKpa = Array.from({ length: 300 }, (_, k) => 1 + (29 * k) / 299);
const saturationTemperaturesC = Array.from({ length: 300 }, (_, k) => 6.97 + ((69.1 - 6.97) * k) / 299);
const liquidTemperaturesC = Array.from({ length: 121 }, (_, k) => k * 0.5);
const liquidPressuresMpa = [0.1, 0.2, 0.3, 0.4, 0.5];
const vapourStates = Array.from({ length: 10 }, (_, i) => 320 + i * 40).flatMap((tK) =>
  [0.001, 0.003, 0.006, 0.01].filter((p) => tK > 330 || p < 0.01).map((pMpa) => ({ tK, pMpa })),
);

const queries: IapwsQuery[] = [
  ...saturationPressuresKpa.map((p) => ({ kind: 'tsat' as const, pMpa: p / 1000 })),
  ...saturationTemperaturesC.map((t) => ({ kind: 'psat' as const, tK: t + 273.15 })),
  ...liquidTemperaturesC.flatMap((t) => liquidPressuresMpa.map((pMpa) => ({ kind: 'region1' as const, tK: t + 273.15, pMpa }))),
  ...liquidTemperaturesC.map((t) => ({ kind: 'region1' as const, tK: t + 273.15, pMpa: 0.101325 })),
  ...vapourStates.map((s) => ({ kind: 'region2' as const, ...s })),
];

let answers: IapwsAnswer[] = [];

beforeAll(() => {
  if (!pythonIapwsAvailable()) {
    throw new Error('Debian python3-iapws is missing: apt-get install -y --no-install-recommends python3-iapws (uses /usr/bin/python3)');
  }
  answers = queryPythonIapws(queries);
});

describe('IAPWS-IF97 against python3-iapws on a grid of more than 1,000 points', () => {
  it('the grid has at least 1,000 points', () => {
    expect(queries.length).toBeGreaterThanOrEqual(1000);
  });

  it('saturation temperature over 1–30 kPa agrees within 1e-6 relative (in K)', () => {
    saturationPressuresKpa.forEach((p, k) => {
      expect(rel(saturationTemperatureC(p) + 273.15, answers[k]!.value!)).toBeLessThanOrEqual(TOL);
    });
  });

  it('saturation pressure over the same range agrees within 1e-6 relative', () => {
    const off = saturationPressuresKpa.length;
    saturationTemperaturesC.forEach((t, k) => {
      expect(rel(saturationPressureKpa(t) / 1000, answers[off + k]!.value!)).toBeLessThanOrEqual(TOL);
    });
  });

  it('liquid v, h, s, cp over 0–60 °C at 0.1–0.5 MPa agree within 1e-6 relative', () => {
    let k = saturationPressuresKpa.length + saturationTemperaturesC.length;
    let worst = 0;
    for (const t of liquidTemperaturesC) {
      for (const pMpa of liquidPressuresMpa) {
        const ours = region1(t + 273.15, pMpa);
        const ref = answers[k++]!;
        worst = Math.max(worst, rel(ours.vM3Kg, ref.v!), rel(ours.hKjKg, ref.h!), rel(ours.cpKjKgK, ref.cp!));
        // s passes through zero at 0.01 °C, so compare it with an absolute floor.
        expect(Math.abs(ours.sKjKgK - ref.s!)).toBeLessThanOrEqual(TOL * Math.max(Math.abs(ref.s!), 1e-3));
      }
    }
    expect(worst).toBeLessThanOrEqual(TOL);
  });

  it('the fast cooling-water density and cp at 101.325 kPa agree within 1e-6 relative', () => {
    const off = saturationPressuresKpa.length + saturationTemperaturesC.length + liquidTemperaturesC.length * liquidPressuresMpa.length;
    liquidTemperaturesC.forEach((t, k) => {
      const ref = answers[off + k]!;
      expect(rel(liquidDensityKgM3(t), 1 / ref.v!)).toBeLessThanOrEqual(TOL);
      expect(rel(liquidCpKjKgK(t), ref.cp!)).toBeLessThanOrEqual(TOL);
    });
  });

  it('low-pressure vapour v, h, s, cp agree within 1e-6 relative', () => {
    const off = queries.length - vapourStates.length;
    vapourStates.forEach((s, k) => {
      const ours = region2(s.tK, s.pMpa);
      const ref = answers[off + k]!;
      expect(rel(ours.vM3Kg, ref.v!)).toBeLessThanOrEqual(TOL);
      expect(rel(ours.hKjKg, ref.h!)).toBeLessThanOrEqual(TOL);
      expect(rel(ours.sKjKgK, ref.s!)).toBeLessThanOrEqual(TOL);
      expect(rel(ours.cpKjKgK, ref.cp!)).toBeLessThanOrEqual(TOL);
    });
  });
});
