import Box from '@mui/joy/Box';
import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import ListItemButton from '@mui/joy/ListItemButton';
import Sheet from '@mui/joy/Sheet';
import Typography from '@mui/joy/Typography';
import { Suspense } from 'react';
import { staffRoles, type AuthUser } from '@loomwright/shared';
import { Navigate, NavLink, Outlet, useLocation } from 'react-router';
import { UnreadCountChip, useUnreadMessages } from '@loomwright/shared/ui';
import { PageLoading } from 'src/components/PageLoading';
import { ShopUnavailable } from 'src/components/ShopUnavailable';
import { useMe } from 'src/features/auth/api/get-me';
import { SignedInStaff } from 'src/features/auth/components/SignedInStaff';
import { StaffOnly } from 'src/features/auth/components/StaffOnly';
import { useHealth } from 'src/features/shop/api/get-health';
import { useShop } from 'src/features/shop/api/get-shop';

export const navigation = [
  { to: '/today', label: 'Today' },
  { to: '/', label: 'Overview', end: true },
  { to: '/requests', label: 'Requests' },
  { to: '/bench', label: 'Bench' },
  { to: '/builds', label: 'Builds' },
  { to: '/customers', label: 'Customers' },
  { to: '/reports', label: 'Reports' },
  { to: '/price-book', label: 'Price book' },
  { to: '/team', label: 'Team' },
  { to: '/settings', label: 'Settings' },
  { to: '/mail', label: 'Mail log' },
  { to: '/calendars', label: 'Calendar links' },
];

/**
 * Every backoffice page sits inside this layout, so this is where staff-only is enforced in the
 * browser (the API enforces it again on every route): nobody signed in → the sign-in page, and
 * back here afterwards; a player's account → a plain "staff only" page with a way to sign out.
 */
export function AppLayout() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <PageLoading label="Checking who is signed in…" />;
  // Not knowing who is here (the shop is down) is not the same as nobody signed in.
  if (me.isError && !me.data) return <ShopUnavailable error={me.error} />;
  if (!me.data) {
    const next = `${location.pathname}${location.search}`;
    return <Navigate to={next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  if (!staffRoles.includes(me.data.role)) return <StaffOnly user={me.data} />;
  return <StaffLayout user={me.data} />;
}

function StaffLayout({ user }: { user: AuthUser }) {
  const shop = useShop();
  const health = useHealth();
  const unread = useUnreadMessages();
  return (
    <Box sx={{ minHeight: '100dvh', display: 'grid', gridTemplateColumns: { xs: 'minmax(0, 1fr)', md: '232px minmax(0, 1fr)' } }}>
      {/* A column on the left from md up; on a tablet or phone a compact bar over the page. */}
      <Sheet
        component="aside"
        variant="soft"
        color="primary"
        sx={{
          p: { xs: 1.5, md: 2 },
          display: 'flex',
          flexDirection: { xs: 'row', md: 'column' },
          flexWrap: { xs: 'wrap', md: 'nowrap' },
          alignItems: { xs: 'center', md: 'stretch' },
          columnGap: 2,
          rowGap: { xs: 1, md: 2 },
          borderRight: { md: '1px solid' },
          borderBottom: { xs: '1px solid', md: 'none' },
          borderColor: 'divider',
        }}
      >
        <Box>
          <Typography level="title-lg">{shop.data?.name ?? 'Loomwright'}</Typography>
          <Typography level="body-xs">Backoffice</Typography>
        </Box>
        <List
          component="nav"
          aria-label="Backoffice"
          size="sm"
          sx={{
            '--ListItem-radius': '6px',
            flex: 'none',
            order: { xs: 3, md: 0 },
            width: { xs: '100%', md: 'auto' },
            flexDirection: { xs: 'row', md: 'column' },
            flexWrap: 'wrap',
            gap: { xs: 0.5, md: 0 },
          }}
        >
          {navigation.map((item) => (
            <ListItem key={item.to}>
              <ListItemButton
                component={NavLink}
                to={item.to}
                end={item.end}
                sx={{ '&.active': { fontWeight: 'lg', bgcolor: 'background.surface', boxShadow: 'sm' } }}
              >
                {item.label}
                {item.to === '/builds' && <UnreadCountChip count={unread.data?.total ?? 0} />}
              </ListItemButton>
            </ListItem>
          ))}
        </List>
        <Box sx={{ mt: { md: 'auto' }, ml: { xs: 'auto', md: 0 } }}>
          <SignedInStaff user={user} />
        </Box>
        <Typography level="body-xs" role="status" sx={{ display: { xs: 'none', md: 'block' } }}>
          {health.isError || health.data?.db === 'down'
            ? 'Database not answering'
            : health.data
              ? 'API and database up'
              : 'Checking the API…'}
        </Typography>
      </Sheet>
      <Box component="main" id="main" sx={{ p: { xs: 2, md: 3 }, minWidth: 0 }}>
        <Suspense fallback={<PageLoading />}>
          <Outlet />
        </Suspense>
      </Box>
    </Box>
  );
}
