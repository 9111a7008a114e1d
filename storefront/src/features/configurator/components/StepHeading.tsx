import Box from '@mui/joy/Box';
import Typography from '@mui/joy/Typography';
import { createContext, useContext, type ReactNode } from 'react';

/**
 * A notice for the player (the restored-draft one) drawn under the step's opening words, above the
 * step's own content. The heading and words of the Surface step are painted with the page's HTML; a
 * notice above them would push them down when it arrives, while here it takes the place of the
 * loading line, where the step's cards were about to appear anyway.
 */
export const StepNotice = createContext<ReactNode>(null);

export function StepHeading({ title, children }: { title: string; children?: ReactNode }) {
  const notice = useContext(StepNotice);
  return (
    <Box sx={{ mb: 3 }}>
      <Typography level="h2" component="h2" sx={{ fontSize: 'xl2' }} tabIndex={-1} data-step-heading>
        {title}
      </Typography>
      {children ? <Typography sx={{ mt: 1, maxWidth: 640, color: 'text.secondary' }}>{children}</Typography> : null}
      {notice}
    </Box>
  );
}
