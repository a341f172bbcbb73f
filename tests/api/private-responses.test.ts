/**
 * API answers that carry private data must not be kept by a browser or a shared proxy cache
 * (RFC 9111 §5.2.2.5 no-store).
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTenant, CSRF, signedInAgent } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('private API answers are not cached', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t?.close();
  });

  it('the member list, a unit export and a new API token answer with Cache-Control: no-store', async () => {
    const tenant = await createTenant(t.dataSource, 'nostore');
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const admin = await signedInAgent(t.app, tenant.users.admin.email);

    const members = await admin.get('/api/members').expect(200);
    expect(members.headers['cache-control']).toBe('no-store');

    const exported = await admin.get(`/api/units/${unit.id}/export`).query({ dataset: 'daily', format: 'csv' }).expect(200);
    expect(exported.headers['cache-control']).toBe('no-store');

    const token = await admin.post('/api/api-tokens').set(CSRF).send({ name: 'nightly batch' }).expect(201);
    expect(token.headers['cache-control']).toBe('no-store');
  });

  it('error answers and the session answer are not cached either', async () => {
    const missing = await request(t.app).get('/api/no-such-thing').expect(404);
    expect(missing.headers['cache-control']).toBe('no-store');
    const session = await request(t.app).get('/api/session').expect(200);
    expect(session.headers['cache-control']).toBe('no-store');
  });
});
