/** Files of averages over an interval: the interval is read from the header when stated, and the steadiness rule uses it. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importSamples, type ImportSample } from '@backend/import/parse-rows.js';
import { averagingFromText } from '@backend/import/tall-detection.js';
import { US_HEADER, US_MAPPING, makeTempDir, usRow, writeCsv } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

describe('an averaging interval', () => {
  it('is read from a title line or a header when one states it', () => {
    expect(averagingFromText(['Export of unit 2', 'Hourly averages, interval 1 h'])).toBe(60);
    expect(averagingFromText(['Gross MW (avg 15 min)'])).toBe(15);
    expect(averagingFromText(['Interval,1 minute'])).toBeUndefined(); // an interval of readings, not of averages
    expect(averagingFromText(['Mean of 0.5 min'])).toBeUndefined();
  });

  it('widens the steadiness window to the neighbouring intervals and is recorded as an assumption', async () => {
    // hourly rows at 480 MW, one hour at 400 MW: a change of 80 MW > 2 % of 600 MW between neighbouring hours
    const loads = [480, 480, 480, 400, 480, 480];
    const f = await writeCsv(tmp.file('hourly.csv'), [US_HEADER, ...loads.map((l, h) => usRow(h * 60, l))]);
    const run = async (mapping: unknown) => {
      const out: ImportSample[] = [];
      const summary = await importSamples(f, { mapping, fileOrder: 'ascending', steadiness: { ratingMw: 600 }, onBatch: (b) => void out.push(...b) });
      return { validity: out.map((s) => s.validity), assumptions: summary.assumptions };
    };
    // read as instantaneous values, no neighbour lies within ±30 min: every hour counts as steady
    expect((await run(US_MAPPING)).validity).toEqual(['ok', 'ok', 'ok', 'ok', 'ok', 'ok']);
    const averaged = await run({ ...US_MAPPING, averagingMinutes: 60 });
    expect(averaged.validity).toEqual(['ok', 'ok', 'unsteady-load', 'unsteady-load', 'unsteady-load', 'ok']);
    expect(averaged.assumptions).toContain("values are averages over 60 min: the load's steadiness is judged within ±60 min (the neighbouring intervals)");
  });
});
