import Button from '@mui/joy/Button';
import Divider from '@mui/joy/Divider';
import Stack from '@mui/joy/Stack';
import { useState } from 'react';
import { Link as RouterLink, Navigate, useNavigate } from 'react-router';
import { PageLoading } from 'src/components/PageLoading';
import { ShopUnavailable } from 'src/components/ShopUnavailable';
import { useMe } from 'src/features/auth/api/get-me';
import { AccountSummary } from 'src/features/auth/components/AccountSummary';
import { AuthCard } from 'src/features/auth/components/AuthCard';
import { ChangePasswordForm } from 'src/features/auth/components/ChangePasswordForm';

export function Component() {
  const me = useMe();
  const navigate = useNavigate();
  const [changingPassword, setChangingPassword] = useState(false);
  if (me.isPending) return <PageLoading />;
  // Not knowing who is here (the shop is down) is not the same as nobody signed in.
  if (me.isError && !me.data) return <ShopUnavailable error={me.error} />;
  if (!me.data) return <Navigate to="/sign-in?next=%2Faccount" replace />;
  return (
    <AuthCard title="My account">
      <AccountSummary user={me.data} onSignedOut={() => navigate('/', { replace: true })} />
      <Stack direction="row" gap={1} flexWrap="wrap">
        <Button component={RouterLink} to="/builds" variant="plain">
          My builds
        </Button>
        <Button component={RouterLink} to="/configurations" variant="plain">
          Saved boards
        </Button>
        {!changingPassword && (
          <Button variant="plain" onClick={() => setChangingPassword(true)}>
            Change my password
          </Button>
        )}
      </Stack>
      {changingPassword && (
        <>
          <Divider />
          <ChangePasswordForm onCancel={() => setChangingPassword(false)} />
        </>
      )}
    </AuthCard>
  );
}
