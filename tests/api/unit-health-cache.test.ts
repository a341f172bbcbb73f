/**
 * The health view is served from a cache keyed by the unit's versions as read from the database: a recompute,
 * a setup save or an event seen on the next request (whichever process made it), the cached answer the same
 * as the one computed afresh, and the stored forecast band the same as the one the view would draw itself.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { HealthQuery } from '@shared/schemas/health.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import type { TenantScope } from '../../backend/src/policies/tenant-scope.js';
import { recomputeUnit } from '../../backend/src/services/derived/recompute-unit.js';
import { computeUnitHealth, computeUnitSamples, unitHealth, unitHealthCache } from '../../backend/src/services/health.service.js';
import { createTenant, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv } from '../helpers/historian-files.js';

/** Midnight in Chicago on 1 June 2024 (CDT = UTC−5). */
const START_UTC = Date.UTC(2024, 5, 1, 5, 0);
const DAYS = 40;
const Q: HealthQuery = { breakdownBy: 'month' };

describe('unit health cache', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let tenant: TenantFixture;
  let analyst: TestAgent;
  let unit: GeneratingUnit;
  let scope: TenantScope;

  const drain = () => drainJobs(t.dataSource, JOB_HANDLERS);
  const health = async () => (await analyst.get(`/api/units/${unit.id}/health`).expect(200)).body;

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    tenant = await createTenant(t.dataSource, 'health-cache');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    scope = { organisationId: tenant.organisation.id, userId: tenant.users.analyst.id, role: 'analyst', clientGroupIds: null };
    unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    // Fouling from 0.9 to about 0.8 over the 40 days, so the latest cycle has a fitted trend and a forecast band.
    const rows = physicalHistory({
      startUtc: START_UTC,
      hours: DAYS * 24,
      condenser: TEST_CONDENSER,
      turbine: TEST_TURBINE,
      cleanlinessAt: (h) => 1 / (1 / 0.9 + (0.14 / 40) * (h / 24)),
    });
    const up = await analyst
      .post(`/api/units/${unit.id}/uploads`)
      .set(CSRF)
      .attach('file', await writeHistorianCsv(tmp.file('history.csv'), rows))
      .expect(201);
    await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
    await drain();
  }, 120_000);
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  it('answers a repeated request from the cache with exactly what a fresh computation gives', async () => {
    unitHealthCache.clear();
    const first = await health();
    const second = await health();
    expect(second).toEqual(first);
    expect(unitHealthCache.size).toBe(1);
    // the service hands back the very object it cached, and it equals one computed without the cache
    const cachedA = await unitHealth(t.dataSource, scope, unit.id, Q);
    const cachedB = await unitHealth(t.dataSource, scope, unit.id, Q);
    expect(cachedB).toBe(cachedA);
    expect(JSON.parse(JSON.stringify(cachedA))).toEqual(first);
    expect(await computeUnitHealth(t.dataSource, scope, unit.id, Q)).toEqual(cachedA);
    expect(first.forecast.length).toBeGreaterThan(0);
  });

  it('the forecast band stored by the recompute is the one the view draws from the daily figures', async () => {
    const withStored = await computeUnitHealth(t.dataSource, scope, unit.id, Q);
    const [row] = await t.dataSource.query('SELECT analysis FROM generating_unit WHERE id = ?', [unit.id]);
    const analysis = typeof row.analysis === 'string' ? JSON.parse(row.analysis) : row.analysis;
    expect(analysis.forecast.status).toBe('fitted');
    // an analysis stored before the forecast was: the view draws the band itself, to the same figures
    delete analysis.forecast;
    await t.dataSource.query('UPDATE generating_unit SET analysis = ? WHERE id = ?', [JSON.stringify(analysis), unit.id]);
    const drawn = await computeUnitHealth(t.dataSource, scope, unit.id, Q);
    expect(drawn.forecast).toEqual(withStored.forecast);
    expect(drawn.trend).toEqual(withStored.trend);
    await recomputeUnit(t.dataSource, unit.id);
  });

  it('after a recompute run outside this app (another process), the next request has the new figures and hourly points', async () => {
    const before = await health();
    const samplesUrl = `/api/units/${unit.id}/samples?from=2024-06-10&to=2024-06-12&quantity=backpressure`;
    const pointsBefore = (await analyst.get(samplesUrl).expect(200)).body;
    expect((await analyst.get(samplesUrl).expect(200)).body).toEqual(pointsBefore);
    // The raw backpressure readings rise by 5 % (no new sample, no event, no setup change), then a recompute
    // that did not pass through this app's requests: only the data version it raises in the database tells.
    await t.dataSource.query('UPDATE performance_sample SET backpressureKpa = backpressureKpa * 1.05 WHERE unitId = ?', [unit.id]);
    await recomputeUnit(t.dataSource, unit.id);
    const after = await health();
    expect(after.headline.cleanliness).toBeLessThan(before.headline.cleanliness - 0.01);
    expect(after.series.at(-1).backpressureKpa).toBeCloseTo(before.series.at(-1).backpressureKpa * 1.05, 6);
    expect(after).toEqual(JSON.parse(JSON.stringify(await computeUnitHealth(t.dataSource, scope, unit.id, Q))));
    const pointsAfter = (await analyst.get(samplesUrl).expect(200)).body;
    expect(pointsAfter.points[0].backpressureKpa).toBeCloseTo(pointsBefore.points[0].backpressureKpa * 1.05, 6);
    const sq = { from: '2024-06-10', to: '2024-06-12', quantity: 'backpressure' } as const;
    expect(pointsAfter).toEqual(JSON.parse(JSON.stringify(await computeUnitSamples(t.dataSource, scope, unit.id, sq))));
  });

  it('after a setup save, the next request shows the new setup before the recompute has run, and the recomputed figures after it', async () => {
    const before = await health();
    expect(before.headline.referenceCleanliness).toBe(TEST_CONDENSER.designCleanliness);
    await analyst
      .put(`/api/units/${unit.id}/condenser`)
      .set(CSRF)
      .send({ ...TEST_CONDENSER, referenceCleanliness: 0.85, surfaceM2: TEST_CONDENSER.surfaceM2 * 1.1 })
      .expect(200);
    const saved = await health();
    expect(saved.headline.referenceCleanliness).toBe(0.85);
    expect(saved.headline.cleanliness).toBe(before.headline.cleanliness); // not recomputed yet
    expect(await drain()).toBeGreaterThanOrEqual(1);
    const recomputed = await health();
    // a 10 % larger surface reads as a lower cleanliness for the same readings
    expect(recomputed.headline.cleanliness).toBeLessThan(before.headline.cleanliness - 0.02);
    expect(recomputed).toEqual(JSON.parse(JSON.stringify(await computeUnitHealth(t.dataSource, scope, unit.id, Q))));
  });

  it('an event recorded or changed shows on the next request', async () => {
    const before = await health();
    const created = await analyst
      .post(`/api/units/${unit.id}/events`)
      .set(CSRF)
      .send({
        kind: 'other',
        startDate: '2024-06-20',
        endDate: null,
        methodId: null,
        cost: null,
        cleanlinessBefore: null,
        cleanlinessAfter: null,
        pluggedTubesAfter: null,
        notes: 'Waterbox inspection',
      })
      .expect(201);
    const withEvent = await health();
    expect(withEvent.events.length).toBe(before.events.length + 1);
    // a change in place (same number of events) is seen too
    await t.dataSource.query('UPDATE unit_event SET notes = ? WHERE id = ?', ['Waterbox inspection, north side', created.body.id]);
    const edited = await health();
    expect(edited.events.find((e: { id: string }) => e.id === created.body.id).notes).toBe('Waterbox inspection, north side');
  });

  it('a unit outside the caller’s scope is 404 whether or not its view is cached', async () => {
    await health();
    const other = await createTenant(t.dataSource, 'health-cache-other');
    const stranger = await signedInAgent(t.app, other.users.admin.email);
    await stranger.get(`/api/units/${unit.id}/health`).expect(404);
  });
});
