/**
 * Rate limits for the endpoints people (or bots) hammer. Keys combine address and account, so nobody can
 * lock another person out from elsewhere. In-memory per process; see README for running many processes.
 */
import type { Request, RequestHandler } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';

function limiter(what: string, limit: number, windowMs: number, key: (req: Request) => string): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${key(req)}`,
    handler: (_req, res, _next, options) => {
      res.setHeader('Retry-After', String(Math.ceil(options.windowMs / 1000)));
      res.status(429).json({ error: `Too many ${what}; try again in ${Math.ceil(options.windowMs / 60000)} minutes` });
    },
  });
}

const emailOf = (req: Request) => String(req.body?.email ?? '').trim().toLowerCase();

export const signInLimiter = () => limiter('sign-in attempts', 10, 15 * 60_000, emailOf);
export const signUpLimiter = () => limiter('sign-ups from this address', 20, 60 * 60_000, () => '');
export const resetLimiter = () => limiter('password reset requests', 5, 60 * 60_000, emailOf);
export const resetConfirmLimiter = () => limiter('attempts with this reset link', 10, 60 * 60_000, (req) => String(req.body?.token ?? ''));
/** Keyed by the session: another person's guesses never lock this account's owner out. */
export const passwordChangeLimiter = () => limiter('password change attempts', 10, 15 * 60_000, (req) => req.sessionID ?? '');
export const inviteLimiter = () => limiter('invitations', 30, 60 * 60_000, (req) => req.sessionID ?? '');
