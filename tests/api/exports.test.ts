/**
 * Exports follow the person's units: US units for someone who works in US units, SI otherwise, the unit in every
 * header, the currency named on money columns, and a UTF-8 byte-order mark on CSV so spreadsheets show °C and °F.
 */
import ExcelJS from 'exceljs';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cToF, deltaKToF, kpaToInHg } from '@shared/units.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { User } from '../../backend/src/entities/user.entity.js';
import { createTenant, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_ECONOMICS } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let tenant: TenantFixture;
let usPerson: TestAgent;
let siPerson: TestAgent;
let unit: GeneratingUnit;

/** One stored day (invented figures). */
const DAY = {
  day: '2024-06-01',
  pointsUsed: 20,
  pointsDropped: 4,
  meanBackpressureKpa: 6.8,
  meanExcessBackpressureKpa: 0.9,
  meanCwInletC: 21.5,
  medianTtdK: 4.2,
  loadKpa: -0.35,
  foulingCost: 1234.5,
  meanAirRemovalKgS: 0.01,
};

const binary = (res: { on: (e: string, f: (b?: Buffer) => void) => void }, done: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c?: Buffer) => chunks.push(c!));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

/** One CSV line into its fields (quoted fields may hold commas; no line breaks inside fields here). */
const fields = (line: string): string[] =>
  [...line.matchAll(/("(?:[^"]|"")*"|[^,]*)(,|$)/g)].slice(0, -1).map((m) => {
    const field = m[1]!; // the first group always takes part in a match (possibly empty)
    return field.startsWith('"') ? field.slice(1, -1).replace(/""/g, '"') : field;
  });

const csvOf = async (agent: TestAgent, dataset: 'daily' | 'breakdown') => {
  const res = await agent.get(`/api/units/${unit.id}/export`).query({ dataset, format: 'csv' }).buffer(true).parse(binary).expect(200);
  const bytes = res.body as Buffer;
  const lines = bytes
    .toString('utf8')
    .replace(/^\uFEFF/, '')
    .trim()
    .split('\r\n');
  return { bytes, header: fields(lines[0]!), rows: lines.slice(1).map(fields) };
};

beforeAll(async () => {
  t = await createTestApp();
  tenant = await createTenant(t.dataSource, 'exports');
  await t.dataSource.getRepository(User).update({ id: tenant.users.analyst.id }, { unitPreference: 'us' });
  await t.dataSource.getRepository(User).update({ id: tenant.users.viewer.id }, { unitPreference: 'si' });
  usPerson = await signedInAgent(t.app, tenant.users.analyst.email);
  siPerson = await signedInAgent(t.app, tenant.users.viewer.email);
  unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
  await t.dataSource.query(
    'INSERT INTO daily_aggregate (unitId, day, pointsUsed, pointsDropped, meanBackpressureKpa, meanExcessBackpressureKpa, meanCwInletC, medianTtdK, loadKpa, foulingCost, meanAirRemovalKgS) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)',
    [
      unit.id,
      DAY.day,
      DAY.pointsUsed,
      DAY.pointsDropped,
      DAY.meanBackpressureKpa,
      DAY.meanExcessBackpressureKpa,
      DAY.meanCwInletC,
      DAY.medianTtdK,
      DAY.loadKpa,
      DAY.foulingCost,
      DAY.meanAirRemovalKgS,
    ],
  );
});
afterAll(async () => t?.close());

describe('the daily export', () => {
  it('starts a CSV with the UTF-8 byte-order mark so a spreadsheet reads °C and °F', async () => {
    const { bytes } = await csvOf(siPerson, 'daily');
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
  });

  it('for a person who works in US units: inHgA and °F headers with converted values', async () => {
    const { header, rows } = await csvOf(usPerson, 'daily');
    const value = (h: string) => {
      expect(header, h).toContain(h);
      return Number(rows[0]?.[header.indexOf(h)]);
    };
    expect(value('Backpressure inHgA')).toBeCloseTo(kpaToInHg(DAY.meanBackpressureKpa), 9);
    expect(value('Excess backpressure inHg')).toBeCloseTo(kpaToInHg(DAY.meanExcessBackpressureKpa), 9);
    expect(value('CW inlet °F')).toBeCloseTo(cToF(DAY.meanCwInletC), 9);
    expect(value('TTD (median) °F')).toBeCloseTo(deltaKToF(DAY.medianTtdK), 9);
    expect(value('Deviation: load and duty inHg')).toBeCloseTo(kpaToInHg(DAY.loadKpa), 9);
    expect(value('Air-removal flow lb/h')).toBeCloseTo((DAY.meanAirRemovalKgS * 3600) / 0.45359237, 9);
    expect(header.some((h) => /kPa|°C|kg\/s/.test(h))).toBe(false);
  });

  it('for a person who works in SI: kPa(a) and °C headers with the stored values', async () => {
    const { header, rows } = await csvOf(siPerson, 'daily');
    expect(Number(rows[0]?.[header.indexOf('Backpressure kPa(a)')])).toBe(DAY.meanBackpressureKpa);
    expect(Number(rows[0]?.[header.indexOf('CW inlet °C')])).toBe(DAY.meanCwInletC);
    expect(header.some((h) => /inHg|°F/.test(h))).toBe(false);
  });

  it('names the unit’s currency on every money column', async () => {
    const { header } = await csvOf(usPerson, 'daily');
    expect(header).toContain('Fouling cost USD/day');
    expect(header).toContain('Unexplained cost USD/day');
    expect(header.some((h) => /money/.test(h))).toBe(false);
  });

  it('names another currency when the unit’s economics use it, in CSV and XLSX', async () => {
    const euro = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    await t.dataSource.query('UPDATE generating_unit SET economics = ? WHERE id = ?', [JSON.stringify({ ...TEST_ECONOMICS, currency: 'EUR' }), euro.id]);
    const csv = (await siPerson.get(`/api/units/${euro.id}/export`).query({ dataset: 'breakdown', format: 'csv' }).buffer(true).parse(binary).expect(200))
      .body as Buffer;
    const header = fields(
      csv
        .toString('utf8')
        .replace(/^\uFEFF/, '')
        .split('\r\n')[0]!,
    );
    expect(header).toContain('Fouling cost EUR');
    const res = await siPerson.get(`/api/units/${euro.id}/export`).query({ dataset: 'daily', format: 'xlsx' }).buffer(true).parse(binary).expect(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as ArrayBuffer);
    const first = ((wb.worksheets[0]?.getRow(1).values ?? []) as unknown[]).slice(1);
    expect(first).toContain('Fouling cost EUR/day');
    expect(first).toContain('Backpressure kPa(a)');
  });
});

describe('the monthly breakdown export', () => {
  it('for a person who works in US units: pressures in inHg, costs with the currency', async () => {
    const { header, rows } = await csvOf(usPerson, 'breakdown');
    expect(header).toEqual([
      'Month',
      'CW inlet temperature inHg',
      'CW flow inHg',
      'Load and duty inHg',
      'Plugged tubes inHg',
      'Fouling inHg',
      'Unexplained inHg',
      'Excess backpressure inHg',
      'Fouling cost USD',
      'Unexplained cost USD',
    ]);
    expect(Number(rows[0]?.[header.indexOf('Load and duty inHg')])).toBeCloseTo(kpaToInHg(DAY.loadKpa), 9);
  });
});
