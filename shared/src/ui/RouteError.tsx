import Button from '@mui/joy/Button';
import Sheet from '@mui/joy/Sheet';
import Typography from '@mui/joy/Typography';
import { useRouteError } from 'react-router';

/** The error screen of a page that failed to load or render; `homeHref` is where the app starts. */
export function RouteErrorScreen({ homeHref, error }: { homeHref: string; error: unknown }) {
  const message = error instanceof Error ? error.message : undefined;
  return (
    <Sheet sx={{ maxWidth: 560, mx: 'auto', my: 8, p: 4, borderRadius: 'lg' }} variant="outlined">
      <Typography level="h2" component="h1">
        This page could not be shown
      </Typography>
      <Typography sx={{ my: 2 }}>
        {message ?? 'Something went wrong while loading it.'} Reload the page, or go back to the start.
      </Typography>
      <Button component="a" href={homeHref}>
        Back to the start
      </Button>
    </Sheet>
  );
}

/** The same screen as a data router's `errorElement` (it reads the route's error). */
export function RouteError({ homeHref }: { homeHref: string }) {
  return <RouteErrorScreen homeHref={homeHref} error={useRouteError()} />;
}
