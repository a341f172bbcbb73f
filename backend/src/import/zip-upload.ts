/**
 * A ZIP of one-tag files, unpacked into numbered files of the upload's folder. A ZIP is hostile until read, so:
 *  - the central directory is read first (never the whole archive into memory): entry count, declared sizes,
 *    encryption, ZIP64 and multi-disk archives are refused before a byte is inflated;
 *  - every entry is inflated as a stream and its bytes counted: more than its declared size (a lying directory),
 *    or more than the total cap, stops it at once;
 *  - an entry's name is never a path: it is shown to the person, and the file written is `<n>.upload`;
 *  - entries that overlap another's bytes (a bomb built of shared data), archives or workbooks inside the ZIP, and
 *    empty files are refused.
 * Any refusal throws a ZipRefusal in our words; the caller removes the folder.
 */
import fs from 'node:fs';
import { open, rm } from 'node:fs/promises';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import path from 'node:path';
import zlib from 'node:zlib';
import { MAX_TAG_FILES } from '@shared/schemas/imports.js';

/** All the files of one ZIP together, inflated (a year of 1-min values of 20 tags is about 350 MB). */
export const MAX_UNZIPPED_BYTES = 512 * 1024 * 1024;
/** Entries read from the directory at most, folders and system files included. */
export const MAX_ZIP_ENTRIES = 200;

export class ZipRefusal extends Error {
  constructor(
    message: string,
    readonly status: 400 | 413 = 400,
  ) {
    super(message);
  }
}

export interface ZipEntry {
  /** As the archive spells it: for display only. */
  name: string;
  method: number;
  flags: number;
  crc: number;
  compressedBytes: number;
  uncompressedBytes: number;
  localHeaderOffset: number;
}

const EOCD = 0x06054b50;
const CENTRAL = 0x02014b50;
const LOCAL = 0x04034b50;

/** The first four bytes of a ZIP (and so of an XLSX workbook). */
export const startsLikeZip = (head: Buffer): boolean => head.length >= 4 && head.readUInt32LE(0) === LOCAL;

/** Whether a ZIP is an XLSX workbook rather than an archive of files: it holds the workbook's parts. */
export const isWorkbook = (entries: readonly ZipEntry[]): boolean =>
  entries.some((e) => e.name === '[Content_Types].xml') && entries.some((e) => e.name.startsWith('xl/'));

/** Folders and the files some systems add to an archive (__MACOSX/, .DS_Store, Thumbs.db): passed over. */
export const isPassedOver = (name: string): boolean => {
  // some zippers write Windows separators: a name is split at either, as displayName does
  const parts = name.split(/[/\\]/).filter(Boolean);
  const base = parts.at(-1) ?? '';
  return /[/\\]$/.test(name) || parts[0] === '__MACOSX' || base.startsWith('.') || base.toLowerCase() === 'thumbs.db';
};

/** The display name of an entry: its last path part, printable characters only, at most 120 characters. */
export const displayName = (name: string): string =>
  (name.split(/[/\\]/).filter(Boolean).at(-1) ?? 'file').replace(/[\u0000-\u001f\u007f]/g, '').slice(0, 120) || 'file';

/** Reads the central directory (the end record is within the last 64 KB + 22 bytes). */
export async function readZipDirectory(zipPath: string): Promise<ZipEntry[]> {
  const fh = await open(zipPath, 'r');
  try {
    const { size } = await fh.stat();
    const tailBytes = Math.min(size, 65_535 + 22);
    const tail = Buffer.alloc(tailBytes);
    await fh.read(tail, 0, tailBytes, size - tailBytes);
    let at = -1;
    for (let i = tailBytes - 22; i >= 0; i--) {
      if (tail.readUInt32LE(i) === EOCD) {
        at = i;
        break;
      }
    }
    if (at < 0) throw new ZipRefusal('The ZIP file is damaged (its table of contents is missing): make the ZIP again');
    const disk = tail.readUInt16LE(at + 4);
    const dirDisk = tail.readUInt16LE(at + 6);
    const onDisk = tail.readUInt16LE(at + 8);
    const count = tail.readUInt16LE(at + 10);
    const dirSize = tail.readUInt32LE(at + 12);
    const dirOffset = tail.readUInt32LE(at + 16);
    if (disk !== 0 || dirDisk !== 0 || onDisk !== count) throw new ZipRefusal('A ZIP split over several parts cannot be read: make one ZIP');
    if (count === 0xffff || dirSize === 0xffffffff || dirOffset === 0xffffffff) {
      throw new ZipRefusal('This ZIP uses the large-archive format (ZIP64), which is not read: zip fewer or smaller files');
    }
    if (count > MAX_ZIP_ENTRIES) throw new ZipRefusal(`The ZIP holds ${count} entries; at most ${MAX_ZIP_ENTRIES} are read (and ${MAX_TAG_FILES} files)`);
    if (count === 0) throw new ZipRefusal('The ZIP is empty: put the files of one tag each in it');
    if (dirOffset + dirSize > size) throw new ZipRefusal('The ZIP file is damaged (its table of contents points past its end): make the ZIP again');
    const dir = Buffer.alloc(dirSize);
    await fh.read(dir, 0, dirSize, dirOffset);
    const entries: ZipEntry[] = [];
    let p = 0;
    for (let k = 0; k < count; k++) {
      if (p + 46 > dir.length || dir.readUInt32LE(p) !== CENTRAL)
        throw new ZipRefusal('The ZIP file is damaged (its table of contents is cut): make the ZIP again');
      const nameLength = dir.readUInt16LE(p + 28);
      const extraLength = dir.readUInt16LE(p + 30);
      const commentLength = dir.readUInt16LE(p + 32);
      if (p + 46 + nameLength > dir.length) throw new ZipRefusal('The ZIP file is damaged (its table of contents is cut): make the ZIP again');
      const entry: ZipEntry = {
        flags: dir.readUInt16LE(p + 8),
        method: dir.readUInt16LE(p + 10),
        crc: dir.readUInt32LE(p + 16),
        compressedBytes: dir.readUInt32LE(p + 20),
        uncompressedBytes: dir.readUInt32LE(p + 24),
        localHeaderOffset: dir.readUInt32LE(p + 42),
        name: dir.toString('utf8', p + 46, p + 46 + nameLength),
      };
      if (entry.compressedBytes === 0xffffffff || entry.uncompressedBytes === 0xffffffff || entry.localHeaderOffset === 0xffffffff) {
        throw new ZipRefusal('This ZIP uses the large-archive format (ZIP64), which is not read: zip fewer or smaller files');
      }
      entries.push(entry);
      p += 46 + nameLength + extraLength + commentLength;
    }
    return entries;
  } finally {
    await fh.close();
  }
}

export interface UnzippedFile {
  /** The entry's display name. */
  name: string;
  /** Where it was written: `<folder>/<n>.upload`. */
  path: string;
  bytes: number;
}

/**
 * Checks the directory against the limits and inflates the files (folders and system files passed over) into
 * `folder` as 1.upload, 2.upload, … Throws a ZipRefusal for anything refused; what was written stays for the
 * caller to remove with the folder.
 */
export async function unzipTagFiles(
  zipPath: string,
  folder: string,
  limits = { maxBytes: MAX_UNZIPPED_BYTES, maxFiles: MAX_TAG_FILES },
): Promise<UnzippedFile[]> {
  const all = await readZipDirectory(zipPath);
  const entries = all.filter((e) => !isPassedOver(e.name));
  if (entries.length === 0) throw new ZipRefusal('The ZIP holds no files: put the files of one tag each in it');
  if (entries.length > limits.maxFiles) throw new ZipRefusal(`The ZIP holds ${entries.length} files; at most ${limits.maxFiles} are imported together`);
  let declared = 0;
  for (const e of entries) {
    const name = displayName(e.name);
    if (e.flags & 0x1) throw new ZipRefusal(`"${name}" in the ZIP is encrypted: make the ZIP without a password`);
    if (e.method !== 0 && e.method !== 8)
      throw new ZipRefusal(`"${name}" in the ZIP is packed in a way that is not read: make the ZIP with ordinary compression`);
    if (/\.(zip|xlsx|xlsm|7z|gz|rar|tar)$/i.test(e.name)) throw new ZipRefusal(`"${name}" is an archive or workbook inside the ZIP: put CSV files in the ZIP`);
    if (e.uncompressedBytes === 0) throw new ZipRefusal(`"${name}" in the ZIP is empty (0 bytes)`);
    declared += e.uncompressedBytes;
  }
  if (declared > limits.maxBytes) {
    throw new ZipRefusal(`The files in the ZIP come to ${mb(declared)} MB unpacked; at most ${mb(limits.maxBytes)} MB are read together`, 413);
  }
  const fh = await open(zipPath, 'r');
  let size: number;
  const spans: [number, number, string][] = [];
  try {
    size = (await fh.stat()).size;
    for (const e of entries) {
      const local = Buffer.alloc(30);
      await fh.read(local, 0, 30, e.localHeaderOffset);
      if (local.readUInt32LE(0) !== LOCAL) throw new ZipRefusal(`The ZIP file is damaged at "${displayName(e.name)}": make the ZIP again`);
      const dataStart = e.localHeaderOffset + 30 + local.readUInt16LE(26) + local.readUInt16LE(28);
      const dataEnd = dataStart + e.compressedBytes;
      if (dataEnd > size) throw new ZipRefusal(`The ZIP file is damaged at "${displayName(e.name)}" (cut short): make the ZIP again`);
      spans.push([e.localHeaderOffset, dataEnd, e.name]);
    }
  } finally {
    await fh.close();
  }
  // entries sharing bytes are no ordinary archive (the overlapping-file bomb): refuse
  const sorted = [...spans].sort((a, b) => a[0] - b[0]);
  for (let i = 1; i < sorted.length; i++) {
    if (sorted[i]![0] < sorted[i - 1]![1]) throw new ZipRefusal('The ZIP file is malformed (two files share the same bytes): make the ZIP again');
  }
  const out: UnzippedFile[] = [];
  let total = 0;
  for (let k = 0; k < entries.length; k++) {
    const e = entries[k]!;
    const [, dataEnd] = spans[k]!;
    const name = displayName(e.name);
    const target = path.join(folder, `${k + 1}.upload`);
    let bytes = 0;
    let crc = 0;
    let head: Buffer | null = null;
    const counter = new Transform({
      transform(chunk: Buffer, _enc, done) {
        bytes += chunk.length;
        total += chunk.length;
        if (bytes > e.uncompressedBytes) return done(new ZipRefusal(`"${name}" in the ZIP holds more than its stated size: the ZIP is malformed`));
        if (total > limits.maxBytes) return done(new ZipRefusal(`The files in the ZIP come to more than ${mb(limits.maxBytes)} MB unpacked`, 413));
        if (!head) {
          head = chunk.subarray(0, 4);
          if (startsLikeZip(head)) return done(new ZipRefusal(`"${name}" is an archive or workbook inside the ZIP: put CSV files in the ZIP`));
        }
        crc = zlib.crc32(chunk, crc);
        done(null, chunk);
      },
    });
    const compressed = fs.createReadStream(zipPath, { start: dataStart(spans[k]!, e), end: dataEnd - 1 });
    try {
      const sink = fs.createWriteStream(target);
      await (e.method === 8 ? pipeline(compressed, zlib.createInflateRaw(), counter, sink) : pipeline(compressed, counter, sink));
    } catch (err) {
      await rm(target, { force: true });
      if (err instanceof ZipRefusal) throw err;
      if ((err as { code?: string }).code === 'ENOSPC' || (err as { code?: string }).code === 'EDQUOT') throw err;
      throw new ZipRefusal(`"${name}" in the ZIP cannot be unpacked (the ZIP is damaged): make the ZIP again`);
    }
    if (bytes !== e.uncompressedBytes) throw new ZipRefusal(`"${name}" in the ZIP holds less than its stated size: the ZIP is damaged`);
    if (crc !== e.crc) throw new ZipRefusal(`"${name}" in the ZIP is damaged (its check sum does not match): make the ZIP again`);
    out.push({ name, path: target, bytes });
  }
  return out;
}

const dataStart = (span: [number, number, string], e: ZipEntry) => span[1] - e.compressedBytes;
const mb = (bytes: number) => Math.ceil(bytes / 1024 / 1024).toLocaleString('en-US');
