/**
 * The disk fills up while an upload is written: the person is told in our words (507) and the part already
 * written is removed, so no half file stays in the upload folder and no import is recorded. The full disk is
 * simulated without root: the upload folder's write stream writes its first chunk to the real file, then fails
 * the way a full file system does (ENOSPC).
 */
import fs, { type WriteStream } from 'node:fs';
import { readdir } from 'node:fs/promises';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { DataImport } from '../../backend/src/entities/data-import.entity.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { createTenant, CSRF, signedInAgent } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { csvLines, makeTempDir, physicalHistory } from '../helpers/historian-files.js';
import { buildZip } from '../helpers/zip-builder.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;
let analyst: TestAgent;
let unit: GeneratingUnit;
let uploadDir: string;

/** Write streams into the upload folder take `roomBytes`, then fail with ENOSPC as a full disk does. */
function fillDiskAfter(roomBytes: number): { partWritten: () => boolean } {
  const original = fs.createWriteStream;
  let written = 0;
  let part = false;
  vi.spyOn(fs, 'createWriteStream').mockImplementation(((target: fs.PathLike, options?: unknown) => {
    const stream = original(target, options as Parameters<typeof fs.createWriteStream>[1]) as WriteStream;
    if (!String(target).startsWith(uploadDir)) return stream;
    const write = stream._write.bind(stream);
    stream._write = (chunk: Buffer, encoding: BufferEncoding, cb: (err?: Error | null) => void) => {
      if (written + chunk.length > roomBytes) {
        const err = Object.assign(new Error('ENOSPC: no space left on device, write'), { code: 'ENOSPC', errno: -28, syscall: 'write' });
        return cb(err);
      }
      written += chunk.length;
      part = true;
      write(chunk, encoding, cb);
    };
    return stream;
  }) as typeof fs.createWriteStream);
  return { partWritten: () => part };
}

describe('disk full while an upload is written', { timeout: 60_000 }, () => {
  beforeAll(async () => {
    tmp = await makeTempDir();
    uploadDir = tmp.file('uploads');
    t = await createTestApp({ UPLOAD_DIR: uploadDir });
    const tenant = await createTenant(t.dataSource, 'disk-full');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
  });
  afterEach(() => vi.restoreAllMocks());
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  it('answers 507 saying the server has no room, leaves no part of the file and records no import', async () => {
    const rows = physicalHistory({ startUtc: Date.UTC(2024, 0, 1), hours: 24 * 180, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    const csv = Buffer.from(csvLines(rows).join('\n'));
    expect(csv.length).toBeGreaterThan(200_000);
    const disk = fillDiskAfter(64 * 1024);
    const res = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', csv, 'history.csv');
    expect(disk.partWritten()).toBe(true);
    expect(res.status, JSON.stringify(res.body)).toBe(507);
    expect(res.body.error).toMatch(/no room|space/i);
    expect(res.body.error).toMatch(/nothing was stored/i);
    expect(res.body.error).not.toMatch(/ENOSPC|errno|write/);
    expect(await readdir(uploadDir)).toEqual([]);
    expect(await t.dataSource.getRepository(DataImport).countBy({ unitId: unit.id })).toBe(0);
  });

  /** One-tag files of a few thousand hours each (about 150 KB each). */
  const tagFile = (k: number) =>
    Buffer.from(
      [
        `Time,U1.TAG${k}`,
        ...Array.from({ length: 5000 }, (_, h) => `${new Date(Date.UTC(2024, 0, 1) + h * 3_600_000).toISOString()},${(400 + k + h / 1000).toFixed(3)}`),
      ].join('\n'),
    );

  it('answers 507 when the disk fills while several files of one tag each are written, leaving none of them', async () => {
    const disk = fillDiskAfter(200 * 1024);
    let req = analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF);
    for (let k = 0; k < 3; k++) req = req.attach('file', tagFile(k), `tag-${k}.csv`);
    const res = await req;
    expect(disk.partWritten()).toBe(true);
    expect(res.status, JSON.stringify(res.body)).toBe(507);
    expect(res.body.error).toMatch(/nothing was stored/i);
    expect(await readdir(uploadDir)).toEqual([]);
    expect(await t.dataSource.getRepository(DataImport).countBy({ unitId: unit.id })).toBe(0);
  });

  it('answers 507 when the disk fills while a ZIP of files is unpacked, leaving neither the ZIP nor its files', async () => {
    const zip = buildZip([0, 1, 2].map((k) => ({ name: `tag-${k}.csv`, data: tagFile(k) })));
    const disk = fillDiskAfter(zip.length + 200 * 1024);
    const res = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', zip, 'tags.zip');
    expect(disk.partWritten()).toBe(true);
    expect(res.status, JSON.stringify(res.body)).toBe(507);
    expect(res.body.error).toMatch(/nothing was stored/i);
    expect(await readdir(uploadDir)).toEqual([]);
    expect(await t.dataSource.getRepository(DataImport).countBy({ unitId: unit.id })).toBe(0);
  });

  it('once there is room again, the same upload is stored', async () => {
    const rows = physicalHistory({ startUtc: Date.UTC(2024, 0, 1), hours: 48, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    const res = await analyst
      .post(`/api/units/${unit.id}/uploads`)
      .set(CSRF)
      .attach('file', Buffer.from(csvLines(rows).join('\n')), 'history.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(await readdir(uploadDir)).toHaveLength(1);
  });
});
