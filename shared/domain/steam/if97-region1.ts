/**
 * IAPWS-IF97 region 1 (compressed liquid), basic equation (IAPWS R7-97(2012), eq. 7, Table 2),
 * and the backward equation T(p, h) (eq. 11, Table 6).
 */
import { outOfRange, requireFinite } from './range-error.js';
import { psatMpaUnchecked } from './if97-region4.js';

/** Specific gas constant of water in IF97, kJ/(kg·K). */
export const R_KJ_KGK = 0.461526;

const I = [0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 5, 8, 8, 21, 23, 29, 30, 31, 32];
const J = [-2, -1, 0, 1, 2, 3, 4, 5, -9, -7, -1, 0, 1, 3, -3, 0, 1, 3, 17, -4, 0, 6, -5, -2, 10, -8, -11, -6, -29, -31, -38, -39, -40, -41];
const N = [
  0.14632971213167, -0.84548187169114, -0.3756360367204e1, 0.33855169168385e1, -0.95791963387872, 0.15772038513228, -0.16616417199501e-1, 0.81214629983568e-3,
  0.28319080123804e-3, -0.60706301565874e-3, -0.18990068218419e-1, -0.32529748770505e-1, -0.21841717175414e-1, -0.5283835796993e-4, -0.47184321073267e-3,
  -0.30001780793026e-3, 0.47661393906987e-4, -0.44141845330846e-5, -0.72694996297594e-15, -0.31679644845054e-4, -0.28270797985312e-5, -0.85205128120103e-9,
  -0.22425281908e-5, -0.65171222895601e-6, -0.14341729937924e-12, -0.40516996860117e-6, -0.12734301741641e-8, -0.17424871230634e-9, -0.68762131295531e-18,
  0.14478307828521e-19, 0.26335781662795e-22, -0.11947622640071e-22, 0.18228094581404e-23, -0.93537087292458e-25,
];

export interface SteamProperties {
  /** specific volume, m³/kg */
  vM3Kg: number;
  /** specific enthalpy, kJ/kg */
  hKjKg: number;
  /** specific entropy, kJ/(kg·K) */
  sKjKgK: number;
  /** isobaric heat capacity, kJ/(kg·K) */
  cpKjKgK: number;
}

export const REGION1_T_MIN_K = 273.15;
export const REGION1_T_MAX_K = 623.15;
export const REGION1_P_MAX_MPA = 100;

/** Region 1 properties without range checks (for callers that have checked already). */
export function region1Unchecked(tK: number, pMpa: number): SteamProperties {
  const pi = pMpa / 16.53;
  const tau = 1386 / tK;
  const a = 7.1 - pi;
  const b = tau - 1.222;
  let g = 0;
  let gPi = 0;
  let gTau = 0;
  let gTauTau = 0;
  for (let k = 0; k < 34; k++) {
    const i = I[k]!;
    const j = J[k]!;
    const n = N[k]!;
    const aI1 = i === 0 ? 0 : a ** (i - 1);
    const aI = a ** i;
    const bJ2 = b ** (j - 2);
    const bJ1 = bJ2 * b;
    const bJ = bJ1 * b;
    g += n * aI * bJ;
    gPi -= n * i * aI1 * bJ;
    gTau += n * aI * j * bJ1;
    gTauTau += n * aI * j * (j - 1) * bJ2;
  }
  const rt = R_KJ_KGK * tK;
  return {
    vM3Kg: (rt * pi * gPi) / (pMpa * 1000),
    hKjKg: rt * tau * gTau,
    sKjKgK: R_KJ_KGK * (tau * gTau - g),
    cpKjKgK: -R_KJ_KGK * tau * tau * gTauTau,
  };
}

/** Checks that (T, p) lies in region 1: 273.15 K ≤ T ≤ 623.15 K and psat(T) ≤ p ≤ 100 MPa. */
export function assertRegion1(tK: number, pMpa: number): void {
  requireFinite('temperature (K)', tK);
  requireFinite('pressure (MPa)', pMpa);
  if (tK < REGION1_T_MIN_K || tK > REGION1_T_MAX_K) {
    throw outOfRange('region 1 temperature (K)', tK, '273.15 K to 623.15 K');
  }
  if (pMpa > REGION1_P_MAX_MPA) throw outOfRange('region 1 pressure (MPa)', pMpa, 'psat(T) to 100 MPa');
  const psat = psatMpaUnchecked(tK);
  if (pMpa < psat * (1 - 1e-9)) {
    throw outOfRange('region 1 pressure (MPa)', pMpa, `psat(${tK} K) = ${psat} MPa to 100 MPa (liquid)`);
  }
}

/** Liquid properties from IF97 region 1 at temperature tK (K) and pressure pMpa (MPa). */
export function region1(tK: number, pMpa: number): SteamProperties {
  assertRegion1(tK, pMpa);
  return region1Unchecked(tK, pMpa);
}

const IB = [0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 1, 2, 2, 3, 3, 4, 5, 6];
const JB = [0, 1, 2, 6, 22, 32, 0, 1, 2, 3, 4, 10, 32, 10, 32, 10, 32, 32, 32, 32];
const NB = [
  -0.23872489924521e3, 0.40421188637945e3, 0.11349746881718e3, -0.58457616048039e1, -0.1528548241314e-3, -0.10866707695377e-5, -0.13391744872602e2,
  0.43211039183559e2, -0.54010067170506e2, 0.30535892203916e2, -0.65964749423638e1, 0.93965400878363e-2, 0.1157364750534e-6, -0.25858641282073e-4,
  -0.40644363084799e-8, 0.66456186191635e-7, 0.80670734103027e-10, -0.93477771213947e-12, 0.58265442020601e-14, -0.15020185953503e-16,
];

/**
 * Backward equation T(p, h) for region 1, K. The result is checked to lie in region 1,
 * so an enthalpy that belongs to another region is an error, not a silent wrong answer.
 */
export function region1TemperatureFromPh(pMpa: number, hKjKg: number): number {
  requireFinite('pressure (MPa)', pMpa);
  requireFinite('enthalpy (kJ/kg)', hKjKg);
  if (pMpa <= 0 || pMpa > REGION1_P_MAX_MPA) throw outOfRange('region 1 pressure (MPa)', pMpa, '0 to 100 MPa');
  const pi = pMpa;
  const eta1 = hKjKg / 2500 + 1;
  let theta = 0;
  for (let k = 0; k < 20; k++) theta += NB[k]! * pi ** IB[k]! * eta1 ** JB[k]!;
  if (
    theta < REGION1_T_MIN_K - 0.05 ||
    theta > REGION1_T_MAX_K + 0.05 ||
    pMpa < psatMpaUnchecked(Math.min(Math.max(theta, REGION1_T_MIN_K), REGION1_T_MAX_K)) * (1 - 1e-6)
  ) {
    throw outOfRange('region 1 enthalpy (kJ/kg)', hKjKg, `liquid (region 1) enthalpies at ${pMpa} MPa`);
  }
  return theta;
}
