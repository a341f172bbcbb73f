/**
 * Every route is declared here as data: method, path, who may call it and whether it is tenant-scoped.
 * Mounting builds one fixed chain per route: rate limit → authenticate → role check → CSRF → forbidden
 * fields → validate → handler. The security tests read the same list.
 */
import type { Express, NextFunction, Request, RequestHandler, Response } from 'express';
import type { ZodType } from 'zod';
import { PERMISSIONS, type Permission } from '@shared/permissions.js';
import { findTextProblem } from '@shared/well-formed-text.js';
import { AppError, forbidden, unauthorised } from './app-error.js';
import { csrfGuard } from './csrf.js';
import { readOnlyReason } from '@shared/billing-access.js';
import { rejectPrivilegedFields } from './privileged-fields.js';

export type Access = 'public' | 'signed-in' | Permission;

/** What a successful call answers: a JSON body (its schema), nothing (204), or a file download (its media types). */
export type RouteResponse = ZodType | 'empty' | { file: string[] };

export interface RouteSpec {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  /** 'public': anyone; 'signed-in': any signed-in user (no tenant needed); a permission: members of the active tenant whose role has it. */
  access: Access;
  /** Personal API tokens may call this route (calculation API); otherwise only a browser session. */
  apiToken?: boolean;
  /** Reads or writes records of the active tenant (and so must answer 404 outside its scope). */
  tenantScoped: boolean;
  /** Unsafe methods are CSRF-checked unless this is false (only the Stripe webhook). */
  csrf?: boolean;
  /** An unsafe tenant-scoped route that still answers while the organisation is read-only (billing: paying again). */
  openWhenReadOnly?: boolean;
  /** Endpoints whose job is to set tenant, role or billing fields. */
  allowsPrivilegedFields?: boolean;
  rateLimit?: RequestHandler;
  body?: ZodType;
  /** A body described in the API description but checked by the handler itself (the calculation API answers 422 per input). */
  bodyCheckedByHandler?: ZodType;
  query?: ZodType;
  /** The success answer, for the API description (GET /api/openapi.json) and the response-schema tests. */
  response?: RouteResponse;
  /** Success status when it is not 200 (201 created, 202 accepted); 'empty' answers 204. */
  status?: 201 | 202;
  /** An answer besides success and the common errors, e.g. 422 with each failed input's error in place. */
  otherAnswer?: { status: 422; description: string; schema: ZodType };
  /** Extra middleware before the handler (e.g. a file upload parser). */
  before?: RequestHandler[];
  handler: (req: Request, res: Response) => unknown;
  description: string;
}

function requireAccess(spec: RouteSpec): RequestHandler {
  const { access } = spec;
  return (req: Request, _res: Response, next: NextFunction) => {
    if (req.actor?.via === 'api-token' && !spec.apiToken) return next(forbidden('API tokens can only call the calculation API'));
    if (access === 'public') return next();
    if (!req.actor) return next(unauthorised());
    if (access === 'signed-in') return next();
    if (!req.actor.membership) return next(forbidden('Choose an organisation first'));
    const allowed: readonly string[] = PERMISSIONS[access];
    if (!allowed.includes(req.actor.membership.role)) {
      return next(forbidden(`Your role (${req.actor.membership.role}) cannot do this; it needs ${allowed.join(' or ')}`));
    }
    next();
  };
}

function validate(spec: RouteSpec): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    // Every route, with a schema or without: broken text never reaches a service or the database.
    for (const part of ['body', 'query'] as const) {
      const found = findTextProblem(req[part] ?? {});
      if (found?.problem === 'surrogate') {
        const message = 'This text holds a broken character (a lone UTF-16 surrogate): retype it or paste it again from its source';
        return next(new AppError(400, 'Some text could not be read: it holds a broken character', { fieldErrors: [{ path: found.path, message }] }));
      }
      if (found?.problem === 'control') {
        const message = 'This text holds a control character (such as NUL or escape): only letters, digits, symbols, tabs and line breaks';
        return next(new AppError(400, 'Some text holds a control character', { fieldErrors: [{ path: found.path, message }] }));
      }
    }
    for (const [part, schema] of [
      ['body', spec.body],
      ['query', spec.query],
    ] as const) {
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

/** A lapsed subscription (trial ended unpaid, past due beyond the grace period, canceled) refuses every write of the tenant: 402 with the reason. */
const refuseWhileReadOnly: RequestHandler = (req, _res, next) => {
  const organisation = req.actor?.organisation;
  const reason = organisation ? readOnlyReason(organisation, new Date()) : null;
  next(reason ? new AppError(402, reason, { readOnly: true }) : undefined);
};

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
    chain.push(authenticate, requireAccess(spec));
    if (unsafe && spec.csrf !== false) chain.push(csrfGuard);
    if (unsafe && spec.tenantScoped && !spec.openWhenReadOnly) chain.push(refuseWhileReadOnly);
    if (unsafe && !spec.allowsPrivilegedFields) chain.push(rejectPrivilegedFields);
    chain.push(...(spec.before ?? []), validate(spec), wrap(spec.handler));
    app[spec.method](spec.path, ...chain);
  }
}
