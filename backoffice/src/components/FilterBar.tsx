import Stack from '@mui/joy/Stack';
import type { ReactNode } from 'react';

/** Filters sit above the table they narrow, in one wrapping row. */
export function FilterBar({ children, label }: { children: ReactNode; label: string }) {
  return (
    <Stack
      component="form"
      role="search"
      aria-label={label}
      direction="row"
      gap={1.5}
      flexWrap="wrap"
      alignItems="flex-end"
      onSubmit={(event) => event.preventDefault()}
      sx={{ mb: 1.5 }}
    >
      {children}
    </Stack>
  );
}
