import type { Request, Response } from 'express';
import type passport from 'passport';
import type { DataSource } from 'typeorm';
import { switchTenantRequest } from '@shared/schemas/accounts.js';
import { sessionResponse, signInRequest } from '@shared/schemas/session.js';
import { endSession, establishSession } from '../auth/establish-session.js';
import { BAD_CREDENTIALS } from '../auth/passport-setup.js';
import type { User } from '../entities/user.entity.js';
import { AppError } from '../http/app-error.js';
import { signInLimiter } from '../http/rate-limits.js';
import type { RouteSpec } from '../http/route-registry.js';
import { assertMemberOf } from '../services/account.service.js';
import { describeSession } from '../services/session.service.js';

export const SESSION_COOKIE = 'cleancase.sid';

/** `answer` re-reads the actor after the session changed and replies with the session description. */
export function sessionRoutes(
  ds: DataSource,
  auth: passport.PassportStatic,
  answer: (req: Request, res: Response) => Promise<void>,
  devMailbox: boolean,
): RouteSpec[] {
  const verify = (req: Request, res: Response) =>
    new Promise<User>((resolve, reject) => {
      auth.authenticate('local', (err: unknown, user: User | false) => {
        if (err) return reject(err);
        if (!user) return reject(new AppError(401, BAD_CREDENTIALS));
        resolve(user);
      })(req, res, reject);
    });

  return [
    {
      method: 'get',
      path: '/api/session',
      response: sessionResponse,
      access: 'public',
      tenantScoped: false,
      description: 'Who is signed in, their organisations and what the active role may do',
      handler: async (req, res) => res.json(await describeSession(ds, req.actor, devMailbox)),
    },
    {
      method: 'post',
      path: '/api/session',
      response: sessionResponse,
      access: 'public',
      tenantScoped: false,
      rateLimit: signInLimiter(ds),
      body: signInRequest,
      description: 'Sign in with e-mail and password (new session id)',
      handler: async (req, res) => {
        const user = await verify(req, res);
        await establishSession(req, user);
        await answer(req, res);
      },
    },
    {
      method: 'delete',
      path: '/api/session',
      response: 'empty',
      access: 'signed-in',
      tenantScoped: false,
      description: 'Sign out',
      handler: async (req, res) => {
        await endSession(req);
        res.clearCookie(SESSION_COOKIE);
        res.status(204).end();
      },
    },
    {
      method: 'post',
      path: '/api/session/organisation',
      response: sessionResponse,
      access: 'signed-in',
      tenantScoped: false,
      allowsPrivilegedFields: true,
      body: switchTenantRequest,
      description: 'Switch the active organisation (tenant)',
      handler: async (req, res) => {
        const { organisationId } = req.body as { organisationId: string };
        await assertMemberOf(ds, req.actor!.user.id, organisationId);
        req.session.activeOrganisationId = organisationId;
        await answer(req, res);
      },
    },
  ];
}
