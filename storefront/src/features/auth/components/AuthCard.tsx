import Card from '@mui/joy/Card';
import Typography from '@mui/joy/Typography';
import type { ReactNode } from 'react';

/** The narrow card every account page sits in. */
export function AuthCard({ title, intro, children }: { title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <Card variant="outlined" sx={{ maxWidth: 440, mx: 'auto', p: { xs: 2.5, sm: 4 }, gap: 2 }}>
      <Typography level="h2" component="h1">
        {title}
      </Typography>
      {intro && <Typography level="body-md">{intro}</Typography>}
      {children}
    </Card>
  );
}
