/**
 * How the built front end is served: its files leave compressed when the browser accepts it, the content-hashed files
 * under /assets/ may be kept by the browser for a year without asking again (a new build has new names), and the app
 * shell (index.html, which names the current hashed files) is checked with the server on every load.
 */
import { once } from 'node:events';
import { mkdir, writeFile } from 'node:fs/promises';
import { get, type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo } from 'node:net';
import { gunzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, type CleancaseApp } from '../../backend/src/app.js';
import { createLogger } from '../../backend/src/logger.js';
import { makeTempDir } from '../helpers/historian-files.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let app: CleancaseApp;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;
// large enough to be worth compressing (the middleware leaves answers under 1 KB alone)
const script = `export const figures = [${Array.from({ length: 2000 }, (_, i) => i).join(',')}];\n`;

beforeAll(async () => {
  t = await createTestApp();
  tmp = await makeTempDir();
  await mkdir(tmp.file('dist/assets'), { recursive: true });
  await writeFile(tmp.file('dist/index.html'), `<!doctype html><title>Cleancase</title>${'<!-- shell -->'.repeat(200)}`);
  await writeFile(tmp.file('dist/assets/health-charts-Ab12Cd34.js'), script);
  app = createApp({ config: t.config, dataSource: t.dataSource, logger: createLogger('silent'), mailer: t.mailer, staticDir: tmp.file('dist') });
});
afterAll(async () => {
  await app?.locals.close();
  await t?.close();
  await tmp?.cleanup();
});

/** The answer's bytes as they went over the wire (supertest would decode them), with its status and headers. */
async function raw(address: string, encoding: string): Promise<{ status: number; headers: IncomingHttpHeaders; body: Buffer }> {
  const server = app.listen(0, '127.0.0.1');
  await once(server, 'listening');
  try {
    const { port } = server.address() as AddressInfo;
    return await new Promise((resolve, reject) => {
      get({ host: '127.0.0.1', port, path: address, headers: { 'Accept-Encoding': encoding } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
        res.on('error', reject);
      }).on('error', reject);
    });
  } finally {
    server.close();
  }
}

describe('the built front end', () => {
  it('sends a script gzip-compressed to a browser that accepts gzip, and it decodes to the file', async () => {
    const res = await raw('/assets/health-charts-Ab12Cd34.js', 'gzip');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers['vary']).toMatch(/accept-encoding/i);
    const body = res.body;
    expect(body.length).toBeLessThan(script.length / 2);
    expect(gunzipSync(body).toString()).toBe(script);
  });

  it('sends the script as it is to a client that accepts no compression', async () => {
    const res = await raw('/assets/health-charts-Ab12Cd34.js', 'identity');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.body.toString()).toBe(script);
  });

  it('lets the browser keep a content-hashed file for a year without asking again', async () => {
    const res = await request(app).get('/assets/health-charts-Ab12Cd34.js').expect(200);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('has the browser check the app shell with the server on every load, whichever address serves it', async () => {
    for (const address of ['/units/some-unit', '/', '/index.html']) {
      const res = await raw(address, 'gzip');
      expect(res.status, address).toBe(200);
      expect(res.headers['cache-control'], address).toBe('no-cache');
      expect(res.headers['content-encoding'], address).toBe('gzip');
      expect(gunzipSync(res.body).toString(), address).toContain('<title>Cleancase</title>');
    }
  });

  it('keeps API answers out of every cache', async () => {
    const res = await request(app).get('/api/no-such-thing').expect(404);
    expect(res.headers['cache-control']).toBe('no-store');
  });
});
