/** GET and PUT /api/notifications: your own choices in the active organisation, only units in your scope, bounded input. */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { notificationSettingsResponse } from '@shared/schemas/notifications.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { addMember, createTenant, createUser, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('notification settings API', () => {
  let t: TestApp;
  let tenant: TenantFixture;
  let unitOne: GeneratingUnit;
  let unitTwo: GeneratingUnit;
  let analyst: TestAgent;
  let viewer: TestAgent;
  let limited: TestAgent;

  beforeAll(async () => {
    t = await createTestApp();
    tenant = await createTenant(t.dataSource, 'notify');
    unitOne = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[0].id));
    unitTwo = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id, tenant.groups[1].id));
    analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    viewer = await signedInAgent(t.app, tenant.users.viewer.email);
    const person = await createUser(t.dataSource, 'limited');
    await addMember(t.dataSource, tenant.organisation.id, person, 'viewer', [tenant.groups[1].id]);
    limited = await signedInAgent(t.app, person.email);
  });
  afterAll(async () => {
    await t?.close();
  });

  const read = async (agent: TestAgent) => notificationSettingsResponse.parse((await agent.get('/api/notifications').expect(200)).body);

  it('nothing chosen at first; the units in scope are offered', async () => {
    const s = await read(analyst);
    expect(s).toMatchObject({ weeklyDigest: false, allUnits: null, units: [], dataStoppedDays: { min: 1, max: 60, default: 3 } });
    expect(s.available.map((u) => u.unitId).sort()).toEqual([unitOne.id, unitTwo.id].sort());
    expect(s.available.find((u) => u.unitId === unitOne.id)?.clientGroup?.name).toBe('Group One');
  });

  it('saved choices come back, and are each person’s own', async () => {
    const body = {
      weeklyDigest: true,
      allUnits: { kinds: ['data-stopped'], dataStoppedDays: 4 },
      units: [{ unitId: unitOne.id, kinds: ['cleaning-now-pays', 'backpressure-unexplained'], dataStoppedDays: 12 }],
    };
    const saved = await analyst.put('/api/notifications').set(CSRF).send(body).expect(200);
    expect(saved.body).toMatchObject(body);
    expect(await read(analyst)).toMatchObject(body);
    // A viewer may choose alerts too; the analyst's choice is not theirs.
    expect((await read(viewer)).weeklyDigest).toBe(false);
    await viewer
      .put('/api/notifications')
      .set(CSRF)
      .send({ weeklyDigest: false, allUnits: null, units: [{ unitId: unitTwo.id, kinds: ['data-stopped'], dataStoppedDays: 1 }] })
      .expect(200);
    expect((await read(analyst)).units.map((u) => u.unitId)).toEqual([unitOne.id]);
    // Saving again replaces the unit choices.
    await analyst
      .put('/api/notifications')
      .set(CSRF)
      .send({ ...body, units: [] })
      .expect(200);
    expect((await read(analyst)).units).toEqual([]);
  });

  it('a client-limited member sees only their group’s units and cannot name another; nothing is saved then', async () => {
    expect((await read(limited)).available.map((u) => u.unitId)).toEqual([unitTwo.id]);
    const refused = await limited
      .put('/api/notifications')
      .set(CSRF)
      .send({ weeklyDigest: true, allUnits: null, units: [{ unitId: unitOne.id, kinds: ['data-stopped'], dataStoppedDays: 3 }] })
      .expect(404);
    expect(refused.body.error).toMatch(/No such unit/);
    expect(await read(limited)).toMatchObject({ weeklyDigest: false, units: [] });
  });

  it('bad input: a clear message, 400, nothing saved', async () => {
    const before = await read(analyst);
    const cases: [unknown, RegExp][] = [
      [{ weeklyDigest: true, allUnits: { kinds: ['data-stopped'], dataStoppedDays: 90 }, units: [] }, /between 1 and 60/],
      [{ weeklyDigest: 'yes', allUnits: null, units: [] }, /weekly digest/],
      [{ weeklyDigest: true, allUnits: null, units: [{ unitId: 'not-a-unit', kinds: [], dataStoppedDays: 3 }] }, /not a unit id/],
      [{ weeklyDigest: true, allUnits: { kinds: ['everything'], dataStoppedDays: 3 }, units: [] }, /Choose among/],
    ];
    for (const [body, message] of cases) {
      const res = await analyst
        .put('/api/notifications')
        .set(CSRF)
        .send(body as object)
        .expect(400);
      expect(JSON.stringify(res.body)).toMatch(message);
    }
    expect(await read(analyst)).toEqual(before);
  });
});
