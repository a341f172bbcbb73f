/**
 * A new case's prefill on a unit with six weeks of history, an outage far beyond two years and a library of
 * sixteen methods: the case is made, with the methods chosen and said so, the far outage kept, the months without
 * history marked and filled from the design CW inlet, and a baseline that cleans at the planned outages.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import { caseView } from '@shared/schemas/cases.js';
import { TYPICAL_CLEANING_METHODS } from '@shared/schemas/cleaning-method.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { createMethod, seedTypicalMethods } from '../../backend/src/services/cleaning-method.service.js';
import { createTenant, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv } from '../helpers/historian-files.js';

const H = 24;
const DAYS = 42;
/** Made-up test data: 0.90 after a cleaning, 0.80 after 35 days. */
const CF0 = 0.9;
const K = (1 / 0.8 - 1 / CF0) / 35;
const TIME_ZONE = 'America/Chicago';

describe('a new case’s prefill', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let tenant: TenantFixture;
  let unit: GeneratingUnit;
  let analyst: TestAgent;
  let farOutage: { from: string; to: string };

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    tenant = await createTenant(t.dataSource, 'prefill');
    await seedTypicalMethods(t.dataSource.manager, tenant.organisation.id);
    const scope = { organisationId: tenant.organisation.id, userId: tenant.users.admin.id, role: 'admin', clientGroupIds: null } as never;
    // eleven more outage methods, dearer than the typical ones, so the library holds sixteen
    for (let i = 0; i < 11; i++) {
      await createMethod(t.dataSource, scope, {
        ...TYPICAL_CLEANING_METHODS[2]!,
        id: `dear-outage-${i}`,
        name: `Dear outage method ${i}`,
        fixedCost: 500_000 + i,
      });
    }
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    const plant = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
    unit = await createUnit(t.dataSource, plant);
    const today = plantDayOf(Date.now(), TIME_ZONE);
    const [y = 0, m = 1, d = 1] = addDays(today, -DAYS - 1)
      .split('-')
      .map(Number);
    const rows = physicalHistory({
      startUtc: Date.UTC(y, m - 1, d, 6, 0),
      hours: DAYS * H,
      condenser: TEST_CONDENSER,
      turbine: TEST_TURBINE,
      cleanlinessAt: (h) => 1 / (1 / CF0 + (K * h) / H),
    });
    const up = await analyst
      .post(`/api/units/${unit.id}/uploads`)
      .set(CSRF)
      .attach('file', await writeHistorianCsv(tmp.file('h.csv'), rows))
      .expect(201);
    await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
    await drainJobs(t.dataSource, JOB_HANDLERS);
    farOutage = { from: addDays(today, 900), to: addDays(today, 910) };
    for (const o of [{ from: addDays(today, 100), to: addDays(today, 110) }, farOutage]) {
      await analyst.post(`/api/units/${unit.id}/events`).set(CSRF).send({ kind: 'outage', startDate: o.from, endDate: o.to, notes: 'planned' }).expect(201);
    }
    await drainJobs(t.dataSource, JOB_HANDLERS);
  }, 240_000);
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  it('a library of sixteen methods still makes a case: twelve are chosen, the dearest outage ones left out, and the source says so', async () => {
    const res = await analyst.post(`/api/units/${unit.id}/cases`).set(CSRF).send({ title: 'Big library' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const view = caseView.parse(res.body);
    const ids = view.inputs.methods.map((m) => (typeof m === 'string' ? m : m.id));
    expect(ids).toHaveLength(12);
    expect(ids).toContain('sponge-ball-campaign');
    expect(ids).toContain('half-condenser-online');
    expect(ids).not.toContain('dear-outage-10');
    expect(view.inputSources.methods?.detail).toMatch(/12 of the organisation’s 16 cleaning methods/);

    // outages beyond the two-year horizon are prefilled too, so a longer horizon finds them
    expect(view.inputs.plannedOutages).toContainEqual(farOutage);

    // six weeks of history cover two or three months: the rest are marked, named and taken from the design CW inlet
    const cw = view.inputs.drivers.cwInletC as { monthly: number[] };
    expect(view.inputSources['drivers.cwInletC']?.source).toBe('prefilled');
    expect(view.inputSources['drivers.cwInletC']?.detail).toMatch(/measured in [23] of 12 months/);
    expect(cw.monthly.filter((v) => v === TEST_CONDENSER.designCwInletC).length).toBeGreaterThanOrEqual(9);
    expect(view.inputSources['drivers.loadFraction']?.detail).toMatch(/off line .* counted as load 0/);

    // a plant cleans at its planned outages anyway: that is the baseline, with the cheapest outage method
    expect(view.inputs.baseline).toEqual({ kind: 'every-planned-outage', methodId: 'shot-tube-cleaners' });
    expect(view.inputSources.baseline?.detail).toMatch(/cheapest outage method/);
  });

  it('moving a case’s start moves the measured days since the cleaning with it, and the case warns of what it rests on', async () => {
    const made = caseView.parse((await analyst.post(`/api/units/${unit.id}/cases`).set(CSRF).send({ title: 'Moved start' }).expect(201)).body);
    expect(made.caseWarnings?.join(' ')).toMatch(/measured/); // few months of history: the case says so beside its results
    const later = addDays(made.inputs.startDate, 30);
    const res = await analyst
      .patch(`/api/cases/${made.id}`)
      .set(CSRF)
      .send({ inputs: { ...made.inputs, startDate: later } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const moved = caseView.parse(res.body);
    expect(moved.inputs.initial.daysSinceCleaning).toBe(made.inputs.initial.daysSinceCleaning + 30);
    expect(moved.inputSources.startDate?.source).toBe('entered');
    expect(moved.inputSources.initial?.source).toBe(made.inputSources.initial?.source);
    expect(moved.inputSources.initial?.detail).toMatch(/moved with the start/);
    // the results stay exactly the calculation's own for the stored inputs; the case's warnings stand beside them
    expect(moved.results.warnings.join(' ')).not.toMatch(/measured in/);
  });
});
