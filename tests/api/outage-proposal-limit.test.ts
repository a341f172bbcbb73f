/**
 * Proposing an outage's scope runs the optimiser (up to about a second on adversarial figures): one member asking
 * for proposals faster than a person would is told to wait (429, in our words), and other members are not slowed.
 * Figures invented for tests.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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

describe('outage proposals are rate limited per member', () => {
  it('a member proposing in a loop gets 429 with a reason; another member still gets proposals', async () => {
    const tenant = await createTenant(t.dataSource, 'outage-propose-limit');
    const plant = await createPlant(t.dataSource, tenant.organisation.id);
    const unit = await createUnit(t.dataSource, plant);
    const { outage } = await createOutageRecord(t.dataSource, [unit], tenant.users.admin.id, {
      name: 'Looping outage',
      items: [{ title: 'Lance the tubes', cost: 40_000, durationDays: 3, lane: 'Waterbox A', benefit: 90_000 }],
    });
    const analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    let last = 0;
    let tries = 0;
    for (; tries < 100 && last !== 429; tries++) {
      const res = await analyst.post(`/api/outages/${outage.id}/optimise`).set(CSRF).send({});
      last = res.status;
      if (last === 429) {
        expect(res.body.error ?? res.body.message).toMatch(/Too many outage proposals/);
        expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      } else expect(last, JSON.stringify(res.body)).toBe(200);
    }
    expect(last).toBe(429);
    expect(tries).toBeGreaterThan(30);
    const approver = await signedInAgent(t.app, tenant.users.approver.email);
    expect((await approver.post(`/api/outages/${outage.id}/optimise`).set(CSRF).send({})).status).toBe(200);
  });
});
