import Box from '@mui/joy/Box';
import Card from '@mui/joy/Card';
import Typography from '@mui/joy/Typography';
import type { ReactNode } from 'react';

export function Section({ title, children, actions }: { title: string; children: ReactNode; actions?: ReactNode }) {
  return (
    <Box component="section" sx={{ display: 'flex', flexDirection: 'column', gap: 1 }}>
      <Box sx={{ display: 'flex', alignItems: 'center', gap: 1 }}>
        <Typography level="title-md" component="h3" sx={{ flex: 1 }}>
          {title}
        </Typography>
        {actions}
      </Box>
      {children}
    </Box>
  );
}

/** A section on a card of its own, as the build page lays out its parts. */
export function SectionCard(props: { title: string; children: ReactNode; actions?: ReactNode }) {
  return (
    <Card variant="outlined">
      <Section {...props} />
    </Card>
  );
}

/** Label/value pairs in two columns: quick to scan, no table chrome. */
export function Facts({ items }: { items: Array<[string, ReactNode]> }) {
  return (
    <Box
      component="dl"
      sx={{
        display: 'grid',
        gridTemplateColumns: 'minmax(120px, max-content) 1fr',
        columnGap: 2,
        rowGap: 0.5,
        m: 0,
        fontVariantNumeric: 'tabular-nums',
        '& dt': { color: 'text.secondary', fontSize: 'sm' },
        '& dd': { m: 0, fontSize: 'sm' },
      }}
    >
      {items.map(([label, value]) => (
        <Box key={label} sx={{ display: 'contents' }}>
          <dt>{label}</dt>
          <dd>{value}</dd>
        </Box>
      ))}
    </Box>
  );
}
