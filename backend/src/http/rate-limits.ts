/**
 * Rate limits for the endpoints people (or bots) hammer. Every counter lives in MariaDB (table
 * rate_limit_counter, made by a migration), so the limits hold across app processes and restarts; keys are
 * hashed, so the table holds no e-mail address. The address is req.ip: the connection's own address unless
 * TRUST_PROXY names the proxy in front (see trust-proxy.ts), so X-Forwarded-For cannot choose it.
 */
import { createHash } from 'node:crypto';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import { RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible';
import type { DataSource } from 'typeorm';
import type { MysqlDriver } from 'typeorm/driver/mysql/MysqlDriver.js';
import { RATE_LIMIT_TABLE } from '../entities/rate-limit-counter.entity.js';
import { AppError } from './app-error.js';

interface Rule {
  /** Stored in front of each key: one name per limit. */
  name: string;
  /** "Too many …" */
  what: string;
  points: number;
  windowMs: number;
}

const MINUTE = 60_000;
/** Limits common in practice for sign-in forms: a person mistypes a few times, a guesser needs thousands. */
const RULES = {
  signInAccount: { name: 'sign-in-account', what: 'failed sign-ins for this account', points: 10, windowMs: 15 * MINUTE },
  signInAddress: { name: 'sign-in-address', what: 'failed sign-ins from this address', points: 30, windowMs: 15 * MINUTE },
  signUp: { name: 'sign-up', what: 'sign-ups from this address', points: 20, windowMs: 60 * MINUTE },
  reset: { name: 'reset', what: 'password reset requests', points: 5, windowMs: 60 * MINUTE },
  resetConfirm: { name: 'reset-confirm', what: 'attempts with this reset link', points: 10, windowMs: 60 * MINUTE },
  addressConfirm: { name: 'address-confirm', what: 'address confirmation attempts', points: 20, windowMs: 60 * MINUTE },
  passwordChange: { name: 'password-change', what: 'password change attempts', points: 10, windowMs: 15 * MINUTE },
  invite: { name: 'invite', what: 'invitations', points: 30, windowMs: 60 * MINUTE },
  /**
   * Case creations, edits and copies: each may run a calculation of seconds. A person saves a case a few times a
   * minute at most (what-ifs run in the browser); 60 in 10 minutes leaves room for that and stops a loop.
   */
  caseWrite: { name: 'case-write', what: 'case calculations (new cases, edits and copies)', points: 60, windowMs: 10 * MINUTE },
  /** Scope proposals: the optimiser may take about a second on adversarial figures; a planner asks a few times a minute. */
  outageProposal: { name: 'outage-proposal', what: 'outage proposals', points: 60, windowMs: 10 * MINUTE },
} satisfies Record<string, Rule>;

type Counter = { rule: Rule; limiter: () => RateLimiterMySQL };

/** Built on first use, when the data source's connection pool exists; shares that pool. */
function counter(ds: DataSource, rule: Rule, clearsExpiredRows = false): Counter {
  let limiter: RateLimiterMySQL | undefined;
  return {
    rule,
    limiter: () =>
      (limiter ??= new RateLimiterMySQL({
        storeClient: (ds.driver as MysqlDriver).pool,
        storeType: 'pool',
        dbName: ds.driver.database,
        tableName: RATE_LIMIT_TABLE,
        tableCreated: true,
        // One limit per app deletes rows whose window ended over an hour ago (every 5 minutes, the whole table).
        clearExpiredByTimeout: clearsExpiredRows,
        keyPrefix: rule.name,
        points: rule.points,
        duration: rule.windowMs / 1000,
      })),
  };
}

const hashed = (key: string) => createHash('sha256').update(key).digest('hex');
const addressOf = (req: Request) => ipKeyGenerator(req.ip ?? '');
/** A body field as a key part: text as it is, anything else (the schema refuses it after the limit) as nothing, never String() of a nested value. */
const textOf = (value: unknown): string => (typeof value === 'string' ? value : '');
/** The address a request names; anything but text (the schema refuses it after the limit) counts as none, never String() of a nested value. */
const emailOf = (req: Request) => {
  const email: unknown = req.body?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
};

function tooMany(res: Response, next: NextFunction, rule: Rule, msBeforeNext: number) {
  const seconds = Math.max(1, Math.ceil(msBeforeNext / 1000));
  const minutes = Math.ceil(seconds / 60);
  res.setHeader('Retry-After', String(seconds));
  next(new AppError(429, `Too many ${rule.what}; try again in ${minutes} minute${minutes === 1 ? '' : 's'}`));
}

/** Every request counts. */
function limitEveryRequest(c: Counter, key: (req: Request) => string): RequestHandler {
  return async (req, res, next) => {
    try {
      await c.limiter().consume(hashed(key(req)));
      next();
    } catch (err) {
      if (err instanceof RateLimiterRes) return tooMany(res, next, c.rule, err.msBeforeNext);
      next(err);
    }
  };
}

/**
 * Only failures count (answers 401). Each attempt is counted before the password is checked, so guesses
 * sent in parallel are all counted, and given back once it answers anything but 401. While any counter is
 * full, attempts are refused without being counted.
 */
function limitFailures(counters: { c: Counter; key: (req: Request) => string }[]): RequestHandler {
  return async (req, res, next) => {
    try {
      const keyed = counters.map(({ c, key }) => ({ c, key: hashed(key(req)) }));
      for (const { c, key } of keyed) {
        const used = await c.limiter().get(key);
        if (used && used.consumedPoints >= c.rule.points) return tooMany(res, next, c.rule, used.msBeforeNext);
      }
      const counted: typeof keyed = [];
      const giveBack = () => Promise.all(counted.map(({ c, key }) => c.limiter().reward(key, 1)));
      for (const k of keyed) {
        try {
          await k.c.limiter().consume(k.key);
          counted.push(k);
        } catch (err) {
          await giveBack();
          // Filled by a parallel attempt since the check above.
          if (err instanceof RateLimiterRes) return tooMany(res, next, k.c.rule, err.msBeforeNext);
          throw err;
        }
      }
      // Given back before the answer leaves, so the next attempt (even one sent right after) sees the true count.
      const end = res.end.bind(res) as (...args: unknown[]) => Response;
      res.end = ((...args: unknown[]) => {
        if (res.statusCode === 401) return end(...args);
        giveBack()
          .catch((err: unknown) => req.log?.warn({ err }, 'could not give back a sign-in attempt'))
          .finally(() => end(...args));
        return res;
      }) as Response['end'];
      next();
    } catch (err) {
      next(err);
    }
  };
}

/**
 * Forgets an account's failed sign-ins: once the owner proved they hold the address (a confirmed password reset
 * or address confirmation), someone else's guesses no longer keep them out.
 */
export async function clearSignInFailures(ds: DataSource, email: string): Promise<void> {
  await counter(ds, RULES.signInAccount).limiter().delete(hashed(email.trim().toLowerCase()));
}

/** Failed sign-ins per account (from anywhere) and per address (for any account). */
export const signInLimiter = (ds: DataSource) =>
  limitFailures([
    { c: counter(ds, RULES.signInAccount), key: emailOf },
    { c: counter(ds, RULES.signInAddress, true), key: addressOf },
  ]);
export const signUpLimiter = (ds: DataSource) => limitEveryRequest(counter(ds, RULES.signUp), addressOf);
/** Address and account together: nobody locks another person out of resets from elsewhere. */
export const resetLimiter = (ds: DataSource) => limitEveryRequest(counter(ds, RULES.reset), (req) => `${addressOf(req)}|${emailOf(req)}`);
export const resetConfirmLimiter = (ds: DataSource) =>
  limitEveryRequest(counter(ds, RULES.resetConfirm), (req) => `${addressOf(req)}|${textOf(req.body?.token)}`);
/** Per address: guessing confirmation links from one place stops there. */
export const addressConfirmLimiter = (ds: DataSource) => limitEveryRequest(counter(ds, RULES.addressConfirm), addressOf);
/** Keyed by the session: another person's guesses never lock this account's owner out. */
export const passwordChangeLimiter = (ds: DataSource) => limitEveryRequest(counter(ds, RULES.passwordChange), (req) => req.sessionID ?? '');
export const inviteLimiter = (ds: DataSource) => limitEveryRequest(counter(ds, RULES.invite), (req) => req.sessionID ?? '');
/**
 * Per member (after authentication, so an API token and every session of the same person share one count): one
 * member's loop of saves cannot hold the server's calculation time, and other members are not slowed.
 */
export const caseWriteLimiter = (ds: DataSource) =>
  limitEveryRequest(counter(ds, RULES.caseWrite), (req) => `member:${req.actor?.user.id ?? req.sessionID ?? ''}`);
/** Per member, like case calculations: a loop of proposals cannot hold the server's calculation time. */
export const outageProposalLimiter = (ds: DataSource) =>
  limitEveryRequest(counter(ds, RULES.outageProposal), (req) => `member:${req.actor?.user.id ?? req.sessionID ?? ''}`);
