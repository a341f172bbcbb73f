import type { Request } from 'express';
import type { Config } from '../config.js';

/** Address for links in e-mail: PUBLIC_URL when set (always set it in production), else this request's own origin. */
export function baseUrl(config: Config, req: Request): string {
  return config.PUBLIC_URL?.replace(/\/$/, '') ?? `${req.protocol}://${req.get('host')}`;
}
