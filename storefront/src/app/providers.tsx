import CssBaseline from '@mui/joy/CssBaseline';
import { CssVarsProvider } from '@mui/joy/styles';
import { QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { queryClient } from 'src/app/query-client';
import { storefrontTheme } from 'src/theme';

export function AppProviders({ children }: { children: ReactNode }) {
  return (
    <CssVarsProvider theme={storefrontTheme()} defaultMode="light" modeStorageKey="lw-storefront-mode">
      <CssBaseline />
      <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
    </CssVarsProvider>
  );
}
