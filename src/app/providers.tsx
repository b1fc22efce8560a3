import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { createQueryClient } from '../lib/query-client';
import { AppErrorBoundary } from './error-boundary';

/** Server-state cache and the app-wide error boundary. Tests pass their own QueryClient. */
export function AppProviders({ children, queryClient }: { children: ReactNode; queryClient?: QueryClient }) {
  const [client] = useState(() => queryClient ?? createQueryClient());
  return (
    <AppErrorBoundary>
      <QueryClientProvider client={client}>{children}</QueryClientProvider>
    </AppErrorBoundary>
  );
}
