/**
 * The condenser model P(t1, W, Q, Np, CF) of ENGINEERING.md §3: expected backpressure at a given
 * cleanliness with the state's own CW inlet temperature, flow, duty and plugging.
 * U = CF·U_clean; NTU = U·A_eff/(W·cp); ε = 1 − e^(−NTU) (condensing side, Cr = 0 [pub: ε-NTU
 * relation in heat-transfer textbooks]); Ts = t1 + (Q/(W·cp))/ε; p = psat(Ts).
 * This sits inside the scheduler's loops: keep it free of allocation.
 */
import { liquidCpKjKgK, liquidDensityKgM3, saturationPressureKpa } from '../steam/index.js';
import { DEFAULT_HEI_TABLES, type HeiTables } from './hei-tables.js';
import { activeSurfaceM2, assertGeometry, tubeVelocityMs, type CondenserGeometry } from './geometry.js';
import { cleanCoefficientFromConstant, geometryConstant } from './clean-coefficient.js';

export interface BackpressureModelInput {
  geometry: CondenserGeometry;
  cwInletC: number;
  /** CW volume flow metered at the inlet, m³/s */
  cwFlowM3s: number;
  /** Heat rejected to the cooling water, MW */
  dutyMw: number;
  pluggedTubes: number;
  cleanliness: number;
  heiTables?: HeiTables;
  /** Clean coefficient at this very state, W/(m²·K), replacing the HEI value. */
  uCleanWm2K?: number;
  /** Multiplier on the HEI clean coefficient (a user's U* expressed relative to HEI); default 1. */
  uCleanScale?: number;
}

const cache = new WeakMap<
  CondenserGeometry,
  { tables: HeiTables; od: number; bwg: number; material: string; surface: number; n: number; passes: number; cFm: number }
>();

/** C·Fm for a geometry, memoised per geometry object (the geometry is checked once per object). */
function cachedGeometryConstant(g: CondenserGeometry, tables: HeiTables, pluggedTubes: number): number {
  const hit = cache.get(g);
  if (
    hit &&
    hit.tables === tables &&
    hit.od === g.tubeOdMm &&
    hit.bwg === g.tubeBwg &&
    hit.material === g.tubeMaterial &&
    hit.surface === g.surfaceM2 &&
    hit.n === g.tubeCount &&
    hit.passes === g.passes
  ) {
    if (!(pluggedTubes >= 0 && pluggedTubes < g.tubeCount && Number.isInteger(pluggedTubes))) assertGeometry(g, pluggedTubes);
    return hit.cFm;
  }
  assertGeometry(g, pluggedTubes);
  const cFm = geometryConstant(g, tables);
  cache.set(g, { tables, od: g.tubeOdMm, bwg: g.tubeBwg, material: g.tubeMaterial, surface: g.surfaceM2, n: g.tubeCount, passes: g.passes, cFm });
  return cFm;
}

/**
 * CW temperature rise, K, for a duty: solves Q = W·cp(t1 + rise/2)·rise (cp at the mean CW
 * temperature, as in the measured point, so that the model reproduces a measured point exactly).
 */
export function cwRiseK(cwInletC: number, massFlowKgS: number, dutyMw: number): number {
  const qKw = dutyMw * 1000;
  let rise = qKw / (massFlowKgS * liquidCpKjKgK(cwInletC));
  for (let k = 0; k < 20; k++) {
    const next = qKw / (massFlowKgS * liquidCpKjKgK(cwInletC + rise / 2));
    if (Math.abs(next - rise) <= 1e-14 * rise) return next;
    rise = next;
  }
  return rise;
}

function positive(name: string, v: number): void {
  if (!(v > 0 && Number.isFinite(v))) throw new RangeError(`${name} must be a positive finite number, got ${v}`);
}

/** Expected backpressure, kPa(a), at the given cleanliness: the model P(t1, W, Q, Np, CF). */
export function backpressureAtCleanlinessKpa(input: BackpressureModelInput): number {
  const tables = input.heiTables ?? DEFAULT_HEI_TABLES;
  const cFm = cachedGeometryConstant(input.geometry, tables, input.pluggedTubes);
  const uClean = input.uCleanWm2K;
  if (uClean !== undefined) positive('uCleanWm2K', uClean);
  return modelBackpressureKpa(
    input.geometry,
    tables,
    cFm,
    input.cwInletC,
    input.cwFlowM3s,
    input.dutyMw,
    input.pluggedTubes,
    input.cleanliness,
    uClean === undefined ? Number.NaN : uClean,
    input.uCleanScale ?? 1,
  );
}

/**
 * The model with positional arguments (no object shapes to go megamorphic in hot loops).
 * uCleanWm2K NaN means "from the HEI tables × uCleanScale". The geometry must have been checked.
 */
export function modelBackpressureKpa(
  geometry: CondenserGeometry,
  tables: HeiTables,
  cFm: number,
  cwInletC: number,
  cwFlowM3s: number,
  dutyMw: number,
  pluggedTubes: number,
  cleanliness: number,
  uCleanWm2K: number,
  uCleanScale: number,
): number {
  positive('cwFlowM3s', cwFlowM3s);
  positive('dutyMw', dutyMw);
  positive('cleanliness', cleanliness);
  const massFlowKgS = liquidDensityKgM3(cwInletC) * cwFlowM3s;
  const rise = cwRiseK(cwInletC, massFlowKgS, dutyMw);
  const cp = liquidCpKjKgK(cwInletC + rise / 2);
  const uClean =
    uCleanWm2K === uCleanWm2K
      ? uCleanWm2K
      : cleanCoefficientFromConstant(cFm, tables, cwInletC, tubeVelocityMs(geometry, cwFlowM3s, pluggedTubes)) * uCleanScale;
  const ntu = (cleanliness * uClean * activeSurfaceM2(geometry, pluggedTubes)) / (massFlowKgS * cp * 1000);
  const effectiveness = -Math.expm1(-ntu);
  const tsC = cwInletC + rise / effectiveness;
  if (!(tsC < 373.946)) {
    throw new RangeError(
      `expected saturation temperature ${tsC.toFixed(1)} °C is beyond the critical point: duty ${dutyMw} MW is far too large for this flow, surface and cleanliness`,
    );
  }
  return saturationPressureKpa(tsC);
}

/** C·Fm for a geometry and tables, memoised per geometry object; checks the geometry and plugging. */
export function checkedGeometryConstant(geometry: CondenserGeometry, tables: HeiTables, pluggedTubes: number): number {
  return cachedGeometryConstant(geometry, tables, pluggedTubes);
}
