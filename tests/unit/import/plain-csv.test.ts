/**
 * A plain CSV file (no quotes; LF or CR LF line ends throughout) is read by splitting lines and cells instead of the
 * CSV parser: every row, cell and line number must be the same as the parser's, and a line too long is refused by
 * the same words. Files with quotes or mixed line ends still go to the parser.
 */
import { writeFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openCsvTable, plainLineEnds } from '@backend/import/read-csv.js';
import { makeTempDir } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
let n = 0;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

async function rowsOf(file: string, plainSplit: boolean) {
  const table = await openCsvTable(file, { plainSplit, maxLineChars: 200 });
  const rows: { line: number; cells: string[] }[] = [];
  for await (const chunk of table.chunks) rows.push(...chunk);
  return { headers: table.headers, titleLines: table.titleLines, units: table.units, rows };
}

async function write(content: string | Buffer): Promise<string> {
  const f = tmp.file(`f${++n}.csv`);
  await writeFile(f, content);
  return f;
}

const body = (eol: string) =>
  [
    'Export of unit 1',
    '',
    'Time;Load;BP',
    ';MW;inHgA',
    '2025-03-01T00:00:00Z;480.5;2.01',
    '',
    '2025-03-01T01:00:00Z;;2.02',
    '2025-03-01T02:00:00Z;Bad;2.03;extra',
    '2025-03-01T03:00:00Z;481,5;2.04',
    ...Array.from({ length: 5000 }, (_, k) => `2025-03-02T00:00:00Z;${k};${k / 7}`),
  ].join(eol);

describe('a plain CSV file', () => {
  it.each([
    ['LF, final line end', body('\n') + '\n'],
    ['CR LF, no final line end', body('\r\n')],
    ['LF with a BOM', '\uFEFF' + body('\n')],
    ['CR LF with a BOM and blank lines at the end', '\uFEFF' + body('\r\n') + '\r\n\r\n'],
  ])('%s: reads the same rows, cells and lines as the CSV parser', async (_name, text) => {
    const f = await write(text);
    expect(await plainLineEnds(f)).not.toBeNull();
    const plain = await rowsOf(f, true);
    expect(plain.rows.length).toBe(5004);
    expect(plain).toEqual(await rowsOf(f, false));
  });

  it('reads Windows Latin-1 text the same as the parser', async () => {
    const f = await write(Buffer.from(body('\r\n').replace('Load', 'Lüfter'), 'latin1'));
    const plain = await rowsOf(f, true);
    expect(plain.headers[1]).toBe('Lüfter (MW)');
    expect(plain).toEqual(await rowsOf(f, false));
  });

  it('refuses a line too long with the parser’s words and line', async () => {
    const f = await write(body('\n').replace('2025-03-01T01:00:00Z;;2.02', `2025-03-01T01:00:00Z;${'9'.repeat(300)};2.02`));
    const fail = async (plainSplit: boolean) =>
      (await rowsOf(f, plainSplit).then(
        () => null,
        (e: Error) => e.message,
      )) ?? 'no error';
    expect(await fail(true)).toBe('line 7 is longer than 200 characters: is this the right file and delimiter?');
    expect(await fail(true)).toBe(await fail(false));
  });

  it('is not plain with a quote anywhere, mixed line ends or a lone CR', async () => {
    expect(await plainLineEnds(await write('a,b\n"1",2\n'))).toBeNull();
    expect(await plainLineEnds(await write('a,b\r\n1,2\n'))).toBeNull();
    expect(await plainLineEnds(await write('a,b\r1,2\r'))).toBeNull();
    expect(await plainLineEnds(await write('a,b\n1\r,2\n'))).toBeNull();
    expect(await plainLineEnds(await write('a,b\r\n1,2\r\n'))).toBe('crlf');
    expect(await plainLineEnds(await write('a,b\n1,2'))).toBe('lf');
  });
});
