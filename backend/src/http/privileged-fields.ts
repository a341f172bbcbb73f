import type { NextFunction, Request, Response } from 'express';
import { AppError } from './app-error.js';

/** Fields a client may never set through an ordinary endpoint: the tenant, a role, billing. */
export const PRIVILEGED_FIELDS = [
  'organisationId',
  'tenantId',
  'role',
  'roles',
  'membershipId',
  'clientGroupIds',
  'plan',
  'subscriptionStatus',
  'stripeCustomerId',
  'stripeSubscriptionId',
  'trialEndsAt',
];

export function rejectPrivilegedFields(req: Request, _res: Response, next: NextFunction): void {
  const body = req.body;
  if (body && typeof body === 'object' && !Array.isArray(body)) {
    const found = PRIVILEGED_FIELDS.filter((f) => Object.hasOwn(body, f));
    if (found.length) return next(new AppError(400, `These fields cannot be set here: ${found.join(', ')}`));
  }
  next();
}
