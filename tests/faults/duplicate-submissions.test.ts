/**
 * The same form sent twice at once (a double click, a retried request): one effect, and the second answer is
 * either the same success or a clear 409 in our words, never a 500 and never two records.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import { AuditEvent } from '../../backend/src/entities/audit-event.entity.js';
import { BackgroundJob } from '../../backend/src/entities/background-job.entity.js';
import { CleaningCase } from '../../backend/src/entities/cleaning-case.entity.js';
import { ClientGroup } from '../../backend/src/entities/client-group.entity.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { Plant } from '../../backend/src/entities/plant.entity.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { createTenant, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv } from '../helpers/historian-files.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

/** Each pair is sent this many times; a race that one pair misses, another catches. */
const PAIRS = 5;

let t: TestApp;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;
let tenant: TenantFixture;
let analyst: TestAgent;
let admin: TestAgent;
let unit: GeneratingUnit;

/** Both answers of a pair: exactly one success, the other the same success or a 409 that says why. */
function expectOneEffect(answers: { status: number; body: { error?: string } }[], success: number): void {
  const statuses = answers.map((a) => a.status).sort();
  expect(
    statuses.filter((s) => s >= 500),
    JSON.stringify(answers.map((a) => a.body)),
  ).toEqual([]);
  expect(statuses).toContain(success);
  for (const a of answers.filter((x) => x.status !== success)) {
    expect(a.status, JSON.stringify(a.body)).toBe(409);
    expect(a.body.error).toMatch(/already|moments? ago|same time/i);
  }
}

describe('duplicate form submissions', { timeout: 120_000 }, () => {
  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    tenant = await createTenant(t.dataSource, 'duplicates');
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    admin = await signedInAgent(t.app, tenant.users.admin.email);
    const plant = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
    unit = await createUnit(t.dataSource, plant);
    // Six weeks of history up to two days ago, so a case can be calculated.
    const first = addDays(plantDayOf(Date.now(), plant.timeZone), -43);
    const [y = 0, m = 1, d = 1] = first.split('-').map(Number);
    const rows = physicalHistory({ startUtc: Date.UTC(y, m - 1, d, 6, 0), hours: 42 * 24, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    const up = await analyst
      .post(`/api/units/${unit.id}/uploads`)
      .set(CSRF)
      .attach('file', await writeHistorianCsv(tmp.file('history.csv'), rows))
      .expect(201);
    await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
    await drainJobs(t.dataSource, JOB_HANDLERS);
  });
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  it('creating a plant twice at once stores one plant; the other answer is 409', async () => {
    for (let i = 0; i < PAIRS; i++) {
      const body = { name: `Twice plant ${i}`, timeZone: 'America/Chicago', clientGroupId: null };
      const answers = await Promise.all([0, 1].map(() => analyst.post('/api/plants').set(CSRF).send(body)));
      expectOneEffect(answers, 201);
      expect(await t.dataSource.getRepository(Plant).countBy({ organisationId: tenant.organisation.id, name: body.name })).toBe(1);
    }
  });

  it('creating a client group twice at once stores one group; the other answer is 409', async () => {
    for (let i = 0; i < PAIRS; i++) {
      const body = { name: `Twice group ${i}` };
      const answers = await Promise.all([0, 1].map(() => admin.post('/api/client-groups').set(CSRF).send(body)));
      expectOneEffect(answers, 201);
      expect(await t.dataSource.getRepository(ClientGroup).countBy({ organisationId: tenant.organisation.id, name: body.name })).toBe(1);
    }
  });

  it('creating a case twice at once stores one case; the other answer is 409', async () => {
    for (let i = 0; i < PAIRS; i++) {
      const body = { title: `Twice case ${i}` };
      const answers = await Promise.all([0, 1].map(() => analyst.post(`/api/units/${unit.id}/cases`).set(CSRF).send(body)));
      expectOneEffect(answers, 201);
      expect(await t.dataSource.getRepository(CleaningCase).countBy({ unitId: unit.id, title: body.title })).toBe(1);
    }
  });

  it('starting an import twice at once queues one import job and records one start; the other answer is 409', async () => {
    for (let i = 0; i < PAIRS; i++) {
      const rows = physicalHistory({ startUtc: Date.UTC(2020, 0, 1 + i), hours: 6, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
      const file = await writeHistorianCsv(tmp.file(`twice-${i}.csv`), rows);
      const up = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', file).expect(201);
      const importId: string = up.body.import.id;
      const answers = await Promise.all([0, 1].map(() => analyst.post(`/api/imports/${importId}/start`).set(CSRF).send({ mapping: US_MAPPING })));
      expectOneEffect(answers, 202);
      const jobs = await t.dataSource.getRepository(BackgroundJob).find({ where: { unitId: unit.id, kind: 'import' } });
      expect(jobs.filter((j) => (j.payload as { importId?: string } | null)?.importId === importId)).toHaveLength(1);
      expect(await t.dataSource.getRepository(AuditEvent).countBy({ action: 'import.started', entityId: importId })).toBe(1);
      await drainJobs(t.dataSource, JOB_HANDLERS);
    }
  });
});
