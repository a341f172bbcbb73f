/**
 * Security review: two writes that go around a rule enforced on the obvious route.
 * 1. Seats (client-limited members) are checked when inviting (services/invitation.service.ts) but not when an
 *    administrator puts a client-group limit on an existing member (services/member.service.ts updateMember), so a
 *    plan with no seats ends with client-limited members: invite unrestricted, then PATCH /api/members/:id.
 * 2. An approved outage is a frozen snapshot (outage-rules.ts), yet deleting one of its units
 *    (services/plant.service.ts deleteUnit) cascades its outage_unit link and its items away without a word in
 *    the outage's audit, while an approved case on a unit refuses the same deletion.
 * Both tests fail on the code as reviewed.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Membership } from '../../backend/src/entities/membership.entity.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import { OutageItem } from '../../backend/src/entities/outage-item.entity.js';
import { OutageUnit } from '../../backend/src/entities/outage-unit.entity.js';
import { createTenant, CSRF, signedInAgent } from '../factories/accounts.js';
import { createOutageRecord } from '../factories/outages.js';
import { createPlant, createUnit } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t?.close();
});

describe('plan seats cannot be gained by limiting an existing member', () => {
  it('the Plant plan (no client-limited seats) refuses PATCH /api/members/:id that sets a client-group limit', async () => {
    const tenant = await createTenant(t.dataSource, 'review-seats');
    await t.dataSource
      .getRepository(Organisation)
      .update(
        { id: tenant.organisation.id },
        { plan: 'plant', priceLookupKey: 'cleancase_plant_month', subscriptionStatus: 'active', stripeSubscriptionId: `sub_test_${randomUUID().slice(0, 8)}` },
      );
    const admin = await signedInAgent(t.app, tenant.users.admin.email);

    // Control: the invitation route refuses a client-limited seat on this plan.
    const invite = await admin
      .post('/api/invitations')
      .set(CSRF)
      .send({ email: `x.${randomUUID().slice(0, 6)}@example.test`, role: 'viewer', clientGroupIds: [tenant.groups[0].id] });
    expect(invite.status).toBe(402);

    // The way around it: limit the unrestricted viewer already in the organisation.
    const res = await admin
      .patch(`/api/members/${tenant.memberships.viewer.id}`)
      .set(CSRF)
      .send({ clientGroupIds: [tenant.groups[0].id] });
    // Fails today: 204 and the organisation holds a client-limited member the plan does not allow.
    expect(res.status).toBe(402);
    const m = await t.dataSource.getRepository(Membership).findOneByOrFail({ id: tenant.memberships.viewer.id });
    expect(m.clientGroupIds).toBeNull();
  });
});

describe('an approved outage keeps its units and items', () => {
  it('deleting a unit an approved outage takes off line is refused, as for a unit with an approved case', async () => {
    const tenant = await createTenant(t.dataSource, 'review-snapshot');
    const plant = await createPlant(t.dataSource, tenant.organisation.id);
    const unit = await createUnit(t.dataSource, plant);
    const other = await createUnit(t.dataSource, plant);
    const { outage } = await createOutageRecord(t.dataSource, [unit, other], tenant.users.admin.id, {
      status: 'approved',
      items: [{ title: 'Lance the tubes', cost: 40_000, durationDays: 3, lane: 'Waterbox A', benefit: 90_000, unit }],
    });
    const analyst = await signedInAgent(t.app, tenant.users.analyst.email);

    const res = await analyst.delete(`/api/units/${unit.id}`).set(CSRF);
    // Fails today: 204, and the approved outage silently loses the unit and its item.
    expect(res.status).toBe(409);
    expect(await t.dataSource.getRepository(OutageUnit).countBy({ outageId: outage.id })).toBe(2);
    expect(await t.dataSource.getRepository(OutageItem).countBy({ outageId: outage.id })).toBe(1);
  });
});
