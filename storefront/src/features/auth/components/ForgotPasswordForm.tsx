import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { passwordResetRequestSchema } from '@loomwright/shared';
import { useForm } from 'react-hook-form';
import { useRequestPasswordReset } from 'src/features/auth/api/request-password-reset';
import { FormTextField } from './FormTextField';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const { register, handleSubmit, formState } = useForm({
    resolver: zodResolver(passwordResetRequestSchema),
    defaultValues: { email: '' },
  });
  const onSubmit = handleSubmit((values) => request.mutate(values));
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
        {request.error && (
          <Alert color="danger" role="alert">
            {request.error.message}
          </Alert>
        )}
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
