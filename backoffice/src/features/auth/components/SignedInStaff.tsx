import Button from '@mui/joy/Button';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { AuthUser } from '@loomwright/shared';
import { useNavigate } from 'react-router';
import { useSignOut } from 'src/features/auth/api/sign-out';

/** The signed-in staff member: at the foot of the left navigation, or at the end of the bar on a tablet. */
export function SignedInStaff({ user }: { user: AuthUser }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  return (
    <Stack
      direction={{ xs: 'row', md: 'column' }}
      alignItems={{ xs: 'center', md: 'stretch' }}
      gap={{ xs: 1, md: 0.5 }}
      aria-label="Signed in"
    >
      <Typography level="title-sm">{user.name}</Typography>
      <Typography level="body-xs">{user.role === 'owner' ? 'Owner' : 'Builder'}</Typography>
      <Button
        size="sm"
        variant="outlined"
        color="neutral"
        loading={signOut.isPending}
        onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in', { replace: true }) })}
        sx={{ alignSelf: { md: 'flex-start' }, mt: { md: 0.5 } }}
      >
        Sign out
      </Button>
      {/* The account page is the storefront's, outside the backoffice's base path: one place to change a password for everyone. */}
      <Link href="/account" level="body-xs">
        Change password
      </Link>
    </Stack>
  );
}
