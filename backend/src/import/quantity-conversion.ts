/**
 * Converts one imported value from the unit the file states into the SI-based unit used inside
 * Cleancase (kPa absolute, °C, m³/s, kg/s, MW, ppb). Factors from shared/units.ts (NIST SP 811);
 * the few that are not there are named here with their source.
 */
import { KPA_PER_INHG, KPA_PER_MBAR, KPA_PER_PSI, fToC, gpmToM3s, m3hToM3s, kgsToM3s } from '@shared/units.js';
import { liquidDensityKgM3 } from '@shared/domain/steam/index.js';

/** NIST SP 811: millimetre of mercury (conventional) = 133.3224 Pa. */
const KPA_PER_MMHG = 0.1333224;
/** NIST SP 811: foot of water (conventional) = 2.98898 kPa (39.2 °F). */
const KPA_PER_FT_WATER = 2.98898;
const KG_PER_LB = 0.45359237;
/**
 * "Standard air" 0.075 lb/ft³ (14.7 psia, about 70 °F, dry) [common practice; vendors differ on the
 * reference temperature by a few per cent]: 1 scfm = 4.5 lb/h of air.
 */
const LB_PER_SCF_STANDARD_AIR = 0.075;
export const SCFM_BASIS_NOTE = 'scfm converted at standard air 0.075 lb/ft³ (common practice)';

export const PRESSURE_KPA_PER_UNIT: Readonly<Record<string, number>> = {
  kPa: 1,
  inHg: KPA_PER_INHG,
  mbar: KPA_PER_MBAR,
  psi: KPA_PER_PSI,
  bar: 100,
  mmHg: KPA_PER_MMHG,
  ftH2O: KPA_PER_FT_WATER,
};

export const pressureToKpa = (value: number, unit: string): number => {
  const f = PRESSURE_KPA_PER_UNIT[unit];
  if (f === undefined) throw new RangeError(`unknown pressure unit "${unit}"`);
  return value * f;
};

export const temperatureToC = (value: number, unit: string): number => {
  if (unit === 'degC') return value;
  if (unit === 'degF') return fToC(value);
  throw new RangeError(`unknown temperature unit "${unit}"`);
};

export const powerToMw = (value: number, unit: string): number => {
  if (unit === 'MW') return value;
  if (unit === 'kW') return value / 1000;
  throw new RangeError(`unknown power unit "${unit}"`);
};

/** CW volume flow at the inlet, m³/s; a mass flow is turned into volume at the inlet temperature (IF97 density). */
export const cwFlowToM3s = (value: number, unit: string, cwInletC: number): number => {
  switch (unit) {
    case 'gpm':
      return gpmToM3s(value);
    case 'm3/h':
      return m3hToM3s(value);
    case 'm3/s':
      return value;
    case 'kg/s':
      return kgsToM3s(value, liquidDensityKgM3(cwInletC));
    default:
      throw new RangeError(`unknown CW flow unit "${unit}"`);
  }
};

export const massFlowToKgS = (value: number, unit: string): number => {
  switch (unit) {
    case 'kg/s':
      return value;
    case 'kg/h':
      return value / 3600;
    case 't/h':
      return value / 3.6;
    case 'lb/h':
      return (value * KG_PER_LB) / 3600;
    case 'klb/h':
      return (value * 1000 * KG_PER_LB) / 3600;
    case 'scfm':
      return (value * LB_PER_SCF_STANDARD_AIR * KG_PER_LB) / 60;
    default:
      throw new RangeError(`unknown mass flow unit "${unit}"`);
  }
};

export const dissolvedOxygenToPpb = (value: number, unit: string): number => {
  if (unit === 'ppb') return value;
  if (unit === 'ppm') return value * 1000;
  throw new RangeError(`unknown dissolved oxygen unit "${unit}"`);
};
