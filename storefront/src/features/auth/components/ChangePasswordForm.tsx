import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { authMessages, changePasswordFormSchema, hasErrorCode, PASSWORD_MIN_LENGTH } from '@loomwright/shared';
import { ApiErrorAlert, fieldsCoverError, PasswordField, setServerFieldErrors } from '@loomwright/shared/ui';
import { useForm } from 'react-hook-form';
import { useChangePassword } from 'src/features/auth/api/change-password';

const FIELDS = ['currentPassword', 'password'] as const;
const empty = { currentPassword: '', password: '', repeatPassword: '' };

/** Change the password while signed in: the current one, then the new one twice. */
export function ChangePasswordForm({ onCancel }: { onCancel: () => void }) {
  const change = useChangePassword();
  const { register, handleSubmit, formState, setError, reset } = useForm({
    resolver: zodResolver(changePasswordFormSchema),
    defaultValues: empty,
  });
  const onSubmit = handleSubmit(({ currentPassword, password }) =>
    change.mutate(
      { currentPassword, password },
      {
        onSuccess: () => reset(empty),
        onError: (error) => {
          // A wrong current password belongs under its field, not in an alert above the form.
          if (hasErrorCode(error, 'current_password_wrong')) {
            setError('currentPassword', { type: 'server', message: error.message }, { shouldFocus: true });
          } else setServerFieldErrors(error, setError, FIELDS);
        },
      },
    ),
  );
  const fieldError = hasErrorCode(change.error, 'current_password_wrong') || fieldsCoverError(change.error, FIELDS);
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Change your password">
      <Stack gap={2}>
        {change.isSuccess && (
          <Alert color="success" role="status">
            {authMessages.passwordChanged}
          </Alert>
        )}
        {!fieldError && <ApiErrorAlert error={change.error} />}
        <PasswordField
          label="Current password"
          autoComplete="current-password"
          autoFocus
          registration={register('currentPassword')}
          error={formState.errors.currentPassword}
        />
        <PasswordField
          label="New password"
          autoComplete="new-password"
          registration={register('password')}
          error={formState.errors.password}
          hint={`At least ${PASSWORD_MIN_LENGTH} characters. Every other device where you are signed in will be signed out.`}
        />
        <PasswordField
          label="New password again"
          autoComplete="new-password"
          registration={register('repeatPassword')}
          error={formState.errors.repeatPassword}
        />
        <Stack direction="row" gap={1} flexWrap="wrap">
          <Button type="submit" loading={change.isPending}>
            Change password
          </Button>
          <Button variant="plain" color="neutral" onClick={onCancel}>
            {change.isSuccess ? 'Close' : 'Cancel'}
          </Button>
        </Stack>
      </Stack>
    </form>
  );
}
