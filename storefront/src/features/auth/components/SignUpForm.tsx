import { zodResolver } from '@hookform/resolvers/zod';
import Alert from '@mui/joy/Alert';
import Button from '@mui/joy/Button';
import Link from '@mui/joy/Link';
import Stack from '@mui/joy/Stack';
import Typography from '@mui/joy/Typography';
import { hasErrorCode, PASSWORD_MIN_LENGTH, signUpSchema } from '@loomwright/shared';
import { useForm } from 'react-hook-form';
import { Link as RouterLink } from 'react-router';
import { useSignUp } from 'src/features/auth/api/sign-up';
import { FormTextField } from './FormTextField';
import { ApiErrorAlert, EmailField, PasswordField, setServerFieldErrors } from '@loomwright/shared/ui';

const FIELDS = ['name', 'email', 'password'] as const;

export function SignUpForm({ onSignedUp, signInHref }: { onSignedUp: () => void; signInHref: string }) {
  const signUp = useSignUp();
  const { register, handleSubmit, formState, setError } = useForm({
    resolver: zodResolver(signUpSchema),
    defaultValues: { name: '', email: '', password: '' },
  });
  const onSubmit = handleSubmit((values) =>
    signUp.mutate(values, { onSuccess: onSignedUp, onError: (error) => setServerFieldErrors(error, setError, FIELDS) }),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create an account">
      <Stack gap={2}>
        {signUp.error && hasErrorCode(signUp.error, 'email_taken') ? (
          <Alert color="danger" role="alert">
            <span>
              {signUp.error.message}{' '}
              <Link component={RouterLink} to={signInHref}>
                Sign in instead
              </Link>
            </span>
          </Alert>
        ) : (
          <ApiErrorAlert error={signUp.error} fields={FIELDS} />
        )}
        <FormTextField label="Your name" autoComplete="name" autoFocus registration={register('name')} error={formState.errors.name} />
        <EmailField
          registration={register('email')}
          error={formState.errors.email}
          hint="We send your quote, bench date and build updates here."
        />
        <PasswordField
          autoComplete="new-password"
          registration={register('password')}
          error={formState.errors.password}
          hint={`At least ${PASSWORD_MIN_LENGTH} characters; a short sentence works well.`}
        />
        <Button type="submit" loading={signUp.isPending}>
          Create account
        </Button>
        <Typography level="body-sm">
          Already have an account?{' '}
          <Link component={RouterLink} to={signInHref}>
            Sign in
          </Link>
        </Typography>
      </Stack>
    </form>
  );
}
