/**
 * Exhaust-pressure correction curves [pub: ASME PTC 6 practice]: % change of heat rate (or of
 * output) against exhaust pressure, one curve per load fraction. Monotone cubic in pressure, linear
 * in load fraction (clamped to the nearest curve outside the listed loads); flat below each curve's
 * first point (the choke point); straight continuation above the last point, with a warning, and never
 * beyond the highest backpressure a measured point may have (no turbine runs there).
 */
import { BACKPRESSURE_BOUNDS_KPA } from '../validity/rejection-reasons.js';
import { buildMonotoneCubic, evaluateMonotoneCubic, type MonotoneCubic } from './monotone-cubic.js';

export interface CorrectionCurve {
  basis: 'heat-rate' | 'output';
  label: string;
  isGeneric: boolean;
  curves: { loadFraction: number; points: { backpressureKpa: number; changePct: number }[] }[];
}

interface CompiledCurve {
  loads: number[];
  cubics: MonotoneCubic[];
}

const compiled = new WeakMap<CorrectionCurve, CompiledCurve>();

/** Checks a curve; throws a RangeError naming the problem. */
export function compileCorrectionCurve(curve: CorrectionCurve): CompiledCurve {
  const hit = compiled.get(curve);
  if (hit) return hit;
  if (curve.basis !== 'heat-rate' && curve.basis !== 'output') throw new RangeError(`curve basis must be "heat-rate" or "output", got ${String(curve.basis)}`);
  if (!Array.isArray(curve.curves) || curve.curves.length === 0) throw new RangeError('a correction curve needs at least one load curve');
  const sorted = [...curve.curves].sort((a, b) => a.loadFraction - b.loadFraction);
  for (let i = 0; i < sorted.length; i++) {
    const lf = sorted[i]!.loadFraction;
    if (!(lf > 0 && lf <= 1.2)) throw new RangeError(`curve load fraction must be in (0, 1.2], got ${lf}`);
    if (i > 0 && lf === sorted[i - 1]!.loadFraction) throw new RangeError(`two curves share the load fraction ${lf}`);
  }
  const cubics = sorted.map((c) => {
    const pts = [...c.points].sort((a, b) => a.backpressureKpa - b.backpressureKpa);
    if (pts.length < 2) throw new RangeError(`the curve at load ${c.loadFraction} needs at least two points`);
    for (const p of pts) {
      if (!(Number.isFinite(p.backpressureKpa) && p.backpressureKpa > 0 && Number.isFinite(p.changePct))) {
        throw new RangeError(`curve points need a positive backpressureKpa and a finite changePct (load ${c.loadFraction})`);
      }
    }
    return buildMonotoneCubic(
      pts.map((p) => p.backpressureKpa),
      pts.map((p) => p.changePct),
    );
  });
  const result = { loads: sorted.map((c) => c.loadFraction), cubics };
  compiled.set(curve, result);
  return result;
}

/** The curve's own reading (heat-rate or output % change, per its basis). */
export function curveChangePct(curve: CorrectionCurve, loadFraction: number, backpressureKpa: number): number {
  if (!Number.isFinite(loadFraction) || !(loadFraction > 0)) throw new RangeError(`loadFraction must be a positive number, got ${loadFraction}`);
  if (!(Number.isFinite(backpressureKpa) && backpressureKpa > 0)) throw new RangeError(`backpressureKpa must be a positive number, got ${backpressureKpa}`);
  if (backpressureKpa > BACKPRESSURE_BOUNDS_KPA.max) {
    throw new RangeError(
      `backpressure ${+backpressureKpa.toPrecision(4)} kPa is above ${BACKPRESSURE_BOUNDS_KPA.max} kPa, the most a condenser point may read: the correction curve is not continued that far (check the setup: design duty, CW flow, surface)`,
    );
  }
  const { loads, cubics } = compileCorrectionCurve(curve);
  const n = loads.length;
  if (n === 1 || loadFraction <= loads[0]!) return evaluateMonotoneCubic(cubics[0]!, backpressureKpa);
  if (loadFraction >= loads[n - 1]!) return evaluateMonotoneCubic(cubics[n - 1]!, backpressureKpa);
  let i = 1;
  while (loadFraction > loads[i]!) i++;
  const w = (loadFraction - loads[i - 1]!) / (loads[i]! - loads[i - 1]!);
  return (1 - w) * evaluateMonotoneCubic(cubics[i - 1]!, backpressureKpa) + w * evaluateMonotoneCubic(cubics[i]!, backpressureKpa);
}

/**
 * The warning to show when a backpressure lies beyond the last point of the load curves read at this load:
 * there the curve is continued in a straight line with its end slope, which the maker's data do not cover.
 */
export function curveExtrapolationWarning(curve: CorrectionCurve, loadFraction: number, backpressureKpa: number): string | undefined {
  const { loads, cubics } = compileCorrectionCurve(curve);
  const n = loads.length;
  const above = loads.findIndex((l) => l >= loadFraction);
  // Only the curves the reading blends: one when the load sits on a curve (or outside them all), else the two around it.
  const used = n === 1 || loadFraction <= loads[0]! ? [0] : above === -1 ? [n - 1] : loads[above] === loadFraction ? [above] : [above - 1, above];
  const lastKpa = Math.min(...used.map((i) => lastX(cubics[i]!)));
  if (!(backpressureKpa > lastKpa)) return undefined;
  return `backpressure ${+backpressureKpa.toPrecision(4)} kPa is beyond the correction curve's last point (${+lastKpa.toPrecision(4)} kPa at load ${loadFraction}): the curve is continued in a straight line there`;
}

/** Output change with firing held, from a heat-rate change: ΔkW% = −ΔHR%/(1 + ΔHR%/100) [derived]. */
export const outputChangeFromHeatRatePct = (heatRatePct: number): number => -heatRatePct / (1 + heatRatePct / 100);
/** The inverse: ΔHR% = −ΔkW%/(1 + ΔkW%/100). */
export const heatRateChangeFromOutputPct = (outputPct: number): number => -outputPct / (1 + outputPct / 100);

/** % change of heat rate at this load and exhaust pressure, relative to the curve's zero. */
export function heatRateChangePct(curve: CorrectionCurve, loadFraction: number, backpressureKpa: number): number {
  const c = curveChangePct(curve, loadFraction, backpressureKpa);
  return curve.basis === 'heat-rate' ? c : heatRateChangeFromOutputPct(c);
}

export interface PenaltyBetween {
  /** extra heat rate at backpressureKpa over referenceBackpressureKpa, % (load held) */
  heatRatePenaltyPct: number;
  /** lost output at backpressureKpa against referenceBackpressureKpa, % (firing held) */
  outputPenaltyPct: number;
}

/**
 * Heat-rate and capacity penalties between two backpressures: the difference of the curve readings
 * (percentage points of the curve's base), the other basis from the firing-held relation.
 * Negative values mean the backpressure is better than the reference.
 */
export function penaltyBetween(curve: CorrectionCurve, loadFraction: number, backpressureKpa: number, referenceBackpressureKpa: number): PenaltyBetween {
  const delta = curveChangePct(curve, loadFraction, backpressureKpa) - curveChangePct(curve, loadFraction, referenceBackpressureKpa);
  if (curve.basis === 'heat-rate') {
    return { heatRatePenaltyPct: delta, outputPenaltyPct: -outputChangeFromHeatRatePct(delta) };
  }
  return { heatRatePenaltyPct: heatRateChangeFromOutputPct(delta), outputPenaltyPct: -delta };
}

/** Backpressure of a load curve's last point (a compiled curve has at least two). */
function lastX(c: MonotoneCubic): number {
  return c.xs[c.xs.length - 1]!;
}
