/**
 * Security review: an outage adds money in one currency (create-outage.ts, edit-outage.ts and a case's cleaning in
 * price-item.ts all refuse another), but a recovered cleanliness is priced with the unit's own economics
 * (price-item.ts priceCleanliness) without comparing the unit's currency with the outage's. After the unit's
 * economics move to EUR (PUT /api/units/:id/economics, unguarded), an item priced in EUR is stored and summed
 * as USD in the outage's budget and totals. Fails on the code as reviewed.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutageItem } from '../../backend/src/entities/outage-item.entity.js';
import { createTenant, CSRF, signedInAgent } from '../factories/accounts.js';
import { writeSteadyDays } from '../factories/outages.js';
import { createPlant, createUnit, TEST_ECONOMICS } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t?.close();
});

describe('an outage never adds money of two currencies', () => {
  it('a cleanliness item on a unit whose economics now count EUR is refused in a USD outage', async () => {
    const tenant = await createTenant(t.dataSource, 'review-currency');
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    await writeSteadyDays(t.dataSource, unit, { lastDay: '2026-09-30', days: 30, cleanliness: 0.7, cwInletC: 20, loadMw: 289 });
    const analyst = await signedInAgent(t.app, tenant.users.analyst.email);

    const created = await analyst
      .post('/api/outages')
      .set(CSRF)
      .send({ name: 'Autumn outage', unitIds: [unit.id], startDate: '2026-10-05', endDate: '2026-10-18', budget: 100_000 });
    expect(created.status).toBe(201);
    expect(created.body.currency).toBe('USD');

    expect(
      (
        await analyst
          .put(`/api/units/${unit.id}/economics`)
          .set(CSRF)
          .send({ ...TEST_ECONOMICS, currency: 'EUR' })
      ).status,
    ).toBe(200);

    const res = await analyst
      .post(`/api/outages/${created.body.id}/items`)
      .set(CSRF)
      .send({
        unitId: unit.id,
        kind: 'air-in-leakage-repair',
        title: 'Fix the air leak',
        cost: 15_000,
        durationDays: 2,
        lane: 'Vacuum',
        benefit: { cleanlinessRecovered: 0.1, horizonDays: 365 },
      });
    // Fails today: 201, the EUR-priced benefit is stored as USD in the outage.
    expect(res.status).not.toBe(201);
    expect([400, 409]).toContain(res.status);
    expect(res.body.error ?? res.body.message).toMatch(/EUR.*USD|USD.*EUR/);
    expect(await t.dataSource.getRepository(OutageItem).countBy({ outageId: created.body.id })).toBe(0);
  });
});
