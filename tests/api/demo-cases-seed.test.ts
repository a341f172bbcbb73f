/**
 * The demo's cleaning cases: on the Northmere people and a Harrow Creek plant whose two units have a few weeks of
 * history, the seed leaves an approved case on Unit 1 (with a comment) and one waiting for a decision on Unit 2.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import { CleaningCase } from '../../backend/src/entities/cleaning-case.entity.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import { Plant } from '../../backend/src/entities/plant.entity.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { seedDemoCases } from '../../backend/src/seed/demo-cases-seed.js';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { seedDemoIfEmpty } from '../../backend/src/seed/demo-seed.js';
import { CSRF, signedInAgent } from '../factories/accounts.js';
import { TEST_CONDENSER, TEST_ECONOMICS, TEST_TURBINE } from '../factories/units.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv } from '../helpers/historian-files.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('demo cleaning cases', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    await seedDemoIfEmpty(t.dataSource, () => {}, false);
    const org = await t.dataSource.getRepository(Organisation).findOneByOrFail({ name: 'Northmere Power Cooperative' });
    const plant = await t.dataSource
      .getRepository(Plant)
      .save({ organisationId: org.id, clientGroupId: null, name: 'Harrow Creek Station', timeZone: 'America/Chicago' });
    const analyst = await signedInAgent(t.app, 'analyst@northmere.example', DEMO_PASSWORD);
    const first = addDays(plantDayOf(Date.now(), 'America/Chicago'), -31);
    const [y = 0, m = 1, d = 1] = first.split('-').map(Number);
    for (const name of ['Unit 1', 'Unit 2']) {
      const unit = await t.dataSource.getRepository(GeneratingUnit).save({
        organisationId: org.id,
        plantId: plant.id,
        name,
        condenser: TEST_CONDENSER,
        turbine: TEST_TURBINE,
        economics: TEST_ECONOMICS,
        savedMapping: null,
      });
      // cleanliness falling from 0.90 by a linear fouling resistance (made-up test data)
      const rows = physicalHistory({
        startUtc: Date.UTC(y, m - 1, d, 6, 0),
        hours: 30 * 24,
        condenser: TEST_CONDENSER,
        turbine: TEST_TURBINE,
        cleanlinessAt: (h) => 1 / (1 / 0.9 + 0.00012 * h),
      });
      const up = await analyst
        .post(`/api/units/${unit.id}/uploads`)
        .set(CSRF)
        .attach('file', await writeHistorianCsv(tmp.file(`${name}.csv`), rows))
        .expect(201);
      await analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
      await drainJobs(t.dataSource, JOB_HANDLERS);
    }
  }, 240_000);
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  it('leaves an approved case on Unit 1 and a submitted one on Unit 2, which the demo viewer and approver see as such', async () => {
    const lines: string[] = [];
    await seedDemoCases(t.dataSource, (l) => lines.push(l));
    const cases = await t.dataSource.getRepository(CleaningCase).find({ order: { title: 'ASC' } });
    expect(cases.map((c) => c.status)).toEqual(['approved', 'submitted']);
    expect(lines).toHaveLength(2);
    const viewer = await signedInAgent(t.app, 'viewer@northmere.example', DEMO_PASSWORD);
    const seen = (await viewer.get('/api/cases').expect(200)).body.cases as { status: string }[];
    expect(seen.map((c) => c.status)).toEqual(['approved']);
    const approver = await signedInAgent(t.app, 'approver@northmere.example', DEMO_PASSWORD);
    const waiting = cases.find((c) => c.status === 'submitted')!;
    expect((await approver.get(`/api/cases/${waiting.id}`).expect(200)).body.actions.approve).toBe(true);
    const approved = cases.find((c) => c.status === 'approved')!;
    expect(((await approver.get(`/api/cases/${approved.id}/comments`).expect(200)).body.comments as unknown[]).length).toBe(1);
  });
});
