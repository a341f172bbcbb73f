/**
 * The database keeps a committed transaction through a crash (settings the README's scale-out section names),
 * and every answer — API success, API error, unknown path, malformed body, static file, app shell — carries the
 * security headers.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, type CleancaseApp } from '../../backend/src/app.js';
import { createLogger } from '../../backend/src/logger.js';
import { CSRF, createTenant, signedInAgent } from '../factories/accounts.js';
import { makeTempDir } from '../helpers/historian-files.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let app: CleancaseApp;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;

beforeAll(async () => {
  t = await createTestApp();
  tmp = await makeTempDir();
  const dist = tmp.file('dist');
  await mkdir(tmp.file('dist/assets'), { recursive: true });
  await writeFile(tmp.file('dist/index.html'), '<!doctype html><title>Cleancase</title>');
  await writeFile(tmp.file('dist/assets/app.js'), 'console.log(1)');
  app = createApp({ config: t.config, dataSource: t.dataSource, logger: createLogger('silent'), mailer: t.mailer, devMailbox: true, staticDir: dist });
});
afterAll(async () => {
  await app?.locals.close();
  await t?.close();
  await tmp?.cleanup();
});

describe('durability settings of the database', () => {
  it('flushes the redo log at every commit, syncs the binary log at every commit and writes pages twice', async () => {
    const [row] = await t.dataSource.query(
      'SELECT @@innodb_flush_log_at_trx_commit AS flush, @@sync_binlog AS syncBinlog, @@innodb_doublewrite AS doublewrite, @@log_bin AS logBin',
    );
    expect(Number(row.flush)).toBe(1);
    expect(Number(row.syncBinlog)).toBe(1);
    expect(Number(row.doublewrite)).toBe(1);
    // The private instance is a single server: no binary log (the README says so; a replica set turns it on with sync_binlog=1 already set).
    expect(Number(row.logBin)).toBe(0);
  });
});

describe('security headers on every kind of answer', () => {
  const expectHeaders = (res: request.Response, what: string) => {
    expect(res.headers['content-security-policy'], what).toContain("default-src 'self'");
    expect(res.headers['x-content-type-options'], what).toBe('nosniff');
    expect(res.headers['x-frame-options'], what).toBe('SAMEORIGIN');
    expect(res.headers['strict-transport-security'], what).toMatch(/max-age=\d+/);
    expect(res.headers['referrer-policy'], what).toBe('no-referrer');
    expect(res.headers['cross-origin-opener-policy'], what).toBe('same-origin');
    expect(res.headers['x-powered-by'], what).toBeUndefined();
  };

  it('on every GET route of the registry, signed in or not', async () => {
    const tenant = await createTenant(t.dataSource, 'headers');
    const admin = await signedInAgent(app, tenant.users.admin.email);
    const gets = app.locals.routes.filter((r) => r.method === 'get');
    expect(gets.length).toBeGreaterThan(20);
    for (const r of gets) {
      const p = r.path.replace(/:[A-Za-z]+/g, '00000000-0000-4000-8000-000000000000');
      expectHeaders(await request(app).get(p), `anonymous GET ${r.path}`);
      expectHeaders(await admin.get(p), `admin GET ${r.path}`);
    }
  });

  it('on every unsafe route without a session, the API answers for unknown paths and malformed or oversized bodies', async () => {
    for (const r of app.locals.routes.filter((x) => x.method !== 'get')) {
      const p = r.path.replace(/:[A-Za-z]+/g, '00000000-0000-4000-8000-000000000000');
      expectHeaders(await request(app)[r.method](p).set(CSRF).send({}), `${r.method} ${r.path}`);
    }
    const unknown = await request(app).get('/api/no-such-thing');
    expect(unknown.status).toBe(404);
    expectHeaders(unknown, 'unknown API path');
    const malformed = await request(app).post('/api/session').set(CSRF).set('content-type', 'application/json').send('{"email": ');
    expect(malformed.status).toBe(400);
    expectHeaders(malformed, 'malformed JSON');
    const oversized = await request(app)
      .post('/api/session')
      .set(CSRF)
      .set('content-type', 'application/json')
      .send(JSON.stringify({ email: 'x'.repeat(2 * 1024 * 1024) }));
    expect(oversized.status).toBe(413);
    expectHeaders(oversized, 'oversized body');
  });

  it('on static files and the app shell', async () => {
    const js = await request(app).get('/assets/app.js').expect(200);
    expectHeaders(js, 'static file');
    const shell = await request(app).get('/plants/anything').expect(200);
    expect(shell.text).toContain('<title>Cleancase</title>');
    expectHeaders(shell, 'app shell');
    expectHeaders(await request(app).get('/assets/missing.js'), 'missing static file');
  });
});
