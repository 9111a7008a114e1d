import Alert from '@mui/joy/Alert';
import Link from '@mui/joy/Link';
import { Link as RouterLink } from 'react-router';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { PageLoading } from 'src/components/PageLoading';
import { useMe } from 'src/features/auth/api/get-me';
import { InviteBuilderForm } from 'src/features/invitations/components/InviteBuilderForm';

export function Component() {
  const me = useMe();
  if (me.isPending) return <PageLoading />;
  return (
    <Stack gap={2}>
      <Link component={RouterLink} to="/team" level="body-sm">
        ← Team
      </Link>
      <Typography level="h2" component="h1">
        Invite a builder
      </Typography>
      {me.data?.role === 'owner' ? (
        <>
          <Typography sx={{ maxWidth: 620 }}>
            The builder gets an e-mail with a link to choose their password and sign in here. Until they do, they appear on the team as
            invited and take no builds; the Team page can send them a fresh link.
          </Typography>
          <InviteBuilderForm />
        </>
      ) : (
        <Alert color="warning" role="alert">
          Only the shop owner can invite builders. Ask the owner to send the invitation.
        </Alert>
      )}
    </Stack>
  );
}
