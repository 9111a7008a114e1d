import Box from '@mui/joy/Box';
import Link from '@mui/joy/Link';
import Sheet from '@mui/joy/Sheet';
import Typography from '@mui/joy/Typography';
import visuallyHidden from '@mui/utils/visuallyHidden';
import { memo, Suspense } from 'react';
import { Link as RouterLink, Outlet } from 'react-router';
import { AccountNav } from 'src/features/auth/components/AccountNav';
import { useHealth } from 'src/features/shop/api/get-health';
import { useShop } from 'src/features/shop/api/get-shop';
import { PageLoading } from 'src/components/PageLoading';

export function AppLayout() {
  const shop = useShop();
  const health = useHealth();
  return (
    <Box sx={{ minHeight: '100dvh', display: 'flex', flexDirection: 'column' }}>
      <Box component="a" href="#main" sx={{ position: 'absolute', left: -9999, '&:focus': { left: 16, top: 16, zIndex: 10 } }}>
        Skip to content
      </Box>
      <Sheet
        component="header"
        // One line at every width, so the header keeps its height when the shop's name and the session check answer.
        sx={{
          px: { xs: 2, md: 4 },
          py: 2,
          display: 'flex',
          alignItems: 'center',
          gap: { xs: 2, sm: 3 },
          borderBottom: '1px solid',
          borderColor: 'divider',
        }}
      >
        <Link component={RouterLink} to="/" underline="none" color="neutral" sx={{ gap: 1.5, minWidth: 40, overflow: 'hidden' }}>
          <BoardMark />
          {/* On a phone the mark stands alone (the links need the width, and a clipped name helps nobody); the
              name stays for screen readers, so the link is named by the words it shows on a wider screen. */}
          <Box sx={(theme) => ({ minWidth: 0, [theme.breakpoints.down('sm')]: visuallyHidden })}>
            <Typography level="title-lg" component="span" noWrap sx={{ display: 'block' }}>
              {shop.data?.name ?? 'Loomwright'}
            </Typography>
            <Typography level="body-xs" component="span" noWrap sx={{ display: 'block' }}>
              pedalboards wired by hand
            </Typography>
          </Box>
        </Link>
        <Box
          component="nav"
          aria-label="Main"
          sx={{ ml: 'auto', display: 'flex', alignItems: 'center', gap: { xs: 1.5, sm: 2 }, flexWrap: 'nowrap', whiteSpace: 'nowrap' }}
        >
          <Link component={RouterLink} to="/configure">
            Configure
            <Box component="span" sx={{ display: { xs: 'none', sm: 'inline' } }}>
              &nbsp;a board
            </Box>
          </Link>
          <AccountNav />
        </Box>
      </Sheet>
      {/* At least a screen tall, so the footer starts below the fold and is not pushed down as the page fills in. */}
      <Box component="main" id="main" sx={{ flex: 1, minHeight: '100dvh', px: { xs: 2, md: 4 }, py: { xs: 3, md: 5 } }}>
        <PageSlot />
      </Box>
      <Box component="footer" sx={{ px: { xs: 2, md: 4 }, py: 2, borderTop: '1px solid', borderColor: 'divider' }}>
        <Typography level="body-xs">
          {shop.data ? `${shop.data.name} · ${shop.data.contactEmail}` : 'Loomwright'} ·{' '}
          {health.isError || health.data?.db === 'down'
            ? 'The shop’s booking system is not answering right now; try again shortly.'
            : health.data
              ? 'Booking system online'
              : 'Checking the booking system…'}
        </Typography>
      </Box>
    </Box>
  );
}

/**
 * Where the page goes. On a prerendered page (`/`, `/configure`) the page's chunk may still be on its
 * way when React takes the HTML over: this boundary then stays as the HTML drew it until the chunk
 * arrives. React's documentation (react.dev/reference/react/Suspense) says a boundary that has not
 * hydrated yet and receives an update that is not a transition is drawn again on the client: the
 * prerendered page would be thrown away and painted afresh. The layout re-renders when the shop's
 * name and the health check answer, often before the page's chunk is in, so the slot is memoized:
 * those answers do not reach it, and only the router's own changes (a new page) do.
 */
const PageSlot = memo(function PageSlot() {
  return (
    <Suspense fallback={<PageLoading />}>
      <Outlet />
    </Suspense>
  );
});

/** Our mark: a board seen from above with three pedals on it (colours from the theme). */
function BoardMark() {
  return (
    <svg viewBox="0 0 40 28" width={40} height={28} aria-hidden="true" style={{ flex: 'none' }}>
      <rect x="1" y="4" width="38" height="20" rx="4" style={{ fill: 'var(--joy-palette-primary-600)' }} />
      <rect x="5" y="9" width="8" height="10" rx="1.5" style={{ fill: 'var(--joy-palette-neutral-50)' }} />
      <rect x="16" y="9" width="8" height="10" rx="1.5" style={{ fill: 'var(--joy-palette-accent-400)' }} />
      <rect x="27" y="9" width="8" height="10" rx="1.5" style={{ fill: 'var(--joy-palette-neutral-50)' }} />
    </svg>
  );
}
