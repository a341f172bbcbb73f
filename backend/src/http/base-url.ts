import type { Request } from 'express';
import { publicUrl, type Config } from '../config.js';

/**
 * Address for links in e-mail: the configured public address only (PUBLIC_URL, else http://HOST:PORT).
 * The request is deliberately not consulted: its Host header is whatever the caller wrote.
 */
export function baseUrl(config: Config, _req?: Request): string {
  return publicUrl(config).replace(/\/$/, '');
}
