/**
 * Fouling trend since the last cleaning: fits the linear, falling-rate and asymptotic (Kern–Seaton) models to
 * daily cleanliness by least squares, picks one by AIC, and forecasts cleanliness with a prediction band.
 *
 * Fit space: z = 1/CF. With the post-cleaning cleanliness CF0 given, z − 1/CF0 = y(t) (the fouling index,
 * proportional to Rf); without it, 1/CF0 is fitted as an intercept. All models are fitted to the same points,
 * so their AIC values compare.
 *
 * Robustness: a first fit of all three models on every usable day; days whose residual from the best of them (by AIC)
 * lies more than k·1.4826·MAD from the median residual (k = 3.5 by default) are dropped as outliers, the models are
 * refitted on the rest and the screen is repeated on every usable day against the new fit (at most 5 passes, until
 * the kept set settles), so a day wrongly dropped by a first fit pulled by a gross outlier comes back.
 * Gaps in the days are harmless (the models take t directly).
 *
 * Nonlinear models: a grid over the nonlinear parameter (θ or n) with the linear ones solved exactly gives the
 * start, then Levenberg–Marquardt (ml-levenberg-marquardt, analytic Jacobian) polishes all parameters.
 */
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { invertMatrix, median, medianAbsoluteDeviation, solveLinear, studentTQuantile } from '../../statistics.js';
import { FOULING_MODEL_KINDS, foulingIndex, foulingIndexGradient, modelFromShape, type FoulingModel, type FoulingModelKind } from './fouling-models.js';

/** Minimum data for a trend (ENGINEERING.md §5). */
export const MINIMUM_TREND_POINTS = 10;
export const MINIMUM_TREND_SPAN_DAYS = 14;

export interface CleanlinessDay {
  /** days of operation since the cleaning */
  day: number;
  cleanliness: number;
}

export interface DayRange {
  fromDay: number;
  toDay: number;
}

export interface FoulingTrendInput {
  points: readonly CleanlinessDay[];
  /** CF0, the cleanliness right after the cleaning; fitted as an intercept when absent */
  cleanlinessAfterCleaning?: number;
  /** clean coefficient, to report the fouling resistance Rf = y/U_clean in m²·K/W */
  uCleanWm2K?: number;
  /** flagged periods (suspected air in-leakage) left out of the fit, inclusive day ranges */
  excludedPeriods?: readonly DayRange[];
  /** days after the last point to forecast (default 60) */
  forecastDays?: number;
  /** central probability of the forecast band (default 0.9) */
  bandProbability?: number;
  /** outlier threshold in robust standard deviations (default 3.5) */
  outlierThreshold?: number;
}

export interface ModelFitSummary {
  model: FoulingModel;
  /** parameters fitted, including the intercept when CF0 is fitted */
  parameterCount: number;
  sse: number;
  aic: number;
  /** R² in the fit space (1/CF) */
  rSquared: number;
  /** standard deviation of the residuals in cleanliness units */
  residualStdCleanliness: number;
  /** CF0 used (given or fitted) */
  cleanlinessAfterCleaning: number;
  /** fouling resistance parameters in m²·K/W (and per day), when U_clean was given */
  foulingResistance?: Record<string, number>;
}

export interface ForecastDay {
  day: number;
  cleanliness: number;
  low: number;
  high: number;
}

export type FoulingTrendResult =
  | {
      status: 'not-enough-data';
      reason: string;
      minimumPoints: number;
      minimumSpanDays: number;
      usablePoints: number;
      spanDays: number;
    }
  | {
      status: 'fitted';
      chosen: ModelFitSummary;
      models: ModelFitSummary[];
      pointsUsed: number;
      excludedDays: number[];
      outlierDays: number[];
      bandProbability: number;
      forecast: ForecastDay[];
    };

interface RawFit {
  kind: FoulingModelKind;
  shape: number[];
  /** 1/CF0 */
  intercept: number;
  interceptFitted: boolean;
  sse: number;
  k: number;
}

interface FitData {
  t: number[];
  z: number[];
  /** 1/CF0 when given */
  knownIntercept: number | null;
}

function predictZ(fit: Pick<RawFit, 'kind' | 'shape' | 'intercept'>, t: number): number {
  return fit.intercept + foulingIndex(modelFromShape(fit.kind, fit.shape), t);
}

function sseOf(data: FitData, fit: Pick<RawFit, 'kind' | 'shape' | 'intercept'>): number {
  let s = 0;
  for (let i = 0; i < data.t.length; i++) s += (data.z[i]! - predictZ(fit, data.t[i]!)) ** 2;
  return s;
}

/** Least squares for z ≈ c + a·φ(t): returns [a, c] (c fixed when known). */
function linearInBasis(data: FitData, basis: (t: number) => number): { a: number; c: number } | null {
  const phi = data.t.map(basis);
  if (data.knownIntercept !== null) {
    const c = data.knownIntercept;
    let num = 0;
    let den = 0;
    for (let i = 0; i < phi.length; i++) {
      num += phi[i]! * (data.z[i]! - c);
      den += phi[i]! * phi[i]!;
    }
    return den > 0 ? { a: num / den, c } : null;
  }
  const n = phi.length;
  let sp = 0;
  let spp = 0;
  let sz = 0;
  let spz = 0;
  for (let i = 0; i < n; i++) {
    sp += phi[i]!;
    spp += phi[i]! * phi[i]!;
    sz += data.z[i]!;
    spz += phi[i]! * data.z[i]!;
  }
  const sol = solveLinear(
    [
      [spp, sp],
      [sp, n],
    ],
    [spz, sz],
  );
  return sol ? { a: sol[0]!, c: sol[1]! } : null;
}

function fitLinear(data: FitData): RawFit | null {
  const sol = linearInBasis(data, (t) => t);
  if (!sol) return null;
  const fit = { kind: 'linear' as const, shape: [sol.a], intercept: sol.c, interceptFitted: data.knownIntercept === null };
  return { ...fit, sse: sseOf(data, fit), k: 1 + (fit.interceptFitted ? 1 : 0) };
}

const THETA_GRID_POINTS = 80;
const MAX_SCREEN_PASSES = 5;
const EXPONENT_GRID = Array.from({ length: 39 }, (_, i) => 0.05 + 0.025 * i); // 0.05 … 1.0

function fitNonlinear(data: FitData, kind: 'asymptotic' | 'falling-rate'): RawFit | null {
  const tMax = Math.max(...data.t, 1);
  const grid =
    kind === 'asymptotic' ? Array.from({ length: THETA_GRID_POINTS }, (_, i) => 0.5 * Math.pow((50 * tMax) / 0.5, i / (THETA_GRID_POINTS - 1))) : EXPONENT_GRID;
  const bounds = kind === 'asymptotic' ? { min: [0, 0.5], max: [1e6, 50 * tMax] } : { min: [-1e6, 0.01], max: [1e6, 1] };
  let best: RawFit | null = null;
  for (const g of grid) {
    const basis = kind === 'asymptotic' ? (t: number) => 1 - Math.exp(-t / g) : (t: number) => (t <= 0 ? 0 : t ** g);
    const sol = linearInBasis(data, basis);
    if (!sol || (kind === 'asymptotic' && sol.a < 0)) continue;
    const fit = { kind, shape: [sol.a, g], intercept: sol.c, interceptFitted: data.knownIntercept === null };
    const sse = sseOf(data, fit);
    if (!best || sse < best.sse) best = { ...fit, sse, k: 2 + (fit.interceptFitted ? 1 : 0) };
  }
  if (!best) return null;

  const fitIntercept = data.knownIntercept === null;
  const start = fitIntercept ? [...best.shape, best.intercept] : [...best.shape];
  const unpack = (p: number[]) => ({ kind, shape: [p[0]!, p[1]!], intercept: fitIntercept ? p[2]! : (data.knownIntercept as number) });
  try {
    const lm = levenbergMarquardt({ x: data.t, y: data.z }, (p) => (t) => predictZ(unpack(p), t), {
      initialValues: start,
      minValues: fitIntercept ? [...bounds.min, 0] : bounds.min,
      maxValues: fitIntercept ? [...bounds.max, 1e6] : bounds.max,
      maxIterations: 200,
      errorTolerance: 1e-18,
      jacobianFunction: (p) => (t) => {
        const g = foulingIndexGradient(modelFromShape(kind, [p[0]!, p[1]!]), t);
        return fitIntercept ? [...g, 1] : g;
      },
    });
    const polished = unpack(lm.parameterValues);
    const sse = sseOf(data, polished);
    if (Number.isFinite(sse) && sse < best.sse) best = { ...best, ...polished, sse };
  } catch {
    // keep the grid solution when the polish fails
  }
  return best;
}

function fitAll(data: FitData): RawFit[] {
  const fits = [fitLinear(data), fitNonlinear(data, 'falling-rate'), fitNonlinear(data, 'asymptotic')];
  return fits.filter((f): f is RawFit => f !== null);
}

function aicOf(fit: RawFit, n: number): number {
  return n * Math.log(Math.max(fit.sse, 1e-300) / n) + 2 * fit.k;
}

/**
 * Lowest AIC; near-ties (within 1e-9) go to the model with fewer parameters, then to the listed order.
 * `fits` is never empty: the straight line fits whenever the days span more than one day.
 */
function chooseByAic(fits: RawFit[], n: number): RawFit {
  const order = (f: RawFit) => FOULING_MODEL_KINDS.indexOf(f.kind);
  return [...fits].sort((a, b) => {
    const d = aicOf(a, n) - aicOf(b, n);
    if (Math.abs(d) > 1e-9) return d;
    return a.k - b.k || order(a) - order(b);
  })[0]!;
}

function jacobianRow(fit: RawFit, t: number): number[] {
  const g = foulingIndexGradient(modelFromShape(fit.kind, fit.shape), t);
  return fit.interceptFitted ? [...g, 1] : g;
}

function summarise(fit: RawFit, data: FitData, uCleanWm2K: number | undefined): ModelFitSummary {
  const n = data.t.length;
  const mean = data.z.reduce((s, v) => s + v, 0) / n;
  const sst = data.z.reduce((s, v) => s + (v - mean) ** 2, 0);
  const cfResiduals = data.t.map((t, i) => 1 / data.z[i]! - 1 / predictZ(fit, t));
  const model = modelFromShape(fit.kind, fit.shape);
  const summary: ModelFitSummary = {
    model,
    parameterCount: fit.k,
    sse: fit.sse,
    aic: aicOf(fit, n),
    rSquared: sst > 0 ? 1 - fit.sse / sst : 1,
    residualStdCleanliness: Math.sqrt(cfResiduals.reduce((s, r) => s + r * r, 0) / Math.max(1, n - fit.k)),
    cleanlinessAfterCleaning: 1 / fit.intercept,
  };
  if (uCleanWm2K) {
    const u = uCleanWm2K;
    summary.foulingResistance =
      model.model === 'linear'
        ? { rfRateM2KWPerDay: model.ratePerDay / u }
        : model.model === 'asymptotic'
          ? { rfMaxM2KW: model.maxIndex / u, timeConstantDays: model.timeConstantDays }
          : { rfCoefficientM2KW: model.coefficient / u, exponent: model.exponent };
  }
  return summary;
}

function forecastOf(fit: RawFit, data: FitData, lastDay: number, probability: number): ForecastDay[] {
  const n = data.t.length;
  const s2 = fit.sse / Math.max(1, n - fit.k);
  const jtj = Array.from({ length: fit.k }, () => new Array<number>(fit.k).fill(0));
  for (const t of data.t) {
    const g = jacobianRow(fit, t);
    for (let a = 0; a < fit.k; a++) for (let b = 0; b < fit.k; b++) jtj[a]![b]! += g[a]! * g[b]!;
  }
  const cov = invertMatrix(jtj);
  // Student's t for the n − k degrees of freedom of the residual variance: with 10–20 daily points the normal
  // quantile would draw the band too narrow (t(0.95, 10) = 1.812 against 1.645).
  const zq = studentTQuantile(0.5 + probability / 2, Math.max(1, n - fit.k));
  const out: ForecastDay[] = [];
  for (let day = 0; day <= Math.ceil(lastDay); day++) {
    const zHat = predictZ(fit, day);
    const g = jacobianRow(fit, day);
    let leverage = 0;
    if (cov) for (let a = 0; a < fit.k; a++) for (let b = 0; b < fit.k; b++) leverage += g[a]! * cov[a]![b]! * g[b]!;
    const half = zq * Math.sqrt(s2 * (1 + leverage));
    out.push({ day, cleanliness: 1 / zHat, low: 1 / (zHat + half), high: zHat - half > 0 ? 1 / (zHat - half) : Number.POSITIVE_INFINITY });
  }
  return out;
}

function insideAny(day: number, periods: readonly DayRange[]): boolean {
  return periods.some((p) => day >= p.fromDay && day <= p.toDay);
}

function notEnough(usable: CleanlinessDay[], why: string): FoulingTrendResult {
  const days = usable.map((p) => p.day);
  return {
    status: 'not-enough-data',
    reason: `${why}: a trend needs at least ${MINIMUM_TREND_POINTS} daily points over at least ${MINIMUM_TREND_SPAN_DAYS} days`,
    minimumPoints: MINIMUM_TREND_POINTS,
    minimumSpanDays: MINIMUM_TREND_SPAN_DAYS,
    usablePoints: usable.length,
    spanDays: days.length ? Math.max(...days) - Math.min(...days) : 0,
  };
}

function enoughData(points: CleanlinessDay[]): boolean {
  if (points.length < MINIMUM_TREND_POINTS) return false;
  const days = points.map((p) => p.day);
  return Math.max(...days) - Math.min(...days) >= MINIMUM_TREND_SPAN_DAYS;
}

/** Daily values: several values on the same day are reduced to their median. */
function byDay(points: readonly CleanlinessDay[]): CleanlinessDay[] {
  const groups = new Map<number, number[]>();
  for (const p of points) groups.set(p.day, [...(groups.get(p.day) ?? []), p.cleanliness]);
  return [...groups.entries()].sort((a, b) => a[0] - b[0]).map(([day, cfs]) => ({ day, cleanliness: median(cfs)! }));
}

export function fitFoulingTrend(input: FoulingTrendInput): FoulingTrendResult {
  for (const p of input.points) {
    if (!Number.isFinite(p.day) || p.day < 0) throw new Error(`day ${p.day} is not a number of days since the cleaning`);
    if (!Number.isFinite(p.cleanliness) || p.cleanliness <= 0) throw new Error(`cleanliness ${p.cleanliness} on day ${p.day} must be above 0`);
  }
  const cf0 = input.cleanlinessAfterCleaning;
  if (cf0 !== undefined && !(cf0 > 0)) throw new Error('cleanlinessAfterCleaning must be above 0');
  const probability = input.bandProbability ?? 0.9;
  const threshold = input.outlierThreshold ?? 3.5;
  const periods = input.excludedPeriods ?? [];

  const daily = byDay(input.points);
  const excludedDays = daily.filter((p) => insideAny(p.day, periods)).map((p) => p.day);
  const usable = daily.filter((p) => !insideAny(p.day, periods));
  if (!enoughData(usable)) return notEnough(usable, 'not enough data');

  const dataOf = (pts: CleanlinessDay[]): FitData => ({
    t: pts.map((p) => p.day),
    z: pts.map((p) => 1 / p.cleanliness),
    knownIntercept: cf0 === undefined ? null : 1 / cf0,
  });

  // Outlier screen, repeated until the kept set settles: residuals of every usable day against the best fit so far.
  const all = dataOf(usable);
  let keep = usable.map(() => true);
  for (let pass = 0; pass < MAX_SCREEN_PASSES; pass++) {
    const pts = usable.filter((_, i) => keep[i]);
    const best = chooseByAic(fitAll(dataOf(pts)), pts.length);
    const residuals = all.t.map((t, i) => all.z[i]! - predictZ(best, t));
    const keptResiduals = residuals.filter((_, i) => keep[i]);
    const centre = median(keptResiduals)!; // the screen always keeps the residual at the median
    let spread = 1.4826 * medianAbsoluteDeviation(keptResiduals);
    if (spread === 0) spread = 1.2533 * (keptResiduals.reduce((s, r) => s + Math.abs(r - centre), 0) / keptResiduals.length);
    const next = residuals.map((r) => spread === 0 || Math.abs(r - centre) <= threshold * spread);
    if (next.every((k, i) => k === keep[i])) break;
    keep = next;
  }
  const kept = usable.filter((_, i) => keep[i]);
  const outlierDays = usable.filter((_, i) => !keep[i]).map((p) => p.day);
  if (!enoughData(kept)) return notEnough(kept, 'not enough data after dropping outliers');

  const data = dataOf(kept);
  const fits = fitAll(data);
  const chosen = chooseByAic(fits, kept.length);
  const lastDay = Math.max(...data.t) + (input.forecastDays ?? 60);
  return {
    status: 'fitted',
    chosen: summarise(chosen, data, input.uCleanWm2K),
    models: fits.map((f) => summarise(f, data, input.uCleanWm2K)),
    pointsUsed: kept.length,
    excludedDays,
    outlierDays,
    bandProbability: probability,
    forecast: forecastOf(chosen, data, lastDay, probability),
  };
}
