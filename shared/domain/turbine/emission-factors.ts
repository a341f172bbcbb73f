/**
 * CO2 emission factors, kg CO2 per MMBtu of fuel heat input (HHV)
 * [pub: US EPA 40 CFR Part 98 Subpart C, Table C-1; values from memory, verify].
 */
export const CO2_KG_PER_MMBTU = {
  'natural-gas': 53.06,
  'bituminous-coal': 93.28,
  'sub-bituminous-coal': 97.17,
  lignite: 97.72,
  'distillate-oil-no2': 73.96,
} as const;

export type Fuel = keyof typeof CO2_KG_PER_MMBTU;
/** Where the factors come from, as a person reads it beside the value. */
export const CO2_FACTORS_SOURCE = 'US EPA 40 CFR Part 98 Subpart C, Table C-1';
export const CO2_FACTORS_NOTE = `${CO2_FACTORS_SOURCE} (from memory, verify)`;
