/**
 * The column guesser against headers written the way different historians write them (tag names invented for
 * these tests): it reads the words and units, checks the values' ranges, and never proposes a column whose
 * header names another quantity (a level, a position, a percentage, reactive power).
 */
import { describe, expect, it } from 'vitest';
import { guessMapping } from '@backend/import/column-mapping.js';

const byHeader = (headers: string[], rows: string[][]) => {
  const g = guessMapping(headers, rows, { timeZone: 'America/Chicago' });
  return { g, col: Object.fromEntries(g.columns.map((c) => [c.header, c])) };
};

describe('headers of a short-tag export with US units', () => {
  const headers = ['Stamp (local)', 'Gen Gross MW', 'Exh press inHgA', 'CW Temp In F', 'CW Temp Out F', 'Circ Flow gpm', 'Hotwell lvl in', 'Gen MVAR'];
  const rows = [
    ['03/10/2024 13:00', '480.2', '2.05', '71.0', '89.4', '251000', '31.5', '42'],
    ['03/10/2024 13:01', '481.0', '2.06', '71.1', '89.5', '250800', '31.2', '41'],
  ];
  const { g, col } = byHeader(headers, rows);

  it('reads "Stamp (local)" as the timestamp, local text month first', () => {
    expect(col['Stamp (local)']?.quantity).toBe('timestamp');
    expect(g.mapping.timestamp).toMatchObject({ column: 'Stamp (local)', format: 'local-text', dateOrder: 'mdy' });
  });

  it('reads "Exh press inHgA" as the absolute backpressure in inHg', () => {
    expect(col['Exh press inHgA']).toMatchObject({ quantity: 'backpressure', unit: 'inHg' });
    expect(g.mapping.columns.backpressure).toEqual({ column: 'Exh press inHgA', unit: 'inHg' });
  });

  it('does not take a hotwell level in inches for the hotwell temperature, and says why', () => {
    expect(col['Hotwell lvl in']).toMatchObject({ quantity: null, unit: null, confidence: 0 });
    expect(col['Hotwell lvl in']?.note).toMatch(/level/);
    expect(g.mapping.columns.hotwellTemperature).toBeUndefined();
  });

  it('does not take reactive power (MVAR) for the gross load', () => {
    expect(col['Gen MVAR']?.quantity).toBeNull();
    expect(g.mapping.columns.grossLoad).toEqual({ column: 'Gen Gross MW', unit: 'MW' });
  });

  it('is complete: every required quantity found', () => {
    expect(g.problems).toEqual([]);
    expect(g.complete).toBe(true);
  });
});

describe('headers of an underscore tag export with SI units', () => {
  const headers = [
    'TS_LOCAL',
    'U1_GROSS_MW',
    'COND_PRESS_KPAA',
    'CW_IN_TEMP_DEGC',
    'CW_OUT_TEMP_DEGC',
    'CW_FLOW_M3H',
    'HOTWELL_LEVEL_PCT',
    'CW_IN_VALVE_POS_PCT',
    'HOTWELL_TEMP_DEGC',
  ];
  const rows = [['2024-03-10 13:00', '410', '6.1', '18.2', '27.9', '54000', '48', '100', '36.1']];
  const { g, col } = byHeader(headers, rows);

  it('finds every quantity with its unit', () => {
    expect(g.mapping.timestamp?.column).toBe('TS_LOCAL');
    expect(g.mapping.columns).toMatchObject({
      grossLoad: { column: 'U1_GROSS_MW', unit: 'MW' },
      backpressure: { column: 'COND_PRESS_KPAA', unit: 'kPa' },
      cwInletTemperature: { column: 'CW_IN_TEMP_DEGC', unit: 'degC' },
      cwOutletTemperature: { column: 'CW_OUT_TEMP_DEGC', unit: 'degC' },
      cwFlow: { column: 'CW_FLOW_M3H', unit: 'm3/h' },
      hotwellTemperature: { column: 'HOTWELL_TEMP_DEGC', unit: 'degC' },
    });
  });

  it('leaves a level and a valve position in per cent unmapped', () => {
    expect(col.HOTWELL_LEVEL_PCT?.quantity).toBeNull();
    expect(col.CW_IN_VALVE_POS_PCT?.quantity).toBeNull();
  });
});

describe('headers of a long-name export with bracketed metric units', () => {
  const headers = [
    'Date and time',
    'Unit load (MW)',
    'Condenser abs. pressure (mbar)',
    'Cooling water inlet temp. (°C)',
    'Cooling water outlet temp. (°C)',
    'Cooling water flow (m³/h)',
    'Hotwell level (%)',
  ];
  const rows = [['10.03.2024 13:00', '395', '62', '17.5', '26.8', '52000', '51']];
  const { g, col } = byHeader(headers, rows);

  it('reads the absolute condenser pressure in mbar as the backpressure', () => {
    expect(col['Condenser abs. pressure (mbar)']).toMatchObject({ quantity: 'backpressure', unit: 'mbar' });
  });

  it('reads the temperatures and leaves the level out', () => {
    expect(col['Cooling water inlet temp. (°C)']).toMatchObject({ quantity: 'cwInletTemperature', unit: 'degC' });
    expect(col['Cooling water outlet temp. (°C)']).toMatchObject({ quantity: 'cwOutletTemperature', unit: 'degC' });
    expect(col['Hotwell level (%)']?.quantity).toBeNull();
    expect(g.complete).toBe(true);
  });
});

describe('a header whose unit or values belong to another quantity', () => {
  it('a temperature header carrying a pressure unit is not proposed', () => {
    const { col } = byHeader(['Time', 'Hotwell Temp inHg'], [['2024-03-10T13:00Z', '2.1']]);
    expect(col['Hotwell Temp inHg']?.quantity).toBeNull();
    expect(col['Hotwell Temp inHg']?.note).toMatch(/inHg/);
  });

  it('a per-cent temperature-looking header is not a temperature', () => {
    const { col } = byHeader(['Time', 'CW Outlet Temp %'], [['2024-03-10T13:00Z', '55']]);
    expect(col['CW Outlet Temp %']?.quantity).toBeNull();
  });

  it('values far outside what the quantity can be leave the column unproposed', () => {
    const { col } = byHeader(
      ['Time', 'CW Inlet Temp'],
      [
        ['2024-03-10T13:00Z', '250000'],
        ['2024-03-10T13:01Z', '251000'],
      ],
    );
    expect(col['CW Inlet Temp']?.quantity).toBeNull();
    expect(col['CW Inlet Temp']?.note).toMatch(/values/);
  });

  it('a stated unit whose values are implausible is not proposed (a backpressure of 95 inHgA)', () => {
    const { col } = byHeader(
      ['Time', 'BP inHgA'],
      [
        ['2024-03-10T13:00Z', '95'],
        ['2024-03-10T13:01Z', '96'],
      ],
    );
    expect(col['BP inHgA']?.quantity).toBeNull();
  });

  it('a column of date-times under a header without date words is taken as the timestamp from its values', () => {
    const { g } = byHeader(
      ['Sample', 'Gross MW'],
      [
        ['2024-03-10 13:00', '400'],
        ['2024-03-10 13:01', '401'],
      ],
    );
    expect(g.mapping.timestamp).toMatchObject({ column: 'Sample', format: 'local-text', dateOrder: 'ymd' });
  });
});
