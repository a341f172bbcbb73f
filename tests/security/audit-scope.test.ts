/**
 * The audit log covers the whole organisation (plants, units, people, client groups, also records since
 * deleted, whose client group can no longer be told), so only members without a client-group limit read it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, createTenant, createUser, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let a: TenantFixture;

beforeAll(async () => {
  t = await createTestApp();
  a = await createTenant(t.dataSource, 'audit-scope');
});
afterAll(async () => t?.close());

describe('audit log and client-group limits', () => {
  it('a member limited to client groups reads no entry about plants or people outside their groups', async () => {
    const admin = await signedInAgent(t.app, a.users.admin.email);
    const plant = (
      await admin.post('/api/plants').set(CSRF).send({ name: 'Riverbend outside', timeZone: 'Europe/Berlin', clientGroupId: a.groups[0].id }).expect(201)
    ).body;
    await admin
      .patch(`/api/members/${a.memberships.viewer.id}`)
      .set(CSRF)
      .send({ clientGroupIds: [a.groups[0].id] })
      .expect(204);
    for (const role of ['admin', 'approver'] as const) {
      const user = await createUser(t.dataSource, `limited-${role}`);
      await addMember(t.dataSource, a.organisation.id, user, role, [a.groups[1].id]);
      const limited = await signedInAgent(t.app, user.email);
      const res = await limited.get('/api/audit-events');
      expect(res.status, role).toBe(403);
      expect(res.body.error).toMatch(/without a client-group limit/);
      expect(JSON.stringify(res.body)).not.toContain(plant.id);
      expect(JSON.stringify(res.body)).not.toContain(a.memberships.viewer.id);
    }
  });

  it('a member without a limit still reads every entry', async () => {
    const approver = await signedInAgent(t.app, a.users.approver.email);
    const events = (await approver.get('/api/audit-events').expect(200)).body.events as { action: string }[];
    expect(events.map((e) => e.action)).toEqual(expect.arrayContaining(['plant.created', 'member.updated']));
  });
});
