import Button from '@mui/joy/Button';
import Typography from '@mui/joy/Typography';
import { Link as RouterLink } from 'react-router';

export function Component() {
  return (
    <>
      <Typography level="h2" component="h1">
        There is no page here
      </Typography>
      <Typography sx={{ my: 2 }}>The link may be old. Pick a page from the menu.</Typography>
      <Button component={RouterLink} to="/">
        Go to the overview
      </Button>
    </>
  );
}
