import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { createQueryClient } from '@/lib/query-client';

interface AppProviderProps {
  children: React.ReactNode;
  /** Tests pass their own client so each starts with an empty cache. */
  queryClient?: QueryClient;
}

export function AppProvider({ children, queryClient }: AppProviderProps) {
  const [client] = useState(() => queryClient ?? createQueryClient());
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
