/**
 * Deleting a client group rewrites every membership limit and every plant that names it, including people
 * and plants a group-limited administrator cannot see: so only members without a limit may delete one.
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ClientGroup } from '../../backend/src/entities/client-group.entity.js';
import { Membership } from '../../backend/src/entities/membership.entity.js';
import { addMember, createTenant, createUser, CSRF, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let a: TenantFixture;
let limited: TestAgent;
let unlimited: TestAgent;

beforeAll(async () => {
  t = await createTestApp();
  a = await createTenant(t.dataSource, 'group-delete');
  const user = await createUser(t.dataSource, 'group-limited-admin');
  await addMember(t.dataSource, a.organisation.id, user, 'admin', [a.groups[1].id]);
  limited = await signedInAgent(t.app, user.email);
  unlimited = await signedInAgent(t.app, a.users.admin.email);
});
afterAll(async () => t?.close());

describe('deleting a client group', () => {
  it('is refused to an administrator limited to client groups, even their own group, and changes nobody’s limit', async () => {
    const wider = await addMember(t.dataSource, a.organisation.id, await createUser(t.dataSource, 'wider'), 'viewer', [a.groups[0].id, a.groups[1].id]);
    const res = await limited.delete(`/api/client-groups/${a.groups[1].id}`).set(CSRF);
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/without a client-group limit/);
    expect(await t.dataSource.getRepository(ClientGroup).existsBy({ id: a.groups[1].id })).toBe(true);
    expect((await t.dataSource.getRepository(Membership).findOneByOrFail({ id: wider.id })).clientGroupIds).toEqual([a.groups[0].id, a.groups[1].id]);
  });

  it('is allowed to an administrator without a limit', async () => {
    await unlimited.delete(`/api/client-groups/${a.groups[0].id}`).set(CSRF).expect(204);
    expect(await t.dataSource.getRepository(ClientGroup).existsBy({ id: a.groups[0].id })).toBe(false);
  });
});
