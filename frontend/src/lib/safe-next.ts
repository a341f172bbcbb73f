/**
 * A `next` address from the query string, kept only when it stays on this site (a path, not `//host` or
 * `/\host`), so a crafted link cannot send someone elsewhere after signing in.
 */
export function safeNextPath(next: string | null | undefined, origin = window.location.origin): string | null {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return null;
  try {
    const url = new URL(next, origin);
    if (url.origin !== origin) return null;
    return `${url.pathname}${url.search}${url.hash}`;
  } catch {
    return null;
  }
}

/** The sign-in address that comes back to `path` afterwards. */
export const signInReturningTo = (path: string): string => `/sign-in?next=${encodeURIComponent(path)}`;
