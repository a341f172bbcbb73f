import { CO2_FACTORS_SOURCE, type Fuel } from '@shared/domain/turbine/emission-factors';

export const FUEL_LABELS: Record<Fuel, string> = {
  'natural-gas': 'Natural gas',
  'bituminous-coal': 'Bituminous coal',
  'sub-bituminous-coal': 'Sub-bituminous coal',
  lignite: 'Lignite',
  'distillate-oil-no2': 'Distillate oil (No. 2)',
};

/** Under the CO2 factor: where the fuel's typical factor comes from, and that the plant's own fuel may differ. */
export const CO2_FACTOR_NOTE = `Typical factor for the fuel, from ${CO2_FACTORS_SOURCE}; check it against your fuel’s analysis. Heat input on the higher heating value.`;
