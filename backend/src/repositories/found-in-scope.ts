import { notFound } from '../http/app-error.js';

/**
 * A record a repository looked up within the caller's scope, or 404 in the given words: a record outside the
 * scope answers exactly as one that does not exist.
 */
export async function foundInScope<T>(lookup: Promise<T | null>, notFoundMessage: string): Promise<T> {
  const found = await lookup;
  if (found === null) throw notFound(notFoundMessage);
  return found;
}
