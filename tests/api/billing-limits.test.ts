/**
 * Plan limits and read-only mode on the server. Limits: the message names the limit and the plan that lifts it,
 * and two requests racing for the last slot end with exactly one success. Read-only: every write route of the
 * registry (so also routes added later) answers 402 with the reason, reads and downloads keep working, billing stays open.
 */
import { randomUUID } from 'node:crypto';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ClientGroup } from '../../backend/src/entities/client-group.entity.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import { PAST_DUE_GRACE_DAYS } from '../../shared/billing-access.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { addMember, createClientGroup, createTenant, createUser, CSRF, signedInAgent, type TenantFixture, uniqueEmail } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t?.close();
});

const DAY = 86_400_000;
const orgs = () => t.dataSource.getRepository(Organisation);

/** A tenant on a paid plan as the webhook leaves it (no Stripe call needed to read limits). */
async function onPlan(plan: 'plant' | 'station', status: Organisation['subscriptionStatus'] = 'active', extra: Partial<Organisation> = {}) {
  const tenant = await createTenant(t.dataSource, `limits-${plan}`);
  await orgs().update(
    { id: tenant.organisation.id },
    { plan, priceLookupKey: `cleancase_${plan}_month`, subscriptionStatus: status, stripeSubscriptionId: `sub_test_${randomUUID().slice(0, 8)}`, ...extra },
  );
  return { tenant, admin: await signedInAgent(t.app, tenant.users.admin.email) };
}

async function race(agent: TestAgent, times: number, call: (a: TestAgent, i: number) => Promise<{ status: number; body: { error?: string } }>) {
  return Promise.all(Array.from({ length: times }, (_, i) => call(agent, i)));
}

describe('plan limits', () => {
  it('two requests for the last unit: exactly one is made, the other is told the limit and the plan that lifts it', async () => {
    for (let round = 0; round < 3; round++) {
      const { tenant, admin } = await onPlan('plant');
      const plant = await createPlant(t.dataSource, tenant.organisation.id);
      await createUnit(t.dataSource, plant);
      const answers = await race(admin, 2, (a, i) =>
        a
          .post(`/api/plants/${plant.id}/units`)
          .set(CSRF)
          .send({ name: `Unit race ${i}` }),
      );
      expect(answers.map((r) => r.status).sort()).toEqual([201, 402]);
      const refused = answers.find((r) => r.status === 402)!;
      expect(refused.body.error).toBe(
        'The Plant plan allows 2 units and this organisation has 2. The Station plan allows 10 units: an administrator can change the plan under Settings → Billing.',
      );
      expect(await t.dataSource.getRepository(GeneratingUnit).countBy({ organisationId: tenant.organisation.id })).toBe(2);
    }
  });

  it('two requests for the last client group: exactly one is made', async () => {
    const { tenant, admin } = await onPlan('station');
    for (let i = 0; i < 2; i++) await createClientGroup(t.dataSource, tenant.organisation.id); // 4 of 5
    const answers = await race(admin, 2, (a, i) =>
      a
        .post('/api/client-groups')
        .set(CSRF)
        .send({ name: `Race group ${i}` }),
    );
    expect(answers.map((r) => r.status).sort()).toEqual([201, 402]);
    expect(answers.find((r) => r.status === 402)!.body.error).toMatch(/The Station plan allows 5 client groups .* The Fleet plan allows 10 client groups/);
    expect(await t.dataSource.getRepository(ClientGroup).countBy({ organisationId: tenant.organisation.id })).toBe(5);
  });

  it('client-limited members count against the seats; a plan without seats says which plan has them', async () => {
    const { tenant, admin } = await onPlan('plant');
    const res = await admin
      .post('/api/invitations')
      .set(CSRF)
      .send({ email: uniqueEmail('client'), role: 'viewer', clientGroupIds: [tenant.groups[0].id] });
    expect(res.status).toBe(402);
    expect(res.body.error).toMatch(/The Plant plan has no client-limited members\. The Station plan allows 5 client-limited members/);
    // Members without a client-group limit are not seats.
    expect(
      (
        await admin
          .post('/api/invitations')
          .set(CSRF)
          .send({ email: uniqueEmail('staff'), role: 'viewer' })
      ).status,
    ).toBe(201);

    const station = await onPlan('station');
    for (let i = 0; i < 4; i++)
      await addMember(t.dataSource, station.tenant.organisation.id, await createUser(t.dataSource, 'seat'), 'viewer', [station.tenant.groups[0].id]);
    const answers = await race(station.admin, 2, (a) =>
      a
        .post('/api/invitations')
        .set(CSRF)
        .send({ email: uniqueEmail('client'), role: 'viewer', clientGroupIds: [station.tenant.groups[0].id] }),
    );
    expect(answers.map((r) => r.status).sort()).toEqual([201, 402]);
  });

  it('limiting an existing member to client groups takes a seat too', async () => {
    const { tenant, admin } = await onPlan('plant');
    const res = await admin
      .patch(`/api/members/${tenant.memberships.viewer.id}`)
      .set(CSRF)
      .send({ clientGroupIds: [tenant.groups[0].id] });
    expect(res.status).toBe(402);
    expect(res.body.error).toMatch(/The Plant plan has no client-limited members/);
    expect((await admin.patch(`/api/members/${tenant.memberships.viewer.id}`).set(CSRF).send({ role: 'analyst' })).status).toBe(204);
  });
});

/** Every unsafe tenant-scoped route of the registry that is not billing, with its ids filled in by made-up ones. */
const writeRoutes = () =>
  t.app.locals.routes
    .filter((r) => r.method !== 'get' && r.tenantScoped && !r.openWhenReadOnly)
    .map((r) => ({ method: r.method, path: r.path.replace(/:[a-zA-Z]+/g, randomUUID()) }));

const LAPSES: [string, (tenant: TenantFixture) => Partial<Organisation>, RegExp][] = [
  ['a trial that ended unpaid', () => ({ subscriptionStatus: 'trialing', trialEndsAt: new Date(Date.now() - DAY) }), /The trial ended on/],
  [
    `a payment past due beyond the ${PAST_DUE_GRACE_DAYS}-day grace`,
    () => ({ subscriptionStatus: 'past_due', stripeSubscriptionId: 'sub_x', pastDueSince: new Date(Date.now() - (PAST_DUE_GRACE_DAYS + 1) * DAY) }),
    /has not been made/,
  ],
  ['a canceled subscription', () => ({ subscriptionStatus: 'canceled', stripeSubscriptionId: 'sub_x' }), /The subscription has ended/],
];

describe.each(LAPSES)('read-only after %s', (_label, lapse, reason) => {
  let tenant: TenantFixture;
  let admin: TestAgent;
  let plantId: string;
  beforeAll(async () => {
    tenant = await createTenant(t.dataSource, 'lapsed');
    const plant = await createPlant(t.dataSource, tenant.organisation.id);
    plantId = plant.id;
    await createUnit(t.dataSource, plant);
    await orgs().update({ id: tenant.organisation.id }, lapse(tenant));
    admin = await signedInAgent(t.app, tenant.users.admin.email);
  });

  it('every write route of the registry answers 402 with the reason', async () => {
    const routes = writeRoutes();
    expect(routes.length).toBeGreaterThan(20);
    const wrong: string[] = [];
    for (const r of routes) {
      const res = await admin[r.method](r.path).set(CSRF).send({});
      if (res.status !== 402 || !reason.test(res.body.error) || !/Nothing has been deleted/.test(res.body.error))
        wrong.push(`${r.method} ${r.path}: ${res.status}`);
    }
    expect(wrong).toEqual([]);
  });

  it('reads and downloads keep working, and nothing was deleted', async () => {
    expect((await admin.get('/api/plants')).status).toBe(200);
    const plant = await admin.get(`/api/plants/${plantId}`);
    expect(plant.status).toBe(200);
    const unitId = (await t.dataSource.getRepository(GeneratingUnit).findOneByOrFail({ plantId })).id;
    const csv = await admin.get(`/api/units/${unitId}/export?dataset=daily&format=csv`);
    expect(csv.status).toBe(200);
    const notice = await admin.get('/api/billing/notice');
    expect(notice.body.readOnly).toMatch(reason);
  });

  it('billing stays open (the way back), and so do signing out and switching organisation', async () => {
    const res = await admin.get('/api/billing');
    expect(res.status).toBe(200);
    expect(res.body.readOnly).toMatch(reason);
    const other = await createTenant(t.dataSource, 'second');
    await addMember(t.dataSource, other.organisation.id, tenant.users.admin, 'viewer');
    expect((await admin.post('/api/session/organisation').set(CSRF).send({ organisationId: other.organisation.id })).status).toBe(200);
    expect((await admin.delete('/api/session').set(CSRF)).status).toBe(204);
  });
});

describe('not read-only', () => {
  it('while past due within the grace period, or on a running trial', async () => {
    const pastDue = await onPlan('station', 'past_due', { pastDueSince: new Date(Date.now() - (PAST_DUE_GRACE_DAYS - 1) * DAY) });
    expect((await pastDue.admin.post('/api/client-groups').set(CSRF).send({ name: 'Still writable' })).status).toBe(201);
    const trial = await createTenant(t.dataSource, 'running-trial');
    await orgs().update({ id: trial.organisation.id }, { trialEndsAt: new Date(Date.now() + DAY) });
    const agent = await signedInAgent(t.app, trial.users.admin.email);
    expect((await agent.post('/api/client-groups').set(CSRF).send({ name: 'Trial group' })).status).toBe(201);
    expect((await agent.get('/api/billing/notice')).body).toMatchObject({ readOnly: null, trialDaysLeft: 1, trialEndingSoon: true });
  });
});
