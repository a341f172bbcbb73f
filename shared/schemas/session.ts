import { z } from 'zod';

export const signInRequest = z
  .object({
    email: z.email('Enter an e-mail address').max(254),
    password: z.string().min(1, 'Enter your password').max(4096),
  })
  .strict();
export type SignInRequest = z.infer<typeof signInRequest>;

export const roleSchema = z.enum(['admin', 'analyst', 'approver', 'viewer']);
const permissionSchema = z.enum([
  'data.read',
  'data.write',
  'cases.approve',
  'outages.plan',
  'outages.delete',
  'members.manage',
  'client-groups.manage',
  'billing.manage',
  'audit.read',
  'calc.use',
]);

export const membershipSummary = z
  .object({
    organisationId: z.string(),
    organisationName: z.string(),
    role: roleSchema,
    limitedToClientGroups: z.boolean(),
  })
  .strict();

export const sessionResponse = z
  .object({
    user: z
      .object({ id: z.string(), email: z.string(), name: z.string(), unitPreference: z.enum(['us', 'si']) })
      .strict()
      .nullable(),
    activeOrganisationId: z.string().nullable(),
    /** What the active role may do, for hiding or disabling actions in the UI. */
    permissions: z.array(permissionSchema),
    memberships: z.array(membershipSummary),
    /** Present while the local SMTP sink is in use. */
    devMailbox: z.boolean(),
  })
  .strict();
export type SessionResponse = z.infer<typeof sessionResponse>;
