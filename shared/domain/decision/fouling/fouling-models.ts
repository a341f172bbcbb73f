/**
 * Fouling growth models in terms of the fouling index y(t) = 1/CF(t) − 1/CF0 = U_clean·Rf(t)
 * (dimensionless; from 1/U = 1/(CF0·U_clean) + Rf, so CF(t) = 1/(1/CF0 + y(t))).
 * t is days of operation since the cleaning.
 */

export type FoulingModelKind = 'linear' | 'asymptotic' | 'falling-rate';

export const FOULING_MODEL_KINDS: readonly FoulingModelKind[] = ['linear', 'falling-rate', 'asymptotic'];

/** Linear: y = ratePerDay·t. */
export interface LinearFouling {
  model: 'linear';
  ratePerDay: number;
}

/** Asymptotic (Kern & Seaton 1959): y = maxIndex·(1 − e^(−t/θ)). */
export interface AsymptoticFouling {
  model: 'asymptotic';
  maxIndex: number;
  timeConstantDays: number;
}

/** Falling rate: y = coefficient·t^exponent, exponent < 1. */
export interface FallingRateFouling {
  model: 'falling-rate';
  coefficient: number;
  exponent: number;
}

export type FoulingModel = LinearFouling | AsymptoticFouling | FallingRateFouling;

export function foulingIndex(m: FoulingModel, days: number): number {
  const t = Math.max(0, days);
  switch (m.model) {
    case 'linear':
      return m.ratePerDay * t;
    case 'asymptotic':
      return m.maxIndex * (1 - Math.exp(-t / m.timeConstantDays));
    case 'falling-rate':
      return t === 0 ? 0 : m.coefficient * t ** m.exponent;
  }
}

/** Cleanliness after `days` of operation from a cleaning that left cleanliness cf0; rateMultiplier scales the fouling. */
export function cleanlinessAfter(m: FoulingModel, cf0: number, days: number, rateMultiplier = 1): number {
  return 1 / (1 / cf0 + rateMultiplier * foulingIndex(m, days));
}

/** Shape parameters in a fixed order, used by the fitter. */
export function shapeParameters(m: FoulingModel): number[] {
  switch (m.model) {
    case 'linear':
      return [m.ratePerDay];
    case 'asymptotic':
      return [m.maxIndex, m.timeConstantDays];
    case 'falling-rate':
      return [m.coefficient, m.exponent];
  }
}

export function modelFromShape(kind: FoulingModelKind, p: readonly number[]): FoulingModel {
  switch (kind) {
    case 'linear':
      return { model: 'linear', ratePerDay: p[0]! };
    case 'asymptotic':
      return { model: 'asymptotic', maxIndex: p[0]!, timeConstantDays: p[1]! };
    case 'falling-rate':
      return { model: 'falling-rate', coefficient: p[0]!, exponent: p[1]! };
  }
}

/** ∂y/∂(shape parameters) at t. */
export function foulingIndexGradient(m: FoulingModel, days: number): number[] {
  const t = Math.max(0, days);
  switch (m.model) {
    case 'linear':
      return [t];
    case 'asymptotic': {
      const e = Math.exp(-t / m.timeConstantDays);
      return [1 - e, (-m.maxIndex * e * t) / (m.timeConstantDays * m.timeConstantDays)];
    }
    case 'falling-rate': {
      if (t === 0) return [0, 0];
      const tn = t ** m.exponent;
      return [tn, m.coefficient * tn * Math.log(t)];
    }
  }
}
