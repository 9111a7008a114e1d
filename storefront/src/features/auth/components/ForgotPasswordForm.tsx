import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { passwordResetRequestSchema } from '@loomwright/shared';
import { useForm } from 'react-hook-form';
import { useRequestPasswordReset } from 'src/features/auth/api/request-password-reset';
import { ApiErrorAlert, EmailField, setServerFieldErrors } from '@loomwright/shared/ui';

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
        <ApiErrorAlert error={request.error} fields={FIELDS} />
        <EmailField autoFocus registration={register('email')} error={formState.errors.email} />
        <Button type="submit" loading={request.isPending}>
          Send me a reset link
        </Button>
      </Stack>
    </form>
  );
}
