/**
 * Historian rows with the air in-leakage witnesses (ENGINEERING.md §3): hotwell temperature (so condensate
 * subcooling = Tsat(p) − hotwell), condensate dissolved oxygen and air-removal flow, written as extra
 * US-unit columns after the usual ones of historian-files.ts.
 */
import { saturationTemperatureC } from '@shared/domain/steam/index.js';
import type { ImportMappingInput } from '@shared/schemas/import-mapping.js';
import { US_HEADERS, US_MAPPING, usCells, type HistorianRow } from './historian-files.js';

export const WITNESS_HEADERS = [...US_HEADERS, 'Hotwell Temp F', 'Condensate DO ppb', 'Air Removal kg/h'] as const;

export const WITNESS_MAPPING: ImportMappingInput = {
  ...US_MAPPING,
  columns: {
    ...US_MAPPING.columns,
    hotwellTemperature: { column: 'Hotwell Temp F', unit: 'degF' },
    dissolvedOxygen: { column: 'Condensate DO ppb', unit: 'ppb' },
    airRemovalFlow: { column: 'Air Removal kg/h', unit: 'kg/h' },
  },
};

export interface Witnesses {
  subcoolingK: number;
  dissolvedOxygenPpb: number;
  airRemovalKgS: number;
}

export interface WitnessRow extends HistorianRow {
  hotwellC: number;
  witnesses: Witnesses;
}

const cToF = (c: number) => c * 1.8 + 32;

/** The row's cells: the usual US-unit ones, then hotwell °F, DO ppb and air removal kg/h (exact: 1 h = 3600 s). */
export function witnessCells(r: Omit<WitnessRow, 'cells' | 'cleanliness'>): string[] {
  return [...usCells(r), cToF(r.hotwellC).toFixed(5), r.witnesses.dissolvedOxygenPpb.toFixed(3), (r.witnesses.airRemovalKgS * 3600).toFixed(4)];
}

/**
 * Adds the witnesses to rows: the hotwell sits `subcoolingK` below the saturation temperature at the row's
 * backpressure (IAPWS-IF97 region 4).
 */
export function withWitnesses(rows: HistorianRow[], at: (hour: number, row: HistorianRow) => Witnesses): WitnessRow[] {
  return rows.map((r, h) => {
    const witnesses = at(h, r);
    const hotwellC = saturationTemperatureC(r.backpressureKpa) - witnesses.subcoolingK;
    const row = { ...r, hotwellC, witnesses };
    return { ...row, cells: witnessCells(row) };
  });
}

/** Rewrites a row's cells after a test changed its values (the hotwell stays where it was). */
export function refreshCells(r: WitnessRow): WitnessRow {
  r.cells = witnessCells(r);
  return r;
}
