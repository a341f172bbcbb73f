import { z } from 'zod';
import { roleSchema } from './session.js';

const email = z.email('Enter an e-mail address').max(254).transform((e) => e.trim().toLowerCase());
/** Names go into e-mails: plain text, no markup, no links (the mail templates strip them too). */
const plainText = (s: string) => !/[<>]|:\/\/|\bwww\./i.test(s);
const PLAIN_TEXT_MESSAGE = 'Use plain text: no links and no < or >';
const personName = z.string().trim().min(1, 'Enter a name').max(80, 'Use at most 80 characters').refine(plainText, PLAIN_TEXT_MESSAGE);
const organisationName = (empty: string) => z.string().trim().min(2, empty).max(120, 'Use at most 120 characters').refine(plainText, PLAIN_TEXT_MESSAGE);
const newPassword = z.string().min(1, 'Enter a password').max(4096);
const uuid = z.uuid('Not a valid id');

/** A client-group limit: each group once, whatever the client sent. */
const groupIdList = z.array(uuid).max(200).transform((ids) => [...new Set(ids)]);

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

export const inviteRequest = z
  .object({ email, role: roleSchema, clientGroupIds: groupIdList.nullable().default(null) })
  .strict();
export type InviteRequest = z.infer<typeof inviteRequest>;

export const acceptInvitationRequest = z
  .object({ name: personName.optional(), password: newPassword.optional() })
  .strict();

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

export interface MemberView {
  membershipId: string;
  userId: string;
  name: string;
  email: string;
  role: z.infer<typeof roleSchema>;
  clientGroupIds: string[] | null;
  joinedAt: string;
}

export interface InvitationView {
  id: string;
  email: string;
  role: z.infer<typeof roleSchema>;
  clientGroupIds: string[] | null;
  expiresAt: string;
  createdAt: string;
}

export interface ClientGroupView {
  id: string;
  name: string;
  createdAt: string;
}

export interface ApiTokenView {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
}

export interface AuditEventView {
  id: string;
  createdAt: string;
  userId: string | null;
  userName: string | null;
  action: string;
  entityType: string;
  entityId: string | null;
  details: Record<string, unknown> | null;
}
