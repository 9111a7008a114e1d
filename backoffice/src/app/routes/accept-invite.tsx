import Alert from '@mui/joy/Alert';
import { useNavigate, useSearchParams } from 'react-router';
import { AcceptInviteForm } from 'src/features/auth/components/AcceptInviteForm';
import { AuthCard } from 'src/features/auth/components/AuthCard';

export function Component() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const navigate = useNavigate();
  return (
    <AuthCard title="Join the shop’s bench" intro="Choose the password you will sign in with. The invitation link works once.">
      {token ? (
        <AcceptInviteForm token={token} onAccepted={() => navigate('/', { replace: true })} />
      ) : (
        <Alert color="warning" role="alert">
          This page needs the link from your invitation e-mail. Ask the shop owner to send it again.
        </Alert>
      )}
    </AuthCard>
  );
}
