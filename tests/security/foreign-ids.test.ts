/**
 * Every id a request body names (a cleaning method on an event, a client group on a plant) is checked
 * against the caller's scope: another tenant's id, or one the caller cannot see, is refused with a
 * message and never stored. Client groups on invitations and memberships: scope-escalation.test.ts;
 * the organisation to switch to: the isolation matrix.
 */
import { randomBytes } from 'node:crypto';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Plant } from '../../backend/src/entities/plant.entity.js';
import { UnitEvent } from '../../backend/src/entities/unit-event.entity.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { createMethod } from '../../backend/src/services/cleaning-method.service.js';
import { TYPICAL_CLEANING_METHODS } from '../../shared/schemas/cleaning-method.js';
import { addMember, createTenant, createUser, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createCaseRecord } from '../factories/cases.js';
import { createEvent, createPlant, createUnit } from '../factories/units.js';
import { CleaningCase } from '../../backend/src/entities/cleaning-case.entity.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let a: TenantFixture;
let b: TenantFixture;
let unit: GeneratingUnit;
let analyst: TestAgent;
let ownMethodKey: string;
let foreignMethodKey: string;

const addLibraryMethod = async (tenant: TenantFixture, key: string) =>
  createMethod(
    t.dataSource,
    { organisationId: tenant.organisation.id, userId: tenant.users.admin.id, role: 'admin', clientGroupIds: null },
    { ...TYPICAL_CLEANING_METHODS[1]!, id: key },
  );

beforeAll(async () => {
  t = await createTestApp();
  a = await createTenant(t.dataSource, 'own');
  b = await createTenant(t.dataSource, 'foreign');
  ownMethodKey = `own-${randomBytes(3).toString('hex')}`;
  foreignMethodKey = `foreign-${randomBytes(3).toString('hex')}`;
  await addLibraryMethod(a, ownMethodKey);
  await addLibraryMethod(b, foreignMethodKey);
  unit = await createUnit(t.dataSource, await createPlant(t.dataSource, a.organisation.id, a.groups[0].id));
  analyst = await signedInAgent(t.app, a.users.analyst.email);
});
afterAll(async () => t?.close());

const cleaning = (methodId: string | null) => ({ kind: 'cleaning', startDate: '2026-03-02', endDate: '2026-03-04', methodId, cost: 90000 });

describe('cleaning method named by an event', () => {
  it('a cleaning may name a method of the organisation’s own library', async () => {
    const res = await analyst.post(`/api/units/${unit.id}/events`).set(CSRF).send(cleaning(ownMethodKey));
    expect(res.status).toBe(201);
    expect(res.body.methodId).toBe(ownMethodKey);
  });

  it('a new event naming another tenant’s method, or a method nobody has, is refused and not stored', async () => {
    for (const methodId of [foreignMethodKey, 'no-such-method']) {
      const res = await analyst.post(`/api/units/${unit.id}/events`).set(CSRF).send(cleaning(methodId));
      expect(res.status, methodId).toBe(400);
      expect(res.body.error).toMatch(/cleaning method/i);
      expect(await t.dataSource.getRepository(UnitEvent).existsBy({ unitId: unit.id, methodId })).toBe(false);
    }
  });

  it('changing an event to another tenant’s method is refused and leaves the event as it was', async () => {
    const event = await createEvent(t.dataSource, unit);
    const res = await analyst.put(`/api/events/${event.id}`).set(CSRF).send(cleaning(foreignMethodKey));
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/cleaning method/i);
    const after = await t.dataSource.getRepository(UnitEvent).findOneByOrFail({ id: event.id });
    expect(after.methodId).toBe(event.methodId);
    expect(after.kind).toBe(event.kind);
  });
});

describe('client group named by a plant', () => {
  const plantBody = (clientGroupId: string | null) => ({ name: `Plant ${randomBytes(3).toString('hex')}`, timeZone: 'Europe/Berlin', clientGroupId });

  it('a new plant in another tenant’s client group is refused and not stored', async () => {
    const admin = await signedInAgent(t.app, a.users.admin.email);
    const body = plantBody(b.groups[0].id);
    const res = await admin.post('/api/plants').set(CSRF).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/client group/i);
    expect(await t.dataSource.getRepository(Plant).existsBy({ name: body.name })).toBe(false);
  });

  it('moving a plant into another tenant’s client group is refused and leaves the plant where it was', async () => {
    const admin = await signedInAgent(t.app, a.users.admin.email);
    const plant = await createPlant(t.dataSource, a.organisation.id, a.groups[0].id);
    await admin.put(`/api/plants/${plant.id}`).set(CSRF).send(plantBody(b.groups[0].id)).expect(400);
    expect((await t.dataSource.getRepository(Plant).findOneByOrFail({ id: plant.id })).clientGroupId).toBe(a.groups[0].id);
  });

  it('a member limited to client groups cannot create or move a plant into a group they cannot see', async () => {
    const user = await createUser(t.dataSource, 'limited-analyst');
    await addMember(t.dataSource, a.organisation.id, user, 'analyst', [a.groups[0].id]);
    const limited = await signedInAgent(t.app, user.email);
    const body = plantBody(a.groups[1].id);
    await limited.post('/api/plants').set(CSRF).send(body).expect(400);
    expect(await t.dataSource.getRepository(Plant).existsBy({ name: body.name })).toBe(false);
    const plant = await createPlant(t.dataSource, a.organisation.id, a.groups[0].id);
    await limited.put(`/api/plants/${plant.id}`).set(CSRF).send(plantBody(a.groups[1].id)).expect(400);
    await limited.put(`/api/plants/${plant.id}`).set(CSRF).send(plantBody(null)).expect(400);
    expect((await t.dataSource.getRepository(Plant).findOneByOrFail({ id: plant.id })).clientGroupId).toBe(a.groups[0].id);
  });
});

describe('cleaning case named by its id', () => {
  const caseCalls = (id: string): [string, string, object | undefined][] => [
    ['get', `/api/cases/${id}`, undefined],
    ['patch', `/api/cases/${id}`, { title: 'Taken over' }],
    ['post', `/api/cases/${id}/submit`, {}],
    ['post', `/api/cases/${id}/approve`, {}],
    ['post', `/api/cases/${id}/return`, { reason: 'Not yours' }],
    ['post', `/api/cases/${id}/archive`, {}],
    ['post', `/api/cases/${id}/copy`, {}],
    ['get', `/api/cases/${id}/comments`, undefined],
    ['post', `/api/cases/${id}/comments`, { text: 'Not yours' }],
    ['get', `/api/cases/${id}/report.pdf`, undefined],
    ['get', `/api/cases/${id}/export.xlsx`, undefined],
  ];
  const call = (agent: TestAgent, [method, path, body]: [string, string, object | undefined]) => {
    const send = (agent as unknown as Record<string, ((p: string) => ReturnType<TestAgent['get']>) | undefined>)[method];
    if (!send) throw new Error(`no request method ${method}`);
    const req = send.call(agent, path);
    return method === 'get' ? req : req.set(CSRF).send(body);
  };

  it('another tenant’s case is not found by any case route, and stays as it was', async () => {
    const c = await createCaseRecord(t.dataSource, unit, a.users.analyst.id, 'submitted');
    const foreignAdmin = await signedInAgent(t.app, b.users.admin.email);
    for (const target of caseCalls(c.id)) expect((await call(foreignAdmin, target)).status, target.join(' ')).toBe(404);
    expect((await foreignAdmin.get(`/api/units/${unit.id}/cases`)).status).toBe(404);
    expect((await foreignAdmin.get(`/api/cases?unitId=${unit.id}`)).status).toBe(404);
    const after = await t.dataSource.getRepository(CleaningCase).findOneByOrFail({ id: c.id });
    expect(after.status).toBe('submitted');
    expect(after.title).toBe(c.title);
  });

  it('a member limited to client groups does not find a case on a unit outside their groups', async () => {
    const c = await createCaseRecord(t.dataSource, unit, a.users.analyst.id, 'submitted');
    const user = await createUser(t.dataSource, 'limited-admin-cases');
    await addMember(t.dataSource, a.organisation.id, user, 'admin', [a.groups[1].id]);
    const limited = await signedInAgent(t.app, user.email);
    for (const target of caseCalls(c.id)) expect((await call(limited, target)).status, target.join(' ')).toBe(404);
    expect(((await limited.get('/api/cases').expect(200)).body.cases as { id: string }[]).map((x) => x.id)).not.toContain(c.id);
    expect((await t.dataSource.getRepository(CleaningCase).findOneByOrFail({ id: c.id })).status).toBe('submitted');
  });
});
