/**
 * Tables of the HEI-form clean coefficient U_clean = C(OD)·√V[ft/s]·Fw(t1)·Fm(material, BWG), in
 * Btu/(h·ft²·°F). They are data: a tenant may replace any of them, and the basis label travels with
 * every result computed from them. Sources as in ENGINEERING.md §3.
 */
import { fToC, inToMm } from '../../units.js';

export const TUBE_MATERIALS = ['admiralty', 'cuni-90-10', 'cuni-70-30', 'stainless', 'titanium'] as const;
export type TubeMaterial = (typeof TUBE_MATERIALS)[number];

export interface HeiTables {
  /** Where the numbers come from; recorded on every result. */
  basis: string;
  /** C by tube OD, ascending bands: a band applies when OD < odBelowMm; the last band has odBelowMm null. */
  tubeConstant: { odBelowMm: number | null; c: number }[];
  /** Fw by CW inlet temperature, ascending; linear between points, clamped (with a warning) outside. */
  inletTemperatureFactor: { inletC: number; factor: number }[];
  /** Fm by material and BWG; linear in wall thickness between listed gauges, an error outside them. */
  materialFactor: Record<TubeMaterial, { bwg: number; factor: number }[]>;
}

export const DEFAULT_HEI_TABLES: HeiTables = {
  basis:
    'HEI form, default tables: C by OD from memory (last three bands 255/251/247; another recollection gives 256/252/248), ' +
    'Fw from memory (approximate), Fm from older HEI editions as widely reproduced',
  // from memory: contiguous bands split at the midpoints between standard tube sizes
  tubeConstant: [
    { odBelowMm: inToMm(13 / 16), c: 267 }, // 5/8–3/4 in
    { odBelowMm: inToMm(17 / 16), c: 263 }, // 7/8–1 in
    { odBelowMm: inToMm(21 / 16), c: 259 }, // 1-1/8–1-1/4 in
    { odBelowMm: inToMm(25 / 16), c: 255 }, // 1-3/8–1-1/2 in
    { odBelowMm: inToMm(29 / 16), c: 251 }, // 1-5/8–1-3/4 in
    { odBelowMm: null, c: 247 },
  ],
  // from memory, approximate; keyed by °F in the source
  inletTemperatureFactor: [
    { inletC: fToC(40), factor: 0.67 },
    { inletC: fToC(50), factor: 0.8 },
    { inletC: fToC(60), factor: 0.92 },
    { inletC: fToC(70), factor: 1.0 },
    { inletC: fToC(80), factor: 1.05 },
    { inletC: fToC(90), factor: 1.09 },
    { inletC: fToC(100), factor: 1.12 },
  ],
  // older HEI editions as widely reproduced; later editions differ
  materialFactor: {
    admiralty: [
      { bwg: 16, factor: 0.96 },
      { bwg: 18, factor: 1.0 },
      { bwg: 20, factor: 1.02 },
      { bwg: 22, factor: 1.04 },
      { bwg: 24, factor: 1.06 },
    ],
    'cuni-90-10': [
      { bwg: 16, factor: 0.85 },
      { bwg: 18, factor: 0.9 },
      { bwg: 20, factor: 0.94 },
      { bwg: 22, factor: 0.97 },
    ],
    'cuni-70-30': [
      { bwg: 16, factor: 0.77 },
      { bwg: 18, factor: 0.82 },
      { bwg: 20, factor: 0.87 },
      { bwg: 22, factor: 0.9 },
    ],
    stainless: [
      { bwg: 18, factor: 0.69 },
      { bwg: 20, factor: 0.75 },
      { bwg: 22, factor: 0.79 },
    ],
    titanium: [
      { bwg: 18, factor: 0.71 },
      { bwg: 20, factor: 0.77 },
      { bwg: 22, factor: 0.81 },
    ],
  },
};

const checked = new WeakSet<HeiTables>();

/** Checks edited tables once per object; throws a RangeError naming the problem. */
export function assertHeiTables(tables: HeiTables): void {
  if (checked.has(tables)) return;
  if (!tables.basis || typeof tables.basis !== 'string') throw new RangeError('HEI tables need a basis label');
  const c = tables.tubeConstant;
  if (!Array.isArray(c) || c.length === 0) throw new RangeError('the C table needs at least one band');
  c.forEach((band, i) => {
    if (!(band.c > 0)) throw new RangeError(`C must be positive (band ${i + 1})`);
    const last = i === c.length - 1;
    if (last !== (band.odBelowMm === null)) throw new RangeError('only the last C band is open-ended (odBelowMm null)');
    if (!last && i > 0 && !((band.odBelowMm as number) > (c[i - 1]!.odBelowMm as number))) {
      throw new RangeError('C bands must be in increasing order of OD');
    }
  });
  const fw = tables.inletTemperatureFactor;
  if (!Array.isArray(fw) || fw.length === 0) throw new RangeError('the Fw table needs at least one row');
  fw.forEach((row, i) => {
    if (!(row.factor > 0) || !Number.isFinite(row.inletC)) throw new RangeError(`Fw row ${i + 1} needs a finite temperature and a positive factor`);
    if (i > 0 && !(row.inletC > fw[i - 1]!.inletC)) throw new RangeError('Fw rows must be in increasing order of temperature');
  });
  for (const material of TUBE_MATERIALS) {
    const rows = tables.materialFactor[material];
    if (!Array.isArray(rows) || rows.length === 0) throw new RangeError(`the Fm table has no rows for ${material}`);
    for (const row of rows) {
      if (!(row.factor > 0) || !Number.isInteger(row.bwg)) throw new RangeError(`Fm for ${material} needs whole BWG numbers and positive factors`);
    }
  }
  checked.add(tables);
}
