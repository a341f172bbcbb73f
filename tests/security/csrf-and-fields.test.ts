import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PRIVILEGED_FIELDS } from '../../backend/src/http/privileged-fields.js';
import { createTenant, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

/** A concrete path for a registered pattern (ids that do not exist are fine: the guards answer first). */
const concrete = (path: string) =>
  path.replace(':id', '00000000-0000-4000-8000-000000000000').replace(':token', 'x'.repeat(20)).replace(':command', 'saturation');

/** Stripe's webhook is checked by its signature instead (no session, no header, its body the raw bytes Stripe signed). */
const STRIPE_WEBHOOK = '/api/billing/webhook';

describe('CSRF defence on every state-changing route', () => {
  let t: TestApp;
  let tenant: TenantFixture;
  let admin: TestAgent;

  beforeAll(async () => {
    t = await createTestApp();
    tenant = await createTenant(t.dataSource, 'csrf');
    admin = await signedInAgent(t.app, tenant.users.admin.email);
  });
  afterAll(async () => t?.close());

  const unsafe = () => t.app.locals.routes.filter((r) => r.method !== 'get' && r.path !== STRIPE_WEBHOOK);

  it('lets only the Stripe webhook go without the CSRF check, and it refuses an unsigned request', async () => {
    expect(t.app.locals.routes.filter((r) => r.csrf === false).map((r) => `${r.method} ${r.path}`)).toEqual([`post ${STRIPE_WEBHOOK}`]);
    const res = await admin.post(STRIPE_WEBHOOK).set('content-type', 'application/json').send('{"type":"invoice.paid"}');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/signature/);
  });

  it('covers every unsafe route (none opts out of the check)', () => {
    expect(unsafe().length).toBeGreaterThan(15);
    expect(unsafe().filter((r) => r.csrf === false)).toEqual([]);
  });

  it('refuses an unsafe request without our request header, before doing anything', async () => {
    for (const route of unsafe()) {
      const res = await admin[route.method](concrete(route.path)).send({});
      expect(res.status, `${route.method} ${route.path}`).toBe(403);
      expect(res.body.error).toMatch(/Missing request header/);
    }
  });

  it('refuses a request whose Origin is another site even with the header', async () => {
    for (const route of unsafe()) {
      const res = await admin[route.method](concrete(route.path)).set(CSRF).set('Origin', 'https://evil.example').send({});
      expect(res.status, `${route.method} ${route.path}`).toBe(403);
      expect(res.body.error).toBe('Cross-site request refused');
    }
  });

  it('refuses a request the browser marks as cross-site (Sec-Fetch-Site)', async () => {
    for (const route of unsafe()) {
      const res = await admin[route.method](concrete(route.path)).set(CSRF).set('Sec-Fetch-Site', 'cross-site').send({});
      expect(res.status, `${route.method} ${route.path}`).toBe(403);
    }
  });

  it('accepts a same-origin request with the header', async () => {
    const res = await admin
      .patch('/api/profile')
      .set(CSRF)
      .set('Host', 'cleancase.test')
      .set('Origin', 'http://cleancase.test')
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ unitPreference: 'si' });
    expect(res.status).toBe(200);
    expect(res.body.user.unitPreference).toBe('si');
  });
});

describe('tenant, role and billing fields in a request body', () => {
  let t: TestApp;
  let admin: TestAgent;

  beforeAll(async () => {
    t = await createTestApp();
    const tenant = await createTenant(t.dataSource, 'fields');
    admin = await signedInAgent(t.app, tenant.users.admin.email);
  });
  afterAll(async () => t?.close());

  it('answer 400 on every unsafe route except those whose job is to set them', async () => {
    const routes = t.app.locals.routes.filter((r) => r.method !== 'get' && !r.allowsPrivilegedFields && r.path !== STRIPE_WEBHOOK);
    for (const route of routes) {
      for (const field of ['organisationId', 'role', 'subscriptionStatus']) {
        const res = await admin[route.method](concrete(route.path))
          .set(CSRF)
          .send({ [field]: 'x' });
        expect(res.status, `${route.method} ${route.path} with ${field}`).toBe(400);
        expect(res.body.error).toContain(field);
      }
    }
  });

  it('lists the endpoints that may set them: invite, change role, switch tenant', () => {
    const allowed = t.app.locals.routes
      .filter((r) => r.allowsPrivilegedFields)
      .map((r) => `${r.method.toUpperCase()} ${r.path}`)
      .sort();
    expect(allowed).toEqual(['PATCH /api/members/:id', 'POST /api/invitations', 'POST /api/session/organisation']);
    expect(PRIVILEGED_FIELDS).toEqual(expect.arrayContaining(['organisationId', 'role', 'plan', 'stripeCustomerId']));
  });
});
