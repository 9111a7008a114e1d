import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import type { AuthUser } from '@loomwright/shared';
import { useSignOut } from 'src/features/auth/api/sign-out';
import { AuthCard } from './AuthCard';

/** What a player sees if they sign in here: a plain explanation, a way out, and a way back to the shop. */
export function StaffOnly({ user }: { user: AuthUser }) {
  const signOut = useSignOut();
  return (
    <AuthCard title="Staff only">
      <Alert color="warning" role="alert">
        The backoffice is for the shop’s builders and owner. You are signed in as {user.name} ({user.email}), a player account.
      </Alert>
      <Stack gap={1}>
        <Button component="a" href="/builds">
          Go to my builds in the shop
        </Button>
        <Button variant="outlined" color="neutral" loading={signOut.isPending} onClick={() => signOut.mutate()}>
          Sign out
        </Button>
      </Stack>
    </AuthCard>
  );
}
