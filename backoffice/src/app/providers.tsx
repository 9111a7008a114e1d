import CssBaseline from '@mui/joy/CssBaseline';
import { CssVarsProvider } from '@mui/joy/styles';
import { QueryClientProvider } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { createQueryClient } from 'src/lib/query-client';
import { theme } from 'src/theme';
import { ShopVoice } from './shop-voice';

export function AppProviders({ children }: { children: ReactNode }) {
  const [queryClient] = useState(createQueryClient);
  return (
    <CssVarsProvider theme={theme} defaultMode="light" modeStorageKey="lw-backoffice-mode">
      <CssBaseline />
      <QueryClientProvider client={queryClient}>
        <ShopVoice>{children}</ShopVoice>
      </QueryClientProvider>
    </CssVarsProvider>
  );
}
