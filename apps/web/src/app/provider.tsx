import { ChakraProvider } from '@chakra-ui/react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { ColorModeProvider } from '@/components/ui/color-mode';
import { Toaster } from '@/components/ui/toaster';
import { system } from '@/theme';

export interface AppProviderProps {
  queryClient: QueryClient;
  children: ReactNode;
}

/** Everything a screen needs around it; tests render through this too, with their own client. */
export function AppProvider({ queryClient, children }: AppProviderProps) {
  return (
    <ChakraProvider value={system}>
      <ColorModeProvider>
        <QueryClientProvider client={queryClient}>
          {children}
          <Toaster />
        </QueryClientProvider>
      </ColorModeProvider>
    </ChakraProvider>
  );
}
