/**
 * The demo scenario seeded into an empty database looks current: made on a given day, its units' health
 * views have data up to the day before (plant-local), with the story's cleanings moved along with it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoSignIns, seedDemoIfEmpty } from '../../backend/src/seed/demo-seed.js';
import { DEMO_TRIAL, seedDemoBilling } from '../../backend/src/seed/demo-billing-seed.js';
import { createBillingContext } from '../../backend/src/services/billing/billing-context.js';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { signedInAgent } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('the demo seed', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t?.close();
  });

  it('seeded on 2 Dec 2026, shows a unit’s health with data up to 1 Dec 2026 and its last cleaning moved with the story', async () => {
    // One unit keeps the test short; the others are made the same way.
    expect(await seedDemoIfEmpty(t.dataSource, () => {}, true, { today: '2026-12-02', units: ['saltmarsh-point-1'] })).toBe(true);
    const admin = await signedInAgent(t.app, 'admin@tidewater.example', DEMO_PASSWORD);
    const plants = (await admin.get('/api/plants').expect(200)).body.plants as { name: string; units: { id: string; name: string }[] }[];
    const unit = plants.find((p) => p.name === 'Saltmarsh Point')!.units[0]!;

    const health = (await admin.get(`/api/units/${unit.id}/health`).expect(200)).body;
    expect(health.headline.asOf).toBe('2026-12-01');
    // written for 3–11 May 2025, 235 days before the written end (1 Jan 2026): played 235 days before 2 Dec 2026
    expect(health.headline.lastCleaning.date).toBe('2026-04-11');
    expect(health.headline.lastSampleUtc.slice(0, 10)).toBe('2026-12-02'); // 23:00 on 1 Dec in New York is 04:00 UTC on 2 Dec

    // Each demo cleaning names a method of the organisation's library and costs what the library says for this
    // condenser's tubes in service (fixed cost + cost per tube).
    const methods = (await admin.get('/api/cleaning-methods').expect(200)).body.methods as {
      id: string;
      name: string;
      fixedCost: number;
      costPerTube: number;
    }[];
    const setup = (await admin.get(`/api/units/${unit.id}`).expect(200)).body.condenser as { tubeCount: number; pluggedTubes: number };
    const events = (await admin.get(`/api/units/${unit.id}/events`).expect(200)).body.events as {
      kind: string;
      methodId: string | null;
      cost: number | null;
      notes: string;
    }[];
    const cleanings = events.filter((e) => e.kind === 'cleaning');
    expect(cleanings.length).toBeGreaterThan(0);
    for (const c of cleanings) {
      const method = methods.find((m) => m.id === c.methodId);
      expect(method, `cleaning with method ${c.methodId}`).toBeDefined();
      expect(Number(c.cost)).toBeCloseTo(method!.fixedCost + method!.costPerTube * (setup.tubeCount - setup.pluggedTubes), 2);
      expect(c.notes).toContain(method!.name);
    }
  }, 300_000);

  it('subscribes both demo organisations to a paid plan through the Stripe stand-in, and shows one more on a trial in its last days', async () => {
    await seedDemoBilling(createBillingContext(t.dataSource, t.config), () => {});
    for (const email of ['admin@tidewater.example', 'admin@northmere.example']) {
      const admin = await signedInAgent(t.app, email, DEMO_PASSWORD);
      const billing = (await admin.get('/api/billing').expect(200)).body;
      expect(billing, email).toMatchObject({ status: 'active', readOnly: null, trialDaysLeft: null });
      expect(billing.invoices[0], email).toMatchObject({ status: 'paid' });
    }
    const trial = await signedInAgent(t.app, DEMO_TRIAL.admin.email, DEMO_PASSWORD);
    expect((await trial.get('/api/billing/notice').expect(200)).body).toMatchObject({
      status: 'trialing',
      trialDaysLeft: 2,
      trialEndingSoon: true,
      readOnly: null,
    });
    expect(demoSignIns().map((s) => s.email)).toContain(DEMO_TRIAL.admin.email);
  });
});
