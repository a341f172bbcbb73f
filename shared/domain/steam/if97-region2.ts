/**
 * IAPWS-IF97 region 2 (vapour), basic equation (IAPWS R7-97(2012), eqs. 15–17, Tables 10 and 11).
 * Range: 273.15 K ≤ T ≤ 623.15 K, 0 < p ≤ psat(T); 623.15 K < T ≤ 863.15 K, 0 < p ≤ p_B23(T);
 * 863.15 K < T ≤ 1073.15 K, 0 < p ≤ 100 MPa.
 */
import { outOfRange, requireFinite } from './range-error.js';
import { psatMpaUnchecked } from './if97-region4.js';
import { R_KJ_KGK, type SteamProperties } from './if97-region1.js';

const J0 = [0, 1, -5, -4, -3, -2, -1, 2, 3];
const N0 = [
  -0.96927686500217e1, 0.10086655968018e2, -0.5608791128302e-2, 0.71452738081455e-1, -0.40710498223928, 0.14240819171444e1, -0.4383951131945e1,
  -0.28408632460772, 0.21268463753307e-1,
];

const IR = [1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 5, 6, 6, 6, 7, 7, 7, 8, 8, 9, 10, 10, 10, 16, 16, 18, 20, 20, 20, 21, 22, 23, 24, 24, 24];
const JR = [
  0, 1, 2, 3, 6, 1, 2, 4, 7, 36, 0, 1, 3, 6, 35, 1, 2, 3, 7, 3, 16, 35, 0, 11, 25, 8, 36, 13, 4, 10, 14, 29, 50, 57, 20, 35, 48, 21, 53, 39, 26, 40, 58,
];
const NR = [
  -0.17731742473213e-2, -0.17834862292358e-1, -0.45996013696365e-1, -0.57581259083432e-1, -0.5032527872793e-1, -0.33032641670203e-4, -0.18948987516315e-3,
  -0.39392777243355e-2, -0.43797295650573e-1, -0.26674547914087e-4, 0.20481737692309e-7, 0.43870667284435e-6, -0.3227767723857e-4, -0.15033924542148e-2,
  -0.40668253562649e-1, -0.78847309559367e-9, 0.12790717852285e-7, 0.48225372718507e-6, 0.22922076337661e-5, -0.16714766451061e-10, -0.21171472321355e-2,
  -0.23895741934104e2, -0.5905956432427e-17, -0.12621808899101e-5, -0.38946842435739e-1, 0.11256211360459e-10, -0.82311340897998e1, 0.19809712802088e-7,
  0.10406965210174e-18, -0.10234747095929e-12, -0.10018179379511e-8, -0.80882908646985e-10, 0.10693031879409, -0.33662250574171, 0.89185845355421e-24,
  0.30629316876232e-12, -0.42002467698208e-5, -0.59056029685639e-25, 0.37826947613457e-5, -0.12768608934681e-14, 0.73087610595061e-28, 0.55414715350778e-16,
  -0.9436970724121e-6,
];

/** Boundary between regions 2 and 3, p_B23(T) in MPa (eq. 5). */
export function b23PressureMpa(tK: number): number {
  return 0.34805185628969e3 - 0.11671859879975e1 * tK + 0.10192970039326e-2 * tK * tK;
}

export function region2Unchecked(tK: number, pMpa: number): SteamProperties {
  const pi = pMpa;
  const tau = 540 / tK;
  let g0 = Math.log(pi);
  let g0Tau = 0;
  let g0TauTau = 0;
  for (let k = 0; k < 9; k++) {
    const j = J0[k]!;
    const n = N0[k]!;
    g0 += n * tau ** j;
    g0Tau += n * j * tau ** (j - 1);
    g0TauTau += n * j * (j - 1) * tau ** (j - 2);
  }
  const b = tau - 0.5;
  let gr = 0;
  let grPi = 0;
  let grTau = 0;
  let grTauTau = 0;
  for (let k = 0; k < 43; k++) {
    const i = IR[k]!;
    const j = JR[k]!;
    const n = NR[k]!;
    const piI1 = pi ** (i - 1);
    const piI = piI1 * pi;
    const bJ = b ** j;
    gr += n * piI * bJ;
    grPi += n * i * piI1 * bJ;
    grTau += j === 0 ? 0 : n * piI * j * b ** (j - 1);
    grTauTau += j < 2 ? 0 : n * piI * j * (j - 1) * b ** (j - 2);
  }
  const rt = R_KJ_KGK * tK;
  return {
    vM3Kg: (rt * pi * (1 / pi + grPi)) / (pMpa * 1000),
    hKjKg: rt * tau * (g0Tau + grTau),
    sKjKgK: R_KJ_KGK * (tau * (g0Tau + grTau) - (g0 + gr)),
    cpKjKgK: -R_KJ_KGK * tau * tau * (g0TauTau + grTauTau),
  };
}

export function assertRegion2(tK: number, pMpa: number): void {
  requireFinite('temperature (K)', tK);
  requireFinite('pressure (MPa)', pMpa);
  if (tK < 273.15 || tK > 1073.15) throw outOfRange('region 2 temperature (K)', tK, '273.15 K to 1073.15 K');
  if (!(pMpa > 0)) throw outOfRange('region 2 pressure (MPa)', pMpa, 'above 0 MPa');
  let pMax: number;
  let rule: string;
  if (tK <= 623.15) {
    pMax = psatMpaUnchecked(tK) * (1 + 1e-9);
    rule = `0 to psat(${tK} K) (vapour)`;
  } else if (tK <= 863.15) {
    pMax = b23PressureMpa(tK);
    rule = `0 to p_B23(${tK} K) = ${pMax} MPa`;
  } else {
    pMax = 100;
    rule = '0 to 100 MPa';
  }
  if (pMpa > pMax) throw outOfRange('region 2 pressure (MPa)', pMpa, rule);
}

/** Vapour properties from IF97 region 2 at temperature tK (K) and pressure pMpa (MPa). */
export function region2(tK: number, pMpa: number): SteamProperties {
  assertRegion2(tK, pMpa);
  return region2Unchecked(tK, pMpa);
}
