import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { passwordResetRequestSchema } from '@loomwright/shared';
import { useForm } from 'react-hook-form';
import { useRequestPasswordReset } from 'src/features/auth/api/request-password-reset';
import { FormTextField } from './FormTextField';
import { ApiErrorAlert, fieldsCoverError, setServerFieldErrors } from '@loomwright/shared/ui';

const FIELDS = ['email'] as const;

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const { register, handleSubmit, formState, setError } = useForm({
    resolver: zodResolver(passwordResetRequestSchema),
    defaultValues: { email: '' },
  });
  const onSubmit = handleSubmit((values) => request.mutate(values, { onError: (error) => setServerFieldErrors(error, setError, FIELDS) }));
  if (request.isSuccess) {
    return (
      <Alert color="success" role="status">
        {request.data.message}
      </Alert>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Ask for a reset link">
      <Stack gap={2}>
        {!fieldsCoverError(request.error, FIELDS) && <ApiErrorAlert error={request.error} />}
        <FormTextField
          label="E-mail"
          type="email"
          autoComplete="email"
          autoFocus
          registration={register('email')}
          error={formState.errors.email}
        />
        <Button type="submit" loading={request.isPending}>
          Send me a reset link
        </Button>
      </Stack>
    </form>
  );
}
