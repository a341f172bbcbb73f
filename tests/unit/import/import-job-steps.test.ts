/**
 * The pure parts of the import job's steps (backend/src/services/import-job): check → store → queue the
 * recompute. The steps' database work (clearing an earlier run, storing under the import id, the failure
 * cleanup, queuing the recompute) is covered through the API by tests/api/imports.test.ts and job-queue.test.ts.
 */
import { describe, expect, it } from 'vitest';
import type { ImportCheck, ImportSample } from '@backend/import/index.js';
import { rejection } from '@backend/services/import-job/check-file.js';
import { sortAgainstStored } from '@backend/services/import-job/store-rows.js';
import { completion } from '@backend/services/import-job/queue-recompute.js';

const T0 = Date.UTC(2025, 0, 1, 0, 0);
const HOUR = 3_600_000;

function sample(i: number, o: Partial<ImportSample> = {}): ImportSample {
  return {
    line: i + 2,
    timestampUtc: T0 + i * HOUR,
    loadMw: 300,
    backpressureKpa: 7,
    cwInletC: 20,
    cwOutletC: 29,
    cwFlowM3s: 14,
    flowAssumed: false,
    validity: 'ok',
    ...o,
  };
}
const storedAs = (s: ImportSample, o: Partial<{ backpressureKpa: number }> = {}) => ({
  ts: new Date(s.timestampUtc),
  loadMw: s.loadMw,
  backpressureKpa: s.backpressureKpa,
  cwInletC: s.cwInletC,
  cwOutletC: s.cwOutletC,
  cwFlowM3s: s.cwFlowM3s,
  ...o,
});

const check = (o: Partial<ImportCheck> = {}): ImportCheck => ({
  ok: false,
  headers: [],
  errors: [],
  errorsNotListed: 0,
  dataRows: 10,
  duplicateTimestamps: 0,
  firstTimestampUtc: null,
  lastTimestampUtc: null,
  order: 'ascending',
  assumptions: ['design flow used'],
  warnings: [],
  ...o,
});

describe('storing a batch against the rows already stored', () => {
  it('stores new times, skips identical re-imports and holds back rows whose stored values differ', () => {
    const batch = [sample(0), sample(1), sample(2)];
    const sorted = sortAgainstStored(batch, [storedAs(batch[1]!), storedAs(batch[2]!, { backpressureKpa: 8.5 })]);
    expect(sorted.fresh).toEqual([batch[0]]);
    expect(sorted.skippedIdentical).toBe(1);
    expect(sorted.conflicting).toEqual([batch[2]]);
  });

  it('counts a value differing only by rounding noise as identical', () => {
    const s = sample(0, { backpressureKpa: 7.000000000001 });
    expect(sortAgainstStored([s], [storedAs(sample(0))]).skippedIdentical).toBe(1);
  });
});

describe('a rejected file', () => {
  it('lists every row error and counts those not listed too', () => {
    const errors = [{ row: 3, column: 'Backpressure', value: 'x', message: 'not a number' }];
    const r = rejection(check({ errors, errorsNotListed: 4 }));
    expect(r).toMatchObject({ status: 'rejected', errors, errorCount: 5, progress: 1, storedPath: null, counts: { rowsRead: 10 } });
    expect(r.message).toBe('The file was not imported: 5 problems to fix');
  });

  it('reports a file-level error as one error with its line', () => {
    const r = rejection(check({ fileError: { code: 'no-data-rows', message: 'The file has no data rows', line: 1 } }));
    expect(r).toMatchObject({
      errorCount: 1,
      message: 'The file has no data rows',
      errors: [{ row: 1, column: '', value: '', message: 'The file has no data rows' }],
    });
  });
});

describe('a completed import', () => {
  it('records the stored, skipped and conflicting counts with the file’s time span', () => {
    const summary = {
      rowsRead: 10,
      rowsOk: 9,
      rowsByReason: { 'low-load': 1 },
      firstTimestampUtc: T0,
      lastTimestampUtc: T0 + 9 * HOUR,
      duplicateTimestamps: 0,
      flowAssumedRows: 0,
      sortedOnTheWay: false,
      assumptions: ['a'],
    } as never;
    const r = completion(
      { summary, stored: 7, skippedIdentical: 2, conflicting: 1, conflicts: [{ timestampUtc: new Date(T0).toISOString() }] },
      check({ warnings: ['w'] }),
    );
    expect(r).toMatchObject({ status: 'complete', progress: 1, message: null, storedPath: null, notes: { assumptions: ['a'], warnings: ['w'] } });
    expect(r.counts).toMatchObject({ rowsRead: 10, stored: 7, skippedIdentical: 2, conflicting: 1, rowsOk: 9 });
    expect(r.firstTimestamp).toEqual(new Date(T0));
    expect(r.lastTimestamp).toEqual(new Date(T0 + 9 * HOUR));
  });
});
