import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Stack from '@mui/joy/Stack';
import { signInSchema, type AuthUser } from '@loomwright/shared';
import { useForm } from 'react-hook-form';
import { useSignIn } from 'src/features/auth/api/sign-in';
import { FormTextField } from './FormTextField';

export function StaffSignInForm({ onSignedIn }: { onSignedIn: (user: AuthUser) => void }) {
  const signIn = useSignIn();
  const { register, handleSubmit, formState } = useForm({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });
  return (
    <form
      onSubmit={handleSubmit((v) => signIn.mutate(v, { onSuccess: ({ user }) => onSignedIn(user) }))}
      noValidate
      aria-label="Staff sign in"
    >
      <Stack gap={2}>
        {signIn.error && (
          <Alert color="danger" role="alert">
            {signIn.error.message}
          </Alert>
        )}
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
