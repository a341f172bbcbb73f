import { QueryClientProvider } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { createQueryClient } from '@frontend/lib/query-client';
import { queryClientHolder } from './query-client-holder';

export function AppProvider({ children }: { children: ReactNode }) {
  const [client] = useState(() => {
    const c = createQueryClient();
    queryClientHolder.current = c;
    return c;
  });
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
