import type passport from 'passport';
import { establishSession } from '../auth/establish-session.js';
import { GOOGLE_STRATEGY } from '../auth/google-strategy.js';
import type { User } from '../entities/user.entity.js';
import type { RouteSpec } from '../http/route-registry.js';

export function googleAuthRoutes(auth: passport.PassportStatic): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/auth/google',
      access: 'public',
      tenantScoped: false,
      description: 'Start Google sign-in (redirects to Google, or to the local stand-in)',
      handler: (req, res) =>
        new Promise<void>((resolve, reject) => {
          auth.authenticate(GOOGLE_STRATEGY, { scope: ['openid', 'email', 'profile'], session: false })(req, res, (err?: unknown) =>
            err ? reject(err) : resolve(),
          );
          res.once('finish', () => resolve());
        }),
    },
    {
      method: 'get',
      path: '/api/auth/google/callback',
      access: 'public',
      tenantScoped: false,
      description: 'Google sign-in returns here; signs in and goes to the app',
      handler: (req, res) =>
        new Promise<void>((resolve) => {
          auth.authenticate(GOOGLE_STRATEGY, { session: false }, async (err: unknown, user: User | false) => {
            if (err || !user) {
              res.redirect('/sign-in?google=failed');
              return resolve();
            }
            try {
              await establishSession(req, user);
              res.redirect('/');
            } catch {
              res.redirect('/sign-in?google=failed');
            }
            resolve();
          })(req, res, () => resolve());
        }),
    },
  ];
}
