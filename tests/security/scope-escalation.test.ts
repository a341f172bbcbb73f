/**
 * A member limited to client groups can never hand out more than they see themselves: not to themselves,
 * not to another member, not through an invitation. Only an administrator without a limit lifts a limit.
 * Callers: tenant A's unlimited admin, and an admin of tenant A limited to group Two ("limited admin").
 */
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Invitation } from '../../backend/src/entities/invitation.entity.js';
import { Membership } from '../../backend/src/entities/membership.entity.js';
import { addMember, createInvitation, createTenant, createUser, CSRF, signedInAgent, type TenantFixture, uniqueEmail } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let a: TenantFixture;
let b: TenantFixture;
let limitedMembership: Membership;
let limited: TestAgent;
let unlimited: TestAgent;
const groupOne = () => a.groups[0].id;
const groupTwo = () => a.groups[1].id;

const membershipOf = (id: string) => t.dataSource.getRepository(Membership).findOneByOrFail({ id });

beforeAll(async () => {
  t = await createTestApp();
  a = await createTenant(t.dataSource, 'escalate');
  b = await createTenant(t.dataSource, 'elsewhere');
  const user = await createUser(t.dataSource, 'limited-admin');
  limitedMembership = await addMember(t.dataSource, a.organisation.id, user, 'admin', [groupTwo()]);
  limited = await signedInAgent(t.app, user.email);
  unlimited = await signedInAgent(t.app, a.users.admin.email);
});
afterAll(async () => t?.close());

describe('a group-limited administrator changing memberships', () => {
  it('cannot lift their own limit', async () => {
    const res = await limited.patch(`/api/members/${limitedMembership.id}`).set(CSRF).send({ clientGroupIds: null });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/without a client-group limit/);
    expect((await membershipOf(limitedMembership.id)).clientGroupIds).toEqual([groupTwo()]);
  });

  it('cannot widen their own limit to a group they cannot see', async () => {
    const res = await limited
      .patch(`/api/members/${limitedMembership.id}`)
      .set(CSRF)
      .send({ clientGroupIds: [groupTwo(), groupOne()] });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/client group/i);
    expect((await membershipOf(limitedMembership.id)).clientGroupIds).toEqual([groupTwo()]);
  });

  it('cannot give a member of their group access to another group, nor lift that member’s limit', async () => {
    const member = await addMember(t.dataSource, a.organisation.id, await createUser(t.dataSource, 'in-two'), 'viewer', [groupTwo()]);
    await limited
      .patch(`/api/members/${member.id}`)
      .set(CSRF)
      .send({ clientGroupIds: [groupOne()] })
      .expect(400);
    await limited.patch(`/api/members/${member.id}`).set(CSRF).send({ clientGroupIds: null }).expect(403);
    expect((await membershipOf(member.id)).clientGroupIds).toEqual([groupTwo()]);
  });

  it('can change the role of a member within their group and narrow a limit', async () => {
    const member = await addMember(t.dataSource, a.organisation.id, await createUser(t.dataSource, 'narrow'), 'viewer', [groupTwo()]);
    await limited.patch(`/api/members/${member.id}`).set(CSRF).send({ role: 'analyst' }).expect(204);
    await limited.patch(`/api/members/${member.id}`).set(CSRF).send({ clientGroupIds: [] }).expect(204);
    const after = await membershipOf(member.id);
    expect(after.role).toBe('analyst');
    expect(after.clientGroupIds).toEqual([]);
  });

  it('cannot see, change or remove a member whose access reaches beyond their groups', async () => {
    const wider = await addMember(t.dataSource, a.organisation.id, await createUser(t.dataSource, 'in-one-and-two'), 'viewer', [groupOne(), groupTwo()]);
    const unlimitedViewer = a.memberships.viewer;
    for (const m of [wider, unlimitedViewer]) {
      await limited.patch(`/api/members/${m.id}`).set(CSRF).send({ role: 'analyst' }).expect(404);
      await limited.delete(`/api/members/${m.id}`).set(CSRF).expect(404);
    }
    const list = (await limited.get('/api/members').expect(200)).body.members as { membershipId: string }[];
    const ids = list.map((m) => m.membershipId);
    expect(ids).toContain(limitedMembership.id);
    expect(ids).not.toContain(wider.id);
    expect(ids).not.toContain(unlimitedViewer.id);
    expect((await membershipOf(unlimitedViewer.id)).role).toBe('viewer');
  });

  it('cannot give a member another tenant’s client group', async () => {
    const member = await addMember(t.dataSource, a.organisation.id, await createUser(t.dataSource, 'foreign-group'), 'viewer', [groupTwo()]);
    await limited
      .patch(`/api/members/${member.id}`)
      .set(CSRF)
      .send({ clientGroupIds: [b.groups[0].id] })
      .expect(400);
    await unlimited
      .patch(`/api/members/${member.id}`)
      .set(CSRF)
      .send({ clientGroupIds: [b.groups[0].id] })
      .expect(400);
    expect((await membershipOf(member.id)).clientGroupIds).toEqual([groupTwo()]);
  });
});

describe('a group-limited administrator inviting', () => {
  it('cannot invite someone without a client-group limit', async () => {
    const email = uniqueEmail('unlimited-invitee');
    const res = await limited.post('/api/invitations').set(CSRF).send({ email, role: 'admin', clientGroupIds: null });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/without a client-group limit/);
    expect(await t.dataSource.getRepository(Invitation).existsBy({ email })).toBe(false);
  });

  it('cannot invite someone to a group they cannot see, nor to another tenant’s group', async () => {
    for (const clientGroupIds of [[groupOne()], [groupTwo(), groupOne()], [b.groups[0].id]]) {
      const email = uniqueEmail('outside-invitee');
      const res = await limited.post('/api/invitations').set(CSRF).send({ email, role: 'viewer', clientGroupIds });
      expect(res.status, JSON.stringify(clientGroupIds)).toBe(400);
      expect(await t.dataSource.getRepository(Invitation).existsBy({ email })).toBe(false);
    }
  });

  it('can invite someone to their own group', async () => {
    const res = await limited
      .post('/api/invitations')
      .set(CSRF)
      .send({ email: uniqueEmail('inside-invitee'), role: 'admin', clientGroupIds: [groupTwo()] });
    expect(res.status).toBe(201);
    expect(res.body.clientGroupIds).toEqual([groupTwo()]);
  });

  it('sees and withdraws only invitations within their groups', async () => {
    const outside = await createInvitation(t.dataSource, a.organisation.id);
    const inside = (
      await limited
        .post('/api/invitations')
        .set(CSRF)
        .send({ email: uniqueEmail('listed'), role: 'viewer', clientGroupIds: [groupTwo()] })
        .expect(201)
    ).body;
    const listed = ((await limited.get('/api/invitations').expect(200)).body.invitations as { id: string }[]).map((i) => i.id);
    expect(listed).toContain(inside.id);
    expect(listed).not.toContain(outside.invitation.id);
    await limited.delete(`/api/invitations/${outside.invitation.id}`).set(CSRF).expect(404);
    expect(await t.dataSource.getRepository(Invitation).existsBy({ id: outside.invitation.id })).toBe(true);
    await limited.delete(`/api/invitations/${inside.id}`).set(CSRF).expect(204);
  });
});

describe('an administrator without a limit', () => {
  it('lifts a member’s limit and invites someone without one', async () => {
    const member = await addMember(t.dataSource, a.organisation.id, await createUser(t.dataSource, 'lifted'), 'analyst', [groupTwo()]);
    await unlimited.patch(`/api/members/${member.id}`).set(CSRF).send({ clientGroupIds: null }).expect(204);
    expect((await membershipOf(member.id)).clientGroupIds).toBeNull();
    await unlimited
      .post('/api/invitations')
      .set(CSRF)
      .send({ email: uniqueEmail('full'), role: 'admin', clientGroupIds: null })
      .expect(201);
  });

  it('cannot invite someone to another tenant’s client group', async () => {
    const email = uniqueEmail('foreign-invitee');
    await unlimited
      .post('/api/invitations')
      .set(CSRF)
      .send({ email, role: 'viewer', clientGroupIds: [b.groups[0].id] })
      .expect(400);
    expect(await t.dataSource.getRepository(Invitation).existsBy({ email })).toBe(false);
  });
});
