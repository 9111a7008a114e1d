import Box from '@mui/joy/Box';
import Typography from '@mui/joy/Typography';
import type { ReactNode } from 'react';

export function StepHeading({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <Box sx={{ mb: 3 }}>
      <Typography level="h2" component="h2" sx={{ fontSize: 'xl2' }} tabIndex={-1} data-step-heading>
        {title}
      </Typography>
      {children ? <Typography sx={{ mt: 1, maxWidth: 640, color: 'text.secondary' }}>{children}</Typography> : null}
    </Box>
  );
}
