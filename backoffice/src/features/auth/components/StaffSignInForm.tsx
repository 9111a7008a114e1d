import { zodResolver } from '@hookform/resolvers/zod';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { signInSchema, type AuthUser } from '@loomwright/shared';
import { useForm } from 'react-hook-form';
import { useSignIn } from 'src/features/auth/api/sign-in';
import { FormTextField } from './FormTextField';
import { ApiErrorAlert, fieldsCoverError, setServerFieldErrors } from '@loomwright/shared/ui';

const FIELDS = ['email', 'password'] as const;

export function StaffSignInForm({ onSignedIn }: { onSignedIn: (user: AuthUser) => void }) {
  const signIn = useSignIn();
  const { register, handleSubmit, formState, setError } = useForm({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });
  return (
    <form
      onSubmit={handleSubmit((v) =>
        signIn.mutate(v, { onSuccess: ({ user }) => onSignedIn(user), onError: (error) => setServerFieldErrors(error, setError, FIELDS) }),
      )}
      noValidate
      aria-label="Staff sign in"
    >
      <Stack gap={2}>
        {!fieldsCoverError(signIn.error, FIELDS) && <ApiErrorAlert error={signIn.error} />}
        <FormTextField
          label="E-mail"
          type="email"
          autoComplete="username"
          autoFocus
          registration={register('email')}
          error={formState.errors.email}
        />
        <FormTextField
          label="Password"
          type="password"
          autoComplete="current-password"
          registration={register('password')}
          error={formState.errors.password}
        />
        <Button type="submit" loading={signIn.isPending}>
          Sign in
        </Button>
      </Stack>
    </form>
  );
}
