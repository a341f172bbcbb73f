import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('GET /api/health', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('reports the database as up when MariaDB answers', async () => {
    const res = await request(t.app).get('/api/health').expect(200);
    expect(res.body.status).toBe('ok');
    expect(res.body.database.status).toBe('up');
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('carries security headers from helmet', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('answers an unknown API path with a JSON 404', async () => {
    const res = await request(t.app).get('/api/no-such-thing').expect(404);
    expect(res.body.error).toMatch(/No such API endpoint/);
  });

  it('reports the database as down, with 503, when the connection is gone', async () => {
    const { createTestApp: make } = await import('../helpers/test-app.js');
    const other = await make();
    await other.dataSource.destroy();
    const res = await request(other.app).get('/api/health').expect(503);
    expect(res.body.database.status).toBe('down');
    await other.app.locals.close();
    await other.smtpSink.close();
  });
});
