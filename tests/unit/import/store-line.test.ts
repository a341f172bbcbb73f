/** The line the import's bulk load sends for one sample (LOAD DATA's tab-separated text with `\N` for NULL). */
import { describe, expect, it } from 'vitest';
import type { ImportSample } from '@backend/import/index.js';
import { LOADED_COLUMNS, sampleLine } from '@backend/repositories/sample-bulk-load.repository.js';

const owner = { unitId: '11111111-1111-4111-8111-111111111111', importId: '22222222-2222-4222-8222-222222222222', setupVersion: 3 };
const sample = (timestampUtc: number, extra: Partial<ImportSample> = {}): ImportSample => ({
  line: 2,
  timestampUtc,
  loadMw: 480.5,
  backpressureKpa: 8.1,
  cwInletC: 21.3,
  cwOutletC: 31.2,
  cwFlowM3s: 15.2,
  flowAssumed: false,
  validity: 'ok',
  ...extra,
});
const fields = (line: string) => line.replace(/\n$/, '').split('\t');

describe('a bulk-loaded sample line', () => {
  it('carries the UTC time with milliseconds for times across days, years and before 1970, in any order', () => {
    const times = [
      Date.UTC(2024, 1, 29, 23, 59, 59, 999),
      Date.UTC(2024, 2, 1),
      Date.UTC(1969, 11, 31, 23, 0, 0, 5),
      Date.UTC(2024, 2, 1, 0, 0, 0, 50),
      Date.UTC(2000, 0, 1, 12, 34, 56, 500),
      Date.UTC(2024, 1, 29, 0, 1),
    ];
    for (const ts of times) expect(fields(sampleLine(owner, sample(ts)))[2]).toBe(new Date(ts).toISOString().replace('T', ' ').replace('Z', ''));
  });

  it('has one field per loaded column, NULL markers for absent readings, and escapes tabs and newlines in text', () => {
    const f = fields(sampleLine(owner, sample(0, { flowAssumed: true, hotwellC: 40.5, validity: 'a\tb\\c\nd' as ImportSample['validity'] })));
    expect(f).toHaveLength(LOADED_COLUMNS.length);
    const byColumn = Object.fromEntries(LOADED_COLUMNS.map((c, i) => [c, f[i]]));
    expect(byColumn).toMatchObject({
      unitId: owner.unitId,
      importId: owner.importId,
      flowAssumed: '1',
      hotwellC: '40.5',
      dissolvedOxygenPpb: '\\N',
      condensateFlowKgS: '\\N',
      validity: 'a\\tb\\\\c\\nd',
      setupVersion: '3',
    });
  });

  it('writes each double in the shortest form that reads back as the same number', () => {
    const f = fields(sampleLine(owner, sample(0, { loadMw: 0.1 + 0.2, backpressureKpa: 1e-7, cwInletC: -123456.78901234567 })));
    expect([Number(f[3]), Number(f[4]), Number(f[5])]).toEqual([0.1 + 0.2, 1e-7, -123456.78901234567]);
  });
});
