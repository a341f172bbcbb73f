/** Invitations by e-mail: accept creates the account or links an existing one, then adds the membership. */
import type { DataSource } from 'typeorm';
import { IsNull, MoreThan } from 'typeorm';
import type { InvitationLinkView, InvitationView, InviteRequest } from '@shared/schemas/accounts.js';
import { assertPasswordAcceptable } from '../auth/password-rules.js';
import { hashPassword } from '../auth/password.js';
import { hashSecretToken, newSecretToken } from '../auth/secret-token.js';
import { Invitation } from '../entities/invitation.entity.js';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import { User } from '../entities/user.entity.js';
import { AppError, badRequest, notFound } from '../http/app-error.js';
import type { Mailer } from '../mail/mailer.js';
import { invitationMail } from '../mail/templates.js';
import { assertMayGrant, coversClientGroups, type TenantScope } from '../policies/tenant-scope.js';
import { assertClientGroupsInTenant } from '../repositories/client-group.repository.js';
import { markAddressProven } from './account.service.js';
import { recordAudit } from './audit.service.js';
import { assertWithinPlanLimit } from './billing/plan-limits.js';

const LIFETIME_MS = 7 * 86_400_000;

const view = (i: Invitation): InvitationView => ({
  id: i.id,
  email: i.email,
  role: i.role,
  clientGroupIds: i.clientGroupIds,
  expiresAt: i.expiresAt.toISOString(),
  createdAt: i.createdAt.toISOString(),
});

export async function invite(
  ds: DataSource,
  mailer: Mailer,
  scope: TenantScope,
  inviterName: string,
  input: InviteRequest,
  baseUrl: string,
): Promise<InvitationView> {
  const { token, hash } = newSecretToken();
  const expiresAt = new Date(Date.now() + LIFETIME_MS);
  assertMayGrant(scope, input.clientGroupIds);
  const { invitation, organisation } = await ds.transaction(async (em) => {
    if (input.clientGroupIds) await assertWithinPlanLimit(em, scope.organisationId, 'seats');
    if (input.clientGroupIds && !(await assertClientGroupsInTenant(em, scope.organisationId, input.clientGroupIds))) throw badRequest('Unknown client group');
    const existing = await em
      .getRepository(Membership)
      .createQueryBuilder('m')
      .innerJoin(User, 'u', 'u.id = m.userId')
      .where('m.organisationId = :org AND u.email = :email', { org: scope.organisationId, email: input.email })
      .getExists();
    if (existing) throw new AppError(409, `${input.email} is a member already`);
    const organisation = await em.getRepository(Organisation).findOneByOrFail({ id: scope.organisationId });
    const invitation = await em.getRepository(Invitation).save({
      organisationId: scope.organisationId,
      email: input.email,
      role: input.role,
      clientGroupIds: input.clientGroupIds,
      tokenHash: hash,
      invitedByUserId: scope.userId,
      expiresAt,
      acceptedAt: null,
    });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'invitation.sent',
      entityType: 'invitation',
      entityId: invitation.id,
      details: { email: input.email, role: input.role },
    });
    return { invitation, organisation };
  });
  await mailer.send(
    invitationMail({
      to: input.email,
      organisationName: organisation.name,
      inviterName,
      role: input.role,
      link: `${baseUrl}/invitation?token=${encodeURIComponent(token)}`,
      expiresAt,
    }),
  );
  return view(invitation);
}

export async function listPendingInvitations(ds: DataSource, scope: TenantScope): Promise<InvitationView[]> {
  const rows = await ds.getRepository(Invitation).find({
    where: { organisationId: scope.organisationId, acceptedAt: IsNull(), expiresAt: MoreThan(new Date()) },
    order: { createdAt: 'DESC' },
  });
  return rows.filter((i) => coversClientGroups(scope, i.clientGroupIds)).map(view);
}

export async function revokeInvitation(ds: DataSource, scope: TenantScope, id: string): Promise<void> {
  await ds.transaction(async (em) => {
    const inv = await em.getRepository(Invitation).findOneBy({ id, organisationId: scope.organisationId, acceptedAt: IsNull() });
    if (!inv || !coversClientGroups(scope, inv.clientGroupIds)) throw notFound('No such invitation');
    await em.getRepository(Invitation).delete({ id: inv.id });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'invitation.revoked',
      entityType: 'invitation',
      entityId: inv.id,
      details: { email: inv.email },
    });
  });
}

async function findUsable(ds: DataSource, token: string): Promise<Invitation> {
  const inv = await ds.getRepository(Invitation).findOneBy({ tokenHash: hashSecretToken(token) });
  if (!inv || inv.acceptedAt || inv.expiresAt.getTime() < Date.now()) throw notFound('This invitation is no longer valid; ask for a new one');
  return inv;
}

export async function describeInvitation(ds: DataSource, token: string): Promise<InvitationLinkView> {
  const inv = await findUsable(ds, token);
  const organisation = await ds.getRepository(Organisation).findOneByOrFail({ id: inv.organisationId });
  const accountExists = await ds.getRepository(User).existsBy({ email: inv.email });
  return { email: inv.email, role: inv.role, organisationName: organisation.name, accountExists, expiresAt: inv.expiresAt.toISOString() };
}

/**
 * Accepting as the signed-in user with the invited e-mail links the membership; without an account, name
 * and password create one. Someone signed in under another e-mail cannot take the invitation.
 */
export async function acceptInvitation(
  ds: DataSource,
  token: string,
  signedInUser: User | undefined,
  input: { name?: string; password?: string },
): Promise<{ user: User; organisationId: string }> {
  const inv = await findUsable(ds, token);
  const passwordHash = input.password ? await hashPassword(input.password) : null;
  return ds.transaction(async (em) => {
    const locked = await em.getRepository(Invitation).createQueryBuilder('i').setLock('pessimistic_write').where('i.id = :id', { id: inv.id }).getOneOrFail();
    if (locked.acceptedAt) throw notFound('This invitation is no longer valid; ask for a new one');
    let user = await em.getRepository(User).findOneBy({ email: inv.email });
    if (user) {
      if (!signedInUser || signedInUser.id !== user.id) throw new AppError(401, `Sign in as ${inv.email} to accept this invitation`);
    } else {
      if (signedInUser) throw new AppError(403, `This invitation is for ${inv.email}; sign out first to accept it with a new account`);
      if (!input.name || !input.password || !passwordHash) {
        throw badRequest('Some fields need attention', {
          fieldErrors: [
            ...(!input.name ? [{ path: 'name', message: 'Enter your name' }] : []),
            ...(!input.password ? [{ path: 'password', message: 'Choose a password' }] : []),
          ],
        });
      }
      assertPasswordAcceptable(input.password, { email: inv.email, name: input.name });
      user = await em.getRepository(User).save({ email: inv.email, name: input.name, passwordHash, unitPreference: 'us' });
    }
    // The token came by mail to this address: the address is proven.
    await markAddressProven(em, user);
    if (!(await em.getRepository(Membership).existsBy({ organisationId: inv.organisationId, userId: user.id }))) {
      await em.getRepository(Membership).save({ organisationId: inv.organisationId, userId: user.id, role: inv.role, clientGroupIds: inv.clientGroupIds });
    }
    await em.getRepository(Invitation).update({ id: inv.id }, { acceptedAt: new Date() });
    await recordAudit(em, {
      organisationId: inv.organisationId,
      userId: user.id,
      action: 'invitation.accepted',
      entityType: 'invitation',
      entityId: inv.id,
      details: { email: inv.email, role: inv.role },
    });
    return { user, organisationId: inv.organisationId };
  });
}
