import type { NextFunction, Request, Response } from 'express';
import { AppError } from './app-error.js';

/** One JSON error shape; never a stack trace. */
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction): void {
  if (err instanceof AppError) {
    res.status(err.status).json({ error: err.message, ...(err.details ? { details: err.details } : {}) });
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
