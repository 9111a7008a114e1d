import Card from '@mui/joy/Card';
import Typography from '@mui/joy/Typography';
import Box from '@mui/joy/Box';
import type { ReactNode } from 'react';

/** A centred card for the pages shown outside the backoffice's navigation (sign-in, invitation). */
export function AuthCard({ title, intro, children }: { title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <Box component="main" id="main" sx={{ minHeight: '100dvh', display: 'grid', placeItems: 'center', p: 2 }}>
      <Card variant="outlined" sx={{ width: '100%', maxWidth: 420, p: { xs: 2.5, sm: 4 }, gap: 2 }}>
        <Typography level="body-sm" sx={{ color: 'primary.700', fontWeight: 'lg' }}>
          Backoffice
        </Typography>
        <Typography level="h2" component="h1">
          {title}
        </Typography>
        {intro && <Typography>{intro}</Typography>}
        {children}
      </Card>
    </Box>
  );
}
