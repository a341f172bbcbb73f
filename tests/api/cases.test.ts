/**
 * Cleaning cases through HTTP against a real MariaDB: a unit with six weeks of hourly history whose
 * cleanliness falls (so the recompute fits a fouling trend), a case prefilled from it, the CLI reproducing its
 * figures, edits, every status change by role, the snapshot, comments, copies, mail and the refusals.
 */
import { spawnSync } from 'node:child_process';
import ExcelJS from 'exceljs';
import { PDFParse } from 'pdf-parse';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, daysBetween } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import { ENGINE_VERSION } from '@shared/domain/decision/schedule/engine-version.js';
import { runScheduleCommand } from '@shared/domain/decision/schedule/schedule-command.js';
import { caseView, type CaseView } from '@shared/schemas/cases.js';
import { storedUnitAnalysis } from '@shared/schemas/unit-analysis.js';
import { formatCurrency, formatDay } from '@shared/text/display-format.js';
import { dayText } from '../../backend/src/services/cases/day-text.js';
import { drainJobs } from '../../backend/src/jobs/job-worker.js';
import { JOB_HANDLERS } from '../../backend/src/jobs/job-handlers.js';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import type { Plant } from '../../backend/src/entities/plant.entity.js';
import { methodsOf, seedTypicalMethods } from '../../backend/src/services/cleaning-method.service.js';
import { addMember, createTenant, createUser, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit, TEST_CONDENSER, TEST_ECONOMICS, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { makeTempDir, physicalHistory, US_MAPPING, writeHistorianCsv } from '../helpers/historian-files.js';

const H = 24;
const DAYS = 42;
/** Fouling as a linear rise of the fouling resistance: 0.90 after a cleaning, 0.80 after 35 days (made-up test data). */
const CF0 = 0.9;
const K = (1 / 0.8 - 1 / CF0) / 35;
const cleanlinessAt = (hour: number) => 1 / (1 / CF0 + (K * hour) / H);
const TIME_ZONE = 'America/Chicago';
/** What a value reads as after JSON (the API's answer): −0 becomes 0, nothing else changes. */
const overJson = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

describe('cleaning cases', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let tenant: TenantFixture;
  let plant: Plant;
  let unit: GeneratingUnit;
  let agents: Record<'admin' | 'analyst' | 'approver' | 'viewer' | 'approver2' | 'limitedApprover' | 'otherAnalyst', TestAgent>;
  let lastDataDay: string;
  let outage: { from: string; to: string };
  const drain = () => drainJobs(t.dataSource, JOB_HANDLERS);

  async function importHistory(u: GeneratingUnit, name: string, startUtc: number, hours: number, from = 0) {
    const rows = physicalHistory({ startUtc, hours, condenser: TEST_CONDENSER, turbine: TEST_TURBINE, cleanlinessAt: (h) => cleanlinessAt(h + from) });
    const up = await agents.analyst
      .post(`/api/units/${u.id}/uploads`)
      .set(CSRF)
      .attach('file', await writeHistorianCsv(tmp.file(`${name}.csv`), rows))
      .expect(201);
    await agents.analyst.post(`/api/imports/${up.body.import.id}/start`).set(CSRF).send({ mapping: US_MAPPING }).expect(202);
    await drain();
  }

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads'), PUBLIC_URL: 'http://127.0.0.1:8123' });
    tenant = await createTenant(t.dataSource, 'cases');
    await seedTypicalMethods(t.dataSource.manager, tenant.organisation.id);
    const approver2 = await createUser(t.dataSource, 'cases-approver-two');
    await addMember(t.dataSource, tenant.organisation.id, approver2, 'approver');
    const limitedApprover = await createUser(t.dataSource, 'cases-limited-approver');
    await addMember(t.dataSource, tenant.organisation.id, limitedApprover, 'approver', [tenant.groups[1].id]);
    const otherAnalyst = await createUser(t.dataSource, 'cases-other-analyst');
    await addMember(t.dataSource, tenant.organisation.id, otherAnalyst, 'analyst');
    agents = {
      admin: await signedInAgent(t.app, tenant.users.admin.email),
      analyst: await signedInAgent(t.app, tenant.users.analyst.email),
      approver: await signedInAgent(t.app, tenant.users.approver.email),
      viewer: await signedInAgent(t.app, tenant.users.viewer.email),
      approver2: await signedInAgent(t.app, approver2.email),
      limitedApprover: await signedInAgent(t.app, limitedApprover.email),
      otherAnalyst: await signedInAgent(t.app, otherAnalyst.email),
    };
    plant = await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id);
    unit = await createUnit(t.dataSource, plant);
    // History up to two days ago (plant-local), so the case starts tomorrow.
    const today = plantDayOf(Date.now(), TIME_ZONE);
    const first = addDays(today, -DAYS - 1);
    const [y = 0, m = 1, d = 1] = first.split('-').map(Number);
    await importHistory(unit, 'history', Date.UTC(y, m - 1, d, 6, 0), DAYS * H);
    const stored = storedUnitAnalysis.parse((await t.dataSource.getRepository(GeneratingUnit).findOneByOrFail({ id: unit.id })).analysis);
    lastDataDay = stored.lastDay!;
    outage = { from: addDays(today, 60), to: addDays(today, 74) };
    await agents.analyst
      .post(`/api/units/${unit.id}/events`)
      .set(CSRF)
      .send({ kind: 'outage', startDate: outage.from, endDate: outage.to, notes: 'spring outage' })
      .expect(201);
    await drain();
  }, 240_000);
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  // The same title by the same person on one unit within seconds counts as one form sent twice (409), so each test names its own.
  let casesMade = 0;
  const newCase = async (title = 'Clean before summer', as: TestAgent = agents.analyst): Promise<CaseView> => {
    const res = await as.post(`/api/units/${unit.id}/cases`).set(CSRF).send({ title });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body;
  };
  const act = (as: TestAgent, id: string, action: string, body: object = {}) => as.post(`/api/cases/${id}/${action}`).set(CSRF).send(body);

  it('a new case is prefilled from the unit: its fouling trend, seasonal drivers, prices, outages and methods, each with its source', async () => {
    const view = caseView.parse(await newCase());
    const unitRow = await t.dataSource.getRepository(GeneratingUnit).findOneByOrFail({ id: unit.id });
    const analysis = storedUnitAnalysis.parse(unitRow.analysis);
    const cycle = analysis.cycles.at(-1)!;
    expect(cycle.status).toBe('fitted');
    if (cycle.status !== 'fitted') return;

    expect(view.status).toBe('draft');
    expect(view.engineVersion).toBe(ENGINE_VERSION);
    expect(view.builtFrom).toEqual({ lastDataDay, setupVersion: unitRow.setupVersion });
    expect(view.newerData).toBeNull();
    expect(view.timeZone).toBe(TIME_ZONE);
    expect(view.currency).toBe('USD');
    const tomorrow = addDays(plantDayOf(Date.now(), TIME_ZONE), 1);
    const dayAfterData = addDays(lastDataDay, 1);
    expect(view.inputs.startDate).toBe(tomorrow > dayAfterData ? tomorrow : dayAfterData);
    expect(view.inputs.horizonDays).toBe(730);
    expect(view.inputs.fouling).toEqual(cycle.model);
    expect(view.inputs.initial.cleanlinessAfterCleaning).toBe(cycle.cleanlinessAfterCleaning);
    expect(view.inputs.initial.daysSinceCleaning).toBe(daysBetween(cycle.startDay, view.inputs.startDate));
    const cw = view.inputs.drivers.cwInletC as { monthly: number[] };
    expect(cw.monthly).toHaveLength(12);
    // The history's CW inlet swings 19.5–24.5 °C around 22 °C every day (tests/helpers/historian-files.ts).
    // Months without history take the design CW inlet (TEST_CONDENSER) and are named in the source.
    for (const v of cw.monthly) expect(v === TEST_CONDENSER.designCwInletC || Math.abs(v - 22) < 0.5, String(v)).toBe(true);
    const load = view.inputs.drivers.loadFraction as { monthly: number[] };
    for (const v of load.monthly) expect(v).toBeCloseTo(0.88, 2);
    expect(view.inputs.drivers.fuelPricePerMmbtu).toBe(TEST_ECONOMICS.fuelPricePerMmbtu);
    expect(view.inputs.drivers.replacementPricePerMwh).toBe(TEST_ECONOMICS.replacementPricePerMwh);
    expect(view.inputs.discountRate).toBe(TEST_ECONOMICS.discountRate);
    expect(view.inputs.unit.ratingMw).toBe(TEST_TURBINE.ratingMw);
    expect(view.inputs.unit.condenser).toMatchObject({
      surfaceM2: TEST_CONDENSER.surfaceM2,
      tubeCount: TEST_CONDENSER.tubeCount,
      pluggedTubes: TEST_CONDENSER.pluggedTubes,
      cwFlowM3s: TEST_CONDENSER.designCwFlowM3s,
    });
    expect(view.inputs.plannedOutages).toEqual([outage]);
    expect(view.inputs.methods).toEqual(await methodsOf(t.dataSource.manager, tenant.organisation.id));
    expect(view.inputs.uncertainty).toEqual({ trials: 5000, seed: 1 });

    for (const key of ['fouling', 'initial']) expect(view.inputSources[key]?.source, key).toBe('measured');
    // six weeks of history measure two or three months: the seasonal drivers are prefilled for the rest
    for (const key of ['drivers.cwInletC', 'drivers.loadFraction']) expect(view.inputSources[key]?.detail, key).toMatch(/measured in [23] of 12 months/);
    for (const key of [
      'drivers.fuelPricePerMmbtu',
      'drivers.replacementPricePerMwh',
      'drivers.co2PricePerTonne',
      'unit',
      'methods',
      'plannedOutages',
      'discountRate',
      'startDate',
      'horizonDays',
      'uncertainty',
    ]) {
      expect(view.inputSources[key]?.source, key).toBe('prefilled');
    }
    for (const [key, entry] of Object.entries(view.inputSources)) expect(entry.detail.length, key).toBeGreaterThan(10);
    expect(view.inputSources.fouling?.detail).toContain(dayText(cycle.startDay));

    // results are exactly the schedule calculation of the inputs
    expect(view.results).toEqual(overJson(runScheduleCommand(view.inputs)));
    expect(view.results.monteCarlo?.trials).toBe(5000);
    expect(view.actions).toEqual({ edit: true, submit: true, approve: false, return: false, archive: true, copy: true, comment: true });

    const audit = await t.dataSource.query('SELECT action FROM audit_event WHERE entityId = ?', [view.id]);
    expect(audit.map((a: { action: string }) => a.action)).toEqual(['case.created']);
  });

  it('piping a case’s inputs into `npm run calc -- schedule` gives the same NPV', async () => {
    const view = await newCase('Reproduced by the CLI');
    expect(runScheduleCommand(view.inputs).businessCase.npv).toBe(view.results.businessCase.npv);
    const run = spawnSync('npm', ['run', '--silent', 'calc', '--', 'schedule'], {
      input: JSON.stringify(view.inputs),
      encoding: 'utf8',
      cwd: process.cwd(),
      timeout: 120_000,
    });
    expect(run.status, run.stderr).toBe(0);
    expect(JSON.parse(run.stdout).businessCase.npv).toBe(view.results.businessCase.npv);
  }, 150_000);

  it('an edit recomputes the results and marks each changed input as entered, leaving the others as they were', async () => {
    const view = await newCase(`Clean before summer ${++casesMade}`);
    const inputs = { ...view.inputs, drivers: { ...view.inputs.drivers, fuelPricePerMmbtu: 4.5 }, horizonDays: 365 };
    const res = await agents.analyst.patch(`/api/cases/${view.id}`).set(CSRF).send({ inputs, title: 'Clean before summer, dearer fuel' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const edited = caseView.parse(res.body);
    expect(edited.title).toBe('Clean before summer, dearer fuel');
    expect(edited.results).toEqual(overJson(runScheduleCommand(edited.inputs)));
    expect(edited.results.businessCase.npv).not.toBe(view.results.businessCase.npv);
    expect(edited.inputSources['drivers.fuelPricePerMmbtu']?.source).toBe('entered');
    expect(edited.inputSources.horizonDays?.source).toBe('entered');
    expect(edited.inputSources['drivers.cwInletC']).toEqual(view.inputSources['drivers.cwInletC']);
    expect(edited.inputSources.fouling).toEqual(view.inputSources.fouling);
    expect(edited.inputSources.discountRate).toEqual(view.inputSources.discountRate);
    // the stored form is the parsed one: a default left out comes back filled in
    const again = await agents.analyst.get(`/api/cases/${view.id}`).expect(200);
    expect(again.body.inputs).toEqual(edited.inputs);
    expect(again.body.results).toEqual(edited.results);
  });

  it('inputs the engine cannot calculate and bad bodies are refused with a message, leaving the case as it was', async () => {
    const view = await newCase(`Clean before summer ${++casesMade}`);
    const noTitle = await agents.analyst.post(`/api/units/${unit.id}/cases`).set(CSRF).send({});
    expect(noTitle.status).toBe(400);
    expect(JSON.stringify(noTitle.body)).toContain('Give the case a title');
    const extra = await agents.analyst.post(`/api/units/${unit.id}/cases`).set(CSRF).send({ title: 'x', status: 'approved' });
    expect(extra.status).toBe(400);
    const empty = await agents.analyst.patch(`/api/cases/${view.id}`).set(CSRF).send({});
    expect(empty.status).toBe(400);
    expect(JSON.stringify(empty.body)).toContain('Change the title or the inputs');
    const hot = await agents.analyst
      .patch(`/api/cases/${view.id}`)
      .set(CSRF)
      .send({ inputs: { ...view.inputs, drivers: { ...view.inputs.drivers, cwInletC: 95 } } });
    expect(hot.status).toBe(400);
    expect(JSON.stringify(hot.body)).toContain('cwInletC is at most');
    const unknownMethod = await agents.analyst
      .patch(`/api/cases/${view.id}`)
      .set(CSRF)
      .send({ inputs: { ...view.inputs, methods: ['no-such-method'] } });
    expect(unknownMethod.status).toBe(400);
    expect(unknownMethod.body.error ?? unknownMethod.body.message).toMatch(/no-such-method/);
    const reason = await act(agents.approver, view.id, 'return', { reason: '   ' });
    expect(reason.status).toBe(400);
    const comment = await agents.analyst.post(`/api/cases/${view.id}/comments`).set(CSRF).send({ text: '' });
    expect(comment.status).toBe(400);
    expect(JSON.stringify(comment.body)).toContain('Write a comment');
    const list = await agents.analyst.get('/api/cases?status=pending');
    expect(list.status).toBe(400);
    expect((await agents.analyst.get(`/api/cases/${view.id}`).expect(200)).body).toMatchObject({
      inputs: view.inputs,
      results: view.results,
      title: view.title,
    });
  });

  it('the status changes each role may make, and the ones refused with the reason', async () => {
    const c = await newCase('Walk through the statuses');
    // an approver and a viewer cannot submit; a draft cannot be approved or sent back
    expect((await act(agents.approver, c.id, 'submit')).status).toBe(403);
    expect((await act(agents.viewer, c.id, 'submit')).status).toBe(403);
    const early = await act(agents.approver, c.id, 'approve');
    expect(early.status).toBe(409);
    expect(early.body.error ?? early.body.message).toMatch(/draft/i);
    expect((await act(agents.approver, c.id, 'return', { reason: 'too early' })).status).toBe(409);

    // another analyst (not the author) may submit
    const submitted = await act(agents.otherAnalyst, c.id, 'submit');
    expect(submitted.status).toBe(200);
    expect(submitted.body.status).toBe('submitted');
    expect(submitted.body.submittedAt).not.toBeNull();
    expect(submitted.body.actions.edit).toBe(false);
    const again = await act(agents.analyst, c.id, 'submit');
    expect(again.status).toBe(409);
    const locked = await agents.analyst.patch(`/api/cases/${c.id}`).set(CSRF).send({ title: 'sneaky' });
    expect(locked.status).toBe(409);
    expect(locked.body.error ?? locked.body.message).toMatch(/submitted/);
    expect((await act(agents.analyst, c.id, 'approve')).status).toBe(403);
    expect((await act(agents.analyst, c.id, 'archive')).status).toBe(409);

    const approverView = (await agents.approver.get(`/api/cases/${c.id}`).expect(200)).body as CaseView;
    expect(approverView.actions).toMatchObject({ approve: true, return: true, edit: false, submit: false });
    const back = await act(agents.approver, c.id, 'return', { reason: 'Use the spring outage instead' });
    expect(back.status).toBe(200);
    expect(back.body).toMatchObject({ status: 'returned', returnReason: 'Use the spring outage instead', decidedBy: { id: tenant.users.approver.id } });
    // returned: the author edits and submits again
    expect((await agents.analyst.patch(`/api/cases/${c.id}`).set(CSRF).send({ title: 'Walk through the statuses, revised' })).status).toBe(200);
    expect((await act(agents.analyst, c.id, 'submit')).status).toBe(200);
    const approved = await act(agents.admin, c.id, 'approve');
    expect(approved?.status).toBe(200);
    expect(approved?.body).toMatchObject({ status: 'approved', decidedBy: { id: tenant.users.admin.id } });
    expect(approved?.body.decidedAt).not.toBeNull();
    expect((await act(agents.approver, c.id, 'return', { reason: 'changed my mind' })).status).toBe(409);
    expect((await act(agents.analyst, c.id, 'submit')).status).toBe(409);
    const archived = await act(agents.analyst, c.id, 'archive');
    expect(archived.status).toBe(200);
    expect(archived.body.status).toBe('archived');
    expect(archived.body.archivedAt).not.toBeNull();
    const twice = await act(agents.analyst, c.id, 'archive');
    expect(twice.status).toBe(409);
    expect(twice.body.error ?? twice.body.message).toMatch(/archived/);

    const audit = await t.dataSource.query('SELECT action FROM audit_event WHERE entityId = ? ORDER BY createdAt, id', [c.id]);
    expect(audit.map((a: { action: string }) => a.action).sort()).toEqual(
      ['case.created', 'case.submitted', 'case.returned', 'case.updated', 'case.submitted', 'case.approved', 'case.archived'].sort(),
    );
  });

  it('an approver or administrator never decides a case they wrote', async () => {
    const mine = await newCase('The administrator’s own case', agents.admin);
    expect((await act(agents.admin, mine.id, 'submit')).status).toBe(200);
    const own = await act(agents.admin, mine.id, 'approve');
    expect(own.status).toBe(403);
    expect(own.body.error ?? own.body.message).toMatch(/own|wrote/i);
    expect((await act(agents.admin, mine.id, 'return', { reason: 'mine' })).status).toBe(403);
    expect((await agents.admin.get(`/api/cases/${mine.id}`).expect(200)).body.actions).toMatchObject({ approve: false, return: false });
    expect((await act(agents.approver, mine.id, 'approve')).status).toBe(200);
  });

  it('a draft and a returned case may be archived; archiving stops every further change', async () => {
    const draft = await newCase('Dropped idea');
    expect((await act(agents.analyst, draft.id, 'archive')).status).toBe(200);
    expect((await agents.analyst.patch(`/api/cases/${draft.id}`).set(CSRF).send({ title: 'back' })).status).toBe(409);
    expect((await act(agents.analyst, draft.id, 'submit')).status).toBe(409);
    const returned = await newCase('Sent back then dropped');
    await act(agents.analyst, returned.id, 'submit').expect(200);
    await act(agents.approver, returned.id, 'return', { reason: 'not now' }).expect(200);
    expect((await act(agents.analyst, returned.id, 'archive')).status).toBe(200);
  });

  it('submitting mails the approvers and administrators who see the unit; approving and returning mail the author', async () => {
    const c = await newCase('Mail round');
    await t.deliverMail();
    const before = async (email: string) => (await t.mailTo(email)).length;
    const counts = {
      approver: await before(tenant.users.approver.email),
      admin: await before(tenant.users.admin.email),
      limited: await before(await userEmail('cases-limited-approver')),
    };
    await act(agents.analyst, c.id, 'submit').expect(200);
    const [toApprover] = await t.mailTo(tenant.users.approver.email);
    expect(toApprover?.subject).toContain('Mail round');
    expect(toApprover?.text).toContain(`http://127.0.0.1:8123/cases/${c.id}`);
    expect((await t.mailTo(tenant.users.admin.email)).length).toBe(counts.admin + 1);
    // limited to client group Two: the unit's plant is in group One
    expect((await t.mailTo(await userEmail('cases-limited-approver'))).length).toBe(counts.limited);
    expect((await t.mailTo(tenant.users.viewer.email)).length).toBe(0);

    await act(agents.approver, c.id, 'return', { reason: 'Price the jetting crew again' }).expect(200);
    const [returned] = await t.mailTo(tenant.users.analyst.email);
    expect(returned?.text).toContain('Price the jetting crew again');
    expect(returned?.text).toContain(`http://127.0.0.1:8123/cases/${c.id}`);
    await act(agents.analyst, c.id, 'submit').expect(200);
    await act(agents.approver, c.id, 'approve').expect(200);
    const [approved] = await t.mailTo(tenant.users.analyst.email);
    expect(approved?.subject).toMatch(/approved/i);
    expect(approved?.text).toContain(`http://127.0.0.1:8123/cases/${c.id}`);
  });

  async function userEmail(labelStart: string): Promise<string> {
    const rows: { email: string }[] = await t.dataSource.query('SELECT email FROM user WHERE email LIKE ?', [`${labelStart}.%`]);
    const [row] = rows;
    if (!row) throw new Error(`no member whose e-mail starts with ${labelStart}`);
    return row.email;
  }

  it('viewers see approved cases only, in lists and by id', async () => {
    const draft = await newCase('Viewer cannot see this draft');
    const approved = await newCase('Viewer sees this one');
    await act(agents.analyst, approved.id, 'submit').expect(200);
    await act(agents.approver, approved.id, 'approve').expect(200);
    expect((await agents.viewer.get(`/api/cases/${draft.id}`)).status).toBe(404);
    expect((await agents.viewer.get(`/api/cases/${draft.id}/comments`)).status).toBe(404);
    const seen = (await agents.viewer.get(`/api/cases/${approved.id}`).expect(200)).body as CaseView;
    expect(seen.actions).toEqual({ edit: false, submit: false, approve: false, return: false, archive: false, copy: false, comment: false });
    const list = (await agents.viewer.get('/api/cases').expect(200)).body.cases as { id: string; status: string }[];
    expect(list.map((c) => c.id)).toContain(approved.id);
    expect(list.every((c) => c.status === 'approved')).toBe(true);
    const unitList = (await agents.viewer.get(`/api/units/${unit.id}/cases`).expect(200)).body.cases as { id: string }[];
    expect(unitList.map((c) => c.id)).not.toContain(draft.id);
    const all = (await agents.analyst.get(`/api/cases?unitId=${unit.id}&status=draft`).expect(200)).body.cases as { id: string; status: string; npv: number }[];
    expect(all.map((c) => c.id)).toContain(draft.id);
    expect(all.every((c) => c.status === 'draft')).toBe(true);
    expect(all.find((c) => c.id === draft.id)!.npv).toBe(draft.results.businessCase.npv);
  });

  it('a submitted case is a snapshot: a setup change, a price change and newer data leave it as it was, and it says newer data exists', async () => {
    const snapUnit = await createUnit(t.dataSource, plant);
    const today = plantDayOf(Date.now(), TIME_ZONE);
    const first = addDays(today, -DAYS - 20);
    const [y = 0, m = 1, d = 1] = first.split('-').map(Number);
    await importHistory(snapUnit, 'snapshot', Date.UTC(y, m - 1, d, 6, 0), DAYS * H);
    const created = await agents.analyst.post(`/api/units/${snapUnit.id}/cases`).set(CSRF).send({ title: 'Frozen' }).expect(201);
    const c = created.body as CaseView;
    await act(agents.analyst, c.id, 'submit').expect(200);
    const draft = (await agents.analyst.post(`/api/units/${snapUnit.id}/cases`).set(CSRF).send({ title: 'Still a draft' }).expect(201)).body as CaseView;

    await agents.analyst
      .put(`/api/units/${snapUnit.id}/economics`)
      .set(CSRF)
      .send({ ...TEST_ECONOMICS, fuelPricePerMmbtu: 6.1 })
      .expect(200);
    await agents.analyst
      .put(`/api/units/${snapUnit.id}/condenser`)
      .set(CSRF)
      .send({ ...TEST_CONDENSER, surfaceM2: TEST_CONDENSER.surfaceM2 * 1.05 })
      .expect(200);
    await drain();
    // ten more days of data after the case was built
    const [y2 = 0, m2 = 1, d2 = 1] = addDays(first, DAYS).split('-').map(Number);
    await importHistory(snapUnit, 'snapshot-more', Date.UTC(y2, m2 - 1, d2, 6, 0), 10 * H, DAYS * H);

    const after = caseView.parse((await agents.analyst.get(`/api/cases/${c.id}`).expect(200)).body);
    expect(after.inputs).toEqual(c.inputs);
    expect(after.results).toEqual(c.results);
    expect(after.inputSources).toEqual(c.inputSources);
    expect(after.builtFrom).toEqual(c.builtFrom);
    expect(after.inputs.drivers.fuelPricePerMmbtu).toBe(TEST_ECONOMICS.fuelPricePerMmbtu);
    expect(after.newerData).toEqual({ lastDataDay: addDays(c.builtFrom.lastDataDay!, 10), days: 10 });
    // a draft is not recomputed on read either: it changes only when someone saves it
    const draftAfter = (await agents.analyst.get(`/api/cases/${draft.id}`).expect(200)).body as CaseView;
    expect(draftAfter.results).toEqual(draft.results);

    // a copy takes the current data and prices, keeps what was entered, and points back to its source
    const edited = (
      await agents.analyst
        .patch(`/api/cases/${draft.id}`)
        .set(CSRF)
        .send({ inputs: { ...draft.inputs, discountRate: 0.11 } })
        .expect(200)
    ).body as CaseView;
    const copy = await agents.analyst.post(`/api/cases/${edited.id}/copy`).set(CSRF).send({});
    expect(copy.status, JSON.stringify(copy.body)).toBe(201);
    const copied = caseView.parse(copy.body);
    expect(copied.id).not.toBe(edited.id);
    expect(copied.status).toBe('draft');
    expect(copied.copiedFromId).toBe(edited.id);
    expect(copied.inputs.discountRate).toBe(0.11);
    expect(copied.inputSources.discountRate?.source).toBe('entered');
    expect(copied.inputs.drivers.fuelPricePerMmbtu).toBe(6.1);
    expect(copied.inputs.unit.condenser?.surfaceM2).toBeCloseTo(TEST_CONDENSER.surfaceM2 * 1.05, 9);
    expect(copied.builtFrom.lastDataDay).toBe(after.newerData!.lastDataDay);
    expect(copied.newerData).toBeNull();
    expect(copied.results).toEqual(overJson(runScheduleCommand(copied.inputs)));
  }, 240_000);

  it('a viewer downloads an approved case as a PDF and a workbook, with the NPV and first cleaning date as the API gives them', async () => {
    const c = await newCase('Report: clean in spring / "before" summer');
    await act(agents.analyst, c.id, 'submit').expect(200);
    await act(agents.approver, c.id, 'approve').expect(200);
    const binary = (res: { on: (e: string, f: (b?: Buffer) => void) => void }, done: (err: Error | null, body: Buffer) => void) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk?: Buffer) => chunks.push(chunk!));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    };
    const pdf = await agents.viewer.get(`/api/cases/${c.id}/report.pdf`).buffer(true).parse(binary);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toMatch(/application\/pdf/);
    expect(pdf.headers['content-disposition']).toMatch(/^attachment; filename="cleaning-case-report-clean-in-spring-before-summer-[0-9a-f]{8}\.pdf"$/);
    const text = (await new PDFParse({ data: new Uint8Array(pdf.body as Buffer) }).getText()).text.replace(/\s+/g, '');
    expect(text).toContain(formatCurrency(c.results.businessCase.npv, 'USD').replace(/\s+/g, ''));
    const first = c.results.cleanings[0];
    if (first) expect(text).toContain(formatDay(first.date).replace(/\s+/g, ''));

    const xlsx = await agents.viewer.get(`/api/cases/${c.id}/export.xlsx`).buffer(true).parse(binary);
    expect(xlsx.status).toBe(200);
    expect(xlsx.headers['content-disposition']).toMatch(/\.xlsx"$/);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(xlsx.body as ArrayBuffer);
    expect(wb.worksheets.length).toBeGreaterThan(0);

    const draft = await newCase('Not for viewers');
    expect((await agents.viewer.get(`/api/cases/${draft.id}/report.pdf`)).status).toBe(404);
    expect((await agents.analyst.get(`/api/cases/${draft.id}/report.pdf`)).status).toBe(200);
  });

  it('comments thread on the case in the order written; viewers read them on approved cases only', async () => {
    const c = await newCase('Discussed');
    const first = await agents.analyst.post(`/api/cases/${c.id}/comments`).set(CSRF).send({ text: 'Crew quote attached to the work order' });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ text: 'Crew quote attached to the work order', author: { id: tenant.users.analyst.id } });
    await agents.approver.post(`/api/cases/${c.id}/comments`).set(CSRF).send({ text: 'Which outage does this fit?' }).expect(201);
    const list = (await agents.admin.get(`/api/cases/${c.id}/comments`).expect(200)).body.comments as { text: string }[];
    expect(list.map((x) => x.text)).toEqual(['Crew quote attached to the work order', 'Which outage does this fit?']);
    expect((await agents.viewer.get(`/api/cases/${c.id}/comments`)).status).toBe(404);
    expect((await agents.viewer.post(`/api/cases/${c.id}/comments`).set(CSRF).send({ text: 'hello' })).status).toBe(404);
  });

  it('a case cannot be built on a unit without setup or without a fouling trend: 409 saying what is missing', async () => {
    const bare = await createUnit(t.dataSource, plant, false);
    const noSetup = await agents.analyst.post(`/api/units/${bare.id}/cases`).set(CSRF).send({ title: 'Too soon' });
    expect(noSetup.status).toBe(409);
    expect(noSetup.body.error ?? noSetup.body.message).toMatch(/setup/i);
    const noData = await createUnit(t.dataSource, plant);
    const noTrend = await agents.analyst.post(`/api/units/${noData.id}/cases`).set(CSRF).send({ title: 'Too soon' });
    expect(noTrend.status).toBe(409);
    expect(noTrend.body.error ?? noTrend.body.message).toMatch(/fouling trend/i);
    expect((await t.dataSource.query('SELECT COUNT(*) AS n FROM cleaning_case WHERE unitId IN (?, ?)', [bare.id, noData.id]))[0].n).toBe('0');
  });

  it('cases of a unit outside the member’s client groups, or of another tenant, are not found', async () => {
    const c = await newCase('Scoped');
    const other = await createTenant(t.dataSource, 'cases-other');
    const foreign = await signedInAgent(t.app, other.users.admin.email);
    expect((await foreign.get(`/api/cases/${c.id}`)).status).toBe(404);
    expect((await foreign.patch(`/api/cases/${c.id}`).set(CSRF).send({ title: 'mine now' })).status).toBe(404);
    expect((await foreign.post(`/api/units/${unit.id}/cases`).set(CSRF).send({ title: 'mine now' })).status).toBe(404);
    expect(((await foreign.get('/api/cases').expect(200)).body.cases as unknown[]).length).toBe(0);
    expect((await agents.limitedApprover.get(`/api/cases/${c.id}`)).status).toBe(404);
    expect(((await agents.limitedApprover.get('/api/cases').expect(200)).body.cases as { id: string }[]).map((x) => x.id)).not.toContain(c.id);
  });
});
