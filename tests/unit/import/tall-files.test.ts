/**
 * Tall historian files (one row per tag per time): the alignment rules against values worked by hand, the same
 * stored samples as the wide file of the same data in either row order, and the all-or-nothing rule.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkAnyShape } from '@backend/import/prepare-file.js';
import { importSamples, type ImportSample } from '@backend/import/parse-rows.js';
import { SeriesCursor, TagSeries, type Aligned, type AlignmentSettings } from '@backend/import/tall-alignment.js';
import { detectTallShape } from '@backend/import/tall-detection.js';
import type { ImportMappingInput } from '@shared/schemas/import-mapping.js';
import { US_HEADER, US_MAPPING, makeTempDir, usRow, writeCsv } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

const MIN = 60_000;
function series(points: [minute: number, value: number, marker?: number][]): TagSeries {
  const s = new TagSeries('T');
  points.forEach(([m, v, mk], i) => s.push(m * MIN, v, mk ?? 0, i + 2));
  return s;
}
function alongGrid(s: TagSeries, settings: AlignmentSettings, minutes: number[]): (number | string | null)[] {
  const cursor = new SeriesCursor(s, settings);
  const out: Aligned = { value: 0, marker: 0, found: false };
  return minutes.map((m) => {
    cursor.at(m * MIN, out);
    return !out.found ? null : out.marker > 0 ? `marker ${out.marker}` : out.value;
  });
}

describe('alignment rules, against values worked by hand', () => {
  // samples at 0, 7, 13 and 20 min of 10, 17, 23 and 30
  const s = () =>
    series([
      [0, 10],
      [7, 17],
      [13, 23],
      [20, 30],
    ]);

  it('nearest: the sample nearest each grid time within the tolerance; a tie takes the earlier', () => {
    // grid 10: at 10 min the samples at 7 and 13 are 3 min either side (tie → 7 min, 17)
    expect(alongGrid(s(), { gridMinutes: 10, rule: 'nearest', toleranceMinutes: 5 }, [0, 10, 20, 30])).toEqual([10, 17, 30, null]);
    expect(alongGrid(s(), { gridMinutes: 10, rule: 'nearest', toleranceMinutes: 2 }, [0, 10, 20])).toEqual([10, null, 30]);
  });

  it('interpolate: a straight line between the samples either side, both within the tolerance', () => {
    // at 10 min: 17 + (23 − 17) × (10 − 7) / (13 − 7) = 20
    expect(alongGrid(s(), { gridMinutes: 10, rule: 'interpolate', toleranceMinutes: 5 }, [0, 10, 20])).toEqual([10, 20, 30]);
    // at 5 min: 10 + (17 − 10) × 5 / 7 = 15 (the sample at 0 is 5 min away: inside a 5-min tolerance)
    expect(alongGrid(s(), { gridMinutes: 5, rule: 'interpolate', toleranceMinutes: 5 }, [5])).toEqual([15]);
    expect(alongGrid(s(), { gridMinutes: 5, rule: 'interpolate', toleranceMinutes: 4 }, [5, 10])).toEqual([null, 20]);
  });

  it('interval-mean: the mean of the samples in the interval ending at the grid time', () => {
    // (0, 10]: 17; (10, 20]: (23 + 30) / 2 = 26.5; (20, 30]: none
    expect(alongGrid(s(), { gridMinutes: 10, rule: 'interval-mean', toleranceMinutes: 0 }, [10, 20, 30])).toEqual([17, 26.5, null]);
    // a 1-h grid over the same samples: (−60, 0] holds the first sample only
    expect(alongGrid(s(), { gridMinutes: 60, rule: 'interval-mean', toleranceMinutes: 0 }, [0, 60])).toEqual([10, (17 + 23 + 30) / 3]);
  });

  it('a marked sample the rule uses makes the value marked', () => {
    const marked = series([
      [0, 10],
      [7, Number.NaN, 1],
      [13, 23],
      [20, 30],
    ]);
    expect(alongGrid(marked, { gridMinutes: 10, rule: 'nearest', toleranceMinutes: 5 }, [0, 10, 20])).toEqual([10, 'marker 1', 30]);
    expect(alongGrid(marked, { gridMinutes: 10, rule: 'interpolate', toleranceMinutes: 5 }, [10])).toEqual(['marker 1']);
    expect(alongGrid(marked, { gridMinutes: 10, rule: 'interval-mean', toleranceMinutes: 0 }, [10, 20])).toEqual(['marker 1', 26.5]);
  });

  it('sorts a series given out of order before aligning', () => {
    const out = series([
      [20, 30],
      [0, 10],
      [13, 23],
      [7, 17],
    ]);
    out.sort();
    expect(Array.from(out.times.subarray(0, 4))).toEqual([0, 7, 13, 20].map((m) => m * MIN));
    expect(alongGrid(out, { gridMinutes: 10, rule: 'interpolate', toleranceMinutes: 5 }, [0, 10, 20])).toEqual([10, 20, 30]);
  });
});

/** US_HEADER rows as a tall file: Tag,Timestamp,Value,Quality (quality "Good"), by time or by tag. */
const TAGS = ['U2.GROSS_MW', 'U2.BP_INHGA', 'U2.CW_IN_F', 'U2.CW_OUT_F', 'U2.CW_FLOW_GPM'];
function tallLines(wideRows: string[], order: 'by-time' | 'by-tag', offsetSeconds: (row: number, tag: number) => number = () => 0): string[] {
  const rows: string[][] = [];
  wideRows.forEach((line, r) => {
    const cells = line.split(',');
    TAGS.forEach((tag, k) => {
      const t = new Date(Date.parse(cells[0]!) + offsetSeconds(r, k) * 1000).toISOString();
      rows.push([tag, t, cells[k + 1]!, 'Good']);
    });
  });
  if (order === 'by-tag') rows.sort((a, b) => TAGS.indexOf(a[0]!) - TAGS.indexOf(b[0]!));
  return ['Tag,Timestamp,Value,Quality', ...rows.map((r) => r.join(','))];
}
const TALL_MAPPING: ImportMappingInput = {
  timestamp: { column: 'Timestamp', format: 'iso-8601-offset' },
  columns: {
    grossLoad: { column: TAGS[0]!, unit: 'MW' },
    backpressure: { column: TAGS[1]!, unit: 'inHg' },
    cwInletTemperature: { column: TAGS[2]!, unit: 'degF' },
    cwOutletTemperature: { column: TAGS[3]!, unit: 'degF' },
    cwFlow: { column: TAGS[4]!, unit: 'gpm' },
  },
  quality: { column: 'Quality', goodValues: ['Good'] },
  tall: { tagColumn: 'Tag', valueColumn: 'Value', gridMinutes: 1, rule: 'nearest', toleranceMinutes: 0.5 },
};

async function storedOf(file: string, mapping: unknown): Promise<Omit<ImportSample, 'line'>[]> {
  const { check, prepared } = await checkAnyShape(file, { mapping });
  expect(check.errors).toEqual([]);
  expect(check.fileError).toBeUndefined();
  const out: ImportSample[] = [];
  try {
    await importSamples(prepared!.path, {
      mapping: prepared!.mapping,
      statusWords: prepared!.statusWords,
      fileOrder: check.order,
      steadiness: { ratingMw: 600 },
      onBatch: (b) => void out.push(...b),
    });
  } finally {
    await prepared!.dispose();
  }
  return out.map(({ line: _line, ...s }) => s);
}

describe('a tall file', () => {
  const wide = Array.from({ length: 90 }, (_, m) => usRow(m, 470 + (m % 7), m === 30 ? { bp: 'Bad' } : {}));

  it('is recognised from its header and first rows', () => {
    const lines = tallLines(wide.slice(0, 3), 'by-time');
    expect(
      detectTallShape(
        lines[0]!.split(','),
        lines.slice(1).map((l) => l.split(',')),
      ),
    ).toEqual({
      timestampColumn: 'Timestamp',
      tagColumn: 'Tag',
      valueColumn: 'Value',
      qualityColumn: 'Quality',
    });
    expect(detectTallShape(US_HEADER.split(','), [usRow(0).split(',')])).toBeNull();
  });

  it('in time order, in tag order, or with timestamps off the grid by seconds, stores the same samples as the wide file', async () => {
    const fromWide = await storedOf(await writeCsv(tmp.file('wide.csv'), [US_HEADER, ...wide]), US_MAPPING);
    expect(fromWide).toHaveLength(90);
    expect(fromWide[30]!.validity).toBe('instrument-status');
    const byTime = await storedOf(await writeCsv(tmp.file('tall-time.csv'), tallLines(wide, 'by-time')), TALL_MAPPING);
    const byTag = await storedOf(await writeCsv(tmp.file('tall-tag.csv'), tallLines(wide, 'by-tag')), TALL_MAPPING);
    const offset = await storedOf(
      await writeCsv(
        tmp.file('tall-offset.csv'),
        tallLines(wide, 'by-tag', (r, k) => ((r * 7 + k * 3) % 21) - 10),
      ),
      TALL_MAPPING,
    );
    expect(byTime).toEqual(fromWide);
    expect(byTag).toEqual(fromWide);
    expect(offset).toEqual(fromWide);
  });

  it('leaves out a grid time without a required tag, counted under that tag, and keeps a quality not good as instrument status', async () => {
    const lines = tallLines(wide.slice(0, 10), 'by-time').filter((l) => !(l.startsWith('U2.CW_IN_F,') && l.includes('T00:04:00')));
    const bad = lines.map((l) => (l.startsWith('U2.CW_FLOW_GPM,') && l.includes('T00:06:00') ? l.replace(/Good$/, 'Suspect') : l));
    const { check, prepared } = await checkAnyShape(await writeCsv(tmp.file('tall-gap.csv'), bad), { mapping: TALL_MAPPING });
    expect(check.ok).toBe(true);
    expect(prepared!.alignment).toMatchObject({ gridTimes: 10, aligned: 9, leftOutByTag: { 'U2.CW_IN_F': 1 } });
    expect(check.assumptions[1]).toBe('1 of 10 grid times left out for want of a value: U2.CW_IN_F 1');
    const out: ImportSample[] = [];
    await importSamples(prepared!.path, { mapping: prepared!.mapping, statusWords: prepared!.statusWords, onBatch: (b) => void out.push(...b) });
    await prepared!.dispose();
    expect(out.map((s) => s.validity)).toEqual(['ok', 'ok', 'ok', 'ok', 'ok', 'instrument-status', 'ok', 'ok', 'ok']);
  });

  it('refuses a truly wrong tall file as a whole, listing each wrong cell by row and column', async () => {
    const lines = tallLines(wide.slice(0, 4), 'by-time');
    lines[3] = lines[3]!.replace(/,[^,]*,Good$/, ',2.0x,Good'); // a garbled number
    lines[7] = lines[7]!.replace(/,20\d\d-[^,]*,/, ',yesterday,'); // a bad time
    lines.push(lines[12]!); // the same tag twice at one time (line 22 repeats line 13)
    const { check, prepared } = await checkAnyShape(await writeCsv(tmp.file('tall-wrong.csv'), lines), { mapping: TALL_MAPPING });
    expect(check.ok).toBe(false);
    expect(prepared).toBeNull();
    expect(check.errors.map((e) => [e.row, e.column, e.message.replace(/:.*/, '')])).toEqual([
      [4, 'Value', 'not a number'],
      [8, 'Timestamp', 'bad timestamp'],
      [22, 'Timestamp', expect.stringMatching(/^tag "U2\.[A-Z_]+" has a second value at the same time as line 13$/)],
    ]);
  });
});
