import Box from '@mui/joy/Box';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { ReactNode } from 'react';

export function PageHeader({ title, hint, actions }: { title: string; hint?: ReactNode; actions?: ReactNode }) {
  return (
    <Stack direction="row" alignItems="flex-end" gap={2} flexWrap="wrap" sx={{ mb: 2 }}>
      <Box sx={{ flex: 1, minWidth: 240 }}>
        <Typography level="h3" component="h1">
          {title}
        </Typography>
        {hint && (
          <Typography level="body-sm" sx={{ mt: 0.5, maxWidth: 760 }}>
            {hint}
          </Typography>
        )}
      </Box>
      {actions}
    </Stack>
  );
}
