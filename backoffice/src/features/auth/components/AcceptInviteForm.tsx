import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { newPasswordFormSchema, PASSWORD_MIN_LENGTH } from '@loomwright/shared';
import { useForm } from 'react-hook-form';
import { useAcceptInvitation } from 'src/features/auth/api/accept-invitation';
import { FormTextField } from './FormTextField';

export function AcceptInviteForm({ token, onAccepted }: { token: string; onAccepted: () => void }) {
  const accept = useAcceptInvitation();
  const { register, handleSubmit, formState } = useForm({
    resolver: zodResolver(newPasswordFormSchema),
    defaultValues: { password: '', repeatPassword: '' },
  });
  return (
    <form
      onSubmit={handleSubmit((v) => accept.mutate({ token, password: v.password }, { onSuccess: onAccepted }))}
      noValidate
      aria-label="Accept the invitation"
    >
      <Stack gap={2}>
        {accept.error && (
          <Alert color="danger" role="alert">
            {accept.error.message}
          </Alert>
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
