import { zodResolver } from '@hookform/resolvers/zod';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { hasErrorCode, newPasswordFormSchema, PASSWORD_MIN_LENGTH } from '@loomwright/shared';
import { useForm } from 'react-hook-form';
import { useAcceptInvitation } from 'src/features/auth/api/accept-invitation';
import { FormTextField } from './FormTextField';
import { ApiErrorAlert, fieldsCoverError, setServerFieldErrors } from '@loomwright/shared/ui';

const FIELDS = ['password'] as const;

export function AcceptInviteForm({ token, onAccepted }: { token: string; onAccepted: () => void }) {
  const accept = useAcceptInvitation();
  const { register, handleSubmit, formState, setError } = useForm({
    resolver: zodResolver(newPasswordFormSchema),
    defaultValues: { password: '', repeatPassword: '' },
  });
  return (
    <form
      onSubmit={handleSubmit((v) =>
        accept.mutate(
          { token, password: v.password },
          { onSuccess: onAccepted, onError: (error) => setServerFieldErrors(error, setError, FIELDS) },
        ),
      )}
      noValidate
      aria-label="Accept the invitation"
    >
      <Stack gap={2}>
        {!fieldsCoverError(accept.error, FIELDS) && (
          <ApiErrorAlert
            error={accept.error}
            action={hasErrorCode(accept.error, 'link_invalid') ? 'Ask the shop’s owner to send a fresh invitation.' : undefined}
          />
        )}
        <FormTextField
          label="Choose a password"
          type="password"
          autoComplete="new-password"
          autoFocus
          registration={register('password')}
          error={formState.errors.password}
          hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        />
        <FormTextField
          label="Password again"
          type="password"
          autoComplete="new-password"
          registration={register('repeatPassword')}
          error={formState.errors.repeatPassword}
        />
        <Button type="submit" loading={accept.isPending}>
          Join the bench
        </Button>
      </Stack>
    </form>
  );
}
