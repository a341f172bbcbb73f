import type { TUBE_MATERIALS } from '@shared/domain/condenser/hei-tables';

export const TUBE_MATERIAL_LABELS: Record<(typeof TUBE_MATERIALS)[number], string> = {
  admiralty: 'Admiralty brass',
  'cuni-90-10': '90-10 copper-nickel',
  'cuni-70-30': '70-30 copper-nickel',
  stainless: 'Stainless steel',
  titanium: 'Titanium',
};
