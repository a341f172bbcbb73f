/** Test data for accounts: a fresh tenant with one member per role, client groups, and signed-in agents. */
import { randomBytes } from 'node:crypto';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent.js';
import type { DataSource } from 'typeorm';
import type { Role } from '../../shared/permissions.js';
import { hashPassword } from '../../backend/src/auth/password.js';
import { newSecretToken } from '../../backend/src/auth/secret-token.js';
import { ClientGroup } from '../../backend/src/entities/client-group.entity.js';
import { Invitation } from '../../backend/src/entities/invitation.entity.js';
import { Membership } from '../../backend/src/entities/membership.entity.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import { User } from '../../backend/src/entities/user.entity.js';
import type { CleancaseApp } from '../../backend/src/app.js';

export const TEST_PASSWORD = 'correct horse battery staple 42';
let cachedHash: Promise<string> | null = null;
const passwordHash = () => (cachedHash ??= hashPassword(TEST_PASSWORD));

export const uniqueEmail = (label: string) => `${label}.${randomBytes(4).toString('hex')}@example.test`;

/** A person as invitations and the seed make them: their address proven from now (self sign-up goes through the API). */
export async function createUser(ds: DataSource, label: string): Promise<User> {
  return ds
    .getRepository(User)
    .save({ email: uniqueEmail(label), name: `Test ${label}`, passwordHash: await passwordHash(), unitPreference: 'us', emailProvenAt: new Date() });
}

export async function addMember(ds: DataSource, organisationId: string, user: User, role: Role, clientGroupIds: string[] | null = null): Promise<Membership> {
  return ds.getRepository(Membership).save({ organisationId, userId: user.id, role, clientGroupIds });
}

export interface TenantFixture {
  organisation: Organisation;
  groups: [ClientGroup, ClientGroup];
  users: Record<Role, User>;
  memberships: Record<Role, Membership>;
}

/** A tenant with two client groups and one unrestricted member for each role. */
export async function createTenant(ds: DataSource, label = 'tenant'): Promise<TenantFixture> {
  const organisation = await ds
    .getRepository(Organisation)
    .save({ name: `${label} ${randomBytes(3).toString('hex')}`, kind: 'consultancy', plan: 'trial', subscriptionStatus: 'trialing', trialEndsAt: null });
  const groups: TenantFixture['groups'] = [
    await ds.getRepository(ClientGroup).save({ organisationId: organisation.id, name: 'Group One' }),
    await ds.getRepository(ClientGroup).save({ organisationId: organisation.id, name: 'Group Two' }),
  ];
  const users = {} as Record<Role, User>;
  const memberships = {} as Record<Role, Membership>;
  for (const role of ['admin', 'analyst', 'approver', 'viewer'] as const) {
    users[role] = await createUser(ds, `${label}-${role}`);
    memberships[role] = await addMember(ds, organisation.id, users[role], role);
  }
  return { organisation, groups, users, memberships };
}

export async function createClientGroup(ds: DataSource, organisationId: string): Promise<ClientGroup> {
  return ds.getRepository(ClientGroup).save({ organisationId, name: `Group ${randomBytes(4).toString('hex')}` });
}

export async function createInvitation(ds: DataSource, organisationId: string, role: Role = 'viewer'): Promise<{ invitation: Invitation; token: string }> {
  const { token, hash } = newSecretToken();
  const invitation = await ds.getRepository(Invitation).save({
    organisationId,
    email: uniqueEmail('invitee'),
    role,
    clientGroupIds: null,
    tokenHash: hash,
    invitedByUserId: null,
    expiresAt: new Date(Date.now() + 86_400_000),
    acceptedAt: null,
  });
  return { invitation, token };
}

/** Adds the CSRF header our client sends on every unsafe request. */
export const CSRF = { 'x-cleancase-request': '1' } as const;

export async function signedInAgent(app: CleancaseApp, email: string, password = TEST_PASSWORD): Promise<TestAgent> {
  const agent = request.agent(app);
  const res = await agent.post('/api/session').set(CSRF).send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}
