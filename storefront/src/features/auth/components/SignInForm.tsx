import { zodResolver } from '@hookform/resolvers/zod';
import Button from '@mui/joy/Button';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { signInSchema } from '@loomwright/shared';
import { useForm } from 'react-hook-form';
import { Link as RouterLink } from 'react-router';
import { useSignIn } from 'src/features/auth/api/sign-in';
import { FormTextField } from './FormTextField';
import { ApiErrorAlert, fieldsCoverError, setServerFieldErrors } from '@loomwright/shared/ui';

interface Props {
  onSignedIn: () => void;
  signUpHref: string;
  forgotHref: string;
}

const FIELDS = ['email', 'password'] as const;

export function SignInForm({ onSignedIn, signUpHref, forgotHref }: Props) {
  const signIn = useSignIn();
  const { register, handleSubmit, formState, setError } = useForm({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });
  const onSubmit = handleSubmit((values) =>
    signIn.mutate(values, { onSuccess: onSignedIn, onError: (error) => setServerFieldErrors(error, setError, FIELDS) }),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Sign in">
      <Stack gap={2}>
        {!fieldsCoverError(signIn.error, FIELDS) && <ApiErrorAlert error={signIn.error} />}
        <FormTextField
          label="E-mail"
          type="email"
          autoComplete="email"
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
        <Typography level="body-sm">
          <Link component={RouterLink} to={forgotHref}>
            Forgot your password?
          </Link>
        </Typography>
        <Typography level="body-sm">
          New here?{' '}
          <Link component={RouterLink} to={signUpHref}>
            Create an account
          </Link>
        </Typography>
      </Stack>
    </form>
  );
}
