/**
 * A ZIP of one-tag files is unpacked into numbered files, never by its entries' names, and every archive a
 * hostile sender can build is refused in our words: bombs (by the directory and while inflating), lying sizes,
 * shared bytes, `../` names, nested archives, encryption, too many files, empty files.
 */
import { readdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readZipDirectory, unzipTagFiles, ZipRefusal } from '@backend/import/zip-upload.js';
import { buildZip, type ZipPart } from '../../helpers/zip-builder.js';
import { makeTempDir } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
let n = 0;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

const CSV = 'Timestamp,Value\r\n2025-03-01T00:00:00Z,1.5\r\n2025-03-01T01:00:00Z,1.6\r\n';

async function unzip(parts: ZipPart[], limits?: { maxBytes: number; maxFiles: number }, shared = false) {
  const zip = tmp.file(`a${++n}.zip`);
  await writeFile(zip, buildZip(parts, { shareFirstEntryData: shared }));
  const folder = tmp.file(`out${n}`);
  await (await import('node:fs/promises')).mkdir(folder);
  return { files: await unzipTagFiles(zip, folder, limits), folder };
}

async function refusal(parts: ZipPart[], limits?: { maxBytes: number; maxFiles: number }, shared = false): Promise<ZipRefusal> {
  const err = await unzip(parts, limits, shared).then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(ZipRefusal);
  return err as ZipRefusal;
}

describe('a ZIP of one-tag files', () => {
  it('unpacks stored and deflated files as numbered files, passing over folders and system files', async () => {
    const { files, folder } = await unzip([
      { name: 'export/', data: '', method: 0 },
      { name: 'export/U1.GEN.MW.csv', data: CSV },
      { name: 'export/U1.CW.TIN.csv', data: CSV, method: 0 },
      { name: '__MACOSX/export/._U1.GEN.MW.csv', data: 'x' },
      { name: 'export/.DS_Store', data: 'x' },
    ]);
    expect(files.map((f) => [f.name, path.basename(f.path), f.bytes])).toEqual([
      ['U1.GEN.MW.csv', '1.upload', CSV.length],
      ['U1.CW.TIN.csv', '2.upload', CSV.length],
    ]);
    expect(await readFile(files[0]!.path, 'utf8')).toBe(CSV);
    expect((await readdir(folder)).sort()).toEqual(['1.upload', '2.upload']);
  });

  it('never writes where an entry name points: `../` and absolute names become numbered files in the folder', async () => {
    const { files, folder } = await unzip([
      { name: '../../escaped.csv', data: CSV },
      { name: '/etc/cron.d/evil.csv', data: CSV },
    ]);
    expect(files.map((f) => f.name)).toEqual(['escaped.csv', 'evil.csv']);
    expect(files.every((f) => path.dirname(f.path) === folder)).toBe(true);
    expect(await readdir(tmp.dir)).not.toContain('escaped.csv');
  });

  it('refuses a bomb by the sizes its directory states, before inflating anything', async () => {
    const err = await refusal([{ name: 'big.csv', data: Buffer.alloc(3 * 1024 * 1024, 0x30) }], { maxBytes: 1024 * 1024, maxFiles: 20 });
    expect(err.status).toBe(413);
    expect(err.message).toMatch(/come to 3 MB unpacked; at most 1 MB/);
  });

  it('stops a bomb whose directory understates its size while inflating it', async () => {
    const err = await refusal([{ name: 'liar.csv', data: Buffer.alloc(3 * 1024 * 1024, 0x30), statedBytes: 100 }], { maxBytes: 1024 * 1024, maxFiles: 20 });
    expect(err.message).toBe('"liar.csv" in the ZIP holds more than its stated size: the ZIP is malformed');
  });

  it('refuses files that are each small but together pass the limit', async () => {
    const big = Buffer.alloc(400 * 1024, 0x31);
    const parts = [1, 2, 3].map((k) => ({ name: `t${k}.csv`, data: big, statedBytes: big.length }));
    expect((await refusal(parts, { maxBytes: 1024 * 1024, maxFiles: 20 })).status).toBe(413);
  });

  it('refuses entries that share the same bytes', async () => {
    const err = await refusal(
      [
        { name: 'a.csv', data: CSV },
        { name: 'b.csv', data: CSV },
      ],
      undefined,
      true,
    );
    expect(err.message).toMatch(/two files share the same bytes/);
  });

  it('refuses a ZIP or workbook inside the ZIP, by name and by content', async () => {
    expect((await refusal([{ name: 'inner.zip', data: 'PK' }])).message).toBe('"inner.zip" is an archive or workbook inside the ZIP: put CSV files in the ZIP');
    const inner = buildZip([{ name: 'x.csv', data: CSV }]);
    expect((await refusal([{ name: 'looks-like.csv', data: inner }])).message).toBe(
      '"looks-like.csv" is an archive or workbook inside the ZIP: put CSV files in the ZIP',
    );
  });

  it('refuses encrypted entries, empty files, too many files and an empty ZIP', async () => {
    expect((await refusal([{ name: 'secret.csv', data: CSV, flags: 1 }])).message).toMatch(/encrypted/);
    expect((await refusal([{ name: 'empty.csv', data: '' }])).message).toBe('"empty.csv" in the ZIP is empty (0 bytes)');
    const many = Array.from({ length: 21 }, (_, k) => ({ name: `t${k}.csv`, data: CSV }));
    expect((await refusal(many)).message).toBe('The ZIP holds 21 files; at most 20 are imported together');
    expect((await refusal([{ name: 'only/', data: '', method: 0 }])).message).toBe('The ZIP holds no files: put the files of one tag each in it');
  });

  it('refuses a damaged ZIP: no directory, or a check sum that does not match', async () => {
    const zip = tmp.file('cut.zip');
    await writeFile(zip, buildZip([{ name: 'a.csv', data: CSV }]).subarray(0, 40));
    await expect(readZipDirectory(zip)).rejects.toThrow('The ZIP file is damaged (its table of contents is missing): make the ZIP again');
    const bytes = buildZip([{ name: 'a.csv', data: CSV, method: 0 }]);
    const at = 30 + 'a.csv'.length + 20;
    bytes[at] = bytes[at]! ^ 0x01; // one stored byte changed
    const bad = tmp.file('crc.zip');
    await writeFile(bad, bytes);
    const folder = tmp.file('crc-out');
    await (await import('node:fs/promises')).mkdir(folder);
    await expect(unzipTagFiles(bad, folder)).rejects.toThrow('"a.csv" in the ZIP is damaged (its check sum does not match): make the ZIP again');
  });
});
