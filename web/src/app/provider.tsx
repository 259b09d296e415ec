import { ChakraProvider } from '@chakra-ui/react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { createQueryClient } from '@/lib/query-client';
import { system } from '@/theme/system';

interface AppProviderProps {
  children: ReactNode;
  /** Tests pass their own client so each test starts with an empty cache. */
  queryClient?: QueryClient;
}

export function AppProvider({ children, queryClient }: AppProviderProps) {
  const [client] = useState(() => queryClient ?? createQueryClient());
  return (
    <ChakraProvider value={system}>
      <QueryClientProvider client={client}>{children}</QueryClientProvider>
    </ChakraProvider>
  );
}
