/**
 * Unit conversions at the edges (import, display). Inside shared/domain everything is SI-based:
 * pressure kPa (absolute), temperature °C, temperature difference K, volume flow m³/s, mass flow kg/s,
 * heat rate kJ/kWh, heat-transfer coefficient W/(m²·K), power MW, length m.
 * Factors: NIST SP 811 [pub].
 */

/** Conventional inch of mercury at 0 °C (NIST SP 811). At 60 °F it would be 3.37685 kPa. */
export const KPA_PER_INHG = 3.386389;
export const INHG_REFERENCE_NOTE = 'inHg at 0 °C (conventional), 1 inHg = 3.386389 kPa';
export const KPA_PER_PSI = 6.894757;
export const KPA_PER_MBAR = 0.1;
export const M3_PER_US_GALLON = 0.003785411784;
export const KJ_PER_BTU = 1.055056;
export const BTU_PER_KWH = 3412.14;
export const WM2K_PER_BTU_HFT2F = 5.678263;
export const M_PER_FT = 0.3048;
export const M_PER_IN = 0.0254;
/** Standard atmosphere. */
export const STANDARD_ATMOSPHERE_KPA = 101.325;
/** Rule of thumb [common practice]: 1 psi ≈ 2.31 ft of water. */
export const FT_WATER_PER_PSI_APPROX = 2.31;

// Pressure
export const inHgToKpa = (inHg: number): number => inHg * KPA_PER_INHG;
export const kpaToInHg = (kpa: number): number => kpa / KPA_PER_INHG;
export const psiToKpa = (psi: number): number => psi * KPA_PER_PSI;
export const kpaToPsi = (kpa: number): number => kpa / KPA_PER_PSI;
export const mbarToKpa = (mbar: number): number => mbar * KPA_PER_MBAR;
export const kpaToMbar = (kpa: number): number => kpa / KPA_PER_MBAR;
export const mpaToKpa = (mpa: number): number => mpa * 1000;
export const kpaToMpa = (kpa: number): number => kpa / 1000;
/** Absolute pressure = barometer − vacuum (both in the same unit). */
export const absoluteFromVacuum = (barometer: number, vacuum: number): number => barometer - vacuum;
export const absoluteKpaFromVacuumInHg = (barometerInHg: number, vacuumInHg: number): number => inHgToKpa(barometerInHg - vacuumInHg);
export const absoluteKpaFromVacuumKpa = (barometerKpa: number, vacuumKpa: number): number => barometerKpa - vacuumKpa;

// Temperature
export const fToC = (f: number): number => ((f - 32) * 5) / 9;
export const cToF = (c: number): number => (c * 9) / 5 + 32;
export const cToK = (c: number): number => c + 273.15;
export const kToC = (k: number): number => k - 273.15;
/** A temperature difference in °F (or °R) expressed in K. */
export const deltaFToK = (df: number): number => (df * 5) / 9;
export const deltaKToF = (dk: number): number => (dk * 9) / 5;

// Flow
export const gpmToM3s = (gpm: number): number => (gpm * M3_PER_US_GALLON) / 60;
export const m3sToGpm = (m3s: number): number => (m3s * 60) / M3_PER_US_GALLON;
export const m3hToM3s = (m3h: number): number => m3h / 3600;
export const m3sToM3h = (m3s: number): number => m3s * 3600;
/** Mass flow to volume flow at a given density. */
export const kgsToM3s = (kgs: number, densityKgM3: number): number => kgs / densityKgM3;
export const m3sToKgs = (m3s: number, densityKgM3: number): number => m3s * densityKgM3;

// Heat rate
export const btuKwhToKjKwh = (btuKwh: number): number => btuKwh * KJ_PER_BTU;
export const kjKwhToBtuKwh = (kjKwh: number): number => kjKwh / KJ_PER_BTU;

// Heat-transfer coefficient
export const btuHft2FToWm2K = (u: number): number => u * WM2K_PER_BTU_HFT2F;
export const wm2KToBtuHft2F = (u: number): number => u / WM2K_PER_BTU_HFT2F;

// Power
export const kwToMw = (kw: number): number => kw / 1000;
export const mwToKw = (mw: number): number => mw * 1000;

// Length, area, velocity
export const inToMm = (inch: number): number => inch * 25.4;
export const mmToIn = (mm: number): number => mm / 25.4;
export const ftToM = (ft: number): number => ft * M_PER_FT;
export const mToFt = (m: number): number => m / M_PER_FT;
export const ft2ToM2 = (ft2: number): number => ft2 * M_PER_FT * M_PER_FT;
export const m2ToFt2 = (m2: number): number => m2 / (M_PER_FT * M_PER_FT);
export const ftsToMs = (fts: number): number => fts * M_PER_FT;
export const msToFts = (ms: number): number => ms / M_PER_FT;

/**
 * Tube wall thickness by Birmingham wire gauge, inches [pub, Birmingham wire gauge].
 * Even gauges as listed in ENGINEERING.md §1; odd gauges from memory.
 */
export const BWG_WALL_IN: Readonly<Record<number, number>> = {
  12: 0.109,
  13: 0.095,
  14: 0.083,
  15: 0.072,
  16: 0.065,
  17: 0.058,
  18: 0.049,
  19: 0.042,
  20: 0.035,
  21: 0.032,
  22: 0.028,
  23: 0.025,
  24: 0.022,
};

export function bwgWallIn(bwg: number): number {
  const wall = BWG_WALL_IN[bwg];
  if (wall === undefined) {
    throw new RangeError(`tube gauge BWG ${bwg} is not in the table; valid gauges are the integers 12 to 24`);
  }
  return wall;
}

export const bwgWallMm = (bwg: number): number => inToMm(bwgWallIn(bwg));

// Display presets -----------------------------------------------------------------------------

export type QuantityKind =
  'pressure' | 'temperature' | 'temperatureDifference' | 'flow' | 'massFlow' | 'heatRate' | 'htc' | 'power' | 'length' | 'area' | 'velocity' | 'money';

/** Internal (domain) unit of each quantity kind, the "SI" side of every preset entry. */
export const INTERNAL_UNITS: Readonly<Record<QuantityKind, string>> = {
  pressure: 'kPa(a)',
  temperature: '°C',
  temperatureDifference: 'K',
  flow: 'm³/s',
  massFlow: 'kg/s',
  heatRate: 'kJ/kWh',
  htc: 'W/(m²·K)',
  power: 'MW',
  length: 'm',
  area: 'm²',
  velocity: 'm/s',
  money: 'currency',
};

export interface DisplayUnit {
  label: string;
  /** display value → internal value */
  toSi: (value: number) => number;
  /** internal value → display value */
  fromSi: (value: number) => number;
  decimals: number;
}

export type DisplayPreset = Readonly<Record<QuantityKind, DisplayUnit>>;

const identity = (v: number): number => v;

export const DISPLAY_PRESETS: { readonly us: DisplayPreset; readonly si: DisplayPreset } = {
  us: {
    pressure: { label: 'inHgA', toSi: inHgToKpa, fromSi: kpaToInHg, decimals: 2 },
    temperature: { label: '°F', toSi: fToC, fromSi: cToF, decimals: 1 },
    temperatureDifference: { label: '°F', toSi: deltaFToK, fromSi: deltaKToF, decimals: 1 },
    flow: { label: 'gpm', toSi: gpmToM3s, fromSi: m3sToGpm, decimals: 0 },
    massFlow: { label: 'lb/h', toSi: (v) => (v * 0.45359237) / 3600, fromSi: (v) => (v * 3600) / 0.45359237, decimals: 0 },
    heatRate: { label: 'Btu/kWh', toSi: btuKwhToKjKwh, fromSi: kjKwhToBtuKwh, decimals: 0 },
    htc: { label: 'Btu/(h·ft²·°F)', toSi: btuHft2FToWm2K, fromSi: wm2KToBtuHft2F, decimals: 0 },
    power: { label: 'MW', toSi: identity, fromSi: identity, decimals: 1 },
    length: { label: 'in', toSi: (v) => v * M_PER_IN, fromSi: (v) => v / M_PER_IN, decimals: 3 },
    area: { label: 'ft²', toSi: ft2ToM2, fromSi: m2ToFt2, decimals: 0 },
    velocity: { label: 'ft/s', toSi: ftsToMs, fromSi: msToFts, decimals: 2 },
    money: { label: '$', toSi: identity, fromSi: identity, decimals: 2 },
  },
  si: {
    pressure: { label: 'kPa(a)', toSi: identity, fromSi: identity, decimals: 2 },
    temperature: { label: '°C', toSi: identity, fromSi: identity, decimals: 1 },
    temperatureDifference: { label: 'K', toSi: identity, fromSi: identity, decimals: 1 },
    flow: { label: 'm³/h', toSi: m3hToM3s, fromSi: m3sToM3h, decimals: 0 },
    massFlow: { label: 'kg/s', toSi: identity, fromSi: identity, decimals: 1 },
    heatRate: { label: 'kJ/kWh', toSi: identity, fromSi: identity, decimals: 0 },
    htc: { label: 'W/(m²·K)', toSi: identity, fromSi: identity, decimals: 0 },
    power: { label: 'MW', toSi: identity, fromSi: identity, decimals: 1 },
    length: { label: 'mm', toSi: (v) => v / 1000, fromSi: (v) => v * 1000, decimals: 2 },
    area: { label: 'm²', toSi: identity, fromSi: identity, decimals: 0 },
    velocity: { label: 'm/s', toSi: identity, fromSi: identity, decimals: 2 },
    money: { label: '$', toSi: identity, fromSi: identity, decimals: 2 },
  },
};
