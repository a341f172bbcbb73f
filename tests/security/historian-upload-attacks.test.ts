/**
 * Hostile review of the historian upload of several one-tag files or one ZIP of them (POST /api/units/:id/uploads).
 * Each attack is a real request against the test app. After every refusal: an answer in plain words (never a 500),
 * nothing new anywhere under UPLOAD_DIR, and no import row for the unit. The ZIPs are built byte by byte here, so
 * the malformed ones (lying sizes, ZIP64 markers, symlinks, shifted local headers) are exactly what is described.
 */
import { mkdir, readdir, rm, truncate, writeFile } from 'node:fs/promises';
import os from 'node:os';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import path from 'node:path';
import zlib from 'node:zlib';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DataImport } from '../../backend/src/entities/data-import.entity.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { addMember, createTenant, createUser, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

// ---------------------------------------------------------------------------------------------------------------
// ZIP bytes, written out field by field (PKWARE APPNOTE 6.3: local header 30 bytes, central header 46, end 22)

interface RawEntry {
  /** the name as stored (bytes, so NUL and backslashes go in as they are) */
  name: Buffer | string;
  /** the stored bytes (already deflated when method is 8) */
  body: Buffer;
  method: number;
  crc: number;
  /** the unpacked size the central directory states */
  size: number;
  flags?: number;
  /** central "version made by" (high byte 3: Unix) and external attributes (Unix mode in the high 16 bits) */
  madeBy?: number;
  externalAttrs?: number;
  /** central directory sizes written as 0xffffffff with a ZIP64 extra field */
  zip64?: boolean;
  /** extra bytes claimed by the local header only (a local header that lies about where the data starts) */
  localExtraClaim?: number;
  /** a data descriptor after the data (flag bit 3), as streaming zippers write */
  descriptor?: boolean;
}

const entry = (name: Buffer | string, data: Buffer | string, method: 0 | 8 = 8, extra: Partial<RawEntry> = {}): RawEntry => {
  const raw = Buffer.isBuffer(data) ? data : Buffer.from(data, 'utf8');
  return { name, body: method === 8 ? zlib.deflateRawSync(raw) : raw, method, crc: zlib.crc32(raw), size: raw.length, ...extra };
};

function rawZip(entries: RawEntry[], end: { count?: number } = {}): Buffer {
  const parts: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const e of entries) {
    const name = Buffer.isBuffer(e.name) ? e.name : Buffer.from(e.name, 'utf8');
    const flags = (e.flags ?? 0) | (e.descriptor ? 0x8 : 0);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(flags, 6);
    local.writeUInt16LE(e.method, 8);
    local.writeUInt32LE(e.descriptor ? 0 : e.crc, 14);
    local.writeUInt32LE(e.descriptor ? 0 : e.body.length, 18);
    local.writeUInt32LE(e.descriptor ? 0 : e.size, 22);
    local.writeUInt16LE(name.length, 26);
    local.writeUInt16LE(e.localExtraClaim ?? 0, 28);
    const descriptor = Buffer.alloc(e.descriptor ? 16 : 0);
    if (e.descriptor) {
      descriptor.writeUInt32LE(0x08074b50, 0);
      descriptor.writeUInt32LE(e.crc, 4);
      descriptor.writeUInt32LE(e.body.length, 8);
      descriptor.writeUInt32LE(e.size, 12);
    }
    const zip64Extra = Buffer.alloc(e.zip64 ? 20 : 0);
    if (e.zip64) {
      zip64Extra.writeUInt16LE(0x0001, 0);
      zip64Extra.writeUInt16LE(16, 2);
      zip64Extra.writeBigUInt64LE(BigInt(e.size), 4);
      zip64Extra.writeBigUInt64LE(BigInt(e.body.length), 12);
    }
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(e.madeBy ?? 20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(flags, 8);
    central.writeUInt16LE(e.method, 10);
    central.writeUInt32LE(e.crc, 16);
    central.writeUInt32LE(e.zip64 ? 0xffffffff : e.body.length, 20);
    central.writeUInt32LE(e.zip64 ? 0xffffffff : e.size, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt16LE(zip64Extra.length, 30);
    central.writeUInt32LE(e.externalAttrs ?? 0, 38);
    central.writeUInt32LE(offset, 42);
    centrals.push(Buffer.concat([central, name, zip64Extra]));
    parts.push(local, name, e.body, descriptor);
    offset += 30 + name.length + e.body.length + descriptor.length;
  }
  const dir = Buffer.concat(centrals);
  const eocd = Buffer.alloc(22);
  eocd.writeUInt32LE(0x06054b50, 0);
  eocd.writeUInt16LE(end.count ?? entries.length, 8);
  eocd.writeUInt16LE(end.count ?? entries.length, 10);
  eocd.writeUInt32LE(dir.length, 12);
  eocd.writeUInt32LE(offset, 16);
  return Buffer.concat([...parts, dir, eocd]);
}

/** `bytes` of one CSV line repeated, deflated as a stream (never the whole text in memory): a high-ratio entry. */
async function deflatedRepeat(header: string, line: string, bytes: number): Promise<{ body: Buffer; crc: number; size: number }> {
  const deflate = zlib.createDeflateRaw({ level: 6 });
  const out: Buffer[] = [];
  deflate.on('data', (c: Buffer) => out.push(c));
  const done = new Promise((resolve) => deflate.on('end', resolve));
  const head = Buffer.from(header);
  const block = Buffer.from(line.repeat(Math.floor((1024 * 1024) / line.length)));
  let crc = zlib.crc32(head);
  let size = head.length;
  deflate.write(head);
  while (size + block.length <= bytes) {
    crc = zlib.crc32(block, crc);
    size += block.length;
    if (!deflate.write(block)) await new Promise((resolve) => deflate.once('drain', resolve));
  }
  deflate.end();
  await done;
  return { body: Buffer.concat(out), crc, size };
}

// ---------------------------------------------------------------------------------------------------------------

const START = Date.UTC(2024, 5, 3, 0, 0);
/** A one-tag series, hourly: the tag in the value column's header (or "Value", the tag then from the file's name). */
const tagCsv = (tag: string, hours = 6, offsetHours = 0) =>
  [`Time,${tag}`, ...Array.from({ length: hours }, (_, h) => `${new Date(START + (h + offsetHours) * 3_600_000).toISOString()},${(480 + h).toFixed(1)}`)].join(
    '\r\n',
  ) + '\r\n';

type Part = { name: string; data: Buffer | string; field?: string };

/** Text an engineer can read: short, no stack, no internal error names or paths. */
function plainWords(said: unknown): void {
  expect(typeof said).toBe('string');
  const text = said as string;
  expect(text.length).toBeGreaterThan(10);
  expect(text.length).toBeLessThan(400);
  expect(text).not.toMatch(/\b(TypeError|RangeError|Error:|ENOENT|EPIPE|EACCES|undefined|NaN|\[object)|\bat .+:\d+:\d+|\/tmp\/|\.upload\b/);
}

describe('historian upload attacks', () => {
  let t: TestApp;
  let root: string;
  let uploadDir: string;
  let tenant: TenantFixture;
  let analyst: TestAgent;

  beforeAll(async () => {
    root = path.join(os.tmpdir(), `upload-attacks-${process.pid}-${Date.now()}`);
    uploadDir = path.join(root, 'uploads');
    await mkdir(uploadDir, { recursive: true });
    t = await createTestApp({ UPLOAD_DIR: uploadDir });
    tenant = await createTenant(t.dataSource, 'attacks');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
  });
  afterAll(async () => {
    await t?.close();
    if (root) await rm(root, { recursive: true, force: true });
  });

  const newUnit = async (clientGroupId: string | null = null, organisationId = tenant.organisation.id): Promise<GeneratingUnit> =>
    createUnit(t.dataSource, await createPlant(t.dataSource, organisationId, clientGroupId));
  /** Everything under UPLOAD_DIR, folders included, and everything beside it (an escape would land there). */
  const listing = async () => [...(await readdir(uploadDir, { recursive: true })).map((f) => `uploads/${f}`), ...(await readdir(root))].sort();
  const importsOf = async (unitId: string): Promise<number> =>
    Number((await t.dataSource.query('SELECT COUNT(*) AS n FROM data_import WHERE unitId = ?', [unitId]))[0].n);
  const samplesOf = async (unitId: string): Promise<number> =>
    Number((await t.dataSource.query('SELECT COUNT(*) AS n FROM performance_sample WHERE unitId = ?', [unitId]))[0].n);

  const send = (agent: TestAgent, unitId: string, parts: Part[], csrf = true) => {
    let req = agent.post(`/api/units/${unitId}/uploads`);
    if (csrf) req = req.set(CSRF);
    for (const p of parts) req = req.attach(p.field ?? 'file', Buffer.isBuffer(p.data) ? p.data : Buffer.from(p.data), p.name);
    return req;
  };

  /** A refusal: its status, its words, nothing new on disk, no import row (so none in a half state). */
  async function refused(parts: Part[], status: number, message: RegExp, opts: { agent?: TestAgent; unitId?: string; csrf?: boolean } = {}) {
    const unitId = opts.unitId ?? (await newUnit()).id;
    const before = await listing();
    const res = await send(opts.agent ?? analyst, unitId, parts, opts.csrf ?? true);
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    plainWords(res.body.error);
    expect(res.body.error).toMatch(message);
    expect(await listing()).toEqual(before);
    expect(await importsOf(unitId)).toBe(0);
    return res;
  }

  /** An accepted upload of one-tag files: its answer, and the new folder's listing (numbered files and the manifest). */
  async function accepted(parts: Part[]) {
    const unit = await newUnit();
    const before = await listing();
    const res = await send(analyst, unit.id, parts);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.shape).toBe('per-tag-files');
    const added = (await listing()).filter((f) => !before.includes(f));
    const folder = added.find((f) => !f.slice('uploads/'.length).includes('/'));
    expect(folder, JSON.stringify(added)).toMatch(/^uploads\/[^/]+\.files$/);
    const inside = added.filter((f) => f !== folder).map((f) => f.slice(folder!.length + 1));
    return { unit, res, inside, before };
  }
  const undo = (id: string) => analyst.delete(`/api/imports/${id}`).set(CSRF).expect(200);

  // first, while the process is fresh: the big uploads below leave the heap grown
  describe('memory', () => {
    it('reads a ZIP of 200 MB unpacked without holding it in memory', async () => {
      const line = '2024-06-03T00:00:00Z,480.5\r\n';
      const big = await deflatedRepeat('Time,U9.MEM\r\n', line, 200 * 1024 * 1024);
      expect(big.size).toBeGreaterThan(199 * 1024 * 1024);
      const zip = rawZip([{ name: 'mem.csv', body: big.body, method: 8, crc: big.crc, size: big.size }, entry('small.csv', tagCsv('U9.SMALL'))]);
      const unit = await newUnit();
      const base = process.memoryUsage().rss;
      // the server runs in this process: the event loop's longest stall is how long other requests wait
      const stalls = monitorEventLoopDelay({ resolution: 10 });
      stalls.enable();
      let peak = base;
      const peaks = { heapUsed: 0, external: 0, arrayBuffers: 0, heapTotal: 0 };
      const watch = setInterval(() => {
        const m = process.memoryUsage();
        peak = Math.max(peak, m.rss);
        for (const k of Object.keys(peaks) as (keyof typeof peaks)[]) peaks[k] = Math.max(peaks[k], m[k]);
      }, 25);
      const started = Date.now();
      const res = await send(analyst, unit.id, [{ name: 'mem.zip', data: zip }]);
      clearInterval(watch);
      stalls.disable();
      const seconds = (Date.now() - started) / 1000;
      const stallMs = stalls.max / 1e6;
      console.log(
        `200 MB ZIP (${(zip.length / 1024).toFixed(0)} KB sent): ${seconds.toFixed(1)} s; RSS ${(base / 2 ** 20).toFixed(0)} MB → peak ${(peak / 2 ** 20).toFixed(0)} MB (heap peak ${(peaks.heapUsed / 2 ** 20).toFixed(0)} MB, buffers peak ${(peaks.arrayBuffers / 2 ** 20).toFixed(0)} MB); longest event-loop stall ${stallMs.toFixed(0)} ms`,
      );
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body.files[0]).toMatchObject({ tag: 'U9.MEM', rows: Math.floor((big.size - 13) / line.length) });
      // generous: well under the 200 MB a reader holding the file would need
      expect(peak - base).toBeLessThan(120 * 1024 * 1024);
      // and other requests are not held up for long while it is read (generous)
      expect(stallMs).toBeLessThan(2000);
      await undo(res.body.import.id);
      expect(await importsOf(unit.id)).toBe(1);
    }, 300_000);
  });

  describe('ZIP archives', () => {
    const good = (k: number) => entry(`export/T${k}.csv`, tagCsv(`U9.T${k}`));

    it('refuses a high-ratio bomb whose directory tells the truth (more than 512 MB unpacked) before inflating a byte', async () => {
      const big = await deflatedRepeat('Time,U9.BIG\r\n', '2024-06-03T00:00:00Z,1\r\n', 520 * 1024 * 1024);
      expect(big.body.length).toBeLessThan(3 * 1024 * 1024);
      const zip = rawZip([good(1), { name: 'big.csv', body: big.body, method: 8, crc: big.crc, size: big.size }]);
      await refused(
        [{ name: 'bomb.zip', data: zip }],
        413,
        /^The files in the ZIP come to 52\d MB unpacked; at most 512 MB are read together \(nothing was stored\)$/,
      );
    });

    it('refuses a bomb whose directory understates its size, stopping at the stated size', async () => {
      const big = await deflatedRepeat('Time,U9.BIG\r\n', '2024-06-03T00:00:00Z,1\r\n', 64 * 1024 * 1024);
      const zip = rawZip([good(1), { name: 'small.csv', body: big.body, method: 8, crc: big.crc, size: 1000 }]);
      await refused([{ name: 'liar.zip', data: zip }], 400, /^"small.csv" in the ZIP holds more than its stated size/);
    });

    it('refuses an entry that holds less than stated, and a stored entry whose sizes differ', async () => {
      const short = entry('short.csv', tagCsv('U9.S'));
      await refused(
        [{ name: 'short.zip', data: rawZip([good(1), { ...short, size: short.size + 500 }]) }],
        400,
        /"short.csv" in the ZIP holds less than its stated size/,
      );
      const stored = entry('stored.csv', tagCsv('U9.S'), 0);
      await refused(
        [{ name: 'stored.zip', data: rawZip([good(1), { ...stored, size: stored.size * 2 }]) }],
        400,
        /"stored.csv" in the ZIP holds less than its stated size/,
      );
    });

    it('refuses a wrong check sum', async () => {
      const bad = entry('crc.csv', tagCsv('U9.C'));
      await refused(
        [{ name: 'crc.zip', data: rawZip([good(1), { ...bad, crc: (bad.crc ^ 0xff) >>> 0 }]) }],
        400,
        /"crc.csv" in the ZIP is damaged \(its check sum does not match\)/,
      );
    });

    it('refuses a local header that lies about where its data starts (pointing into the next entry)', async () => {
      const first = good(1);
      const second = good(2);
      const zip = rawZip([{ ...first, localExtraClaim: first.body.length + 10 }, second]);
      await refused([{ name: 'shifted.zip', data: zip }], 400, /^The ZIP file is (malformed \(two files share the same bytes\)|damaged)/);
      const past = rawZip([good(1), { ...second, localExtraClaim: 60_000 }]);
      await refused([{ name: 'past.zip', data: past }], 400, /^The ZIP file is damaged at "T2.csv" \(cut short\)/);
    });

    it('refuses ZIP64 sizes and a ZIP64 entry count, in plain words', async () => {
      await refused([{ name: 'z64.zip', data: rawZip([good(1), { ...good(2), zip64: true }]) }], 400, /large-archive format \(ZIP64\)/);
      await refused([{ name: 'count.zip', data: rawZip([good(1)], { count: 0xffff }) }], 400, /large-archive format \(ZIP64\)/);
    });

    it('refuses more than 200 entries in the directory, and more than 20 files', async () => {
      const folders = Array.from({ length: 201 }, (_, k) => entry(`d${k}/`, '', 0));
      await refused([{ name: 'entries.zip', data: rawZip([good(1), ...folders]) }], 400, /^The ZIP holds 202 entries; at most 200 are read/);
      await refused(
        [{ name: 'files.zip', data: rawZip(Array.from({ length: 21 }, (_, k) => good(k))) }],
        400,
        /^The ZIP holds 21 files; at most 20 are imported together/,
      );
    });

    it('takes 20 files and passes over folders and system files (__MACOSX, .DS_Store)', async () => {
      const zip = rawZip([
        entry('export/', '', 0),
        ...Array.from({ length: 20 }, (_, k) => good(k)),
        entry('__MACOSX/export/._T1.csv', 'junk'),
        entry('export/.DS_Store', 'x'),
      ]);
      const { res, inside } = await accepted([{ name: 'twenty.zip', data: zip }]);
      expect(res.body.files).toHaveLength(20);
      expect(inside.sort()).toEqual([...Array.from({ length: 20 }, (_, k) => `${k + 1}.upload`), 'files.json'].sort());
      await undo(res.body.import.id);
    });

    it('writes entries named with ../, absolute paths, backslashes, NUL and very long names only as numbered files, and shows tidy names', async () => {
      const names: (string | Buffer)[] = [
        '../../../../escaped-up.csv',
        '/etc/cron.d/abs.csv',
        '..\\..\\windows\\back.csv',
        Buffer.concat([Buffer.from('nul'), Buffer.from([0]), Buffer.from('byte.csv')]),
        `${'x'.repeat(3000)}.csv`,
        'C:\\Temp\\drive.csv',
      ];
      const zip = rawZip(names.map((n) => entry(n, tagCsv('Value'))));
      const { res, inside } = await accepted([{ name: 'names.zip', data: zip }]);
      const shown = res.body.files.map((f: { name: string }) => f.name);
      expect(shown.slice(0, 4)).toEqual(['escaped-up.csv', 'abs.csv', 'back.csv', 'nulbyte.csv']);
      expect(shown[4]).toHaveLength(120);
      expect(shown[5]).toBe('drive.csv');
      // the tag comes from the tidy name (the value column says only "Value")
      expect(res.body.files.map((f: { tag: string }) => f.tag).slice(0, 4)).toEqual(['escaped-up', 'abs', 'back', 'nulbyte']);
      for (const s of JSON.stringify(res.body)) expect(s.charCodeAt(0) === 0).toBe(false);
      expect(inside.sort()).toEqual(['1.upload', '2.upload', '3.upload', '4.upload', '5.upload', '6.upload', 'files.json']);
      await undo(res.body.import.id);
      expect(await readdir(root)).toEqual(['uploads']);
    });

    it('never makes a link from a symlink entry: its bytes are an ordinary file, refused as no series, and the target is never read', async () => {
      const link = entry('passwd.csv', '/etc/passwd', 0, { madeBy: (3 << 8) | 20, externalAttrs: (0o120777 << 16) >>> 0 });
      const res = await refused(
        [{ name: 'link.zip', data: rawZip([good(1), link]) }],
        400,
        /^"passwd.csv" (is not the series of one tag|cannot be read as a table|holds no values)/,
      );
      expect(JSON.stringify(res.body)).not.toMatch(/root:/);
    });

    it('refuses encrypted entries (the flag, and strong encryption method 99) and unknown methods', async () => {
      await refused(
        [{ name: 'locked.zip', data: rawZip([good(1), { ...good(2), flags: 0x1 }]) }],
        400,
        /^"T2.csv" in the ZIP is encrypted: make the ZIP without a password/,
      );
      await refused(
        [{ name: 'aes.zip', data: rawZip([good(1), { ...good(2), method: 99 }]) }],
        400,
        /^"T2.csv" in the ZIP is packed in a way that is not read/,
      );
      await refused(
        [{ name: 'bzip.zip', data: rawZip([good(1), { ...good(2), method: 12 }]) }],
        400,
        /^"T2.csv" in the ZIP is packed in a way that is not read/,
      );
    });

    it('refuses an entry of one 40 MB line (no line breaks) in plain words', async () => {
      const line = await deflatedRepeat('Time,U9.LINE\r\n', '1234567890', 40 * 1024 * 1024);
      await refused(
        [
          {
            name: 'line.zip',
            data: rawZip([{ name: 'line.csv', body: line.body, method: 8, crc: line.crc, size: line.size }, entry('b.csv', tagCsv('U9.B'))]),
          },
        ],
        400,
        /^"line.csv" cannot be read as a table: line 2 is longer than 100,000 characters/,
      );
    });

    it('refuses a nested archive whatever its name, and a gzip file inside', async () => {
      const inner = rawZip([good(3)]);
      await refused([{ name: 'nest.zip', data: rawZip([good(1), entry('inner.zip', inner)]) }], 400, /"inner.zip" is an archive or workbook inside the ZIP/);
      await refused(
        [{ name: 'nest2.zip', data: rawZip([good(1), entry('disguised.csv', inner)]) }],
        400,
        /"disguised.csv" is an archive or workbook inside the ZIP/,
      );
      const gz = zlib.gzipSync(Buffer.from(tagCsv('U9.G')));
      await refused([{ name: 'gz.zip', data: rawZip([good(1), entry('tag.csv', gz, 0)]) }], 400, /^"tag.csv" /);
    });

    it('refuses duplicate entry names holding the same tag', async () => {
      await refused([{ name: 'dup.zip', data: rawZip([good(1), good(1)]) }], 400, /^Tag "U9.T1" is in two files, "T1.csv" and "T1.csv": upload each tag once/);
    });

    it('takes a ZIP sent under a .csv name as the ZIP it is, and reads a CSV sent under a .zip name as a CSV', async () => {
      const { res } = await accepted([{ name: 'tags.csv', data: rawZip([good(1), good(2)]) }]);
      expect(res.body.files.map((f: { tag: string }) => f.tag)).toEqual(['U9.T1', 'U9.T2']);
      await undo(res.body.import.id);
      const unit = await newUnit();
      const csv = await send(analyst, unit.id, [{ name: 'export.zip', data: tagCsv('U9.T1') }]);
      expect(csv.status, JSON.stringify(csv.body)).toBe(201);
      expect(csv.body.shape).toBe('wide');
      expect(csv.body.headers).toEqual(['Time', 'U9.T1']);
      await undo(csv.body.import.id);
    });

    it('refuses a damaged ZIP under any name, and an empty archive, in plain words', async () => {
      const zip = rawZip([good(1), good(2)]);
      await refused([{ name: 'cut.zip', data: zip.subarray(0, zip.length - 30) }], 400, /^The ZIP file is damaged/);
      await refused([{ name: 'cut.csv', data: zip.subarray(0, zip.length - 30) }], 400, /./);
      await refused([{ name: 'empty.zip', data: rawZip([]) }], 400, /./);
    });

    it('takes a ZIP written with data descriptors (as streaming zippers write them)', async () => {
      const { res } = await accepted([
        {
          name: 'stream.zip',
          data: rawZip([
            { ...good(1), descriptor: true },
            { ...good(2), descriptor: true },
          ]),
        },
      ]);
      expect(res.body.files.map((f: { tag: string; rows: number }) => [f.tag, f.rows])).toEqual([
        ['U9.T1', 6],
        ['U9.T2', 6],
      ]);
      await undo(res.body.import.id);
    });
  });

  describe('several parts in one request', () => {
    it('takes 20 files and refuses 21', async () => {
      const files = (n: number) => Array.from({ length: n }, (_, k) => ({ name: `p${k}.csv`, data: tagCsv(`U9.P${k}`) }));
      const { res } = await accepted(files(20));
      expect(res.body.files).toHaveLength(20);
      await undo(res.body.import.id);
      await refused(files(21), 400, /^Upload one file, or at most 20 files of one tag each together$/);
    });

    it('refuses a part under another field name, a seventh form field, and an empty part', async () => {
      await refused(
        [
          { name: 'a.csv', data: tagCsv('U9.A') },
          { name: 'b.csv', data: tagCsv('U9.B'), field: 'upload' },
        ],
        400,
        /^Send the file in the form field named "file"/,
      );
      const unit = await newUnit();
      const before = await listing();
      let req = analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF);
      for (let k = 0; k < 6; k++) req = req.field(`note${k}`, 'x');
      const res = await req.attach('file', Buffer.from(tagCsv('U9.A')), 'a.csv');
      expect(res.status).toBe(400);
      plainWords(res.body.error);
      expect(res.body.error).toMatch(/too many form fields/);
      expect(await listing()).toEqual(before);
      expect(await importsOf(unit.id)).toBe(0);
      await refused(
        [
          { name: 'a.csv', data: tagCsv('U9.A') },
          { name: 'hollow.csv', data: '' },
        ],
        400,
        /^"hollow.csv" is empty \(0 bytes\): nothing was stored$/,
      );
      await refused([], 400, /^Choose a CSV or XLSX file to upload$/);
    });

    it('stores parts named ../../x.csv (or with backslashes) only as numbered files in the upload folder', async () => {
      const { res, inside } = await accepted([
        { name: '../../up.csv', data: tagCsv('Value') },
        { name: '..\\..\\back.csv', data: tagCsv('U9.B') },
      ]);
      for (const f of res.body.files as { name: string }[]) expect(f.name).not.toMatch(/\.\.[\\/]/);
      expect(inside.sort()).toEqual(['1.upload', '2.upload', 'files.json']);
      expect(await readdir(root)).toEqual(['uploads']);
      await undo(res.body.import.id);
    });

    it('keeps control characters of a part name out of the name shown and the tag it names, so the tag can be mapped', async () => {
      // a quoted file name with a control character is refused by the form reader; the encoded form (RFC 5987) is not
      const quoted = await refused([{ name: 'bell\u0007tag.csv', data: tagCsv('Value') }], 400, /^The upload was cut off or is incomplete/);
      expect(quoted.body.error).toMatch(/nothing was stored/);
      const unit = await newUnit();
      const part = (disposition: string, text: string) =>
        `--B0undary\r\nContent-Disposition: form-data; name="file"; ${disposition}\r\nContent-Type: text/csv\r\n\r\n${text}\r\n`;
      const body = Buffer.from(
        `${part("filename*=utf-8''bell%07tag.csv", tagCsv('Value'))}${part("filename*=utf-8''esc%1B%5B31mred.csv", tagCsv('Value'))}--B0undary--\r\n`,
      );
      const res = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).set('content-type', 'multipart/form-data; boundary=B0undary').send(body);
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body.files.map((f: { name: string; tag: string }) => [f.name, f.tag])).toEqual([
        ['belltag.csv', 'belltag'],
        ['esc[31mred.csv', 'esc[31mred'],
      ]);
      expect(res.body.import.fileName).toBe('2 files: belltag.csv, esc[31mred.csv');
      // the tags go back in a mapping, which refuses control characters: they map
      const mapping = {
        ...res.body.proposedMapping,
        columns: { grossLoad: { column: 'belltag', unit: 'MW' }, backpressure: { column: 'esc[31mred', unit: 'inHg' } },
      };
      const started = await analyst.post(`/api/imports/${res.body.import.id}/start`).set(CSRF).send({ mapping });
      expect(started.body.error ?? '').not.toMatch(/control character/);
      await drainJobs(t.dataSource, JOB_HANDLERS);
      await undo(res.body.import.id);
    });

    it('names each tag as a mapping can name it: spaces around a name trimmed, a tag longer than a mapping takes refused', async () => {
      const { res } = await accepted([
        { name: '  U9.SPACED  .csv', data: tagCsv('Value') },
        { name: 'b.csv', data: tagCsv(' U9.B ') },
      ]);
      expect(res.body.files.map((f: { tag: string }) => f.tag)).toEqual(['U9.SPACED', 'U9.B']);
      await undo(res.body.import.id);
      const long = 'U9.'.padEnd(240, 'L');
      const tall = ['Tag,Time,Value', ...[0, 1, 2].map((h) => `${long},${new Date(START + h * 3_600_000).toISOString()},${h}`)].join('\n');
      await refused(
        [
          { name: 'a.csv', data: tagCsv('U9.A') },
          { name: 'long.csv', data: tall },
        ],
        400,
        /^"long.csv" names a tag of 240 characters; at most 200/,
      );
      await refused(
        [
          { name: 'a.csv', data: tagCsv('U9.A') },
          { name: ' .csv', data: tagCsv('Value') },
        ],
        400,
        /^" .csv" names no tag \(its value column says only "Value"\): name the file after its tag \(nothing was stored\)$/,
      );
    });

    it('refuses mixed shapes among the files: a wide file, a tall file of two tags', async () => {
      const wide = `Time,U9.A,U9.B\r\n${new Date(START).toISOString()},1,2\r\n`;
      await refused(
        [
          { name: 'a.csv', data: tagCsv('U9.A') },
          { name: 'wide.csv', data: wide },
        ],
        400,
        /^"wide.csv" is not the series of one tag/,
      );
      const tall = [
        'Tag,Time,Value',
        ...[0, 1, 2].flatMap((h) => ['U9.X', 'U9.Y'].map((g) => `${g},${new Date(START + h * 3_600_000).toISOString()},${h}`)),
      ].join('\n');
      await refused(
        [
          { name: 'a.csv', data: tagCsv('U9.A') },
          { name: 'tall.csv', data: tall },
        ],
        400,
        /^"tall.csv" holds more than one tag \("U9.X", "U9.Y"\)/,
      );
    });

    it('refuses a single part over 200 MB, and parts over 512 MB together, leaving nothing', async () => {
      const big = path.join(`${root}-big`, 'big-201.csv');
      await mkdir(`${root}-big`, { recursive: true });
      await writeFile(big, 'Time,U9.Z\r\n');
      await truncate(big, 201 * 1024 * 1024);
      const unit = await newUnit();
      const before = await listing();
      const one = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', big);
      expect(one.status).toBe(413);
      plainWords(one.body.error);
      expect(one.body.error).toBe('The file is larger than 200 MB');
      const parts = [];
      for (let k = 0; k < 3; k++) {
        const p = path.join(`${root}-big`, `part-${k}.csv`);
        await writeFile(p, `Time,U9.Z${k}\r\n`);
        await truncate(p, 180 * 1024 * 1024);
        parts.push(p);
      }
      let req = analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF);
      for (const p of parts) req = req.attach('file', p);
      const together = await req;
      expect(together.status).toBe(413);
      plainWords(together.body.error);
      expect(together.body.error).toBe('The files together are larger than 512 MB: nothing was stored');
      await rm(`${root}-big`, { recursive: true, force: true });
      expect(await listing()).toEqual(before);
      expect(await importsOf(unit.id)).toBe(0);
    }, 240_000);
  });

  describe('tenancy', () => {
    let other: TenantFixture;
    let limited: TestAgent;
    let viewer: TestAgent;
    const parts: Part[] = [
      { name: 'a.csv', data: tagCsv('U9.A') },
      { name: 'b.csv', data: tagCsv('U9.B') },
    ];

    beforeAll(async () => {
      other = await createTenant(t.dataSource, 'attacks-other');
      const person = await createUser(t.dataSource, 'attacks-limited');
      await addMember(t.dataSource, tenant.organisation.id, person, 'analyst', [tenant.groups[0].id]);
      limited = await signedInAgent(t.app, person.email);
      viewer = await signedInAgent(t.app, tenant.users.viewer.email);
    });

    it("answers 404 for another organisation's unit and another client group's unit, storing nothing", async () => {
      const foreign = await newUnit(null, other.organisation.id);
      await refused(parts, 404, /^No such unit$/, { unitId: foreign.id });
      const zip = rawZip([entry('a.csv', tagCsv('U9.A')), entry('b.csv', tagCsv('U9.B'))]);
      await refused([{ name: 'a.zip', data: zip }], 404, /^No such unit$/, { unitId: foreign.id });
      const groupTwo = await newUnit(tenant.groups[1].id);
      await refused(parts, 404, /^No such unit$/, { unitId: groupTwo.id, agent: limited });
      // the same member may upload to the group they work for
      const groupOne = await newUnit(tenant.groups[0].id);
      const ok = await send(limited, groupOne.id, parts);
      expect(ok.status, JSON.stringify(ok.body)).toBe(201);
      await limited.delete(`/api/imports/${ok.body.import.id}`).set(CSRF).expect(200);
    });

    it('refuses a viewer, a request without the CSRF header, and a read-only organisation, storing nothing', async () => {
      await refused(parts, 403, /viewer/, { agent: viewer });
      await refused(parts, 403, /./, { csrf: false });
      const lapsed = await createTenant(t.dataSource, 'attacks-lapsed');
      await t.dataSource.getRepository(Organisation).update({ id: lapsed.organisation.id }, { subscriptionStatus: 'canceled', stripeSubscriptionId: 'sub_x' });
      const lapsedAnalyst = await signedInAgent(t.app, lapsed.users.analyst.email);
      const lapsedUnit = await newUnit(null, lapsed.organisation.id);
      await refused(parts, 402, /The subscription has ended/, { agent: lapsedAnalyst, unitId: lapsedUnit.id });
    });

    it('answers 404 to another tenant or client group for every action on an import of files, and leaves it and its folder as they were', async () => {
      const unit = await newUnit(tenant.groups[1].id);
      const up = await send(analyst, unit.id, parts);
      expect(up.status).toBe(201);
      const id = up.body.import.id as string;
      const outsider = await signedInAgent(t.app, other.users.admin.email);
      const before = await listing();
      for (const agent of [outsider, limited]) {
        await agent.get(`/api/imports/${id}`).expect(404);
        await agent.get(`/api/imports/${id}/errors.csv`).expect(404);
        await agent.post(`/api/imports/${id}/sheet`).set(CSRF).send({ sheet: 'x' }).expect(404);
        await agent.post(`/api/imports/${id}/start`).set(CSRF).send({ mapping: up.body.proposedMapping }).expect(404);
        await agent.delete(`/api/imports/${id}`).set(CSRF).expect(404);
      }
      expect(await listing()).toEqual(before);
      expect((await analyst.get(`/api/imports/${id}`).expect(200)).body.status).toBe('mapping');
      await undo(id);
    });
  });

  describe('after a successful import of files', () => {
    it('undo removes its rows; undo of one still being mapped removes its folder', async () => {
      const tags = ['U9.MW', 'U9.BP', 'U9.CWI', 'U9.CWO', 'U9.FLOW'];
      const values = [480, 2.1, 75, 92, 160_000];
      const csv = (tag: string, v: number) =>
        [`Time,${tag}`, ...Array.from({ length: 12 }, (_, h) => `${new Date(START + h * 3_600_000).toISOString()},${v}`)].join('\r\n') + '\r\n';
      const { unit, res, before } = await accepted(tags.map((g, k) => ({ name: `${g}.csv`, data: csv(g, values[k]!) })));
      const mapping = {
        ...res.body.proposedMapping,
        columns: {
          grossLoad: { column: 'U9.MW', unit: 'MW' },
          backpressure: { column: 'U9.BP', unit: 'inHg' },
          cwInletTemperature: { column: 'U9.CWI', unit: 'degF' },
          cwOutletTemperature: { column: 'U9.CWO', unit: 'degF' },
          cwFlow: { column: 'U9.FLOW', unit: 'gpm' },
        },
      };
      const started = await analyst.post(`/api/imports/${res.body.import.id}/start`).set(CSRF).send({ mapping });
      expect(started.status, JSON.stringify(started.body)).toBe(202);
      await drainJobs(t.dataSource, JOB_HANDLERS);
      const imp = (await analyst.get(`/api/imports/${res.body.import.id}`).expect(200)).body;
      expect(imp.status, JSON.stringify(imp)).toBe('complete');
      expect(await samplesOf(unit.id)).toBe(12);
      expect(await listing()).toEqual(before);
      const undone = await undo(res.body.import.id);
      expect(undone.body.status).toBe('undone');
      expect(await samplesOf(unit.id)).toBe(0);
      // a second undo changes nothing and says so
      const again = await analyst.delete(`/api/imports/${res.body.import.id}`).set(CSRF);
      expect(again.status).toBe(409);
      plainWords(again.body.error);

      const pending = await accepted([
        { name: 'a.csv', data: tagCsv('U9.A') },
        { name: 'b.csv', data: tagCsv('U9.B') },
      ]);
      await undo(pending.res.body.import.id);
      expect(await listing()).toEqual(pending.before);
      const row = await t.dataSource.getRepository(DataImport).findOneByOrFail({ id: pending.res.body.import.id });
      expect(row.status).toBe('undone');
    });
  });
});
