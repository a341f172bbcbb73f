/**
 * Several files of one tag each are limited together, not only one by one: past the limit the file being read is
 * stopped, every file of the request is removed and the answer is 413 in our words.
 */
import { readdir } from 'node:fs/promises';
import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorHandler } from '@backend/http/error-handler.js';
import { historianUpload } from '@backend/http/upload.js';
import { makeTempDir } from './import-fixtures.js';

let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp.cleanup();
});

function app(dir: string) {
  const a = express();
  a.post('/upload', historianUpload(dir, 256 * 1024), (req, res) => {
    res.json({ files: (req.files as Express.Multer.File[]).map((f) => f.originalname) });
  });
  a.use(errorHandler);
  return a;
}

describe('files uploaded together', () => {
  it('are taken while together within the limit', async () => {
    const dir = tmp.file('within');
    const res = await request(app(dir))
      .post('/upload')
      .attach('file', Buffer.alloc(100 * 1024, 0x31), 'a.csv')
      .attach('file', Buffer.alloc(100 * 1024, 0x32), 'b.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.files).toEqual(['a.csv', 'b.csv']);
    expect(await readdir(dir)).toHaveLength(2);
  });

  it('past the limit together answer 413 and leave no file, though each is within the limit alone', async () => {
    const dir = tmp.file('past');
    const res = await request(app(dir))
      .post('/upload')
      .attach('file', Buffer.alloc(100 * 1024, 0x31), 'a.csv')
      .attach('file', Buffer.alloc(100 * 1024, 0x32), 'b.csv')
      .attach('file', Buffer.alloc(100 * 1024, 0x33), 'c.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(413);
    expect(res.body.error).toBe('The files together are larger than 0.25 MB: nothing was stored');
    expect(await readdir(dir)).toEqual([]);
  });
});
