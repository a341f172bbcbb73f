/**
 * Clean heat-transfer coefficient, HEI form [pub: HEI Standards for Steam Surface Condensers]:
 * U_clean = C(OD)·√V[ft/s]·Fw(t1)·Fm(material, BWG), Btu/(h·ft²·°F), returned in W/(m²·K).
 */
import { bwgWallIn, msToFts, WM2K_PER_BTU_HFT2F, cToF } from '../../units.js';
import { assertHeiTables, DEFAULT_HEI_TABLES, type HeiTables, type TubeMaterial } from './hei-tables.js';
import type { CondenserGeometry } from './geometry.js';

export function tubeConstantC(tables: HeiTables, tubeOdMm: number): number {
  for (const band of tables.tubeConstant) {
    if (band.odBelowMm === null || tubeOdMm < band.odBelowMm) return band.c;
  }
  throw new RangeError(`tube OD ${tubeOdMm} mm is beyond the last band of the C table (the last band must be open-ended)`);
}

/** Fw with linear interpolation; `clamped` is true outside the table (the end value is used). */
export function inletTemperatureFactor(tables: HeiTables, cwInletC: number): { factor: number; clamped: boolean } {
  const t = tables.inletTemperatureFactor;
  const n = t.length;
  if (cwInletC <= t[0]!.inletC) return { factor: t[0]!.factor, clamped: cwInletC < t[0]!.inletC };
  if (cwInletC >= t[n - 1]!.inletC) return { factor: t[n - 1]!.factor, clamped: cwInletC > t[n - 1]!.inletC };
  return { factor: interpolateFw(t, cwInletC), clamped: false };
}

/** Fw without allocation, for the hot path (clamped at the ends). */
export function inletTemperatureFactorValue(tables: HeiTables, cwInletC: number): number {
  const t = tables.inletTemperatureFactor;
  const n = t.length;
  if (cwInletC <= t[0]!.inletC) return t[0]!.factor;
  if (cwInletC >= t[n - 1]!.inletC) return t[n - 1]!.factor;
  return interpolateFw(t, cwInletC);
}

function interpolateFw(t: HeiTables['inletTemperatureFactor'], x: number): number {
  let i = 1;
  while (x > t[i]!.inletC) i++;
  const a = t[i - 1]!;
  const b = t[i]!;
  return a.factor + ((b.factor - a.factor) * (x - a.inletC)) / (b.inletC - a.inletC);
}

/** Fm: exact at listed gauges, linear in wall thickness between them, an error outside. */
export function materialFactor(tables: HeiTables, material: TubeMaterial, bwg: number): number {
  const rows = tables.materialFactor[material];
  if (!rows || rows.length === 0) throw new RangeError(`no Fm values for tube material "${material}"`);
  const wall = bwgWallIn(bwg);
  const byWall = rows.map((r) => ({ wall: bwgWallIn(r.bwg), factor: r.factor })).sort((p, q) => p.wall - q.wall);
  const lo = byWall[0]!;
  const hi = byWall[byWall.length - 1]!;
  if (wall < lo.wall - 1e-12 || wall > hi.wall + 1e-12) {
    const gauges = rows.map((r) => r.bwg).sort((p, q) => p - q);
    throw new RangeError(
      `tube gauge BWG ${bwg} is outside the listed gauges for ${material} (BWG ${gauges[0]} to ${gauges[gauges.length - 1]}); enter Fm for it in the HEI tables`,
    );
  }
  for (let i = 1; i < byWall.length; i++) {
    const a = byWall[i - 1]!;
    const b = byWall[i]!;
    if (wall <= b.wall) return b.wall === a.wall ? b.factor : a.factor + ((b.factor - a.factor) * (wall - a.wall)) / (b.wall - a.wall);
  }
  return lo.factor;
}

/** C·Fm in Btu/(h·ft²·°F)/√(ft/s): constant for a geometry, so hot loops compute it once. */
export function geometryConstant(geometry: CondenserGeometry, tables: HeiTables): number {
  assertHeiTables(tables);
  return tubeConstantC(tables, geometry.tubeOdMm) * materialFactor(tables, geometry.tubeMaterial, geometry.tubeBwg);
}

/** U_clean in W/(m²·K) from a precomputed C·Fm; no allocation. */
export function cleanCoefficientFromConstant(cFm: number, tables: HeiTables, cwInletC: number, velocityMs: number): number {
  return cFm * Math.sqrt(msToFts(velocityMs)) * inletTemperatureFactorValue(tables, cwInletC) * WM2K_PER_BTU_HFT2F;
}

/** The warning to show when the inlet temperature lies outside the Fw table (the end value is used). */
export function inletTemperatureFactorWarning(tables: HeiTables, cwInletC: number): string | undefined {
  const fw = inletTemperatureFactor(tables, cwInletC);
  if (!fw.clamped) return undefined;
  const t = tables.inletTemperatureFactor;
  return `CW inlet ${cToF(cwInletC).toFixed(1)} °F is outside the Fw table (${cToF(t[0]!.inletC).toFixed(0)}–${cToF(t[t.length - 1]!.inletC).toFixed(0)} °F); the end value ${fw.factor} was used`;
}

export interface CleanCoefficient {
  value: number;
  basis: string;
  warnings: string[];
}

export function cleanCoefficientWm2K(
  geometry: CondenserGeometry,
  cwInletC: number,
  velocityMs: number,
  heiTables: HeiTables = DEFAULT_HEI_TABLES,
): CleanCoefficient {
  if (!(Number.isFinite(velocityMs) && velocityMs > 0)) throw new RangeError(`tube velocity must be positive, got ${velocityMs} m/s`);
  if (!Number.isFinite(cwInletC)) throw new RangeError(`cwInletC must be a finite number, got ${cwInletC}`);
  const warning = inletTemperatureFactorWarning(heiTables, cwInletC);
  const fw = inletTemperatureFactorValue(heiTables, cwInletC);
  const value = geometryConstant(geometry, heiTables) * Math.sqrt(msToFts(velocityMs)) * fw * WM2K_PER_BTU_HFT2F;
  const warnings = warning ? [warning] : [];
  return { value, basis: heiTables.basis, warnings };
}

/**
 * A user-supplied clean coefficient U* known at velocity V* and inlet t1*, moved to other conditions
 * by √(V/V*)·Fw(t1)/Fw(t1*) [from memory: HEI practice].
 */
export function rescaleCleanCoefficientWm2K(
  uRefWm2K: number,
  ref: { velocityMs: number; cwInletC: number },
  at: { velocityMs: number; cwInletC: number },
  heiTables: HeiTables = DEFAULT_HEI_TABLES,
): number {
  return (
    uRefWm2K *
    Math.sqrt(at.velocityMs / ref.velocityMs) *
    (inletTemperatureFactorValue(heiTables, at.cwInletC) / inletTemperatureFactorValue(heiTables, ref.cwInletC))
  );
}
