import { createHash, randomBytes } from 'node:crypto';

/** A random URL-safe secret and the SHA-256 hash we store instead of it. */
export function newSecretToken(prefix = ''): { token: string; hash: string } {
  const token = `${prefix}${randomBytes(32).toString('base64url')}`;
  return { token, hash: hashSecretToken(token) };
}

export const hashSecretToken = (token: string) => createHash('sha256').update(token).digest('hex');
