import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import { useNavigate, useSearchParams, Link as RouterLink } from 'react-router';
import { useConfirmPasswordReset } from 'src/features/auth/api/confirm-password-reset';
import { AuthCard } from 'src/features/auth/components/AuthCard';
import { NewPasswordForm } from 'src/features/auth/components/NewPasswordForm';

export function Component() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const confirm = useConfirmPasswordReset();
  const navigate = useNavigate();
  if (!token) {
    return (
      <AuthCard title="Choose a new password">
        <Alert color="warning" role="alert">
          This page needs the link from your reset e-mail. Ask for a new link if you no longer have it.
        </Alert>
        <Button component={RouterLink} to="/forgot-password">
          Ask for a new link
        </Button>
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Choose a new password" intro="The link works once. After this you are signed in with the new password.">
      <NewPasswordForm
        submitLabel="Save password and sign in"
        pending={confirm.isPending}
        error={confirm.error}
        onSubmit={(password) =>
          confirm.mutate(
            { token, password },
            // Staff reset here too; their work is in the backoffice.
            {
              onSuccess: ({ user }) =>
                user.role === 'customer' ? navigate('/account', { replace: true }) : window.location.assign('/backoffice/'),
            },
          )
        }
      />
    </AuthCard>
  );
}
