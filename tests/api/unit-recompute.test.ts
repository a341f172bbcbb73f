/**
 * Derived data follows the unit's setup and timeline: a condenser setup change, a cleaning and a tube
 * plugging each recompute the stored samples and the daily figures (background jobs drained here).
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { createTenant, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv, type HistoryOptions } from '../helpers/historian-files.js';

/** Midnight in Chicago on 1 June 2024 (CDT = UTC−5, Energy Policy Act of 2005 daylight-time rules). */
const START_UTC = Date.UTC(2024, 5, 1, 5, 0);
const HOURS_PER_DAY = 24;

interface Derived {
  id: string;
  ts: Date;
  validity: string;
  cleanliness: number;
  ttdK: number;
  expectedBackpressureKpa: number;
  pluggingKpa: number;
  setupVersion: number;
}

const chicagoJuneDay = (ms: number) => new Date(ms - 5 * 3_600_000).toISOString().slice(0, 10);

describe('recompute of derived data', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let tenant: TenantFixture;
  let analyst: TestAgent;

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    tenant = await createTenant(t.dataSource, 'recompute');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
  });
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  const drain = () => drainJobs(t.dataSource, JOB_HANDLERS);

  async function unitWithHistory(name: string, options: Partial<HistoryOptions> & { hours: number }): Promise<GeneratingUnit> {
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const rows = physicalHistory({ startUtc: START_UTC, condenser: TEST_CONDENSER, turbine: TEST_TURBINE, ...options });
    const up = await analyst
      .post(`/api/units/${unit.id}/uploads`)
      .set(CSRF)
      .attach('file', await writeHistorianCsv(tmp.file(`${name}.csv`), rows))
      .expect(201);
    await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
    await drain();
    const imp = (await analyst.get(`/api/imports/${up.body.import.id}`).expect(200)).body;
    expect(imp.status).toBe('complete');
    expect(imp.counts.rowsOk).toBe(options.hours);
    return unit;
  }

  const derivedOf = (unitId: string): Promise<Derived[]> =>
    t.dataSource.query(
      `SELECT id, timestampUtc AS ts, validity, cleanliness, ttdK, expectedBackpressureKpa, pluggingKpa, setupVersion FROM performance_sample WHERE unitId = ? ORDER BY timestampUtc`,
      [unitId],
    );

  const dailyOf = async (unitId: string) => (await analyst.get(`/api/units/${unitId}/daily`).expect(200)).body.days as Record<string, number | string>[];

  it('a larger condenser surface lowers every stored cleanliness by the surface ratio and leaves TTD alone', async () => {
    const unit = await unitWithHistory('surface', { hours: 72 });
    const before = await derivedOf(unit.id);
    const dailyBefore = await dailyOf(unit.id);

    const bigger = { ...TEST_CONDENSER, surfaceM2: TEST_CONDENSER.surfaceM2 * 1.1 };
    const saved = await analyst.put(`/api/units/${unit.id}/condenser`).set(CSRF).send(bigger);
    expect(saved.status).toBe(200);
    expect(saved.body.condenser.surfaceM2).toBeCloseTo(bigger.surfaceM2, 9);
    expect(saved.body.setupVersion - 1).toBe(before[0]?.setupVersion);
    expect(await drain()).toBeGreaterThanOrEqual(1);

    const after = await derivedOf(unit.id);
    expect(after).toHaveLength(before.length);
    after.forEach((a, i) => {
      const b = before[i]!;
      expect(a.id).toBe(b.id);
      // derived: CF = U/U_clean with U = Q/(A_eff·LMTD); Q and LMTD come from the measured temperatures and
      // U_clean = C·√V·Fw·Fm does not depend on the surface, so CF_new/CF_old = A_old/A_new = 1/1.1.
      expect(a.cleanliness / b.cleanliness).toBeCloseTo(1 / 1.1, 10);
      // TTD = Ts − t2 from the measured backpressure and outlet: no setup value enters it.
      expect(a.ttdK).toBe(b.ttdK);
      // More surface at the same reference CF condenses at a lower pressure (ε = 1 − e^(−NTU) rises with A).
      expect(a.expectedBackpressureKpa).toBeLessThan(b.expectedBackpressureKpa);
      expect(a.setupVersion).toBe(saved.body.setupVersion);
    });
    const dailyAfter = await dailyOf(unit.id);
    dailyAfter.forEach((d, i) => expect(Number(d.medianCleanliness) / Number(dailyBefore[i]?.medianCleanliness)).toBeCloseTo(1 / 1.1, 10));
  });

  it('a setup the schema refuses changes nothing and queues no recompute', async () => {
    const unit = await unitWithHistory('bad-setup', { hours: 24 });
    const before = await derivedOf(unit.id);
    const res = await analyst
      .put(`/api/units/${unit.id}/condenser`)
      .set(CSRF)
      .send({ ...TEST_CONDENSER, pluggedTubes: TEST_CONDENSER.tubeCount });
    expect(res.status).toBe(400);
    expect(await drain()).toBe(0);
    expect(await derivedOf(unit.id)).toEqual(before);
  });

  it('a tube-plugging event changes the plugged tubes used from its date on, and not before', async () => {
    const unit = await unitWithHistory('plugging', { hours: 6 * HOURS_PER_DAY });
    const before = await derivedOf(unit.id);
    const res = await analyst.post(`/api/units/${unit.id}/events`).set(CSRF).send({ kind: 'tube-plugging', startDate: '2024-06-04', pluggedTubesAfter: 1200 });
    expect(res.status).toBe(201);
    expect(await drain()).toBeGreaterThanOrEqual(1);
    const after = await derivedOf(unit.id);

    const n = TEST_CONDENSER.tubeCount;
    const np0 = TEST_CONDENSER.pluggedTubes;
    // derived: CF = Q/(A·(1 − Np/N)·LMTD·C·√V·Fw·Fm) with V ∝ 1/(N − Np) (flow over the open tubes of a
    // pass), so CF ∝ (N − Np)^(−1/2): from 120 to 1,200 plugged tubes CF rises by √((N − 120)/(N − 1200)).
    const ratio = Math.sqrt((n - np0) / (n - 1200));
    let changed = 0;
    expect(after).toHaveLength(before.length);
    after.forEach((a, i) => {
      const b = before[i]!;
      if (chicagoJuneDay(new Date(a.ts).getTime()) >= '2024-06-04') {
        changed++;
        expect(a.cleanliness / b.cleanliness).toBeCloseTo(ratio, 10);
        // More plugged tubes than the design's 0 cost more backpressure in the breakdown.
        expect(a.pluggingKpa).toBeGreaterThan(b.pluggingKpa);
      } else {
        expect(a.cleanliness).toBeCloseTo(b.cleanliness, 12);
        expect(a.pluggingKpa).toBeCloseTo(b.pluggingKpa, 12);
      }
    });
    // 4, 5 and 6 June in Chicago, 24 hourly rows each.
    expect(changed).toBe(3 * HOURS_PER_DAY);
  });

  it('a cleaning restarts the fouling trend from its date', async () => {
    // 40 days of fouling with a real cleaning at midnight on 21 June: CF(t) = 1/(1/CF0 + k·t), the
    // linear-Rf model of ENGINEERING.md §5 (1/U = 1/(CF0·U_clean) + Rf), from 0.92 down to about 0.72 in 20 days.
    const cf0 = 0.92;
    const k = (1 / 0.72 - 1 / cf0) / 20;
    const cleaningHour = 20 * HOURS_PER_DAY;
    const unit = await unitWithHistory('cleaning', {
      hours: 40 * HOURS_PER_DAY,
      cleanlinessAt: (h) => 1 / (1 / cf0 + (k * (h < cleaningHour ? h : h - cleaningHour)) / HOURS_PER_DAY),
    });
    const without = new Map((await dailyOf(unit.id)).map((d) => [d.day as string, d]));

    const res = await analyst.post(`/api/units/${unit.id}/events`).set(CSRF).send({ kind: 'cleaning', startDate: '2024-06-21', endDate: '2024-06-21' });
    expect(res.status).toBe(201);
    expect(await drain()).toBeGreaterThanOrEqual(1);
    const withCleaning = new Map((await dailyOf(unit.id)).map((d) => [d.day as string, d]));

    // Measured cleanliness does not depend on the timeline: the daily medians stay as they were.
    for (const [day, d] of withCleaning) expect(Number(d.medianCleanliness)).toBeCloseTo(Number(without.get(day)!.medianCleanliness), 12);
    // The data itself steps up at the cleaning (generated that way).
    expect(Number(withCleaning.get('2024-06-21')!.medianCleanliness) - Number(withCleaning.get('2024-06-20')!.medianCleanliness)).toBeGreaterThan(0.15);

    const step = (days: Map<string, Record<string, number | string>>) =>
      Number(days.get('2024-06-20')!.foulingKpa) - Number(days.get('2024-06-21')!.foulingKpa);
    // One trend through the whole sawtooth is smooth across 20/21 June; two trends drop the fouling part at the cleaning.
    expect(Math.abs(step(without))).toBeLessThan(0.2 * step(withCleaning));
    expect(step(withCleaning)).toBeGreaterThan(0.3);

    // With the cleaning each cycle's trend follows the data, so what the trend leaves unexplained shrinks.
    const worstUnexplained = (days: Map<string, Record<string, number | string>>) =>
      Math.max(...[...days.values()].map((d) => Math.abs(Number(d.unexplainedKpa))));
    expect(worstUnexplained(withCleaning)).toBeLessThan(0.25 * worstUnexplained(without));

    // Deleting the cleaning brings the single trend back.
    await analyst.delete(`/api/events/${res.body.id}`).set(CSRF).expect(204);
    await drain();
    const again = new Map((await dailyOf(unit.id)).map((d) => [d.day as string, d]));
    for (const [day, d] of again) expect(Number(d.foulingKpa)).toBeCloseTo(Number(without.get(day)!.foulingKpa), 9);
  });
});
