/**
 * Who may do what, by role: one table read by the server's route declarations and by the UI (to hide or
 * disable actions, with the reason). Scope (tenant, client groups) is checked separately on the server.
 */
export const ROLES = ['admin', 'analyst', 'approver', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const PERMISSIONS = {
  /** dashboards, plants, data, approved cases, reports */
  'data.read': ['admin', 'analyst', 'approver', 'viewer'],
  /** plants, units, imports, events, cases */
  'data.write': ['admin', 'analyst'],
  /** approve or send back cases and outage scopes */
  'cases.approve': ['admin', 'approver'],
  /** create and edit outages, add work items, run the optimiser, save scopes */
  'outages.plan': ['admin', 'analyst', 'approver'],
  /** delete an outage, approved or not (the audit log keeps its record) */
  'outages.delete': ['admin'],
  'members.manage': ['admin'],
  'client-groups.manage': ['admin'],
  'billing.manage': ['admin'],
  'audit.read': ['admin', 'approver'],
  /** calculation API, own API tokens */
  'calc.use': ['admin', 'analyst', 'approver', 'viewer'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return !!role && (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

export function permissionsOf(role: Role | null | undefined): Permission[] {
  return (Object.keys(PERMISSIONS) as Permission[]).filter((p) => can(role, p));
}

const ROLE_WORDS: Record<Permission, string> = {
  'data.read': 'members',
  'data.write': 'administrators and analysts',
  'cases.approve': 'administrators and approvers',
  'outages.plan': 'administrators, analysts and approvers',
  'outages.delete': 'administrators',
  'members.manage': 'administrators',
  'client-groups.manage': 'administrators',
  'billing.manage': 'administrators',
  'audit.read': 'administrators and approvers',
  'calc.use': 'members',
};

/** The reason shown beside a disabled action. */
export function whyNot(permission: Permission): string {
  return `Only ${ROLE_WORDS[permission]} can do this`;
}
