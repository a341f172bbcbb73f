/**
 * Is a data point fit for the calculations? Physics (§3) and steadiness (§5) checks, each failure
 * reported with a stable code (REJECTION_REASONS) and a human message, so imports can store and show it.
 * Steadiness defaults [common practice]: load change within ±30 min ≤ 2 % of rating; load ≥ 40 % of rating.
 */
import { saturationTemperatureC } from '../steam/index.js';
import { BACKPRESSURE_BOUNDS_KPA, REJECTION_REASONS, type RejectionReason } from './rejection-reasons.js';

export interface DataPoint {
  backpressureKpa: number;
  cwInletC: number;
  cwOutletC: number;
  cwFlowM3s?: number;
  loadMw?: number;
}

export interface ValidityContext {
  ratingMw?: number;
  /** default 0.4 of rating */
  minLoadFraction?: number;
  /** default 0.02 of rating */
  maxLoadChangeFraction?: number;
  /** default 30 min either side */
  windowMinutes?: number;
  /** Loads at neighbouring times, minutes relative to the point (negative = before). */
  neighbours?: { minutesFromPoint: number; loadMw: number }[];
  /** A CW pump started or stopped within the window. */
  cwPumpChangeInWindow?: boolean;
  /** Plausible ranges, overriding the defaults. */
  ranges?: Partial<Record<keyof DataPoint, { min: number; max: number }>>;
}

export type ValidityResult = { valid: true } | { valid: false; reason: RejectionReason; message: string; field?: string };

/** Default plausible ranges for a steam surface condenser point (common practice, generous). */
export const DEFAULT_POINT_RANGES: Record<keyof DataPoint, { min: number; max: number }> = {
  backpressureKpa: { ...BACKPRESSURE_BOUNDS_KPA },
  cwInletC: { min: 0, max: 50 },
  cwOutletC: { min: 0, max: 70 },
  cwFlowM3s: { min: 0.01, max: 200 },
  loadMw: { min: 0, max: 2500 },
};

const reject = (reason: RejectionReason, detail: string, field?: string): ValidityResult => ({
  valid: false,
  reason,
  message: `${REJECTION_REASONS[reason]}: ${detail}`,
  ...(field ? { field } : {}),
});

export function checkPointValidity(point: DataPoint, context: ValidityContext = {}): ValidityResult {
  const fields: (keyof DataPoint)[] = ['backpressureKpa', 'cwInletC', 'cwOutletC', 'cwFlowM3s', 'loadMw'];
  const required = new Set<keyof DataPoint>(['backpressureKpa', 'cwInletC', 'cwOutletC']);
  for (const f of fields) {
    const v = point[f];
    if (v === undefined && !required.has(f)) continue;
    if (typeof v !== 'number' || !Number.isFinite(v)) return reject('non-finite', `${f} is ${String(v)}`, f);
  }
  if (context.ratingMw !== undefined && point.loadMw !== undefined && point.loadMw > context.ratingMw * 1.2) {
    return reject('out-of-range', `loadMw ${point.loadMw} is above 120 % of the rating ${context.ratingMw} MW`, 'loadMw');
  }
  for (const f of fields) {
    const v = point[f];
    if (v === undefined) continue;
    const r = context.ranges?.[f] ?? DEFAULT_POINT_RANGES[f];
    if (v < r.min || v > r.max) return reject('out-of-range', `${f} = ${v} is outside ${r.min} to ${r.max}`, f);
  }
  const { backpressureKpa, cwInletC, cwOutletC } = point;
  if (cwOutletC <= cwInletC) return reject('rise-not-positive', `outlet ${cwOutletC} °C ≤ inlet ${cwInletC} °C`);
  const ts = saturationTemperatureC(backpressureKpa);
  if (cwOutletC >= ts) return reject('ttd-not-positive', `outlet ${cwOutletC} °C ≥ saturation ${ts.toFixed(2)} °C at ${backpressureKpa} kPa`);

  if (context.ratingMw !== undefined && point.loadMw !== undefined) {
    const rating = context.ratingMw;
    if (!(rating > 0)) throw new RangeError(`ratingMw must be positive, got ${rating}`);
    const minFraction = context.minLoadFraction ?? 0.4;
    if (point.loadMw < minFraction * rating) {
      return reject('low-load', `${point.loadMw} MW is below ${(minFraction * 100).toFixed(0)} % of the ${rating} MW rating`);
    }
    const window = context.windowMinutes ?? 30;
    const maxChange = (context.maxLoadChangeFraction ?? 0.02) * rating;
    let lo = point.loadMw;
    let hi = point.loadMw;
    for (const n of context.neighbours ?? []) {
      if (Math.abs(n.minutesFromPoint) > window || !Number.isFinite(n.loadMw)) continue;
      lo = Math.min(lo, n.loadMw);
      hi = Math.max(hi, n.loadMw);
    }
    if (hi - lo > maxChange) {
      return reject(
        'unsteady-load',
        `load ranged over ${(hi - lo).toFixed(1)} MW within ±${window} min (limit ${maxChange.toFixed(1)} MW, ${((maxChange / rating) * 100).toFixed(0)} % of rating)`,
      );
    }
  }
  if (context.cwPumpChangeInWindow) return reject('cw-pump-change', 'pump start or stop recorded in the window');
  return { valid: true };
}
