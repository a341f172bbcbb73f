/**
 * The portfolio through HTTP against a real MariaDB: every unit the member may see (client-group limits held,
 * viewers counting approved cases only), figures equal to the unit's health view, conditions from the stored
 * figures, money totalled per currency, next outages, and a fixed number of SQL statements whatever the number
 * of units.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { MysqlQueryRunner } from 'typeorm/driver/mysql/MysqlQueryRunner.js';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import { portfolioResponse, type PortfolioResponse, type PortfolioUnit } from '@shared/schemas/portfolio.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import type { Plant } from '../../backend/src/entities/plant.entity.js';
import type { TenantScope } from '../../backend/src/policies/tenant-scope.js';
import { portfolioOf, portfolioView } from '../../backend/src/services/portfolio/portfolio.service.js';
import { recomputeUnit } from '../../backend/src/services/derived/recompute-unit.js';
import { addMember, createTenant, createUser, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createCaseRecord } from '../factories/cases.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_ECONOMICS, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv } from '../helpers/historian-files.js';

const ZONE = 'America/Chicago';
const today = () => plantDayOf(Date.now(), ZONE);

/** A stored analysis with the parts the portfolio reads, as the recompute writes them. */
function storedAnalysis(o: {
  asOf: string;
  cleanliness?: number;
  perDay?: number;
  since?: number;
  airLeakDays?: number;
  next?: { date: string; saving: number } | null;
}): Record<string, unknown> {
  return {
    computedAt: new Date().toISOString(),
    setupVersion: 1,
    lastDay: o.asOf,
    cycles: [],
    airLeakPeriods: [],
    forecast: null,
    current: {
      asOf: o.asOf,
      cleanliness: o.cleanliness ?? 0.8,
      excessBackpressureKpa: 0.4,
      foulingCostPerDay: o.perDay ?? 1000,
      foulingCostSinceCleaning: o.since ?? 50_000,
      lastCleaningDate: '2025-01-10',
      airLeakSuspectedDaysInLastWeek: o.airLeakDays ?? 0,
    },
    outlook: o.next
      ? {
          status: 'planned',
          planFrom: addDays(o.asOf, 1),
          next: {
            date: o.next.date,
            endDate: o.next.date,
            methodId: 'hp-water-lancing',
            methodName: 'High-pressure water lancing',
            cleanlinessBefore: 0.78,
            cleanlinessAfter: 0.9,
            cleaningCost: 60_000,
            downtimeCost: 20_000,
            typicalValues: true,
          },
          plan: [
            { date: o.next.date, endDate: o.next.date, methodId: 'hp-water-lancing', methodName: 'High-pressure water lancing', unitDuringCleaning: 'outage' },
          ],
          savingsVersusNoCleaning: o.next.saving,
          methodsBasis: 'typical cleaning methods',
        }
      : { status: 'none-needed', reason: 'Within the coming year no cleaning pays for itself', methodsBasis: 'typical cleaning methods' },
  };
}

describe('portfolio API', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let tenant: TenantFixture;
  let plantOne: Plant;
  let plantTwo: Plant;
  let imported: GeneratingUnit;
  let analyst: TestAgent;

  const drain = () => drainJobs(t.dataSource, JOB_HANDLERS);
  const portfolio = async (agent: TestAgent): Promise<PortfolioResponse> => portfolioResponse.parse((await agent.get('/api/portfolio').expect(200)).body);
  const unitOf = (p: PortfolioResponse, id: string): PortfolioUnit => {
    const u = p.units.find((x) => x.unitId === id);
    if (!u) throw new Error(`unit ${id} is not in the portfolio`);
    return u;
  };
  async function unitWithAnalysis(plant: Plant, analysis: Record<string, unknown> | null, economics = TEST_ECONOMICS): Promise<GeneratingUnit> {
    const unit = await createUnit(t.dataSource, plant);
    await t.dataSource.query('UPDATE generating_unit SET analysis = ?, economics = ? WHERE id = ?', [
      analysis === null ? null : JSON.stringify(analysis),
      JSON.stringify(economics),
      unit.id,
    ]);
    return unit;
  }

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    tenant = await createTenant(t.dataSource, 'portfolio');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    plantOne = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
    plantTwo = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[1].id);
    imported = await createUnit(t.dataSource, plantOne);
    // 40 days of fouling from 0.9 ending yesterday (plant-local), imported and recomputed as a person would.
    const days = 40;
    const firstDay = addDays(today(), -days);
    const startUtc = Date.parse(`${firstDay}T06:00:00Z`);
    const rows = physicalHistory({
      startUtc,
      hours: days * 24 - 8,
      condenser: TEST_CONDENSER,
      turbine: TEST_TURBINE,
      cleanlinessAt: (h) => 1 / (1 / 0.9 + (0.14 / 40) * (h / 24)),
    });
    const up = await analyst
      .post(`/api/units/${imported.id}/uploads`)
      .set(CSRF)
      .attach('file', await writeHistorianCsv(tmp.file('history.csv'), rows))
      .expect(201);
    await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
    await drain();
  }, 120_000);
  afterAll(async () => {
    vi.restoreAllMocks();
    await t?.close();
    await tmp?.cleanup();
  });

  it('states the same figures now as the unit’s health view', async () => {
    const p = await portfolio(analyst);
    const u = unitOf(p, imported.id);
    const h = (await analyst.get(`/api/units/${imported.id}/health`).expect(200)).body.headline;
    expect(u.dataThrough).toBe(h.asOf);
    expect(u.cleanliness).toBe(h.cleanliness);
    expect(u.referenceCleanliness).toBe(h.referenceCleanliness);
    expect(u.excessBackpressureKpa).toBeCloseTo(h.excessBackpressureKpa, 12);
    expect(u.foulingCostPerDay).toBeCloseTo(h.foulingCostPerDay, 9);
    expect(u.foulingCostSinceCleaning).toBeCloseTo(h.foulingCostSinceCleaning, 6);
    expect(u.currency).toBe(TEST_ECONOMICS.currency);
    expect(u.stale).toBe(false);
    expect(u.dataAgeDays).toBeLessThanOrEqual(2);
    if (h.nextCleaning?.status === 'planned') {
      expect(u.nextCleaning?.date).toBe(h.nextCleaning.next.date);
      expect(u.nextCleaning?.methodName).toBe(h.nextCleaning.next.methodName);
      expect(u.nextCleaning?.saving).toBe(h.nextCleaning.savingsVersusNoCleaning);
    } else {
      expect(u.nextCleaning).toBeNull();
      expect(u.nextCleaningNote).toBeTruthy();
    }
  });

  it('raises each condition from the stored figures, with its sentence, and marks stale data', async () => {
    const now = today();
    const due = await unitWithAnalysis(
      plantOne,
      storedAnalysis({ asOf: addDays(now, -1), airLeakDays: 2, next: { date: addDays(now, -1), saving: 123_456.78 } }),
    );
    const quiet = await unitWithAnalysis(plantOne, storedAnalysis({ asOf: addDays(now, -3), next: { date: addDays(now, 40), saving: 9_000 } }));
    const silent = await unitWithAnalysis(plantOne, storedAnalysis({ asOf: addDays(now, -4) }));
    const p = await portfolio(analyst);

    const d = unitOf(p, due.id);
    expect(d.alerts.map((a) => a.kind).sort()).toEqual(['backpressure-unexplained', 'cleaning-now-pays']);
    expect(d.alerts.find((a) => a.kind === 'cleaning-now-pays')?.sentence).toContain('$123,457');
    expect(d.alerts.find((a) => a.kind === 'backpressure-unexplained')?.sentence).toContain('2 of the last 7 days');
    expect(d.nextCleaning).toEqual({ date: addDays(now, -1), methodName: 'High-pressure water lancing', unitDuringCleaning: 'outage', saving: 123_456.78 });

    // three days without data is not yet stale; four is
    const q = unitOf(p, quiet.id);
    expect(q.alerts).toEqual([]);
    expect(q.stale).toBe(false);
    expect(q.dataAgeDays).toBe(3);
    const s = unitOf(p, silent.id);
    expect(s.stale).toBe(true);
    expect(s.alerts).toEqual([{ kind: 'data-stopped', sentence: expect.stringContaining('4 days ago') }]);
    expect(s.nextCleaning).toBeNull();
    expect(s.nextCleaningNote).toBe('Within the coming year no cleaning pays for itself');
  });

  it('groups units by client group and totals money per currency without adding currencies', async () => {
    const now = today();
    const eur = await unitWithAnalysis(
      plantTwo,
      storedAnalysis({ asOf: addDays(now, -1), perDay: 700.1, since: 20_000.2, next: { date: addDays(now, 5), saving: 1_000 } }),
      {
        ...TEST_ECONOMICS,
        currency: 'EUR',
      },
    );
    const usd = await unitWithAnalysis(
      plantTwo,
      storedAnalysis({ asOf: addDays(now, -1), perDay: 300.2, since: 10_000.1, next: { date: addDays(now, 5), saving: 2_000.5 } }),
    );
    const bare = await createUnit(t.dataSource, plantTwo, false);
    const p = await portfolio(analyst);
    expect(p.groups.map((g) => g.name)).toEqual(['Group One', 'Group Two']);
    const two = p.groups[1]!;
    expect(two.unitIds.sort()).toEqual([eur.id, usd.id, bare.id].sort());
    expect(two.totals.units).toBe(3);
    expect(two.totals.money).toEqual([
      { currency: 'EUR', units: 1, foulingCostPerDay: 700.1, foulingCostSinceCleaning: 20_000.2, nextCleaningSavings: 1_000 },
      { currency: 'USD', units: 1, foulingCostPerDay: 300.2, foulingCostSinceCleaning: 10_000.1, nextCleaningSavings: 2_000.5 },
    ]);
    const b = unitOf(p, bare.id);
    expect(b.currency).toBeNull();
    expect(b.note).toMatch(/setup is incomplete/);
    expect(b.stale).toBe(true);
    // the organisation's totals: every visible unit, each currency apart, equal to the sum of the groups
    expect(p.totals.units).toBe(p.units.length);
    for (const m of p.totals.money) {
      const perGroup = p.groups.flatMap((g) => g.totals.money.filter((x) => x.currency === m.currency));
      expect(m.units).toBe(perGroup.reduce((a, x) => a + x.units, 0));
      expect(m.foulingCostPerDay).toBeCloseTo(
        perGroup.reduce((a, x) => a + x.foulingCostPerDay, 0),
        6,
      );
    }
    expect(p.totals.money.map((m) => m.currency)).toEqual(['EUR', 'USD']);
  });

  it('shows a client-limited member only their groups’ units, another tenant none, and viewers approved cases only', async () => {
    const inOne = await unitWithAnalysis(plantOne, storedAnalysis({ asOf: addDays(today(), -1) }));
    const inTwo = await unitWithAnalysis(plantTwo, storedAnalysis({ asOf: addDays(today(), -1) }));
    await createCaseRecord(t.dataSource, inOne, tenant.users.analyst.id, 'draft', 'Draft case');
    const approved = await createCaseRecord(t.dataSource, inOne, tenant.users.analyst.id, 'approved', 'Approved case');
    await createCaseRecord(t.dataSource, inOne, tenant.users.analyst.id, 'submitted', 'Submitted case');
    const archived = await createCaseRecord(t.dataSource, inOne, tenant.users.analyst.id, 'draft', 'Archived case');
    await t.dataSource.query("UPDATE cleaning_case SET status = 'archived' WHERE id = ?", [archived.id]);

    const limitedUser = await createUser(t.dataSource, 'portfolio-limited');
    await addMember(t.dataSource, tenant.organisation.id, limitedUser, 'viewer', [tenant.groups[0].id]);
    const limited = await portfolio(await signedInAgent(t.app, limitedUser.email));
    expect(limited.units.length).toBeGreaterThan(0);
    expect(limited.units.every((u) => u.clientGroup?.id === tenant.groups[0].id)).toBe(true);
    expect(limited.units.map((u) => u.unitId)).not.toContain(inTwo.id);
    expect(limited.groups.map((g) => g.name)).toEqual(['Group One']);
    expect(unitOf(limited, inOne.id).openCases).toEqual([{ id: approved.id, title: 'Approved case', status: 'approved' }]);
    expect(limited.totals.openCases).toMatchObject({ approved: 1, draft: 0, submitted: 0 });

    const full = await portfolio(analyst);
    expect(
      unitOf(full, inOne.id)
        .openCases.map((c) => c.status)
        .sort(),
    ).toEqual(['approved', 'draft', 'submitted']);
    expect(full.units.map((u) => u.unitId)).toEqual(expect.arrayContaining([inOne.id, inTwo.id]));

    const other = await createTenant(t.dataSource, 'portfolio-other');
    const stranger = await portfolio(await signedInAgent(t.app, other.users.admin.email));
    expect(stranger.units).toEqual([]);
    expect(stranger.groups).toEqual([]);
    expect(stranger.totals.units).toBe(0);
  });

  it('names the next outage of each unit that has not ended (plant-local), the earliest first', async () => {
    const unit = await unitWithAnalysis(plantOne, storedAnalysis({ asOf: addDays(today(), -1) }));
    const now = today();
    const outage = async (name: string, start: string, end: string) => {
      const id = crypto.randomUUID();
      await t.dataSource.query(
        "INSERT INTO outage (id, organisationId, name, startDate, endDate, budget, currency, status, createdById, updatedAt) VALUES (?, ?, ?, ?, ?, 100000, 'USD', 'draft', ?, NOW(3))",
        [id, tenant.organisation.id, name, start, end, tenant.users.analyst.id],
      );
      await t.dataSource.query('INSERT INTO outage_unit (outageId, unitId) VALUES (?, ?)', [id, unit.id]);
      return id;
    };
    await outage('Spring outage (ended)', addDays(now, -30), addDays(now, -1));
    const current = await outage('Running outage', addDays(now, -2), now);
    await outage('Autumn outage', addDays(now, 60), addDays(now, 80));
    const u = unitOf(await portfolio(analyst), unit.id);
    expect(u.nextOutage).toEqual({ id: current, name: 'Running outage', startDate: addDays(now, -2), endDate: now });
  });

  it('reads the whole page with the same number of SQL statements for 1 unit as for 5', async () => {
    const org = await createTenant(t.dataSource, 'portfolio-count');
    const plant = await createPlant(t.dataSource, org.organisation.id, org.groups[0].id);
    const scope: TenantScope = { organisationId: org.organisation.id, userId: org.users.viewer.id, role: 'viewer', clientGroupIds: null };
    const count = async () => {
      const spy = vi.spyOn(MysqlQueryRunner.prototype, 'query');
      try {
        const p = await portfolioOf(t.dataSource, scope);
        return { statements: spy.mock.calls.length, units: p.units.length };
      } finally {
        spy.mockRestore();
      }
    };
    const u1 = await unitWithAnalysis(plant, storedAnalysis({ asOf: addDays(today(), -1) }));
    await createCaseRecord(t.dataSource, u1, org.users.analyst.id, 'approved');
    const one = await count();
    for (let i = 0; i < 4; i++) {
      const u = await unitWithAnalysis(
        await createPlant(t.dataSource, org.organisation.id, org.groups[i % 2 === 0 ? 0 : 1].id),
        storedAnalysis({ asOf: addDays(today(), -2) }),
      );
      await createCaseRecord(t.dataSource, u, org.users.analyst.id, 'approved');
    }
    const five = await count();
    expect(one.units).toBe(1);
    expect(five.units).toBe(5);
    expect(one.statements).toBeGreaterThan(0);
    expect(five.statements).toBe(one.statements);
    expect(five.statements).toBeLessThanOrEqual(3);
  });

  it('through its cache: one statement when nothing changed, one more than the computation when something did, for 1 unit as for 5', async () => {
    const org = await createTenant(t.dataSource, 'portfolio-cache-count');
    const plant = await createPlant(t.dataSource, org.organisation.id, org.groups[0].id);
    const scope: TenantScope = { organisationId: org.organisation.id, userId: org.users.analyst.id, role: 'analyst', clientGroupIds: null };
    const statements = async () => {
      const spy = vi.spyOn(MysqlQueryRunner.prototype, 'query');
      try {
        const p = await portfolioView(t.dataSource, scope);
        return [spy.mock.calls.length, p.units.length];
      } finally {
        spy.mockRestore();
      }
    };
    await unitWithAnalysis(plant, storedAnalysis({ asOf: addDays(today(), -1) }));
    expect(await statements()).toEqual([4, 1]);
    expect(await statements()).toEqual([1, 1]);
    for (let i = 0; i < 4; i++) await unitWithAnalysis(plant, storedAnalysis({ asOf: addDays(today(), -1) }));
    expect(await statements()).toEqual([4, 5]);
    expect(await statements()).toEqual([1, 5]);
  });

  it('after a recompute or a case change made outside this app, the next request has the new figures', async () => {
    const before = unitOf(await portfolio(analyst), imported.id);
    expect(unitOf(await portfolio(analyst), imported.id)).toEqual(before);
    await t.dataSource.query('UPDATE performance_sample SET backpressureKpa = backpressureKpa * 1.05 WHERE unitId = ?', [imported.id]);
    await recomputeUnit(t.dataSource, imported.id);
    const after = unitOf(await portfolio(analyst), imported.id);
    expect(after.cleanliness!).toBeLessThan(before.cleanliness! - 0.01);
    const h = (await analyst.get(`/api/units/${imported.id}/health`).expect(200)).body.headline;
    expect(after.cleanliness).toBe(h.cleanliness);
    const created = await createCaseRecord(t.dataSource, imported, tenant.users.analyst.id, 'submitted', 'Clean in the spring');
    expect(unitOf(await portfolio(analyst), imported.id).openCases.map((c) => c.id)).toContain(created.id);
    await t.dataSource.query("UPDATE cleaning_case SET status = 'archived' WHERE id = ?", [created.id]);
    expect(unitOf(await portfolio(analyst), imported.id).openCases.map((c) => c.id)).not.toContain(created.id);
  });
});
