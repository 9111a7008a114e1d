import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { Navigate, useLocation } from 'react-router';
import { PageLoading } from 'src/components/PageLoading';
import { ShopUnavailable } from 'src/components/ShopUnavailable';
import { useMe } from 'src/features/auth/api/get-me';
import { useCatalog } from 'src/features/configurator/api/get-catalog';
import { SavedConfigurationsList } from 'src/features/saved-configurations/components/SavedConfigurationsList';

export function Component() {
  const me = useMe();
  const location = useLocation();
  const catalog = useCatalog();
  if (me.isPending) return <PageLoading />;
  if (me.isError && !me.data) return <ShopUnavailable error={me.error} />;
  if (!me.data) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname)}`} replace />;
  const surfaceName = (id: string) => catalog.data?.surfaces.find((s) => s.id === id)?.name ?? 'A board no longer in the price book';
  return (
    <Stack gap={2} sx={{ maxWidth: 1080, mx: 'auto' }}>
      <Typography level="h1" sx={{ fontSize: 'xl2' }}>
        Saved boards
      </Typography>
      <Typography level="body-sm">
        Boards you saved while configuring. Open one to change it, get its quote or request the build.
      </Typography>
      <SavedConfigurationsList surfaceName={surfaceName} />
    </Stack>
  );
}
