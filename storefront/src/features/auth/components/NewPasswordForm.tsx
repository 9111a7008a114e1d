import { zodResolver } from '@hookform/resolvers/zod';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { newPasswordFormSchema, PASSWORD_MIN_LENGTH } from '@loomwright/shared';
import { useForm } from 'react-hook-form';
import { FormTextField } from './FormTextField';
import { ApiErrorAlert } from '@loomwright/shared/ui';

interface Props {
  submitLabel: string;
  pending: boolean;
  error: Error | null;
  onSubmit: (password: string) => void;
}

/** Choose a password, typed twice; used by the reset page. */
export function NewPasswordForm({ submitLabel, pending, error, onSubmit }: Props) {
  const { register, handleSubmit, formState } = useForm({
    resolver: zodResolver(newPasswordFormSchema),
    defaultValues: { password: '', repeatPassword: '' },
  });
  return (
    <form onSubmit={handleSubmit((v) => onSubmit(v.password))} noValidate aria-label="Choose a new password">
      <Stack gap={2}>
        <ApiErrorAlert error={error} newLink={{ href: '/forgot-password', label: 'Ask for a new reset link' }} />
        <FormTextField
          label="New password"
          type="password"
          autoComplete="new-password"
          autoFocus
          registration={register('password')}
          error={formState.errors.password}
          hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        />
        <FormTextField
          label="New password again"
          type="password"
          autoComplete="new-password"
          registration={register('repeatPassword')}
          error={formState.errors.repeatPassword}
        />
        <Button type="submit" loading={pending}>
          {submitLabel}
        </Button>
      </Stack>
    </form>
  );
}
