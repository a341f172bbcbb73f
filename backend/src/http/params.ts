import type { Request } from 'express';
import { notFound } from './app-error.js';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A record id from the path; anything that is not an id is simply not found. */
export function idParam(req: Request, name = 'id'): string {
  const value = String(req.params[name] ?? '');
  if (!UUID.test(value)) throw notFound();
  return value.toLowerCase();
}

export function tokenParam(req: Request, name = 'token'): string {
  const value = String(req.params[name] ?? '');
  if (!/^[A-Za-z0-9_-]{10,200}$/.test(value)) throw notFound('This link is not valid');
  return value;
}
