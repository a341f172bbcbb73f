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
export const CO2_FACTORS_NOTE = 'US EPA 40 CFR Part 98 Subpart C, Table C-1 (from memory, verify)';
