/**
 * One file per tag: each file's tag is found (value header, a "Tag,NAME" title line, the file's name, or a tall
 * file of one tag); a file that is no tag series, of several tags, or a tag in two files is refused at the upload;
 * the check refuses a tag in two files and a file whose times do not overlap the others' with nothing written.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeTagFile, surveyTagFiles, TAG_FILES_MANIFEST, TagFilesRefusal } from '@backend/import/per-tag-files.js';
import { checkAnyShape } from '@backend/import/prepare-file.js';
import { openTable } from '@backend/import/open-table.js';
import { makeTempDir } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
let n = 0;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

const TAGS = ['U9.GEN.MW', 'U9.COND.BPA', 'U9.CW.TIN', 'U9.CW.TOUT', 'U9.CW.FLOW'];
const VALUES = [480, 2.1, 75, 92, 180000];
const hour = (h: number, offsetS = 0) => new Date(Date.UTC(2025, 5, 1, h) + offsetS * 1000).toISOString();

/** Writes files (name → lines) into a fresh upload folder as 1.upload, 2.upload, … and surveys them. */
async function folderOf(files: [name: string, lines: string[]][]) {
  const folder = tmp.file(`upload-${++n}`);
  await mkdir(folder);
  const stored: { name: string; path: string; bytes: number }[] = [];
  for (const [k, [name, lines]] of files.entries()) {
    const p = path.join(folder, `${k + 1}.upload`);
    await writeFile(p, lines.join('\r\n') + '\r\n');
    stored.push({ name, path: p, bytes: 1 });
  }
  return { folder, survey: () => surveyTagFiles(folder, stored) };
}

const fileOf = (k: number, hours: number[], offsetS = 0) =>
  [`${TAGS[k]}.csv`, [`Tag,${TAGS[k]}`, 'Timestamp,Value', ...hours.map((h) => `${hour(h, offsetS)},${VALUES[k]}`)]] as [string, string[]];

const mapping = {
  timestamp: { column: 'Timestamp', format: 'iso-8601-offset' },
  columns: {
    grossLoad: { column: TAGS[0], unit: 'MW' },
    backpressure: { column: TAGS[1], unit: 'inHg' },
    cwInletTemperature: { column: TAGS[2], unit: 'degF' },
    cwOutletTemperature: { column: TAGS[3], unit: 'degF' },
    cwFlow: { column: TAGS[4], unit: 'gpm' },
  },
  tall: { tagColumn: 'Tag', valueColumn: 'Value', gridMinutes: 60, rule: 'nearest', toleranceMinutes: 5 },
};

describe('the tag of one file', () => {
  it('reads a "Tag,NAME" line above the header as a title line, not as the header', async () => {
    const { folder } = await folderOf([fileOf(0, [0, 1])]);
    const table = await openTable(path.join(folder, '1.upload'));
    await table.close();
    expect(table.headers).toEqual(['Timestamp', 'Value']);
    expect(table.titleLines).toEqual([`Tag ${TAGS[0]}`]);
    expect(describeTagFile('x.csv', table)).toMatchObject({ tag: TAGS[0], timeColumn: 'Timestamp', valueColumn: 'Value', tagColumn: null });
  });

  it('takes the tag from the value header, else the file name; a tall file of one tag names it in its tag column', () => {
    const rows = [['2025-06-01T00:00:00Z', '480']];
    expect(describeTagFile('a.csv', { headers: ['Time', 'U2_GROSS_MW'], titleLines: [], sampleRows: rows }).tag).toBe('U2_GROSS_MW');
    expect(describeTagFile('U2.CWIT.csv', { headers: ['Time', 'Value'], titleLines: [], sampleRows: rows }).tag).toBe('U2.CWIT');
    const tall = describeTagFile('t.csv', {
      headers: ['Tag', 'Timestamp', 'Value', 'Quality'],
      titleLines: [],
      sampleRows: [['U2.BP', '2025-06-01T00:00:00Z', '2.1', 'Good']],
    });
    expect(tall).toEqual({ tag: 'U2.BP', timeColumn: 'Timestamp', valueColumn: 'Value', qualityColumn: 'Quality', tagColumn: 'Tag' });
  });

  it('refuses a file that is no tag series: several value columns, no times, no numbers', () => {
    const wide = { headers: ['Timestamp', 'Gross MW', 'BP'], titleLines: [], sampleRows: [['2025-06-01T00:00:00Z', '480', '2.1']] };
    expect(() => describeTagFile('wide.csv', wide)).toThrow(
      '"wide.csv" is not the series of one tag (a time column and one value column): it has 3 columns (Timestamp, Gross MW, BP); import a file of several columns on its own',
    );
    expect(() => describeTagFile('n.csv', { headers: ['A', 'B'], titleLines: [], sampleRows: [['1', '2']] })).toThrow(/no column of times was found/);
    expect(() => describeTagFile('w.csv', { headers: ['Time', 'Note'], titleLines: [], sampleRows: [['2025-06-01T00:00:00Z', 'hello']] })).toThrow(
      /its "Note" column holds no numbers/,
    );
  });
});

describe('a set of one-tag files', () => {
  it('is surveyed into a manifest: tag, rows, first and last time per file', async () => {
    const { folder, survey } = await folderOf([fileOf(0, [0, 1, 2]), fileOf(1, [0, 1, 2], 20)]);
    const entries = await survey();
    expect(entries.map((e) => [e.file, e.name, e.tag, e.rows, e.firstTime, e.lastTime])).toEqual([
      ['1.upload', `${TAGS[0]}.csv`, TAGS[0], 3, hour(0), hour(2)],
      ['2.upload', `${TAGS[1]}.csv`, TAGS[1], 3, hour(0, 20), hour(2, 20)],
    ]);
    expect(path.join(folder, TAG_FILES_MANIFEST)).toBeTruthy();
  });

  it('refuses at the survey a tag in two files and a file of two tags', async () => {
    const twice = await folderOf([fileOf(0, [0, 1]), ['copy.csv', fileOf(0, [0, 1])[1]]]);
    await expect(twice.survey()).rejects.toThrow(
      new TagFilesRefusal(`Tag "${TAGS[0]}" is in two files, "${TAGS[0]}.csv" and "copy.csv": upload each tag once`),
    );
    const two = await folderOf([['two.csv', ['Tag,Timestamp,Value', `A,${hour(0)},1`, `B,${hour(0)},2`]]]);
    await expect(two.survey()).rejects.toThrow('"two.csv" holds more than one tag ("A", "B"): upload a file of several tags on its own');
  });

  it('is checked as a tall file: offset times align on the grid', async () => {
    const hours = [0, 1, 2, 3];
    const { folder, survey } = await folderOf(TAGS.map((_, k) => fileOf(k, hours, k * 17 - 30)));
    await survey();
    const { check, prepared } = await checkAnyShape(folder, { mapping });
    expect(check.errors).toEqual([]);
    expect(check.ok).toBe(true);
    expect(check.dataRows).toBe(4);
    expect(prepared!.alignment).toMatchObject({ gridTimes: 4, aligned: 4, samplesByTag: Object.fromEntries(TAGS.map((t) => [t, 4])) });
    await prepared!.dispose();
  });

  it('refuses before writing anything a file whose times do not overlap the others', async () => {
    const files = TAGS.map((_, k) => fileOf(k, k === 3 ? [30, 31, 32] : [0, 1, 2]));
    const { folder, survey } = await folderOf(files);
    await survey();
    const { check, prepared } = await checkAnyShape(folder, { mapping });
    expect(prepared).toBeNull();
    expect(check.ok).toBe(false);
    expect(check.errors).toContainEqual({
      row: 0,
      column: '',
      value: TAGS[3],
      message: `the times of "${TAGS[3]}.csv" (2025-06-02T06:00:00Z to 2025-06-02T08:00:00Z) do not overlap those of "${TAGS[0]}.csv" (2025-06-01T00:00:00Z to 2025-06-01T02:00:00Z): upload files of the same period`,
    });
  });

  it('lists a wrong cell by the file name and its line, and writes nothing', async () => {
    const files = TAGS.map((_, k) => fileOf(k, [0, 1, 2]));
    files[2]![1][3] = `${hour(1)},7..5`;
    const { folder, survey } = await folderOf(files);
    await survey();
    const { check, prepared } = await checkAnyShape(folder, { mapping });
    expect(prepared).toBeNull();
    expect(check.errors).toEqual([{ row: 4, column: `${TAGS[2]}.csv: Value`, value: '7..5', message: 'not a number' }]);
  });

  it('refuses a wide mapping of a folder of tag files', async () => {
    const { folder, survey } = await folderOf(TAGS.map((_, k) => fileOf(k, [0, 1])));
    await survey();
    const { tall: _tall, ...wide } = mapping;
    const { check } = await checkAnyShape(folder, { mapping: wide });
    expect(check.fileError?.message).toMatch(/map the tags/);
  });
});

describe('an upload that is gone', () => {
  it('is told by the reader in our words, whatever the mapping', async () => {
    const gone = tmp.file('never-written.csv');
    const { check } = await checkAnyShape(gone, { mapping });
    expect(check.fileError?.code).toBe('unreadable-file');
    expect(check.fileError?.message).not.toMatch(/ENOENT|\//);
  });
});
