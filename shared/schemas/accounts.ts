import { z } from 'zod';
import { roleSchema } from './session.js';

const email = z
  .email('Enter an e-mail address')
  .max(254)
  .transform((e) => e.trim().toLowerCase());
/** Names go into e-mails: plain text, no markup, no links (the mail templates strip them too). */
const plainText = (s: string) => !/[<>]|:\/\/|\bwww\./i.test(s);
const PLAIN_TEXT_MESSAGE = 'Use plain text: no links and no < or >';
const personName = z.string().trim().min(1, 'Enter a name').max(80, 'Use at most 80 characters').refine(plainText, PLAIN_TEXT_MESSAGE);
const organisationName = (empty: string) => z.string().trim().min(2, empty).max(120, 'Use at most 120 characters').refine(plainText, PLAIN_TEXT_MESSAGE);
const newPassword = z.string().min(1, 'Enter a password').max(4096);
const uuid = z.uuid('Not a valid id');

/** A client-group limit: each group once, whatever the client sent. */
const groupIdList = z
  .array(uuid)
  .max(200)
  .transform((ids) => [...new Set(ids)]);

export const signUpRequest = z
  .object({
    name: personName,
    email,
    password: newPassword,
    organisationName: organisationName('Enter your organisation’s name'),
  })
  .strict();
export type SignUpRequest = z.infer<typeof signUpRequest>;

export const switchTenantRequest = z.object({ organisationId: uuid }).strict();

export const createOrganisationRequest = z.object({ name: organisationName('Enter a name') }).strict();

export const passwordResetRequest = z.object({ email }).strict();
export const passwordResetConfirm = z.object({ token: z.string().min(10).max(200), password: newPassword }).strict();
export const addressConfirmation = z.object({ token: z.string().min(10, 'This confirmation link is incomplete').max(200) }).strict();

export const profileUpdate = z
  .object({ name: personName.optional(), unitPreference: z.enum(['us', 'si']).optional() })
  .strict()
  .refine((v) => v.name !== undefined || v.unitPreference !== undefined, 'Nothing to change');
export const passwordChange = z.object({ currentPassword: z.string().max(4096), newPassword }).strict();

export const inviteRequest = z.object({ email, role: roleSchema, clientGroupIds: groupIdList.nullable().default(null) }).strict();
export type InviteRequest = z.infer<typeof inviteRequest>;

export const acceptInvitationRequest = z.object({ name: personName.optional(), password: newPassword.optional() }).strict();

export const memberUpdate = z
  .object({ role: roleSchema.optional(), clientGroupIds: groupIdList.nullable().optional() })
  .strict()
  .refine((v) => v.role !== undefined || v.clientGroupIds !== undefined, 'Nothing to change');

export const clientGroupInput = z.object({ name: z.string().trim().min(1, 'Enter a name').max(120) }).strict();

export const apiTokenCreate = z.object({ name: z.string().trim().min(1, 'Enter a name').max(80) }).strict();

export const auditQuery = z
  .object({
    action: z.string().max(64).optional(),
    userId: uuid.optional(),
    entityType: z.string().max(64).optional(),
    from: z.iso.date().optional(),
    to: z.iso.date().optional(),
    limit: z.coerce.number().int().min(1).max(500).default(100),
  })
  .strict();

export const memberView = z
  .object({
    membershipId: z.string(),
    userId: z.string(),
    name: z.string(),
    email: z.string(),
    role: roleSchema,
    /** null: every client group of the organisation */
    clientGroupIds: z.array(z.string()).nullable(),
    joinedAt: z.iso.datetime(),
  })
  .strict();
export type MemberView = z.infer<typeof memberView>;
export const membersResponse = z.object({ members: z.array(memberView) }).strict();

export const invitationView = z
  .object({
    id: z.string(),
    email: z.string(),
    role: roleSchema,
    clientGroupIds: z.array(z.string()).nullable(),
    expiresAt: z.iso.datetime(),
    createdAt: z.iso.datetime(),
  })
  .strict();
export type InvitationView = z.infer<typeof invitationView>;

export const clientGroupView = z.object({ id: z.string(), name: z.string(), createdAt: z.iso.datetime() }).strict();
export type ClientGroupView = z.infer<typeof clientGroupView>;

export const apiTokenView = z
  .object({ id: z.string(), name: z.string(), prefix: z.string(), createdAt: z.iso.datetime(), lastUsedAt: z.iso.datetime().nullable() })
  .strict();
export type ApiTokenView = z.infer<typeof apiTokenView>;

export const auditEventView = z
  .object({
    id: z.string(),
    createdAt: z.iso.datetime(),
    userId: z.string().nullable(),
    userName: z.string().nullable(),
    action: z.string(),
    entityType: z.string(),
    entityId: z.string().nullable(),
    details: z.record(z.string(), z.unknown()).nullable(),
  })
  .strict();
export type AuditEventView = z.infer<typeof auditEventView>;

export const invitationsResponse = z.object({ invitations: z.array(invitationView) }).strict();
export const clientGroupsResponse = z.object({ clientGroups: z.array(clientGroupView) }).strict();
export const apiTokensResponse = z.object({ apiTokens: z.array(apiTokenView) }).strict();
/** A new token: its secret is shown this once. */
export const createdApiToken = apiTokenView.extend({ token: z.string() }).strict();
export type CreatedApiToken = z.infer<typeof createdApiToken>;
export const auditEventsResponse = z.object({ events: z.array(auditEventView) }).strict();

/** What an invitation link shows before it is taken: whom it invites, to what, and whether they have an account. */
export const invitationLinkView = z
  .object({ email: z.string(), role: roleSchema, organisationName: z.string(), accountExists: z.boolean(), expiresAt: z.iso.datetime() })
  .strict();
export type InvitationLinkView = z.infer<typeof invitationLinkView>;
export type AuditEventsResponse = z.infer<typeof auditEventsResponse>;
export type InvitationsResponse = z.infer<typeof invitationsResponse>;
export type ClientGroupsResponse = z.infer<typeof clientGroupsResponse>;
export type ApiTokensResponse = z.infer<typeof apiTokensResponse>;
export type MembersResponse = z.infer<typeof membersResponse>;

/** Request bodies as a caller writes them (defaults may be left out). */
export type CreateOrganisationRequest = z.input<typeof createOrganisationRequest>;
export type PasswordResetRequest = z.input<typeof passwordResetRequest>;
export type PasswordResetConfirm = z.input<typeof passwordResetConfirm>;
export type AddressConfirmation = z.input<typeof addressConfirmation>;
export type ProfileUpdate = z.input<typeof profileUpdate>;
export type PasswordChange = z.input<typeof passwordChange>;
export type AcceptInvitationRequest = z.input<typeof acceptInvitationRequest>;
export type MemberUpdate = z.input<typeof memberUpdate>;
export type ClientGroupInput = z.input<typeof clientGroupInput>;
export type ApiTokenCreate = z.input<typeof apiTokenCreate>;
