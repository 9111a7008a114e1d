import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import type { AuthUser } from '@loomwright/shared';
import { useSignOut } from 'src/features/auth/api/sign-out';

export function AccountSummary({ user, onSignedOut }: { user: AuthUser; onSignedOut: () => void }) {
  const signOut = useSignOut();
  return (
    <Stack gap={2}>
      <Stack
        component="dl"
        gap={1}
        sx={{ m: 0, '& dt': { typography: 'body-sm', color: 'text.secondary' }, '& dd': { m: 0, typography: 'title-md' } }}
      >
        <dt>Name</dt>
        <dd>{user.name}</dd>
        <dt>E-mail</dt>
        <dd>{user.email}</dd>
      </Stack>
      {signOut.error && (
        <Typography color="danger" role="alert">
          {signOut.error.message}
        </Typography>
      )}
      <Button
        variant="outlined"
        color="neutral"
        loading={signOut.isPending}
        onClick={() => signOut.mutate(undefined, { onSuccess: onSignedOut })}
      >
        Sign out
      </Button>
    </Stack>
  );
}
