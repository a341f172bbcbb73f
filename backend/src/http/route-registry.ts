/**
 * Every route is declared here as data: method, path, who may call it and whether it is tenant-scoped.
 * Mounting builds one fixed chain per route: rate limit → authenticate → role check → CSRF → forbidden
 * fields → validate → handler. The security tests read the same list.
 */
import type { Express, NextFunction, Request, RequestHandler, Response } from 'express';
import type { ZodType } from 'zod';
import type { Role } from '../entities/membership.entity.js';
import { AppError, forbidden, unauthorised } from './app-error.js';
import { csrfGuard } from './csrf.js';
import { rejectPrivilegedFields } from './privileged-fields.js';

export type Access = 'public' | 'signed-in' | readonly Role[];

export interface RouteSpec {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  /** 'public': anyone; 'signed-in': any signed-in user (no tenant needed); roles: members of the active tenant with one of them. */
  access: Access;
  /** Reads or writes records of the active tenant (and so must answer 404 outside its scope). */
  tenantScoped: boolean;
  /** Unsafe methods are CSRF-checked unless this is false (only the Stripe webhook). */
  csrf?: boolean;
  /** Endpoints whose job is to set tenant, role or billing fields. */
  allowsPrivilegedFields?: boolean;
  rateLimit?: RequestHandler;
  body?: ZodType;
  query?: ZodType;
  /** Extra middleware before the handler (e.g. a file upload parser). */
  before?: RequestHandler[];
  handler: (req: Request, res: Response) => unknown;
  description: string;
}

export const ALL_ROLES = ['admin', 'analyst', 'approver', 'viewer'] as const satisfies readonly Role[];
export const WRITERS = ['admin', 'analyst'] as const satisfies readonly Role[];

function requireAccess(access: Access): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (access === 'public') return next();
    if (!req.actor) return next(unauthorised());
    if (access === 'signed-in') return next();
    if (!req.actor.membership) return next(forbidden('Choose an organisation first'));
    if (!access.includes(req.actor.membership.role)) {
      return next(forbidden(`Your role (${req.actor.membership.role}) cannot do this; it needs ${access.join(' or ')}`));
    }
    next();
  };
}

function validate(spec: RouteSpec): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    for (const [part, schema] of [['body', spec.body], ['query', spec.query]] as const) {
      if (!schema) continue;
      const parsed = schema.safeParse(part === 'body' ? (req.body ?? {}) : req.query);
      if (!parsed.success) {
        const fieldErrors = parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
        return next(new AppError(400, 'Some fields need attention', { fieldErrors }));
      }
      if (part === 'body') req.body = parsed.data;
      else req.validQuery = parsed.data;
    }
    next();
  };
}

const wrap =
  (handler: RouteSpec['handler']): RequestHandler =>
  async (req, res, next) => {
    try {
      await handler(req, res);
    } catch (err) {
      next(err);
    }
  };

export function mountRoutes(app: Express, routes: RouteSpec[], authenticate: RequestHandler): void {
  for (const spec of routes) {
    const unsafe = spec.method !== 'get';
    const chain: RequestHandler[] = [];
    if (spec.rateLimit) chain.push(spec.rateLimit);
    chain.push(authenticate, requireAccess(spec.access));
    if (unsafe && spec.csrf !== false) chain.push(csrfGuard);
    if (unsafe && !spec.allowsPrivilegedFields) chain.push(rejectPrivilegedFields);
    chain.push(...(spec.before ?? []), validate(spec), wrap(spec.handler));
    app[spec.method](spec.path, ...chain);
  }
}
