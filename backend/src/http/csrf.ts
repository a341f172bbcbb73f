/**
 * CSRF defence for cookie sessions: every unsafe request must carry our custom header (a cross-site
 * form cannot set it, and we send no CORS allowances) and, when the browser states one, a same-origin
 * Origin / Sec-Fetch-Site. Requests authenticated by an API token carry no ambient credentials and pass.
 */
import type { NextFunction, Request, Response } from 'express';
import { AppError } from './app-error.js';

export const CSRF_HEADER = 'x-cleancase-request';

export function csrfGuard(req: Request, _res: Response, next: NextFunction): void {
  if (req.actor?.via === 'api-token') return next();
  if (req.get(CSRF_HEADER) !== '1') return next(new AppError(403, 'Missing request header; reload the page and try again'));
  const site = req.get('sec-fetch-site');
  if (site && site !== 'same-origin' && site !== 'none') return next(new AppError(403, 'Cross-site request refused'));
  const origin = req.get('origin');
  if (origin) {
    const host = req.get('host');
    let originHost: string | null = null;
    try {
      originHost = new URL(origin).host;
    } catch {
      originHost = null;
    }
    if (!host || originHost !== host) return next(new AppError(403, 'Cross-site request refused'));
  }
  next();
}
