/** Sign-up, own organisations, tenant switch, profile, password change and reset. */
import { IsNull, type DataSource, type EntityManager } from 'typeorm';
import type { z } from 'zod';
import type { passwordChange, profileUpdate, SignUpRequest } from '@shared/schemas/accounts.js';
import { assertPasswordAcceptable } from '../auth/password-rules.js';
import { hashPassword, verifyPassword } from '../auth/password.js';
import { hashSecretToken, newSecretToken } from '../auth/secret-token.js';
import { AddressConfirmationToken } from '../entities/address-confirmation-token.entity.js';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import { PasswordResetToken } from '../entities/password-reset-token.entity.js';
import { User } from '../entities/user.entity.js';
import { AppError, badRequest, notFound } from '../http/app-error.js';
import { clearSignInFailures } from '../http/rate-limits.js';
import type { Mailer, OutgoingMail } from '../mail/mailer.js';
import { enqueueComposed } from '../mail/outbox.js';
import { accountExistsMail, addressConfirmationMail, passwordResetMail } from '../mail/templates.js';
import { revokeAllApiTokensOf } from './api-token.service.js';
import { recordAudit } from './audit.service.js';
import { seedTypicalMethods } from './cleaning-method.service.js';

export const TRIAL_DAYS = 14;
const RESET_LIFETIME_MS = 60 * 60 * 1000;
const CONFIRMATION_LIFETIME_MS = 24 * 60 * 60 * 1000;

/** The one answer to every well-formed sign-up, whether or not the address had an account (no enumeration). */
export const SIGN_UP_ANSWER = {
  message: 'Thank you. Sign in with this e-mail and password. If the address already had an account, we sent it an e-mail instead.',
};

/**
 * A new address gets an account and organisation at once (it can sign in straight away) and a mail asking to
 * confirm the address, which stays unproven until then; an address with an account gets a notice by e-mail
 * instead of a second account. Both take the same steps up to that point, and each queues one mail.
 */
export async function signUp(ds: DataSource, mailer: Mailer, input: SignUpRequest, baseUrl: string): Promise<void> {
  assertPasswordAcceptable(input.password, { email: input.email, name: input.name });
  const passwordHash = await hashPassword(input.password);
  const noticeExisting = () => mailer.send(accountExistsMail({ to: input.email, signInLink: `${baseUrl}/sign-in`, resetLink: `${baseUrl}/forgot-password` }));
  try {
    await ds.transaction(async (em) => {
      if (await em.getRepository(User).existsBy({ email: input.email })) throw new AddressTaken();
      const user = await em.getRepository(User).save({ email: input.email, name: input.name, passwordHash, unitPreference: 'us', emailProvenAt: null });
      await enqueueComposed(em, ADDRESS_CONFIRMATION_MAIL, input.email);
      const organisation = await em.getRepository(Organisation).save({
        name: input.organisationName,
        kind: 'utility',
        plan: 'trial',
        subscriptionStatus: 'trialing',
        trialEndsAt: new Date(Date.now() + TRIAL_DAYS * 86_400_000),
      });
      await em.getRepository(Membership).save({ organisationId: organisation.id, userId: user.id, role: 'admin', clientGroupIds: null });
      await seedTypicalMethods(em, organisation.id);
      await recordAudit(em, {
        organisationId: organisation.id,
        userId: user.id,
        action: 'organisation.created',
        entityType: 'organisation',
        entityId: organisation.id,
      });
    });
  } catch (err) {
    // Two sign-ups for one new address at once: the second meets the unique index and is treated as existing.
    const duplicate = (err as { code?: string }).code === 'ER_DUP_ENTRY';
    if (!(err instanceof AddressTaken) && !duplicate) throw err;
    await noticeExisting();
  }
}

class AddressTaken extends Error {}

export const ADDRESS_CONFIRMATION_MAIL = 'address-confirmation';

/** Runs at delivery: a fresh single-use link while the address is unproven, nothing once it is proven. */
export async function composeAddressConfirmationMail(ds: DataSource, email: string, baseUrl: string): Promise<OutgoingMail | null> {
  const user = await ds.getRepository(User).findOneBy({ email });
  if (!user || user.emailProvenAt) return null;
  const { token, hash } = newSecretToken();
  const expiresAt = new Date(Date.now() + CONFIRMATION_LIFETIME_MS);
  await ds.getRepository(AddressConfirmationToken).insert({ userId: user.id, tokenHash: hash, expiresAt, usedAt: null });
  return addressConfirmationMail({ to: user.email, link: `${baseUrl}/confirm-address?token=${encodeURIComponent(token)}`, expiresAt });
}

/** The link came by mail to the address: it is proven from now on (an earlier proof stands) and its failed sign-ins are forgotten. */
export async function confirmAddress(ds: DataSource, token: string): Promise<void> {
  const user = await ds.transaction(async (em) => {
    const confirmation = await em
      .getRepository(AddressConfirmationToken)
      .createQueryBuilder('t')
      .setLock('pessimistic_write')
      .where('t.tokenHash = :h', { h: hashSecretToken(token) })
      .getOne();
    if (!confirmation || confirmation.usedAt || confirmation.expiresAt.getTime() < Date.now()) {
      throw new AppError(400, 'This confirmation link is no longer valid; a password reset link confirms the address too');
    }
    await em.getRepository(AddressConfirmationToken).update({ id: confirmation.id }, { usedAt: new Date() });
    const user = await em.getRepository(User).findOneByOrFail({ id: confirmation.userId });
    await markAddressProven(em, user);
    return user;
  });
  await clearSignInFailures(ds, user.email);
}

/** Records that the person receives mail at their address (from now, unless proven earlier). */
export async function markAddressProven(em: DataSource | EntityManager, user: Pick<User, 'id'>): Promise<void> {
  await em.getRepository(User).update({ id: user.id, emailProvenAt: IsNull() }, { emailProvenAt: new Date() });
}

export async function createOrganisation(ds: DataSource, userId: string, name: string): Promise<Organisation> {
  return ds.transaction(async (em) => {
    const organisation = await em.getRepository(Organisation).save({
      name,
      kind: 'utility',
      plan: 'trial',
      subscriptionStatus: 'trialing',
      trialEndsAt: new Date(Date.now() + TRIAL_DAYS * 86_400_000),
    });
    await em.getRepository(Membership).save({ organisationId: organisation.id, userId, role: 'admin', clientGroupIds: null });
    await seedTypicalMethods(em, organisation.id);
    await recordAudit(em, { organisationId: organisation.id, userId, action: 'organisation.created', entityType: 'organisation', entityId: organisation.id });
    return organisation;
  });
}

/** A tenant the user is no member of answers 404, like any record outside the caller's scope. */
export async function assertMemberOf(ds: DataSource, userId: string, organisationId: string): Promise<void> {
  if (!(await ds.getRepository(Membership).existsBy({ userId, organisationId }))) throw notFound('No such organisation');
}

export async function updateProfile(ds: DataSource, user: User, input: z.infer<typeof profileUpdate>): Promise<User> {
  const repo = ds.getRepository(User);
  await repo.update(
    { id: user.id },
    { ...(input.name !== undefined && { name: input.name }), ...(input.unitPreference && { unitPreference: input.unitPreference }) },
  );
  return repo.findOneByOrFail({ id: user.id });
}

/** Changes the password, ends every session of the user that began before now and revokes their API tokens. */
export async function changePassword(ds: DataSource, user: User, input: z.infer<typeof passwordChange>): Promise<void> {
  const withHash = await ds.getRepository(User).createQueryBuilder('u').addSelect('u.passwordHash').where('u.id = :id', { id: user.id }).getOneOrFail();
  if (withHash.passwordHash && !(await verifyPassword(withHash.passwordHash, input.currentPassword))) {
    throw badRequest('Some fields need attention', { fieldErrors: [{ path: 'currentPassword', message: 'This is not your current password' }] });
  }
  assertPasswordAcceptable(input.newPassword, { email: user.email, name: user.name }, 'newPassword');
  const passwordHash = await hashPassword(input.newPassword);
  await ds.transaction(async (em) => {
    await em.getRepository(User).update({ id: user.id }, { passwordHash, sessionsValidFrom: new Date() });
    await revokeAllApiTokensOf(em, user.id);
  });
}

export const PASSWORD_RESET_MAIL = 'password-reset';

/**
 * Only queues the request: the same single insert whether or not the account exists, so the answer is the same
 * in content and time. The outbox delivery composes the mail afterwards (composePasswordResetMail).
 */
export async function requestPasswordReset(ds: DataSource, email: string): Promise<void> {
  await enqueueComposed(ds, PASSWORD_RESET_MAIL, email);
}

/** Runs at delivery: a fresh single-use link for an existing account, nothing for an unknown address. */
export async function composePasswordResetMail(ds: DataSource, email: string, baseUrl: string): Promise<OutgoingMail | null> {
  const user = await ds.getRepository(User).findOneBy({ email });
  if (!user) return null;
  const { token, hash } = newSecretToken();
  const expiresAt = new Date(Date.now() + RESET_LIFETIME_MS);
  await ds.getRepository(PasswordResetToken).insert({ userId: user.id, tokenHash: hash, expiresAt, usedAt: null });
  return passwordResetMail({ to: user.email, link: `${baseUrl}/reset-password?token=${encodeURIComponent(token)}`, expiresAt });
}

/** Sets the new password; the mailed link proves the address, so the account's failed sign-ins are forgotten. */
export async function confirmPasswordReset(ds: DataSource, token: string, password: string): Promise<User> {
  const user = await ds.transaction(async (em) => {
    const reset = await em
      .getRepository(PasswordResetToken)
      .createQueryBuilder('t')
      .setLock('pessimistic_write')
      .where('t.tokenHash = :h', { h: hashSecretToken(token) })
      .getOne();
    if (!reset || reset.usedAt || reset.expiresAt.getTime() < Date.now()) {
      throw new AppError(400, 'This reset link is no longer valid; ask for a new one');
    }
    const user = await em.getRepository(User).findOneByOrFail({ id: reset.userId });
    assertPasswordAcceptable(password, { email: user.email, name: user.name });
    await em.getRepository(User).update({ id: user.id }, { passwordHash: await hashPassword(password), sessionsValidFrom: new Date() });
    await em.getRepository(PasswordResetToken).update({ id: reset.id }, { usedAt: new Date() });
    await markAddressProven(em, user);
    await revokeAllApiTokensOf(em, user.id);
    return user;
  });
  await clearSignInFailures(ds, user.email);
  return user;
}
