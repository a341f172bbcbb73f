/**
 * Every record of a unit (sample, daily figure, import, event, job) is found through its repository only
 * within the caller's scope: another tenant's record, or one on a unit whose plant lies outside the client
 * groups a member is limited to, reads as not there (null, and 404 through the API).
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import type { ImportSample } from '../../backend/src/import/index.js';
import { enqueueJob } from '../../backend/src/jobs/job-queue.js';
import type { TenantScope } from '../../backend/src/policies/tenant-scope.js';
import type { DailyAggregateRow } from '../../backend/src/repositories/daily-aggregate-row.js';
import { dailyFiguresInScope, findDailyFigureInScope, replaceDailyAggregates } from '../../backend/src/repositories/daily-aggregate.repository.js';
import { eventsOfUnitInScope, findEventInScope } from '../../backend/src/repositories/event.repository.js';
import { findImportInScope, importsOfUnitInScope } from '../../backend/src/repositories/import.repository.js';
import { findJobInScope } from '../../backend/src/repositories/job.repository.js';
import { findSampleInScope, insertSamples } from '../../backend/src/repositories/sample.repository.js';
import { addMember, createTenant, createUser, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createEvent, createPendingImport, createPlant, createUnit } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

const DAY = '2026-02-10';

/** The records of one unit, one of each kind. */
interface UnitRecords {
  unit: GeneratingUnit;
  sampleId: string;
  importId: string;
  eventId: string;
  jobId: string;
}

let t: TestApp;
let a: TenantFixture;
let b: TenantFixture;
/** tenant A: a unit in client group One, one in group Two, one on a plant in no group */
let inGroupOne: UnitRecords;
let inGroupTwo: UnitRecords;
let inNoGroup: UnitRecords;
/** tenant B */
let foreign: UnitRecords;

const scope = (tenant: TenantFixture, clientGroupIds: string[] | null): TenantScope => ({
  organisationId: tenant.organisation.id,
  userId: tenant.users.analyst.id,
  role: 'analyst',
  clientGroupIds,
});
const wholeTenantA = () => scope(a, null);
const limitedToGroupTwo = () => scope(a, [a.groups[1].id]);
const wholeTenantB = () => scope(b, null);

const dayRow = (unitId: string): DailyAggregateRow => ({
  unitId,
  day: DAY,
  pointsUsed: 20,
  pointsDropped: 4,
  droppedByReason: JSON.stringify({ 'low-load': 4 }),
  medianCleanliness: 0.81,
  medianTtdK: 4.2,
  trendCleanliness: null,
  meanSubcoolingK: null,
  meanDissolvedOxygenPpb: null,
  meanAirRemovalKgS: null,
  airLeakSuspected: false,
  meanDutyMw: null,
  heatBalanceDutyMw: null,
  stuckSensors: null,
  meanBackpressureKpa: 7.1,
  meanExpectedBackpressureKpa: 6.6,
  meanExcessBackpressureKpa: 0.5,
  meanCwInletC: 21,
  meanLoadMw: 300,
  meanHeatRatePenaltyPct: 0.4,
  foulingKpa: 0.4,
  cwInletKpa: 0,
  cwFlowKpa: 0,
  loadKpa: 0,
  pluggingKpa: 0,
  unexplainedKpa: 0.1,
  foulingCost: 900,
  unexplainedCost: 200,
});

const sample = (timestampUtc: number): ImportSample => ({
  line: 2,
  timestampUtc,
  loadMw: 300,
  backpressureKpa: 7,
  cwInletC: 21,
  cwOutletC: 30,
  cwFlowM3s: 14,
  flowAssumed: false,
  validity: 'ok',
});

async function unitWithRecords(tenant: TenantFixture, clientGroupId: string | null): Promise<UnitRecords> {
  const ds = t.dataSource;
  const unit = await createUnit(ds, await createPlant(ds, tenant.organisation.id, clientGroupId));
  const imp = await createPendingImport(ds, unit);
  await insertSamples(ds.manager, { unitId: unit.id, importId: imp.id, setupVersion: unit.setupVersion }, [sample(Date.parse(`${DAY}T12:00:00Z`))]);
  const [{ id: sampleId }] = await ds.query('SELECT id FROM performance_sample WHERE importId = ?', [imp.id]);
  await replaceDailyAggregates(ds.manager, unit.id, [dayRow(unit.id)]);
  const event = await createEvent(ds, unit);
  const job = await enqueueJob(ds.manager, { organisationId: unit.organisationId, unitId: unit.id, kind: 'recompute', payload: { reason: 'test' } });
  return { unit, sampleId: String(sampleId), importId: imp.id, eventId: event.id, jobId: job.id };
}

beforeAll(async () => {
  t = await createTestApp();
  a = await createTenant(t.dataSource, 'scope-a');
  b = await createTenant(t.dataSource, 'scope-b');
  inGroupOne = await unitWithRecords(a, a.groups[0].id);
  inGroupTwo = await unitWithRecords(a, a.groups[1].id);
  inNoGroup = await unitWithRecords(a, null);
  foreign = await unitWithRecords(b, b.groups[0].id);
});
afterAll(async () => t?.close());

/** Each repository's lookup by id, answering the record's id or null. */
const LOOKUPS: [string, (s: TenantScope, r: UnitRecords) => Promise<string | null>][] = [
  ['sample', async (s, r) => (await findSampleInScope(t.dataSource.manager, s, r.sampleId))?.id ?? null],
  ['daily figure', async (s, r) => ((await findDailyFigureInScope(t.dataSource.manager, s, r.unit.id, DAY)) ? `${r.unit.id}/${DAY}` : null)],
  ['import', async (s, r) => (await findImportInScope(t.dataSource.manager, s, r.importId))?.id ?? null],
  ['event', async (s, r) => (await findEventInScope(t.dataSource.manager, s, r.eventId))?.id ?? null],
  ['job', async (s, r) => (await findJobInScope(t.dataSource.manager, s, r.jobId))?.id ?? null],
];
const idOf = (kind: string, r: UnitRecords) =>
  ({ sample: r.sampleId, 'daily figure': `${r.unit.id}/${DAY}`, import: r.importId, event: r.eventId, job: r.jobId })[kind];

describe.each(LOOKUPS)('a %s looked up within a scope', (kind, lookup) => {
  it('is found by a member of its tenant without a client-group limit', async () => {
    for (const records of [inGroupOne, inGroupTwo, inNoGroup]) expect(await lookup(wholeTenantA(), records)).toBe(idOf(kind, records));
  });

  it('is not found from another tenant, in either direction', async () => {
    expect(await lookup(wholeTenantB(), inGroupOne)).toBeNull();
    expect(await lookup(wholeTenantA(), foreign)).toBeNull();
    expect(await lookup(wholeTenantB(), foreign)).toBe(idOf(kind, foreign));
  });

  it('is not found by a member limited to other client groups, nor on a plant in no group', async () => {
    expect(await lookup(limitedToGroupTwo(), inGroupTwo)).toBe(idOf(kind, inGroupTwo));
    expect(await lookup(limitedToGroupTwo(), inGroupOne)).toBeNull();
    expect(await lookup(limitedToGroupTwo(), inNoGroup)).toBeNull();
    expect(await lookup(scope(a, []), inGroupTwo)).toBeNull();
  });
});

describe('a unit’s records listed within a scope', () => {
  const lists = (s: TenantScope, unitId: string) =>
    Promise.all([
      dailyFiguresInScope(t.dataSource.manager, s, unitId),
      eventsOfUnitInScope(t.dataSource.manager, s, unitId),
      importsOfUnitInScope(t.dataSource.manager, s, unitId),
    ]);

  it('are listed for a unit in scope', async () => {
    const [days, events, imports] = await lists(limitedToGroupTwo(), inGroupTwo.unit.id);
    expect(days?.map((d) => d.day)).toEqual([DAY]);
    expect(events?.map((e) => e.id)).toEqual([inGroupTwo.eventId]);
    expect(imports?.map((i) => i.record.id)).toEqual([inGroupTwo.importId]);
  });

  it('are not there (null, not an empty list) for a unit outside the client groups or of another tenant', async () => {
    expect(await lists(limitedToGroupTwo(), inGroupOne.unit.id)).toEqual([null, null, null]);
    expect(await lists(wholeTenantB(), inGroupTwo.unit.id)).toEqual([null, null, null]);
  });
});

describe('through the API, a member limited to client group Two', () => {
  let limited: TestAgent;
  beforeAll(async () => {
    const user = await createUser(t.dataSource, 'group-two-analyst');
    await addMember(t.dataSource, a.organisation.id, user, 'analyst', [a.groups[1].id]);
    limited = await signedInAgent(t.app, user.email);
  });

  it('reads the daily figures, events and imports of a unit in group Two', async () => {
    const id = inGroupTwo.unit.id;
    expect((await limited.get(`/api/units/${id}/daily`)).body.days.map((d: { day: string }) => d.day)).toEqual([DAY]);
    expect((await limited.get(`/api/units/${id}/events`).expect(200)).body.events).toHaveLength(1);
    expect((await limited.get(`/api/imports/${inGroupTwo.importId}`).expect(200)).body.id).toBe(inGroupTwo.importId);
  });

  it('gets 404 for the same records of a unit in group One, as for ones that do not exist', async () => {
    const id = inGroupOne.unit.id;
    for (const path of [`/api/units/${id}/daily`, `/api/units/${id}/events`, `/api/units/${id}/imports`, `/api/imports/${inGroupOne.importId}`]) {
      const res = await limited.get(path);
      expect(res.status, path).toBe(404);
      expect(res.body.error, path).toMatch(/^No such (unit|import)$/);
    }
  });
});
