/**
 * The health view survives whatever setup is stored: a condenser the setup form would now refuse (stored
 * before its bounds existed, or written by hand) gives warnings and left-out points, never a 500.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import { enqueueRecompute } from '../../backend/src/jobs/job-queue.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { createTenant, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv } from '../helpers/historian-files.js';

/** Midnight in Chicago on 1 June 2024 (CDT = UTC−5). */
const START_UTC = Date.UTC(2024, 5, 1, 5, 0);
const DAYS = 20;

describe('health view with an implausible stored setup', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let tenant: TenantFixture;
  let analyst: TestAgent;

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    tenant = await createTenant(t.dataSource, 'stored-setup');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
  });
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  const drain = () => drainJobs(t.dataSource, JOB_HANDLERS);

  /** A unit with a plausible history, then its condenser setup overwritten in the database and recomputed. */
  async function unitWithStoredCondenser(name: string, change: Partial<typeof TEST_CONDENSER>): Promise<GeneratingUnit> {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const rows = physicalHistory({
      startUtc: START_UTC,
      hours: DAYS * 24,
      condenser: TEST_CONDENSER,
      turbine: TEST_TURBINE,
      cleanlinessAt: (h) => 0.88 - (0.002 * h) / 24,
    });
    const up = await analyst
      .post(`/api/units/${unit.id}/uploads`)
      .set(CSRF)
      .attach('file', await writeHistorianCsv(tmp.file(`${name}.csv`), rows))
      .expect(201);
    await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
    await drain();
    await t.dataSource.getRepository(GeneratingUnit).update(unit.id, { condenser: { ...TEST_CONDENSER, ...change } });
    await enqueueRecompute(t.dataSource.manager, unit.organisationId, unit.id, 'setup changed by hand');
    await drain();
    return unit;
  }

  it('answers 200 with a warning and every point left out with its reason for a condenser of 100,000,000 tubes', async () => {
    const unit = await unitWithStoredCondenser('tubes', { tubeCount: 100_000_000 });
    const body = (await analyst.get(`/api/units/${unit.id}/health`).expect(200)).body;
    expect(body.dataQuality.pointsUsed).toBe(0);
    expect(body.dataQuality.pointsDropped).toBe(DAYS * 24);
    expect(Object.keys(body.dataQuality.droppedByReason).every((r) => r.startsWith('model:'))).toBe(true);
    expect(body.design.modelBackpressureKpa).toBeNull();
    expect(body.warnings.join(' ')).toMatch(/design point cannot be modelled/i);
    // The other views of the unit answer too.
    await analyst.get(`/api/units/${unit.id}/daily`).expect(200);
    await analyst.get(`/api/units/${unit.id}/export`).query({ dataset: 'breakdown', format: 'csv' }).expect(200);
  });

  it('answers 200 with the design point left out for a design duty of 5,000 MW on a 340 MW unit', async () => {
    const unit = await unitWithStoredCondenser('duty', { designDutyMw: 5000 });
    const body = (await analyst.get(`/api/units/${unit.id}/health`).expect(200)).body;
    expect(body.design.modelBackpressureKpa).toBeNull();
    expect(body.warnings.join(' ')).toMatch(/design point cannot be modelled/i);
    // Every point's breakdown would book the design gap as its load term: all left out, with the reason.
    expect(body.dataQuality.pointsUsed).toBe(0);
    expect(body.dataQuality.droppedByReason).toEqual({ 'model:expected-out-of-range': DAYS * 24 });
    // No trend from points left out, so the next cleaning is not planned (never priced at hundreds of kPa).
    expect(body.trend).toBeNull();
    expect(body.headline.nextCleaning).toBeNull();
  });

  it('leaves out the points whose cleanliness is outside 0.2–1.3 (a surface entered 10 times too large) and says so', async () => {
    const unit = await unitWithStoredCondenser('surface', { surfaceM2: TEST_CONDENSER.surfaceM2 * 10 });
    const body = (await analyst.get(`/api/units/${unit.id}/health`).expect(200)).body;
    expect(body.dataQuality.pointsUsed).toBe(0);
    expect(body.dataQuality.droppedByReason['model:implausible-cleanliness']).toBe(DAYS * 24);
    expect(body.warnings.join(' ')).toMatch(/cleanliness/i);
    expect(body.series.every((d: { cleanliness: number | null }) => d.cleanliness === null)).toBe(true);
  });
});
