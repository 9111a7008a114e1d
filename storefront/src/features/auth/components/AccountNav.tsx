import Box from '@mui/joy/Box';
import Link from '@mui/joy/Link';
import Typography from '@mui/joy/Typography';
import { Link as RouterLink, useLocation } from 'react-router';
import { useMe } from 'src/features/auth/api/get-me';

const accountPages = ['/sign-in', '/sign-up', '/forgot-password', '/reset-password'];

/** The header's account links: "Sign in" (returning here afterwards), or the player's name and pages. */
export function AccountNav() {
  const me = useMe();
  const location = useLocation();
  // Holds the place of "Sign in" while the session check is on its way, so nothing moves when it answers.
  if (me.isPending)
    return (
      <Typography component="span" level="body-md" aria-hidden sx={{ visibility: 'hidden' }}>
        Sign in
      </Typography>
    );
  // The shop is not answering: say so rather than offer "Sign in" to someone who may be signed in.
  if (me.isError && !me.data)
    return (
      <Typography component="span" level="body-sm" role="status">
        Shop briefly unavailable
      </Typography>
    );
  if (!me.data) {
    const here = `${location.pathname}${location.search}`;
    const next = accountPages.includes(location.pathname) || here === '/' ? '' : `?next=${encodeURIComponent(here)}`;
    return (
      <Link component={RouterLink} to={`/sign-in${next}`}>
        Sign in
      </Link>
    );
  }
  return (
    <>
      <Typography
        component="span"
        level="body-md"
        sx={{ color: 'text.secondary', display: { xs: 'none', md: 'inline' } }}
        aria-label="Signed in as"
      >
        {me.data.name}
      </Typography>
      <Link component={RouterLink} to="/builds">
        My builds
      </Link>
      {/* On a phone the header has room for "Saved" only; the link keeps its full name for screen readers. */}
      <Link component={RouterLink} to="/configurations" aria-label="Saved boards">
        Saved
        <Box component="span" sx={{ display: { xs: 'none', sm: 'inline' } }}>
          &nbsp;boards
        </Box>
      </Link>
      <Link component={RouterLink} to="/account">
        Account
      </Link>
    </>
  );
}
