/**
 * The MW and t CO2 beside the fouling cost, through HTTP against a real MariaDB: the health view computes them from
 * the stored daily figures at read time with the unit's own heat rate and prices, the portfolio states the same
 * figures for the unit, and a unit without economics says nothing rather than a made-up figure.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import { portfolioResponse } from '@shared/schemas/portfolio.js';
import { unitHealthResponse } from '@shared/schemas/health.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { createTenant, CSRF, signedInAgent } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_ECONOMICS, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv } from '../helpers/historian-files.js';

const ZONE = 'America/Chicago';

// Closed form, written out here apart from physical-cost.ts: a MWh of penalty costs
// (1 − s) · HR/1000 · (fuel price + kg/MMBtu / 1000 · CO2 price) + s · replacement price; the CO2 of a cost C is
// (1 − s) · C / V · HR/1000 MMBtu × kg/MMBtu / 1000, and the output lost in capacity-limited hours s · C / V MWh.
const s = TEST_ECONOMICS.capacityLimitedShare;
const mmbtuPerMwh = TEST_TURBINE.designHeatRateBtuKwh / 1000;
const V =
  (1 - s) * mmbtuPerMwh * (TEST_ECONOMICS.fuelPricePerMmbtu + (TEST_ECONOMICS.co2KgPerMmbtu / 1000) * TEST_ECONOMICS.co2PricePerTonne) +
  s * TEST_ECONOMICS.replacementPricePerMwh;
const co2Of = (cost: number) => ((1 - s) * (cost / V) * mmbtuPerMwh * TEST_ECONOMICS.co2KgPerMmbtu) / 1000;
const lostMwhOf = (cost: number) => (s * cost) / V;

describe('MW and t CO2 beside the fouling cost', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let analyst: TestAgent;
  let unit: GeneratingUnit;
  let bare: GeneratingUnit;

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    const tenant = await createTenant(t.dataSource, 'physical');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    const plant = await createPlant(t.dataSource, tenant.organisation.id, null);
    unit = await createUnit(t.dataSource, plant);
    bare = await createUnit(t.dataSource, plant, false);
    const days = 30;
    const firstDay = addDays(plantDayOf(Date.now(), ZONE), -days);
    const rows = physicalHistory({
      startUtc: Date.parse(`${firstDay}T06:00:00Z`),
      hours: days * 24 - 8,
      condenser: TEST_CONDENSER,
      turbine: TEST_TURBINE,
      cleanlinessAt: (h) => 1 / (1 / 0.9 + (0.14 / 30) * (h / 24)),
    });
    const up = await analyst
      .post(`/api/units/${unit.id}/uploads`)
      .set(CSRF)
      .attach('file', await writeHistorianCsv(tmp.file('history.csv'), rows))
      .expect(201);
    await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
    await drainJobs(t.dataSource, JOB_HANDLERS);
  }, 180_000);

  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  it('the health view’s head, days and periods carry the CO2 and lost output of their fouling cost, by the closed form', async () => {
    const h = unitHealthResponse.parse((await analyst.get(`/api/units/${unit.id}/health`).expect(200)).body);
    const perDayCost = h.headline.foulingCostPerDay!;
    expect(perDayCost).toBeGreaterThan(0);
    const p = h.headline.foulingPhysical!;
    expect(p.capacityLimitedShare).toBe(s);
    expect(p.perDay!.co2Tonnes).toBeCloseTo(co2Of(perDayCost), 6);
    expect(p.perDay!.lostMwh).toBeCloseTo(lostMwhOf(perDayCost), 6);
    expect(p.perDay!.lostMw).toBeCloseTo(perDayCost / V / 24, 6); // a day's penalty MWh over its 24 h
    expect(p.sinceCleaning!.co2Tonnes).toBeCloseTo(co2Of(h.headline.foulingCostSinceCleaning!), 6);
    expect(p.sinceCleaning!.lostMw).toBeNull(); // a total has no rate
    for (const d of h.series.filter((x) => x.foulingCost !== null)) expect(d.foulingCo2Tonnes).toBeCloseTo(co2Of(d.foulingCost!), 6);
    for (const b of h.breakdown) expect(b.foulingLostMwh).toBeCloseTo(lostMwhOf(b.foulingCost), 6);
  });

  it('the portfolio states the same MW and t CO2 for the unit as its health view', async () => {
    const h = unitHealthResponse.parse((await analyst.get(`/api/units/${unit.id}/health`).expect(200)).body);
    const p = portfolioResponse.parse((await analyst.get('/api/portfolio').expect(200)).body);
    const row = p.units.find((u) => u.unitId === unit.id)!;
    expect(row.foulingCostPerDay).toBeCloseTo(h.headline.foulingCostPerDay!, 6);
    expect(row.foulingPhysical!.perDay!.co2Tonnes).toBeCloseTo(h.headline.foulingPhysical!.perDay!.co2Tonnes, 6);
    expect(row.foulingPhysical!.perDay!.lostMw!).toBeCloseTo(h.headline.foulingPhysical!.perDay!.lostMw!, 6);
  });

  it('a unit without turbine and economics shows no quantities on either screen', async () => {
    const h = unitHealthResponse.parse((await analyst.get(`/api/units/${bare.id}/health`).expect(200)).body);
    expect(h.headline.foulingPhysical).toBeNull();
    const p = portfolioResponse.parse((await analyst.get('/api/portfolio').expect(200)).body);
    expect(p.units.find((u) => u.unitId === bare.id)!.foulingPhysical).toBeNull();
  });
});
