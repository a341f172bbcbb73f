import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTenant, CSRF, signedInAgent, TEST_PASSWORD, type TenantFixture } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

const sessionCookie = (res: request.Response): string | undefined =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('cleancase.sid='));
const cookieValue = (setCookie: string) => setCookie.split(';')[0]!;

describe('sessions', () => {
  let t: TestApp;
  let tenant: TenantFixture;
  beforeAll(async () => {
    t = await createTestApp();
    tenant = await createTenant(t.dataSource, 'sessions');
  });
  afterAll(async () => t?.close());

  it('sets an HttpOnly, SameSite=Lax session cookie, without Secure on local HTTP', async () => {
    const res = await request(t.app).post('/api/session').set(CSRF).send({ email: tenant.users.viewer.email, password: TEST_PASSWORD }).expect(200);
    const cookie = sessionCookie(res)!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('adds Secure when the app is served over HTTPS through a configured proxy', async () => {
    const secure = await createTestApp({ COOKIE_SECURE: 'true', TRUST_PROXY: 'loopback', SMTP_URL: 'smtp://127.0.0.1:1' });
    try {
      const tenant2 = await createTenant(secure.dataSource, 'secure');
      const res = await request(secure.app)
        .post('/api/session')
        .set(CSRF)
        .set('X-Forwarded-Proto', 'https')
        .send({ email: tenant2.users.viewer.email, password: TEST_PASSWORD });
      expect(res.status).toBe(200);
      expect(sessionCookie(res)).toMatch(/Secure/);
    } finally {
      await secure.close();
    }
  });

  it('gives a new session id at sign-in; the old id no longer signs anyone in', async () => {
    const first = await request(t.app).post('/api/session').set(CSRF).send({ email: tenant.users.analyst.email, password: TEST_PASSWORD });
    const oldCookie = cookieValue(sessionCookie(first)!);
    const second = await request(t.app)
      .post('/api/session')
      .set(CSRF)
      .set('Cookie', oldCookie)
      .send({ email: tenant.users.analyst.email, password: TEST_PASSWORD });
    const newCookie = cookieValue(sessionCookie(second)!);
    expect(newCookie).not.toBe(oldCookie);
    const withOld = await request(t.app).get('/api/session').set('Cookie', oldCookie);
    expect(withOld.body.user).toBeNull();
    const withNew = await request(t.app).get('/api/session').set('Cookie', newCookie);
    expect(withNew.body.user.email).toBe(tenant.users.analyst.email);
  });

  it('ends the session at sign-out', async () => {
    const agent = await signedInAgent(t.app, tenant.users.approver.email);
    await agent.delete('/api/session').set(CSRF).expect(204);
    expect((await agent.get('/api/session')).body.user).toBeNull();
    await agent.get('/api/members').expect(401);
  });

  it('stores sessions in MariaDB, not in memory', async () => {
    const before = (await t.dataSource.query('SELECT COUNT(*) AS n FROM sessions'))[0].n;
    await signedInAgent(t.app, tenant.users.viewer.email);
    const after = (await t.dataSource.query('SELECT COUNT(*) AS n FROM sessions'))[0].n;
    expect(Number(after)).toBeGreaterThan(Number(before));
  });

  it('when the password changes, every other session of that person ends and this one continues', async () => {
    const tenant3 = await createTenant(t.dataSource, 'pwchange');
    const email = tenant3.users.admin.email;
    const here = await signedInAgent(t.app, email);
    const elsewhere = await signedInAgent(t.app, email);
    const res = await here.post('/api/profile/password').set(CSRF).send({ currentPassword: TEST_PASSWORD, newPassword: 'a brand new passphrase for sure' });
    expect(res.status).toBe(200);
    expect((await here.get('/api/session')).body.user.email).toBe(email);
    expect((await elsewhere.get('/api/session')).body.user).toBeNull();
    await request(t.app).post('/api/session').set(CSRF).send({ email, password: TEST_PASSWORD }).expect(401);
    await request(t.app).post('/api/session').set(CSRF).send({ email, password: 'a brand new passphrase for sure' }).expect(200);
  });

  it('answers an unknown e-mail and a wrong password the same way', async () => {
    const unknown = await request(t.app).post('/api/session').set(CSRF).send({ email: 'nobody-here@example.test', password: 'whatever password' });
    const wrong = await request(t.app).post('/api/session').set(CSRF).send({ email: tenant.users.viewer.email, password: 'whatever password' });
    expect(unknown.status).toBe(401);
    expect(wrong.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
  });
});

describe('rate limits', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t?.close());

  it('sign-in: after 10 failures for one account, the 11th answers 429 with Retry-After; other accounts still sign in', async () => {
    const tenant = await createTenant(t.dataSource, 'ratelimit');
    const victim = tenant.users.viewer.email;
    for (let i = 0; i < 10; i++) await request(t.app).post('/api/session').set(CSRF).send({ email: victim, password: 'wrong guess number x' }).expect(401);
    const limited = await request(t.app).post('/api/session').set(CSRF).send({ email: victim, password: TEST_PASSWORD });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0);
    await request(t.app).post('/api/session').set(CSRF).send({ email: tenant.users.analyst.email, password: TEST_PASSWORD }).expect(200);
  });

  it('password reset: 5 requests per address and hour, then 429 with Retry-After', async () => {
    for (let i = 0; i < 5; i++) await request(t.app).post('/api/password-reset').set(CSRF).send({ email: 'someone@example.test' }).expect(202);
    const limited = await request(t.app).post('/api/password-reset').set(CSRF).send({ email: 'someone@example.test' });
    expect(limited.status).toBe(429);
    expect(limited.headers['retry-after']).toBeDefined();
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email: 'someone-else@example.test' }).expect(202);
  });

  it('invitations: 30 per session and hour, then 429', async () => {
    const tenant = await createTenant(t.dataSource, 'invites');
    const admin = await signedInAgent(t.app, tenant.users.admin.email);
    for (let i = 0; i < 30; i++) {
      await admin
        .post('/api/invitations')
        .set(CSRF)
        .send({ email: `invitee${i}@example.test`, role: 'viewer' })
        .expect(201);
    }
    const limited = await admin.post('/api/invitations').set(CSRF).send({ email: 'one-more@example.test', role: 'viewer' });
    expect(limited.status).toBe(429);
    expect(limited.headers['retry-after']).toBeDefined();
  });
});
