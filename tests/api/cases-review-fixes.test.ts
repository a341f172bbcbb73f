/**
 * Cleaning cases after the hostile review: the calculation is bounded and runs before the case's row is
 * locked, case writes are rate-limited, nobody decides a case they changed or submitted, a decision names
 * the version it read, a submitted case keeps the unit's and plant's names, and a unit or plant with decided
 * or pending cases cannot be deleted from under them.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import { ENGINE_VERSION } from '@shared/domain/decision/schedule/engine-version.js';
import type { CaseView } from '@shared/schemas/cases.js';
import { CleaningCase } from '../../backend/src/entities/cleaning-case.entity.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { Plant } from '../../backend/src/entities/plant.entity.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import { seedTypicalMethods } from '../../backend/src/services/cleaning-method.service.js';
import { addMember, createTenant, createUser, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createCaseRecord } from '../factories/cases.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv } from '../helpers/historian-files.js';

/** Runs once inside the next case calculation (synchronously, as the calculation itself runs). */
const duringCalc: { hook: (() => void) | null } = vi.hoisted(() => ({ hook: null }));
vi.mock('@shared/domain/decision/schedule/schedule-command.js', async (importOriginal) => {
  const real = await importOriginal<typeof import('@shared/domain/decision/schedule/schedule-command.js')>();
  return {
    ...real,
    runScheduleCommand: (...args: Parameters<typeof real.runScheduleCommand>) => {
      const hook = duringCalc.hook;
      duringCalc.hook = null;
      hook?.();
      return real.runScheduleCommand(...args);
    },
  };
});

const H = 24;
const DAYS = 42;
/** Fouling as a linear rise of the fouling resistance (made-up test data, as in cases.test.ts). */
const CF0 = 0.9;
const K = (1 / 0.8 - 1 / CF0) / 35;
const cleanlinessAt = (hour: number) => 1 / (1 / CF0 + (K * hour) / H);
const TIME_ZONE = 'America/Chicago';

describe('cleaning cases: review fixes', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let tenant: TenantFixture;
  let plant: Plant;
  let unit: GeneratingUnit;
  let agents: Record<'admin' | 'analyst' | 'approver' | 'otherAnalyst' | 'busyAnalyst', TestAgent>;

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads'), PUBLIC_URL: 'http://127.0.0.1:8123' });
    tenant = await createTenant(t.dataSource, 'case-fixes');
    await seedTypicalMethods(t.dataSource.manager, tenant.organisation.id);
    const otherAnalyst = await createUser(t.dataSource, 'case-fixes-other-analyst');
    await addMember(t.dataSource, tenant.organisation.id, otherAnalyst, 'analyst');
    const busyAnalyst = await createUser(t.dataSource, 'case-fixes-busy-analyst');
    await addMember(t.dataSource, tenant.organisation.id, busyAnalyst, 'analyst');
    agents = {
      admin: await signedInAgent(t.app, tenant.users.admin.email),
      analyst: await signedInAgent(t.app, tenant.users.analyst.email),
      approver: await signedInAgent(t.app, tenant.users.approver.email),
      otherAnalyst: await signedInAgent(t.app, otherAnalyst.email),
      busyAnalyst: await signedInAgent(t.app, busyAnalyst.email),
    };
    plant = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
    unit = await createUnit(t.dataSource, plant);
    const today = plantDayOf(Date.now(), TIME_ZONE);
    const [y = 0, m = 1, d = 1] = addDays(today, -DAYS - 1)
      .split('-')
      .map(Number);
    const rows = physicalHistory({ startUtc: Date.UTC(y, m - 1, d, 6, 0), hours: DAYS * H, condenser: TEST_CONDENSER, turbine: TEST_TURBINE, cleanlinessAt });
    const up = await agents.analyst
      .post(`/api/units/${unit.id}/uploads`)
      .set(CSRF)
      .attach('file', await writeHistorianCsv(tmp.file('history.csv'), rows))
      .expect(201);
    await agents.analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
    await drainJobs(t.dataSource, JOB_HANDLERS);
  }, 240_000);
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  const newCase = async (title = 'Clean before summer', as: TestAgent = agents.analyst): Promise<CaseView> => {
    const res = await as.post(`/api/units/${unit.id}/cases`).set(CSRF).send({ title });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body;
  };
  const act = (as: TestAgent, id: string, action: string, body: object = {}) => as.post(`/api/cases/${id}/${action}`).set(CSRF).send(body);
  const message = (res: { body: { error?: string; message?: string } }) => res.body.error ?? res.body.message ?? '';
  const stored = (id: string) => t.dataSource.getRepository(CleaningCase).findOneByOrFail({ id });

  it('a calculation larger than one request may take is refused with 400 saying how to make it smaller, leaving the case as it was', async () => {
    const view = await newCase('Far too many trials');
    const inputs = { ...view.inputs, horizonDays: 1830, uncertainty: { ...view.inputs.uncertainty, trials: 20_000 } };
    const res = await agents.analyst.patch(`/api/cases/${view.id}`).set(CSRF).send({ inputs });
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(message(res)).toMatch(/trials/);
    expect(message(res)).toMatch(/horizon/);
    const after = await stored(view.id);
    expect(after.inputs).toEqual(view.inputs);
    expect(after.updatedAt.toISOString()).toBe(view.updatedAt);
  });

  it('a case submitted while an edit is being calculated refuses the edit with 409 and keeps its figures', async () => {
    const view = await newCase('Submitted mid-edit');
    let concurrent: Promise<unknown> | null = null;
    duringCalc.hook = () => {
      // Another member's submit lands while this edit computes.
      concurrent = t.dataSource.query(`UPDATE cleaning_case SET status = 'submitted' WHERE id = ?`, [view.id]);
    };
    const inputs = { ...view.inputs, drivers: { ...view.inputs.drivers, fuelPricePerMmbtu: 6.25 } };
    const res = await agents.analyst.patch(`/api/cases/${view.id}`).set(CSRF).send({ inputs });
    await concurrent;
    expect(concurrent).not.toBeNull();
    expect(res.status, JSON.stringify(res.body)).toBe(409);
    expect(message(res)).toMatch(/submitted/);
    const after = await stored(view.id);
    expect(after.status).toBe('submitted');
    expect(after.inputs).toEqual(view.inputs);
    expect(after.results.businessCase.npv).toBe(view.results.businessCase.npv);
  });

  it('one member saving cases faster than a person would is told to wait (429), other members are not', async () => {
    const view = await newCase('Saved again and again', agents.busyAnalyst);
    let last = 0;
    for (let i = 0; i < 80 && last !== 429; i++) {
      last = (
        await agents.busyAnalyst
          .patch(`/api/cases/${view.id}`)
          .set(CSRF)
          .send({ title: `Saved again ${i}` })
      ).status;
      if (last !== 429) expect(last).toBe(200);
    }
    expect(last).toBe(429);
    const copy = await act(agents.busyAnalyst, view.id, 'copy');
    expect(copy.status).toBe(429);
    expect(message(copy)).toMatch(/Too many/);
    expect((await agents.analyst.patch(`/api/cases/${view.id}`).set(CSRF).send({ title: 'Another member saves' })).status).toBe(200);
  });

  it('an administrator who changed a case’s figures cannot approve or return it; the member who submitted it cannot either', async () => {
    const edited = await newCase('Figures changed by the administrator');
    const inputs = { ...edited.inputs, drivers: { ...edited.inputs.drivers, fuelPricePerMmbtu: 5.5 } };
    await agents.admin.patch(`/api/cases/${edited.id}`).set(CSRF).send({ inputs }).expect(200);
    // an analyst edits last and submits: the administrator's change still counts
    await agents.analyst.patch(`/api/cases/${edited.id}`).set(CSRF).send({ title: 'Figures changed, then retitled' }).expect(200);
    await act(agents.analyst, edited.id, 'submit').expect(200);
    const approve = await act(agents.admin, edited.id, 'approve');
    expect(approve.status).toBe(403);
    expect(message(approve)).toMatch(/changed/);
    expect((await act(agents.admin, edited.id, 'return', { reason: 'mine to judge' })).status).toBe(403);
    expect((await agents.admin.get(`/api/cases/${edited.id}`).expect(200)).body.actions).toMatchObject({ approve: false, return: false });
    // an approver who did not touch it decides; after that decision the earlier edit no longer bars the administrator
    await act(agents.approver, edited.id, 'return', { reason: 'Check the fuel price' }).expect(200);
    await agents.analyst.patch(`/api/cases/${edited.id}`).set(CSRF).send({ title: 'Fuel price checked' }).expect(200);
    await act(agents.analyst, edited.id, 'submit').expect(200);
    expect((await act(agents.admin, edited.id, 'approve')).status).toBe(200);

    const submitted = await newCase('Submitted by the administrator');
    await act(agents.admin, submitted.id, 'submit').expect(200);
    const own = await act(agents.admin, submitted.id, 'approve');
    expect(own.status).toBe(403);
    expect(message(own)).toMatch(/submitted/);
    const record = await stored(submitted.id);
    expect(record.submittedById).toBe(tenant.users.admin.id);
    expect((await act(agents.approver, submitted.id, 'approve')).status).toBe(200);
  });

  it('an edit that recomputes records the engine version it was computed with', async () => {
    const view = await newCase('Older engine');
    await t.dataSource.getRepository(CleaningCase).update({ id: view.id }, { engineVersion: 'schedule-0.0' });
    const inputs = { ...view.inputs, drivers: { ...view.inputs.drivers, fuelPricePerMmbtu: 4.75 } };
    const res = await agents.analyst.patch(`/api/cases/${view.id}`).set(CSRF).send({ inputs });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.engineVersion).toBe(ENGINE_VERSION);
  });

  it('an approver deciding on a version older than the case is told the case changed since they opened it (409)', async () => {
    const view = await newCase('Read before deciding');
    const submitted = (await act(agents.analyst, view.id, 'submit').expect(200)).body as CaseView;
    const stale = await act(agents.approver, view.id, 'approve', { seenUpdatedAt: view.updatedAt });
    expect(stale.status).toBe(409);
    expect(message(stale)).toMatch(/changed since you opened it/);
    const staleReturn = await act(agents.approver, view.id, 'return', { reason: 'no', seenUpdatedAt: view.updatedAt });
    expect(staleReturn.status).toBe(409);
    expect((await stored(view.id)).status).toBe('submitted');
    const bad = await act(agents.approver, view.id, 'approve', { seenUpdatedAt: 'yesterday' });
    expect(bad.status).toBe(400);
    expect((await act(agents.approver, view.id, 'approve', { seenUpdatedAt: submitted.updatedAt })).status).toBe(200);
  });

  it('a submitted case keeps the unit’s and plant’s names as they were; a draft shows the current ones', async () => {
    const ownPlant = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
    const ownUnit = await createUnit(t.dataSource, ownPlant);
    const submitted = await createCaseRecord(t.dataSource, ownUnit, tenant.users.analyst.id);
    const draft = await createCaseRecord(t.dataSource, ownUnit, tenant.users.analyst.id);
    await act(agents.analyst, submitted.id, 'submit').expect(200);
    await t.dataSource.getRepository(GeneratingUnit).update({ id: ownUnit.id }, { name: 'Renamed unit' });
    await t.dataSource.getRepository(Plant).update({ id: ownPlant.id }, { name: 'Renamed plant' });
    const kept = (await agents.analyst.get(`/api/cases/${submitted.id}`).expect(200)).body as CaseView;
    expect(kept).toMatchObject({ unitName: ownUnit.name, plantName: ownPlant.name });
    const current = (await agents.analyst.get(`/api/cases/${draft.id}`).expect(200)).body as CaseView;
    expect(current).toMatchObject({ unitName: 'Renamed unit', plantName: 'Renamed plant' });
  });

  it('a unit or plant with submitted, approved, returned or archived cases is not deleted (409 saying why); drafts go with their unit', async () => {
    for (const status of ['submitted', 'approved', 'returned', 'archived'] as const) {
      const p = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
      const u = await createUnit(t.dataSource, p);
      const kept = await createCaseRecord(t.dataSource, u, tenant.users.analyst.id, status, `Kept ${status}`);
      const unitRes = await agents.admin.delete(`/api/units/${u.id}`).set(CSRF);
      expect(unitRes.status, status).toBe(409);
      expect(message(unitRes)).toMatch(/case/);
      const plantRes = await agents.admin.delete(`/api/plants/${p.id}`).set(CSRF);
      expect(plantRes.status, status).toBe(409);
      expect(message(plantRes)).toMatch(/case/);
      expect((await stored(kept.id)).status).toBe(status);
      expect(await t.dataSource.getRepository(GeneratingUnit).existsBy({ id: u.id })).toBe(true);
    }
    const p = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
    const u = await createUnit(t.dataSource, p);
    const draft = await createCaseRecord(t.dataSource, u, tenant.users.analyst.id, 'draft', 'A draft to drop');
    await agents.admin.delete(`/api/units/${u.id}`).set(CSRF).expect(204);
    expect(await t.dataSource.getRepository(CleaningCase).existsBy({ id: draft.id })).toBe(false);
    const audit = await t.dataSource.query(`SELECT details FROM audit_event WHERE action = 'unit.deleted' AND entityId = ?`, [u.id]);
    expect(JSON.stringify(audit[0].details)).toContain('A draft to drop');

    const p2 = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
    const u2 = await createUnit(t.dataSource, p2);
    const draft2 = await createCaseRecord(t.dataSource, u2, tenant.users.analyst.id, 'draft', 'Another draft');
    await agents.admin.delete(`/api/plants/${p2.id}`).set(CSRF).expect(204);
    expect(await t.dataSource.getRepository(CleaningCase).existsBy({ id: draft2.id })).toBe(false);
  });

  it('the database itself refuses to delete a unit that still has cases', async () => {
    const p = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
    const u = await createUnit(t.dataSource, p);
    await createCaseRecord(t.dataSource, u, tenant.users.analyst.id, 'approved');
    await expect(t.dataSource.query('DELETE FROM generating_unit WHERE id = ?', [u.id])).rejects.toThrow(/foreign key/i);
  });
});
