/**
 * A file that cannot be read is described in the product's words: what is wrong with the file and what to do,
 * never the text of the ZIP, XML or CSV library underneath.
 */
import { readFile, writeFile } from 'node:fs/promises';
import JSZip from 'jszip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ImportFileError } from '@backend/import/import-errors.js';
import { openTable } from '@backend/import/open-table.js';
import { makeTempDir, writeXlsx } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
let good: Buffer;
beforeAll(async () => {
  tmp = await makeTempDir();
  good = await readFile(
    await writeXlsx(tmp.file('good.xlsx'), [
      ['Timestamp', 'Gross MW'],
      [45292, 480],
      [45293, 481],
    ]),
  );
});
afterAll(async () => tmp.cleanup());

/** Words that only a library would write. */
const LIBRARY_TEXT = /Cannot read|undefined|FILE_ENDED|invalid distance|disallowed character|\d+:\d+:|Quote Not Closed|Error:|errno|ENOENT/i;

async function fileErrorOf(name: string, bytes: Buffer): Promise<ImportFileError> {
  const f = tmp.file(name);
  await writeFile(f, bytes);
  try {
    const table = await openTable(f);
    for await (const rows of table.rows) void rows;
  } catch (e) {
    expect(e).toBeInstanceOf(ImportFileError);
    return e as ImportFileError;
  }
  throw new Error(`${name}: expected a file-level error`);
}

async function rezip(edit: (zip: JSZip) => void): Promise<Buffer> {
  const zip = await JSZip.loadAsync(good);
  edit(zip);
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
}

describe('a workbook that cannot be read', () => {
  it.each([
    ['cut short half-way', () => good.subarray(0, Math.floor(good.length / 2))],
    ['cut short after its first bytes', () => good.subarray(0, 100)],
    [
      'damaged inside its compressed data',
      () => {
        const b = Buffer.from(good);
        for (let i = 200; i < b.length - 200; i += 7) b[i]! ^= 0x55;
        return b;
      },
    ],
    ['a ZIP signature followed by garbage', () => Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(2000, 0x41)])],
  ])('%s: "not a readable XLSX workbook", without library text', async (label, bytes) => {
    const e = await fileErrorOf(`${label.replace(/\W+/g, '-')}.xlsx`, bytes());
    expect(e.code).toBe('not-xlsx');
    expect(e.message).toMatch(/not a readable XLSX workbook/);
    expect(e.message).not.toMatch(LIBRARY_TEXT);
  });

  it('a ZIP without the workbook part is not a readable workbook (not a library message about "sheets")', async () => {
    const e = await fileErrorOf('no-workbook.xlsx', await rezip((z) => z.remove('xl/workbook.xml')));
    expect(e.code).toBe('not-xlsx');
    expect(e.message).not.toMatch(LIBRARY_TEXT);
  });

  it('a workbook whose XML is broken is not a readable workbook', async () => {
    const e = await fileErrorOf('bad-xml.xlsx', await rezip((z) => z.file('xl/workbook.xml', 'garbage<<')));
    expect(e.message).toMatch(/not a readable XLSX workbook/);
    expect(e.message).not.toMatch(LIBRARY_TEXT);
  });

  it('a ZIP archive holding no worksheet at all says so (not "the first worksheet is empty")', async () => {
    const zip = new JSZip();
    zip.file('notes.txt', 'Timestamp,Gross MW\n1,2\n');
    const e = await fileErrorOf('plain.zip.xlsx', await zip.generateAsync({ type: 'nodebuffer' }));
    expect(e.code).toBe('not-xlsx');
    expect(e.message).toMatch(/no worksheet/);
  });
});

describe('a file named .csv that is not text', () => {
  it('binary data: "not CSV text", without library text', async () => {
    const bytes = Buffer.alloc(4096);
    let x = 7;
    for (let i = 0; i < bytes.length; i++) bytes[i] = x = (x * 1103515245 + 12345) & 0xff;
    const e = await fileErrorOf('binary.csv', bytes);
    expect(e.code).toBe('not-text');
    expect(e.message).not.toMatch(LIBRARY_TEXT);
  });

  it('a quoted cell that never closes names the line in our words', async () => {
    const e = await fileErrorOf('open-quote.csv', Buffer.from('Timestamp,Gross MW\n2024-01-01T00:00Z,"480\n2024-01-01T00:01Z,481\n'));
    expect(e.code).toBe('malformed-csv');
    expect(e.message).toMatch(/quote/);
    expect(e.message).toMatch(/line 2/);
    expect(e.message).not.toMatch(LIBRARY_TEXT);
  });
});
