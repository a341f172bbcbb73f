import type { NextFunction, Request, Response } from 'express';
import { QueryFailedError } from 'typeorm';
import { isDatabaseUnreachable } from '../database-errors.js';
import { AppError } from './app-error.js';

const ER_LOCK_WAIT_TIMEOUT = 1205;
const ER_LOCK_DEADLOCK = 1213;
const ER_DUP_ENTRY = 1062;

/** One JSON error shape; never a stack trace. */
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction): void {
  // The database is stopped or restarting: nothing could be read or written; the pool reconnects by itself.
  if (isDatabaseUnreachable(err)) {
    req.log?.warn({ err }, 'database unreachable');
    res.setHeader('Retry-After', '10');
    res.status(503).json({ error: 'Cleancase cannot reach its database just now, so this request could not be completed: try again in a minute' });
    return;
  }
  if (err instanceof AppError) {
    res.status(err.status).json({ error: err.message, ...(err.details ? { details: err.details } : {}) });
    return;
  }
  // Two requests changing the same rows at once: MariaDB rolled this one back whole, so nothing changed.
  const errno = (err as { driverError?: { errno?: number } } | null)?.driverError?.errno;
  if (err instanceof QueryFailedError && (errno === ER_LOCK_DEADLOCK || errno === ER_LOCK_WAIT_TIMEOUT)) {
    res.status(409).json({ error: 'Someone changed the same records at the same time; nothing was changed by this request. Reload and try again.' });
    return;
  }
  // The same record saved twice at once (a double click): a unique index kept the second out, so nothing changed.
  if (err instanceof QueryFailedError && errno === ER_DUP_ENTRY) {
    res.status(409).json({ error: 'The same record was saved a moment ago (a second click?); this request changed nothing. Reload to see it.' });
    return;
  }
  const status = typeof err === 'object' && err && 'status' in err ? Number((err as { status: number }).status) : 500;
  if (status >= 400 && status < 500) {
    const message = status === 413 ? 'The request is too large' : status === 400 ? 'The request could not be read' : 'Request refused';
    res.status(status).json({ error: message });
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  res.status(500).json({ error: 'Something went wrong on our side; the request changed nothing. Try again, and tell us if it persists.' });
}
