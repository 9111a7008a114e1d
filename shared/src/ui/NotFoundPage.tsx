import Button from '@mui/joy/Button';
import Typography from '@mui/joy/Typography';
import { Link as RouterLink } from 'react-router';

/** An address no page answers: says so, what to do (each app's own `hint`), and a way back to `/`. */
export function NotFoundPage({ hint, homeLabel }: { hint: string; homeLabel: string }) {
  return (
    <>
      <Typography level="h2" component="h1">
        There is no page here
      </Typography>
      <Typography sx={{ my: 2 }}>{hint}</Typography>
      <Button component={RouterLink} to="/">
        {homeLabel}
      </Button>
    </>
  );
}
