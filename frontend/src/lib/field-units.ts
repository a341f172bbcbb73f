import { btuKwhToKjKwh, DISPLAY_PRESETS, ftToM, inToMm, KJ_PER_BTU, kjKwhToBtuKwh, mmToIn, mToFt, type DisplayUnit } from '@shared/units';
import { readTyped, writeGroupedForInput } from './number-format';

export type UnitSystem = 'us' | 'si';

const identity = (v: number) => v;

/**
 * How each kind of setup field is shown in the user's system, and converted to the unit the shared
 * schema stores (its name says which: `tubeOdMm`, `designHeatRateBtuKwh`, …). Most come from the shared
 * display presets; the rest are fields whose stored unit is not the preset's internal one.
 */
export function fieldUnits(system: UnitSystem) {
  const preset = DISPLAY_PRESETS[system];
  const us = system === 'us';
  // 1 MMBtu = 1.055056 GJ, so a price per GJ is the price per MMBtu ÷ 1.055056 (NIST SP 811 Btu factor).
  const perMmbtu = (label: string, decimals: number): DisplayUnit =>
    us
      ? { label: `${label}/MMBtu`, toSi: identity, fromSi: identity, decimals }
      : { label: `${label}/GJ`, toSi: (v) => v * KJ_PER_BTU, fromSi: (v) => v / KJ_PER_BTU, decimals };
  return {
    pressureKpa: preset.pressure,
    /** a difference of pressures: same factor as the absolute pressure, without the "absolute" mark */
    pressureDifferenceKpa: { ...preset.pressure, label: us ? 'inHg' : 'kPa' } satisfies DisplayUnit,
    temperatureDifferenceK: preset.temperatureDifference,
    temperatureC: preset.temperature,
    flowM3s: preset.flow,
    powerMw: preset.power,
    areaM2: preset.area,
    tubeOdMm: (us
      ? { label: 'in', toSi: inToMm, fromSi: mmToIn, decimals: 3 }
      : { label: 'mm', toSi: identity, fromSi: identity, decimals: 2 }) satisfies DisplayUnit,
    tubeLengthM: (us
      ? { label: 'ft', toSi: ftToM, fromSi: mToFt, decimals: 2 }
      : { label: 'm', toSi: identity, fromSi: identity, decimals: 2 }) satisfies DisplayUnit,
    heatRateBtuKwh: (us
      ? { label: 'Btu/kWh', toSi: identity, fromSi: identity, decimals: 0 }
      : { label: 'kJ/kWh', toSi: kjKwhToBtuKwh, fromSi: btuKwhToKjKwh, decimals: 0 }) satisfies DisplayUnit,
    fuelPricePerMmbtu: perMmbtu('$', 2),
    co2KgPerMmbtu: perMmbtu('kg', 2),
  };
}

export type FieldUnits = ReturnType<typeof fieldUnits>;

/** Significant digits a converted value keeps in an input: a save without edits moves it by under 5 ppm. */
const INPUT_SIGNIFICANT_DIGITS = 6;

/**
 * A stored value as text for an input, in the display unit and the person's number format: one decimal more
 * than the display precision, but never more than six significant digits (a conversion's noise, "164843.4 gpm",
 * is not a figure anyone typed), trailing zeros dropped, thousands grouped from five digits on. What it writes
 * reads back and writes again as the same text, so repeated saves do not drift.
 */
export function toInputText(stored: number | null | undefined, unit: DisplayUnit): string {
  if (stored === null || stored === undefined || !Number.isFinite(stored)) return '';
  const value = unit.fromSi(stored);
  const wholeDigits = Math.abs(value) < 1 ? 1 : Math.floor(Math.log10(Math.abs(value))) + 1;
  const decimals = Math.max(0, Math.min(unit.decimals + 1, INPUT_SIGNIFICANT_DIGITS - wholeDigits));
  return writeGroupedForInput(Number(value.toFixed(decimals)));
}

/**
 * Text typed by a person as a number, in their number format (shared/number-text.ts): blank is "not given"
 * (undefined); text that is not a number, or could be two numbers, becomes NaN so the form refuses it (the
 * field shows why, see QuantityField).
 */
export function parseNumberText(text: string): number | undefined {
  const read = readTyped(text);
  if (read.kind === 'blank') return undefined;
  return read.kind === 'number' ? read.value : Number.NaN;
}

/** What to say beside a field about its text: why it is refused, or how a format-dependent number was read. */
export function numberTextNote(text: string): { error?: string; hint?: string } {
  const read = readTyped(text);
  if (read.kind === 'ambiguous') return { error: read.message };
  if (read.kind === 'number' && read.readAs) return { hint: read.readAs };
  return {};
}

/** Text in a display unit → the stored value (undefined when blank). */
export function fromInputText(text: string, unit: DisplayUnit): number | undefined {
  const n = parseNumberText(text);
  return n === undefined || Number.isNaN(n) ? n : unit.toSi(n);
}

/** A stored value for reading, with its unit, e.g. "2.00 inHgA". */
export function formatStored(stored: number | null | undefined, unit: DisplayUnit): string {
  if (stored === null || stored === undefined || !Number.isFinite(stored)) return '—';
  return `${unit.fromSi(stored).toLocaleString('en-US', { minimumFractionDigits: unit.decimals, maximumFractionDigits: unit.decimals })} ${unit.label}`;
}
