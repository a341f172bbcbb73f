import { describe, expect, it } from 'vitest';
import { guessMapping, normaliseHeader } from '@backend/import/column-mapping.js';
import { importMappingSchema } from '@shared/schemas/import-mapping.js';
import { US_MAPPING } from './import-fixtures.js';

const guessOf = (headers: string[], samples: string[][] = []) => {
  const g = guessMapping(headers, samples, { timeZone: 'America/Chicago' });
  return Object.fromEntries(g.columns.map((c) => [c.header, c]));
};

describe('column mapping guesses', () => {
  it.each([
    ['BP (inHgA)', 'backpressure', 'inHg'],
    ['Backpressure kPa(a)', 'backpressure', 'kPa'],
    ['Condenser Pressure [mbar]', 'backpressure', 'mbar'],
    ['Cond Press psia', 'backpressure', 'psi'],
    ['Condenser Vacuum inHg', 'condenserVacuum', 'inHg'],
    ['Barometric Pressure inHg', 'barometer', 'inHg'],
    ['CW In Temp °F', 'cwInletTemperature', 'degF'],
    ['Circ Water Inlet Temperature (deg F)', 'cwInletTemperature', 'degF'],
    ['CW outlet temperature [°C]', 'cwOutletTemperature', 'degC'],
    ['CW Out Temp degF', 'cwOutletTemperature', 'degF'],
    ['Circ Water Flow gpm', 'cwFlow', 'gpm'],
    ['CW flow [m³/h]', 'cwFlow', 'm3/h'],
    ['Cooling water flow m3/s', 'cwFlow', 'm3/s'],
    ['Gross MW', 'grossLoad', 'MW'],
    ['Generator output [MW]', 'grossLoad', 'MW'],
    ['Hotwell Temp °F', 'hotwellTemperature', 'degF'],
    ['Cond DO ppb', 'dissolvedOxygen', 'ppb'],
    ['Air Removal SCFM', 'airRemovalFlow', 'scfm'],
    ['Air in-leakage kg/h', 'airRemovalFlow', 'kg/h'],
    ['CW DP psi', 'cwDifferentialPressure', 'psi'],
    ['Condenser ΔP ftH2O', 'cwDifferentialPressure', 'ftH2O'],
    ['Condensate Flow klb/h', 'condensateFlow', 'klb/h'],
  ])('reads "%s" as %s in %s', (header, quantity, unit) => {
    const g = guessOf(['Timestamp', header])[header];
    expect(g?.quantity).toBe(quantity);
    expect(g?.unit).toBe(unit);
    expect(g?.confidence).toBeGreaterThanOrEqual(0.85);
  });

  it('recognises the timestamp column under its usual names', () => {
    for (const h of ['Timestamp', 'Date/Time', 'Time (UTC)', 'DateTime', 'Date Time']) expect(guessOf([h, 'Gross MW'])[h]?.quantity).toBe('timestamp');
  });

  it('leaves columns it cannot place unmapped, with zero confidence', () => {
    const g = guessOf(['Timestamp', 'Tag 4711', 'Mill B feeder speed']);
    expect(g['Tag 4711']).toMatchObject({ quantity: null, unit: null, confidence: 0 });
    expect(g['Mill B feeder speed']).toMatchObject({ quantity: null, unit: null, confidence: 0 });
  });

  it('when the header names no unit, guesses it from the values with a low confidence', () => {
    const g = guessOf(['Timestamp', 'CW Inlet Temp', 'CW Outlet Temp'], [['2024-06-01T00:00Z', '74.2', '92.9']]);
    expect(g['CW Inlet Temp']).toMatchObject({ quantity: 'cwInletTemperature', unit: 'degF' });
    expect(g['CW Inlet Temp']?.confidence).toBeLessThanOrEqual(0.5);
    const si = guessOf(['Timestamp', 'CW Inlet Temp'], [['2024-06-01T00:00Z', '21.4']]);
    expect(si['CW Inlet Temp']?.unit).toBe('degC');
  });

  it('keeps the most confident of two columns that look like the same quantity', () => {
    const g = guessMapping(['Timestamp', 'Gross MW', 'Unit load'], []);
    const load = g.columns.filter((c) => c.quantity === 'grossLoad');
    expect(load.map((c) => c.header)).toEqual(['Gross MW']);
    expect(g.columns[2]?.note).toMatch(/preferred/);
  });

  it('prefers an absolute backpressure over vacuum when both are present', () => {
    const g = guessMapping(['Timestamp', 'BP (inHgA)', 'Condenser Vacuum inHg'], []);
    expect(g.mapping.columns.backpressure?.column).toBe('BP (inHgA)');
    expect(g.mapping.columns.condenserVacuum).toBeUndefined();
  });

  it('produces a complete mapping for a typical US export, with the timestamp form read from the samples', () => {
    const headers = ['Timestamp', 'Gross MW', 'BP (inHgA)', 'CW In Temp °F', 'CW Out Temp °F', 'Circ Water Flow gpm'];
    const g = guessMapping(
      headers,
      [
        ['03/10/2024 13:00', '480', '2.1', '70', '88', '250000'],
        ['03/10/2024 14:00', '481', '2.1', '70', '88', '250000'],
      ],
      { timeZone: 'America/Chicago' },
    );
    expect(g.complete).toBe(true);
    expect(g.mapping.timestamp).toMatchObject({ format: 'local-text', timeZone: 'America/Chicago', dateOrder: 'mdy' });
  });

  it('reads day-first dates, ISO offsets, Excel serials and decimal commas from samples', () => {
    expect(guessMapping(['Zeit', 'Leistung MW'], [['13.03.2024 14:00', '400,5']]).mapping).toMatchObject({
      timestamp: { dateOrder: 'dmy' },
      decimalSeparator: ',',
    });
    expect(guessMapping(['Time', 'Gross MW'], [['2024-03-10T14:00:00-05:00', '400']]).mapping.timestamp?.format).toBe('iso-8601-offset');
    expect(guessMapping(['Time', 'Gross MW'], [['45362.5', '400']]).mapping.timestamp?.format).toBe('excel-serial');
  });

  it('reports what is missing when the guess is incomplete', () => {
    const g = guessMapping(['Timestamp', 'Gross MW'], []);
    expect(g.complete).toBe(false);
    expect(g.problems.join(' ')).toMatch(/CW inlet temperature/);
  });

  it('normalises degree signs, superscripts and brackets', () => {
    expect(normaliseHeader('CW flow [m³/h]')).toBe('cw flow m3/h');
    expect(normaliseHeader('CW In Temp °F')).toBe('cw in temp degf');
  });
});

describe('mapping schema', () => {
  const base = US_MAPPING as { columns: Record<string, unknown>; timestamp: unknown };

  it('accepts a complete mapping and fills the defaults', () => {
    const m = importMappingSchema.parse(US_MAPPING);
    expect(m.decimalSeparator).toBe('.');
    expect(m.timestamp.repeatedHour).toBe('by-file-order');
  });

  it('rejects a unit that does not belong to the quantity', () => {
    const r = importMappingSchema.safeParse({ ...base, columns: { ...base.columns, cwFlow: { column: 'Circ Water Flow gpm', unit: 'furlongs/fortnight' } } });
    expect(r.success).toBe(false);
    expect(JSON.stringify(r.error?.issues)).toMatch(/gpm, m3\/h, m3\/s, kg\/s/);
  });

  it('needs a barometer with condenser vacuum, and not both vacuum and backpressure', () => {
    const { backpressure: _bp, ...rest } = base.columns;
    const vacuumOnly = { ...base, columns: { ...rest, condenserVacuum: { column: 'Vac', unit: 'inHg' } } };
    expect(importMappingSchema.safeParse(vacuumOnly).success).toBe(false);
    expect(importMappingSchema.safeParse({ ...vacuumOnly, fixedBarometer: { value: 29.6, unit: 'inHg' } }).success).toBe(true);
    expect(importMappingSchema.safeParse({ ...base, columns: { ...base.columns, condenserVacuum: { column: 'Vac', unit: 'inHg' } } }).success).toBe(false);
  });

  it('needs the CW flow column or a design flow, not both', () => {
    const { cwFlow: _f, ...rest } = base.columns;
    expect(importMappingSchema.safeParse({ ...base, columns: rest }).success).toBe(false);
    expect(importMappingSchema.safeParse({ ...base, columns: rest, designCwFlowM3s: 15 }).success).toBe(true);
    expect(importMappingSchema.safeParse({ ...base, designCwFlowM3s: 15 }).success).toBe(false);
  });

  it('needs a valid IANA zone for local and Excel timestamps', () => {
    const local = { column: 'Timestamp', format: 'local-text', dateOrder: 'mdy' };
    expect(importMappingSchema.safeParse({ ...base, timestamp: local }).success).toBe(false);
    expect(importMappingSchema.safeParse({ ...base, timestamp: { ...local, timeZone: 'Mars/Olympus_Mons' } }).success).toBe(false);
    expect(importMappingSchema.safeParse({ ...base, timestamp: { ...local, timeZone: 'America/Chicago' } }).success).toBe(true);
  });

  it('refuses one column mapped to two quantities', () => {
    const r = importMappingSchema.safeParse({ ...base, columns: { ...base.columns, hotwellTemperature: { column: 'CW Out Temp °F', unit: 'degF' } } });
    expect(r.success).toBe(false);
  });
});
