/**
 * Historian status words and quality flags in a file: a marked value is a missing reading kept as
 * `instrument-status` (before the steadiness and load reasons), counted per word; any other text in a number
 * cell is still a file error listed by row and column.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkImportFile, importSamples, type ImportSample } from '@backend/import/parse-rows.js';
import { DEFAULT_STATUS_WORDS, statusWordsBody } from '@shared/schemas/historian-status.js';
import { US_HEADER, US_MAPPING, makeTempDir, usRow, writeCsv } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

async function importAll(file: string, options: { mapping: unknown; statusWords?: string[]; ratingMw?: number }) {
  const samples: ImportSample[] = [];
  const summary = await importSamples(file, {
    mapping: options.mapping,
    statusWords: options.statusWords,
    fileOrder: 'ascending',
    steadiness: { ratingMw: options.ratingMw },
    onBatch: (b) => void samples.push(...b),
  });
  return { samples, summary };
}

describe('status words in number cells', () => {
  it('keeps a row with a default status word (any case, spaces trimmed) in a required or optional column as instrument-status', async () => {
    const f = await writeCsv(tmp.file('words.csv'), [
      `${US_HEADER},Hotwell °F`,
      `${usRow(0)},100`,
      `${usRow(1, 480, { bp: ' bad quality ' })},100`,
      `${usRow(2, 480, { t1: 'NO DATA' })},100`,
      `${usRow(3)},Timeout`,
      `${usRow(4, 480, { flow: 'Bad', t2: '' })},100`,
      `${usRow(5)},100`,
    ]);
    const mapping = { ...US_MAPPING, columns: { ...US_MAPPING.columns, hotwellTemperature: { column: 'Hotwell °F', unit: 'degF' } } };
    const check = await checkImportFile(f, { mapping });
    expect(check.errors).toEqual([]);
    expect(check.ok).toBe(true);
    const { samples, summary } = await importAll(f, { mapping });
    expect(samples.map((s) => s.validity)).toEqual(['ok', 'instrument-status', 'instrument-status', 'instrument-status', 'instrument-status', 'ok']);
    expect(samples[1]!.backpressureKpa).toBeNaN();
    expect(samples[2]!.cwInletC).toBeNaN();
    expect(samples[3]!.hotwellC).toBeUndefined();
    expect(summary.rowsByReason).toEqual({ 'instrument-status': 4 });
    expect(summary.rowsByMarker).toEqual({ 'Bad Quality': 1, 'No Data': 1, Timeout: 1, Bad: 1 });
    expect(summary.rowsOk).toBe(2);
  });

  it('still refuses a garbled number or a phrase not on the list, by row and column', async () => {
    const f = await writeCsv(tmp.file('garbled.csv'), [
      US_HEADER,
      usRow(0),
      usRow(1, 480, { bp: 'Bad value' }),
      usRow(2, 480, { t1: '7 5' }),
      usRow(3, 480, { flow: 'Badd' }),
    ]);
    const check = await checkImportFile(f, { mapping: US_MAPPING });
    expect(check.ok).toBe(false);
    expect(check.errors.map((e) => [e.row, e.column, e.value, e.message])).toEqual([
      [3, 'BP (inHgA)', 'Bad value', 'not a number'],
      [4, 'CW In Temp °F', '7 5', 'not a number'],
      [5, 'Circ Water Flow gpm', 'Badd', 'not a number'],
    ]);
  });

  it("recognises the organisation's own words besides the defaults", async () => {
    const f = await writeCsv(tmp.file('own.csv'), [US_HEADER, usRow(0), usRow(1, 480, { bp: 'I/O Timeout' }), usRow(2, 480, { t2: 'bad' })]);
    expect((await checkImportFile(f, { mapping: US_MAPPING })).errors.map((e) => e.value)).toEqual(['I/O Timeout']);
    const words = [...DEFAULT_STATUS_WORDS, 'I/O Timeout'];
    expect((await checkImportFile(f, { mapping: US_MAPPING, statusWords: words })).ok).toBe(true);
    const { summary } = await importAll(f, { mapping: US_MAPPING, statusWords: words });
    expect(summary.rowsByMarker).toEqual({ 'I/O Timeout': 1, Bad: 1 });
  });

  it('puts instrument-status before the load reasons, and a marked row is no neighbour in the steadiness window', async () => {
    // rating 600 MW: 100 MW is low load; the marked row's 100 MW would otherwise make its neighbours unsteady
    const f = await writeCsv(tmp.file('precedence.csv'), [US_HEADER, usRow(0), usRow(10), usRow(20, 100, { bp: 'Shutdown' }), usRow(30), usRow(40)]);
    const { samples, summary } = await importAll(f, { mapping: US_MAPPING, ratingMw: 600 });
    expect(samples.map((s) => s.validity)).toEqual(['ok', 'ok', 'instrument-status', 'ok', 'ok']);
    expect(summary.rowsByReason).toEqual({ 'instrument-status': 1 });
  });
});

describe('a mapped quality column', () => {
  it('keeps rows whose quality is not among the good values as instrument-status, counted per quality value', async () => {
    const f = await writeCsv(tmp.file('quality.csv'), [
      `${US_HEADER},Quality`,
      `${usRow(0)},Good`,
      `${usRow(1)},bad`,
      `${usRow(2)}, good `,
      `${usRow(3, 480, { bp: '' })},Uncertain`,
      `${usRow(4)},`,
    ]);
    const mapping = { ...US_MAPPING, quality: { column: 'Quality', goodValues: ['Good'] } };
    const check = await checkImportFile(f, { mapping });
    expect(check.errors).toEqual([]);
    const { samples, summary } = await importAll(f, { mapping });
    expect(samples.map((s) => s.validity)).toEqual(['ok', 'instrument-status', 'ok', 'instrument-status', 'instrument-status']);
    expect(summary.rowsByMarker).toEqual({ 'quality bad': 1, 'quality Uncertain': 1, 'quality (empty)': 1 });
    expect(check.assumptions.join(' ')).toMatch(/"Quality" is not Good/);
  });

  it('takes numeric quality codes with a chosen good set', async () => {
    const f = await writeCsv(tmp.file('codes.csv'), [`${US_HEADER},Q`, `${usRow(0)},192`, `${usRow(1)},0`, `${usRow(2)},193`, `${usRow(3)},24`]);
    const mapping = { ...US_MAPPING, quality: { column: 'Q', goodValues: ['192', '193'] } };
    const { samples, summary } = await importAll(f, { mapping });
    expect(samples.map((s) => s.validity)).toEqual(['ok', 'instrument-status', 'ok', 'instrument-status']);
    expect(summary.rowsByMarker).toEqual({ 'quality 0': 1, 'quality 24': 1 });
  });

  it('refuses a quality column that the file lacks as a file error', async () => {
    const f = await writeCsv(tmp.file('noq.csv'), [US_HEADER, usRow(0)]);
    const check = await checkImportFile(f, { mapping: { ...US_MAPPING, quality: { column: 'Quality', goodValues: ['Good'] } } });
    expect(check.fileError).toMatchObject({ code: 'column-not-found' });
  });
});

describe("an organisation's own status words", () => {
  it('are bounded: no number, no default twice, no repeat, at most 40 words of 40 characters', () => {
    expect(statusWordsBody.safeParse({ words: ['I/O Timeout', 'Scan Off'] }).success).toBe(true);
    const messages = (words: string[]) => statusWordsBody.safeParse({ words }).error?.issues.map((i) => i.message);
    expect(messages(['12.5'])).toEqual(['a status word cannot be a number: numbers in a cell are readings']);
    expect(messages(['bad'])).toEqual(['"bad" is already a default status word']);
    expect(messages(['Scan Off', 'scan  off'])).toEqual(['"scan  off" is in the list twice']);
    expect(messages(['x'.repeat(41)])).toEqual(['a status word is at most 40 characters']);
    expect(messages(Array.from({ length: 41 }, (_, i) => `w${i}`))).toEqual(['at most 40 words of your own']);
  });
});
