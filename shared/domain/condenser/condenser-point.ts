/**
 * Condenser performance at one data point (ENGINEERING.md §3) [pub: HEI Standards for Steam Surface
 * Condensers; ASME PTC 12.2]: duty, rise, ITD, TTD, LMTD, tube velocity, U, HEI clean coefficient,
 * cleanliness factor, and the expected backpressure at a reference cleanliness.
 */
import { liquidCpKjKgK, liquidDensityKgM3, saturationTemperatureC } from '../steam/index.js';
import { BACKPRESSURE_BOUNDS_KPA, PointRejectedError } from '../validity/rejection-reasons.js';
import { DEFAULT_HEI_TABLES, type HeiTables } from './hei-tables.js';
import { activeSurfaceM2, tubeInsideDiameterM, tubeVelocityMs, type CondenserGeometry } from './geometry.js';
import { cleanCoefficientFromConstant, inletTemperatureFactorWarning } from './clean-coefficient.js';
import { backpressureAtCleanlinessKpa, checkedGeometryConstant, modelBackpressureKpa } from './expected-backpressure.js';
import { implausibleResults, type ImplausibleResult } from './plausibility.js';

export interface CondenserPointInput {
  backpressureKpa: number;
  cwInletC: number;
  cwOutletC: number;
  /** CW volume flow metered at the inlet, m³/s */
  cwFlowM3s: number;
  pluggedTubes: number;
  geometry: CondenserGeometry;
  referenceCleanliness: number;
  /** Clean coefficient at this very point, W/(m²·K), replacing the HEI value. */
  uCleanWm2K?: number;
  heiTables?: HeiTables;
}

export interface CondenserPointResult {
  saturationC: number;
  dutyMw: number;
  riseK: number;
  itdK: number;
  ttdK: number;
  lmtdK: number;
  velocityMs: number;
  uWm2K: number;
  uCleanWm2K: number;
  cleanliness: number;
  referenceCleanliness: number;
  expectedBackpressureKpa: number;
  cwMassFlowKgS: number;
  activeSurfaceM2: number;
  pluggedFraction: number;
  tubeInsideDiameterMm: number;
  /** Backpressure rise due to the plugged tubes at the measured cleanliness, kPa (total flow held). */
  pluggedTubesEffectKpa: number;
  /** User U_clean over the HEI value at this point (1 when HEI is used); carries the user basis to other conditions. */
  uCleanScale: number;
  /** Where U_clean comes from. */
  uCleanBasis: string;
  /** Results outside their plausibility band: the point is kept out of trends and daily medians. */
  implausible: ImplausibleResult[];
  warnings: string[];
}

function finite(name: string, v: number): void {
  if (!Number.isFinite(v)) throw new PointRejectedError('non-finite', `${name} must be a finite number, got ${v}`, name);
}

function inRange(name: string, v: number, lo: number, hi: number, unit: string): void {
  if (!(v >= lo && v <= hi)) throw new PointRejectedError('out-of-range', `${name} = ${v} ${unit} is outside ${lo}–${hi} ${unit}`, name);
}

/**
 * The model's expected backpressure, refused (with the point) when it lies outside the range a measured
 * backpressure may have: such a result means the setup or an instrument is wrong, and would price absurd costs.
 */
export function expectedWithinBounds(model: () => number, cleanliness: number, what = 'expected backpressure'): number {
  const { min, max } = BACKPRESSURE_BOUNDS_KPA;
  let kpa: number;
  try {
    kpa = model();
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    kpa = Number.POSITIVE_INFINITY;
  }
  if (!(kpa >= min && kpa <= max)) {
    const shown = Number.isFinite(kpa) ? `${kpa.toPrecision(4)} kPa` : 'beyond the steam tables';
    throw new PointRejectedError(
      'expected-out-of-range',
      `${what} at cleanliness ${cleanliness.toFixed(2)} is ${shown}, outside ${min}–${max} kPa, the range a measured backpressure may have: check the setup (surface, tube count, clean coefficient) or the instruments`,
    );
  }
  return kpa;
}

export function analyseCondenserPoint(input: CondenserPointInput): CondenserPointResult {
  const { backpressureKpa: p, cwInletC: t1, cwOutletC: t2, cwFlowM3s, pluggedTubes, geometry, referenceCleanliness } = input;
  const tables = input.heiTables ?? DEFAULT_HEI_TABLES;
  finite('backpressureKpa', p);
  finite('cwInletC', t1);
  finite('cwOutletC', t2);
  finite('cwFlowM3s', cwFlowM3s);
  finite('referenceCleanliness', referenceCleanliness);
  inRange('backpressureKpa', p, BACKPRESSURE_BOUNDS_KPA.min, BACKPRESSURE_BOUNDS_KPA.max, 'kPa');
  inRange('cwInletC', t1, 0, 60, '°C');
  inRange('cwOutletC', t2, 0, 80, '°C');
  if (!(cwFlowM3s > 0)) throw new PointRejectedError('out-of-range', `cwFlowM3s must be positive, got ${cwFlowM3s}`, 'cwFlowM3s');
  if (!(referenceCleanliness > 0 && referenceCleanliness <= 1.5)) {
    throw new RangeError(`referenceCleanliness must be in (0, 1.5], got ${referenceCleanliness}`);
  }
  const cFm = checkedGeometryConstant(geometry, tables, pluggedTubes);

  const ts = saturationTemperatureC(p);
  const rise = t2 - t1;
  const itd = ts - t1;
  const ttd = ts - t2;
  if (!(rise > 0)) throw new PointRejectedError('rise-not-positive', `CW outlet ${t2} °C is not above the inlet ${t1} °C`);
  if (!(ttd > 0)) {
    throw new PointRejectedError('ttd-not-positive', `CW outlet ${t2} °C is not below the saturation temperature ${ts.toFixed(3)} °C at ${p} kPa`);
  }
  const lmtd = rise / Math.log(itd / ttd);
  const massFlow = liquidDensityKgM3(t1) * cwFlowM3s;
  const cp = liquidCpKjKgK((t1 + t2) / 2);
  const dutyMw = (massFlow * cp * rise) / 1000;
  const aEff = activeSurfaceM2(geometry, pluggedTubes);
  const u = (dutyMw * 1e6) / (aEff * lmtd);
  const velocity = tubeVelocityMs(geometry, cwFlowM3s, pluggedTubes);
  const heiValue = cleanCoefficientFromConstant(cFm, tables, t1, velocity);
  const warnings: string[] = [];
  const fwWarning = inletTemperatureFactorWarning(tables, t1);
  if (fwWarning) warnings.push(fwWarning);
  let uClean = heiValue;
  let basis = tables.basis;
  if (input.uCleanWm2K !== undefined) {
    if (!(Number.isFinite(input.uCleanWm2K) && input.uCleanWm2K > 0)) throw new RangeError(`uCleanWm2K must be positive, got ${input.uCleanWm2K}`);
    uClean = input.uCleanWm2K;
    basis = 'user-supplied clean coefficient at this point; moved to other conditions by √V and Fw of the HEI tables';
  }
  const uCleanScale = uClean / heiValue;
  const cleanliness = u / uClean;
  if (ttd < 1) warnings.push(`TTD ${ttd.toFixed(2)} K is below 1 K: usually an instrument problem (common practice)`);

  const expected = expectedWithinBounds(
    () => modelBackpressureKpa(geometry, tables, cFm, t1, cwFlowM3s, dutyMw, pluggedTubes, referenceCleanliness, Number.NaN, uCleanScale),
    referenceCleanliness,
  );
  const implausible = implausibleResults({ cleanliness, velocityMs: velocity });
  for (const f of implausible) warnings.push(f.message);
  let unplugged = p;
  try {
    if (pluggedTubes > 0) unplugged = modelBackpressureKpa(geometry, tables, cFm, t1, cwFlowM3s, dutyMw, 0, cleanliness, Number.NaN, uCleanScale);
  } catch (err) {
    // only an implausible cleanliness can push the unplugged model past the steam tables; it already carries its warning
    if (!(err instanceof RangeError) || implausible.length === 0) throw err;
    unplugged = Number.NaN;
  }

  return {
    saturationC: ts,
    dutyMw,
    riseK: rise,
    itdK: itd,
    ttdK: ttd,
    lmtdK: lmtd,
    velocityMs: velocity,
    uWm2K: u,
    uCleanWm2K: uClean,
    cleanliness,
    referenceCleanliness,
    expectedBackpressureKpa: expected,
    cwMassFlowKgS: massFlow,
    activeSurfaceM2: aEff,
    pluggedFraction: pluggedTubes / geometry.tubeCount,
    tubeInsideDiameterMm: tubeInsideDiameterM(geometry) * 1000,
    pluggedTubesEffectKpa: p - unplugged,
    uCleanScale,
    uCleanBasis: basis,
    implausible,
    warnings,
  };
}

/**
 * Correction to other conditions (design inlet temperature, flow, duty, plugging): holds the
 * point's cleanliness and rescales U_clean through √V and Fw [from memory: HEI practice].
 */
export function correctedBackpressureKpa(
  point: Pick<CondenserPointResult, 'cleanliness' | 'uCleanScale'>,
  geometry: CondenserGeometry,
  conditions: { cwInletC: number; cwFlowM3s: number; dutyMw: number; pluggedTubes: number },
  heiTables: HeiTables = DEFAULT_HEI_TABLES,
): number {
  return backpressureAtCleanlinessKpa({ geometry, heiTables, ...conditions, cleanliness: point.cleanliness, uCleanScale: point.uCleanScale });
}
