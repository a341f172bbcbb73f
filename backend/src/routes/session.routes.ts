import type { Request, RequestHandler, Response } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import type passport from 'passport';
import type { DataSource } from 'typeorm';
import { signInRequest } from '@shared/schemas/session.js';
import { BAD_CREDENTIALS } from '../auth/passport-setup.js';
import type { User } from '../entities/user.entity.js';
import { AppError } from '../http/app-error.js';
import type { RouteSpec } from '../http/route-registry.js';
import { describeSession } from '../services/session.service.js';

function signInLimiter() {
  // Keyed by address and e-mail together: an attacker cannot lock a victim out from elsewhere.
  return rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: 10,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler: (_req, res, _next, options) => {
      res.status(429).json({ error: `Too many sign-in attempts; try again in ${Math.ceil(options.windowMs / 60000)} minutes` });
    },
  });
}

export function sessionRoutes(dataSource: DataSource, auth: passport.PassportStatic, authenticate: RequestHandler): RouteSpec[] {
  const signIn = (req: Request, res: Response) =>
    new Promise<void>((resolve, reject) => {
      auth.authenticate('local', (err: unknown, user: User | false) => {
        if (err) return reject(err);
        if (!user) return reject(new AppError(401, BAD_CREDENTIALS));
        // req.login regenerates the session id (passport ≥ 0.6): no fixation.
        req.login(user, (loginErr) => {
          if (loginErr) return reject(loginErr);
          req.session.createdAt = Date.now();
          req.session.activeOrganisationId = undefined;
          resolve();
        });
      })(req, res, reject);
    }).then(async () => {
      req.actor = undefined;
      await new Promise<void>((resolve, reject) => authenticate(req, res, (e?: unknown) => (e ? reject(e) : resolve())));
      res.json(await describeSession(dataSource, req.actor));
    });

  return [
    {
      method: 'get',
      path: '/api/session',
      access: 'public',
      tenantScoped: false,
      description: 'Who is signed in, and their organisations',
      handler: async (req, res) => {
        res.json(await describeSession(dataSource, req.actor));
      },
    },
    {
      method: 'post',
      path: '/api/session',
      access: 'public',
      tenantScoped: false,
      rateLimit: signInLimiter(),
      body: signInRequest,
      description: 'Sign in with e-mail and password',
      handler: signIn,
    },
    {
      method: 'delete',
      path: '/api/session',
      access: 'signed-in',
      tenantScoped: false,
      description: 'Sign out',
      handler: async (req, res) => {
        await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
        await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
        res.clearCookie('cleancase.sid');
        res.status(204).end();
      },
    },
  ];
}
