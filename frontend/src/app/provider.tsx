import { QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { appQueryClient } from './app-query-client';

export function AppProvider({ children }: { children: ReactNode }) {
  return <QueryClientProvider client={appQueryClient}>{children}</QueryClientProvider>;
}
