import type { QueryClient } from '@tanstack/react-query';

/** Route loaders run outside React; they reach the app's QueryClient through this holder. */
export const queryClientHolder: { current: QueryClient | null } = { current: null };

export function appQueryClient(): QueryClient {
  if (!queryClientHolder.current) throw new Error('QueryClient not ready');
  return queryClientHolder.current;
}
