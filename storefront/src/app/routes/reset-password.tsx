import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import { NewPasswordForm } from '@loomwright/shared/ui';
import { useNavigate, useSearchParams, Link as RouterLink } from 'react-router';
import { useConfirmPasswordReset } from 'src/features/auth/api/confirm-password-reset';
import { AuthCard } from 'src/features/auth/components/AuthCard';

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
        label="Choose a new password"
        passwordLabel="New password"
        repeatLabel="New password again"
        submitLabel="Save password and sign in"
        mutation={confirm}
        newLink={{ href: '/forgot-password', label: 'Ask for a new reset link' }}
        onSubmit={(password, { onError }) =>
          confirm.mutate(
            { token, password },
            // Staff reset here too; their work is in the backoffice.
            {
              onError,
              onSuccess: ({ user }) =>
                user.role === 'customer' ? navigate('/account', { replace: true }) : window.location.assign('/backoffice/'),
            },
          )
        }
      />
    </AuthCard>
  );
}
